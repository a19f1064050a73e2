package org.polebench.reconcile;

/** What a back-solve parameter stands for; also the kind of a single-fault hypothesis. */
public enum ParameterKind {
    /** φ = ln(C/C_nom) of one low-band capacitor; reported in farads. */
    CAPACITOR("F"),
    /** ln(I/I_nom) of one transistor's bias current; reported in amperes. */
    BIAS("A"),
    /** A flat gain calibration g in nepers (probe or level mistakes); reported in dB. */
    GAIN("dB");

    private final String unit;

    ParameterKind(String unit) {
        this.unit = unit;
    }

    /** @return the unit its estimates are reported in */
    public String unit() {
        return unit;
    }
}

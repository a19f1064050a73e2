package org.polebench.reconcile;

/** What a back-solve parameter stands for. */
public enum ParameterKind {
    /** φ = ln(C/C_nom) of one low-band capacitor; reported in farads. */
    CAPACITOR("F"),
    /** ln(I/I_nom) of one transistor's bias current; reported in amperes. */
    BIAS("A"),
    /** ln(β/β_nom) of one BJT's current gain, a nuisance (device spread); reported as β. */
    CURRENT_GAIN(""),
    /** ln(R/R_nom) of one resistor, freed only by its own hypothesis; reported in ohms. */
    RESISTOR("Ω"),
    /** A flat gain calibration g in nepers (probe or level mistakes); reported in dB. */
    GAIN("dB"),
    /**
     * ln(f_c/1 Hz) of a measuring channel's AC coupling, a first-order high-pass on its reading;
     * freed only by a bench hypothesis; reported in hertz.
     */
    CHANNEL_CORNER("Hz");

    private final String unit;

    ParameterKind(String unit) {
        this.unit = unit;
    }

    /** @return the unit its estimates are reported in (empty for β, a plain ratio) */
    public String unit() {
        return unit;
    }

    /** @return the hypothesis that frees one parameter of this kind; NONE for β, which no hypothesis frees */
    public HypothesisKind faultKind() {
        switch (this) {
            case CAPACITOR:
                return HypothesisKind.CAPACITOR;
            case RESISTOR:
                return HypothesisKind.RESISTOR;
            case BIAS:
                return HypothesisKind.BIAS;
            case GAIN:
                return HypothesisKind.GAIN;
            case CHANNEL_CORNER:
                return HypothesisKind.BENCH;
            default:
                return HypothesisKind.NONE;
        }
    }
}

package org.polebench.reconcile;

/** The fault hypotheses the back-solve ranks (docs/method.md, "The hypotheses"). */
public enum HypothesisKind {
    /** Every parameter within its tolerance prior. */
    NONE,
    /** One capacitor freed (σ = ln 10 in ln C), the rest within tolerance. */
    CAPACITOR,
    /** One resistor freed (σ = ln 10 in ln R) with the bias solved again, the rest within tolerance. */
    RESISTOR,
    /** One transistor's bias current freed, the rest within tolerance. */
    BIAS,
    /** The flat gain calibration freed (a probe or level mistake), the rest within tolerance. */
    GAIN,
    /**
     * The measuring chain, not the board: an AC-coupled output channel of unknown corner, or a
     * ratio of two channels AC-coupled at different corners (a pole–zero doublet).
     */
    BENCH,
    /** Two of the single faults at once, ranked only when no single one explains the sweep. */
    DOUBLE;

    /** @return the word used in JSON: none, capacitor, resistor, bias, gain, bench, double */
    public String word() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }
}

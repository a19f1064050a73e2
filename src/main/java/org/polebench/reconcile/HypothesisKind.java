package org.polebench.reconcile;

/** The single-fault hypotheses the back-solve ranks (DESIGN.md "Back-solve"). */
public enum HypothesisKind {
    /** Every parameter within its tolerance prior. */
    NONE,
    /** One capacitor freed (σ = ln 10 in ln C), the rest within tolerance. */
    CAPACITOR,
    /** One transistor's bias current freed, the rest within tolerance. */
    BIAS,
    /** The flat gain calibration freed (a probe or level mistake), the rest within tolerance. */
    GAIN;

    /** @return the word used in JSON: none, capacitor, bias, gain */
    public String word() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }
}

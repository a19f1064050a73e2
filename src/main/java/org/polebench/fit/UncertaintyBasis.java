package org.polebench.fit;

/** Where the scale of the reported uncertainties comes from (GUM, JCGM 100:2008, 4.2–4.3). */
public enum UncertaintyBasis {
    /**
     * The sweep stated every point's uncertainty and the residuals agree with it (χ² below its
     * 99th percentile): covariance (JᵀWJ)⁻¹ as it stands, k = 2.
     */
    STATED,
    /**
     * The sweep stated uncertainties but the residuals scatter more (χ² above its 99th
     * percentile): covariance scaled by χ²/ν (the Birge ratio squared), k = t₉₅.₄₅(ν).
     */
    STATED_SCALED_BY_RESIDUALS,
    /**
     * The sweep stated no uncertainties: the defaults fix only the relative weight of gain and
     * phase; the scale is estimated from the residuals (a Type A evaluation), covariance
     * (χ²/ν)(JᵀWJ)⁻¹, k = t₉₅.₄₅(ν).
     */
    FROM_RESIDUALS
}

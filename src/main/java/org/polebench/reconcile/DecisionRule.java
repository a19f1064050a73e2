package org.polebench.reconcile;

/**
 * How a measured value with its uncertainty is turned into pass or fail against a limit
 * (ILAC-G8:09/2019, "Guidelines on Decision Rules and Statements of Conformity", §4.2).
 */
public enum DecisionRule {
    /**
     * Simple acceptance (§4.2.1): pass when the measured value lies inside the limits. The
     * false-accept risk reaches 50 % for a value right at a limit.
     */
    SIMPLE("simple acceptance (ILAC-G8:09/2019 4.2.1): pass when the measured value is within the limits"),
    /**
     * Binary statement with a guard band w = U, the expanded uncertainty at k = 2 (§4.2.2):
     * pass only when the value is inside every limit by at least U, which keeps the
     * false-accept risk per limit under about 2.5 % for a normal distribution.
     */
    GUARDED("guarded acceptance (ILAC-G8:09/2019 4.2.2): pass when the measured value is within the limits "
            + "by at least its expanded uncertainty U (k = 2)");

    private final String statement;

    DecisionRule(String statement) {
        this.statement = statement;
    }

    /** @return the rule in words, as a report must state it (ISO/IEC 17025:2017 7.8.6) */
    public String statement() {
        return statement;
    }

    /** @return the guard band for a value with this expanded uncertainty */
    public double guardBand(double expandedUncertainty) {
        return this == GUARDED ? expandedUncertainty : 0.0;
    }
}

package org.polebench.fit;

/**
 * How a fit guards against a few bad points. The robust loss is used in a screening fit
 * (iteratively reweighted least squares); points then standing further out than the outlier
 * threshold are dropped and reported, and the final fit is ordinary weighted least squares on
 * the rest, so its covariance keeps its usual meaning.
 */
public enum RobustLoss {
    /** Keep every point; ordinary weighted least squares. */
    NONE(Double.NaN),
    /** Huber's loss, tuning constant 1.345 (95 % efficiency at the normal; Huber, Robust Statistics, 1981). */
    HUBER(1.345),
    /** Cauchy's loss, tuning constant 2.385 (95 % efficiency at the normal; Holland and Welsch, 1977). */
    CAUCHY(2.385);

    private final double tuning;

    RobustLoss(double tuning) {
        this.tuning = tuning;
    }

    /**
     * IRLS weight of a residual.
     *
     * @param standardised residual divided by its scale
     * @return the weight in (0, 1]
     */
    double weight(double standardised) {
        double a = Math.abs(standardised);
        switch (this) {
            case HUBER:
                return a <= tuning ? 1 : tuning / a;
            case CAUCHY:
                return 1 / (1 + (a / tuning) * (a / tuning));
            default:
                return 1;
        }
    }
}

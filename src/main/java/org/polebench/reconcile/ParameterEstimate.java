package org.polebench.reconcile;

/**
 * One parameter's posterior under one hypothesis.
 *
 * @param parameter      what it is, with its priors
 * @param logEstimate    the MAP on the log scale: ln(value/nominal), or g in nepers
 * @param logUncertainty the posterior standard deviation on that scale, √(H⁻¹)_jj (Laplace)
 * @param priorLogUncertainty the standard deviation of the prior this hypothesis gave it
 * @param identifiable   false when, at this estimate, the sweep would narrow the tolerance
 *                       prior by less than the threshold of {@link FaultRanking}: the data say
 *                       little about it, so it is never blamed
 */
public record ParameterEstimate(ModelParameter parameter, double logEstimate, double logUncertainty,
                                double priorLogUncertainty, boolean identifiable) {

    /** @return the estimate in the parameter's unit: farads, amperes, or dB */
    public double value() {
        return parameter.valueOf(logEstimate);
    }

    /** @return the standard uncertainty in the parameter's unit, to first order */
    public double uncertainty() {
        return parameter.uncertaintyOf(logEstimate, logUncertainty);
    }

    /** @return estimate over nominal (V/V for the gain) */
    public double factor() {
        return Math.exp(logEstimate);
    }
}

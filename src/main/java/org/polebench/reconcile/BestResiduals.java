package org.polebench.reconcile;

import java.util.List;

/**
 * The residuals the most probable hypothesis leaves, for the adequacy test.
 *
 * @param frequenciesHz        each point's frequency, ascending
 * @param magnitude            ln|H_meas/H_model| over its σ at the final scales, per point
 * @param phase                the wrapped phase residual over its σ at the final scales, per
 *                             point; empty for a magnitude-only sweep
 * @param magnitudeSigmaNepers the σ each gain residual was divided by (scale included), Np
 * @param phaseSigmaRad        the σ each phase residual was divided by (scale included), rad
 * @param chiSquaredStated     Σ r² at the stated (or default) σ, before any scale
 * @param effectiveParameters  the parameters the data fix (trace of the hat matrix), at most p
 */
public record BestResiduals(List<Double> frequenciesHz, List<Double> magnitude, List<Double> phase,
                            List<Double> magnitudeSigmaNepers, List<Double> phaseSigmaRad,
                            double chiSquaredStated, double effectiveParameters) {
    public BestResiduals {
        frequenciesHz = List.copyOf(frequenciesHz);
        magnitude = List.copyOf(magnitude);
        phase = List.copyOf(phase);
        magnitudeSigmaNepers = List.copyOf(magnitudeSigmaNepers);
        phaseSigmaRad = List.copyOf(phaseSigmaRad);
    }

    /** @return the real data residuals: one per point, two with phase */
    public int rows() {
        return magnitude.size() + phase.size();
    }
}

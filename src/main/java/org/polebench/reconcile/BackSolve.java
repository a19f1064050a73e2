package org.polebench.reconcile;

import java.util.List;

/**
 * The MAP back-solve of one hypothesis on the stage's exact model (DESIGN.md "Back-solve").
 *
 * @param parameters   every capacitor, then every transistor's bias, then the gain, in order
 * @param correlation  posterior correlations of the log-scale parameters, same order, unit diagonal
 * @param chiSquared   Σ of the squared weighted data residuals at the MAP, at the stated σ
 *                     (before any residual scale)
 * @param dataRows     the number of real data residuals (two per point with phase)
 * @param converged    whether the search met its tolerance within its iteration budget
 */
public record BackSolve(List<ParameterEstimate> parameters, List<List<Double>> correlation, double chiSquared,
                        int dataRows, boolean converged) {
    public BackSolve {
        parameters = List.copyOf(parameters);
        correlation = correlation.stream().map(List::copyOf).collect(java.util.stream.Collectors.toUnmodifiableList());
    }

    /** @return the estimates of one kind, in order */
    public List<ParameterEstimate> of(ParameterKind kind) {
        return parameters.stream().filter(p -> p.parameter().kind() == kind)
                .collect(java.util.stream.Collectors.toUnmodifiableList());
    }

    /** @return the gain calibration's estimate */
    public ParameterEstimate gain() {
        return parameters.get(parameters.size() - 1);
    }
}

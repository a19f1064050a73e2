package org.polebench.reconcile;

import java.util.List;

/**
 * The MAP back-solve of one hypothesis on the stage's exact model (docs/method.md, "The back-solve").
 *
 * @param parameters   the hypothesis' parameters in model order: every capacitor, every
 *                     transistor's bias current, every BJT's β, the resistors it frees, the gain
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
        return of(ParameterKind.GAIN).get(0);
    }

    /** @throws IllegalArgumentException when this back-solve does not have the parameter */
    public ParameterEstimate of(ModelParameter parameter) {
        for (ParameterEstimate estimate : parameters) {
            if (estimate.parameter().equals(parameter)) {
                return estimate;
            }
        }
        throw new IllegalArgumentException("no estimate of " + parameter.label());
    }
}

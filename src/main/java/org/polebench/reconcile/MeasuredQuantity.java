package org.polebench.reconcile;

/**
 * A measured value for a limit check, with where it came from.
 *
 * @param value               the value, in the check's unit
 * @param expandedUncertainty U = k·u in the same unit, at least 0
 * @param source              how it was measured, in words ("fitted model", "back-solve")
 */
public record MeasuredQuantity(double value, double expandedUncertainty, String source) {
}

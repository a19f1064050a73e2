package org.polebench.reconcile;

/**
 * One capacitor's part of the lower corner's error in the first-order apportionment.
 *
 * @param capacitor          the part's designator
 * @param cornerSensitivity  ∂ln f_L/∂ln C of the exact corner at the tolerance priors' means
 * @param logEstimate        φ = ln(C/C_nom) at the MAP of the linearised problem
 * @param estimatedFarads    C_nom·e^φ
 * @param cornerContribution its term of Δln f_L = ln(f_measured/f_nominal): s·(φ − μ) plus its
 *                           share of the expected board's offset (see {@link CornerApportionment})
 * @param share              cornerContribution over the sum of all contributions; NaN when that
 *                           sum is 0
 */
public record CapacitorShare(String capacitor, double cornerSensitivity, double logEstimate, double estimatedFarads,
                             double cornerContribution, double share) {
}

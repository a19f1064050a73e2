package org.polebench.reconcile;

/**
 * One capacitor's part of the lower corner's change along the path from the design to the
 * back-solved board ({@link CornerApportionment}).
 *
 * @param capacitor          the part's designator
 * @param cornerSensitivity  ∂ln f_L/∂ln C of the exact corner, averaged along the path
 * @param logEstimate        φ = ln(C/C_nom), the back-solve's estimate
 * @param estimatedFarads    C_nom·e^φ, the back-solve's estimate
 * @param cornerContribution its term of Δln f_L: φ times the averaged sensitivity
 * @param share              cornerContribution over Δln f_L; NaN when that is 0
 */
public record CapacitorShare(String capacitor, double cornerSensitivity, double logEstimate, double estimatedFarads,
                             double cornerContribution, double share) {
}

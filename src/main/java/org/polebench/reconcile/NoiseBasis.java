package org.polebench.reconcile;

/**
 * How the point uncertainties of a back-solve were set.
 *
 * @param stated               every point of the sweep stated its own uncertainty (u columns or
 *                             an instrument's accuracy); false when the defaults were used
 * @param defaultGainSigmaDb   the gain σ used where the sweep stated none, dB
 * @param defaultPhaseSigmaDeg the phase σ used where the sweep stated none, degrees
 * @param magnitudeScale       the factor (at least 1) on every gain σ
 * @param phaseScale           the factor (at least 1) on every phase σ; equal to the gain's when
 *                             the sweep stated its uncertainties (one Birge ratio), else a
 *                             variance component of its own
 */
public record NoiseBasis(boolean stated, double defaultGainSigmaDb, double defaultPhaseSigmaDeg,
                         double magnitudeScale, double phaseScale) {
}

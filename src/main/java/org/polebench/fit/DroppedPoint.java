package org.polebench.fit;

/**
 * A point the outlier screen left out of the fit.
 *
 * @param sweepIndex   0-based index of the point in the sweep given to the fitter
 * @param frequencyHz  its frequency
 * @param residualSigmas how far it stood from the robust fit, in standard uncertainties (or robust
 *                     scales when larger)
 */
public record DroppedPoint(int sweepIndex, double frequencyHz, double residualSigmas) {
}

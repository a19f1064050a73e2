package org.polebench.fit;

import java.util.OptionalDouble;

/**
 * How well the chosen model fits the points it used.
 *
 * @param chiSquare         Σ (rₖ/σₖ)² over every real residual, with the points' own uncertainties
 * @param degreesOfFreedom  ν = residuals − parameters
 * @param pointsUsed        points fitted (after band restriction and outlier rejection)
 * @param residualRmsDb     RMS gain residual, dB
 * @param residualRmsDeg    RMS phase residual, degrees; empty for a magnitude-only sweep
 * @param basis             how the uncertainty scale of the point noise was set
 * @param calibration       the flat calibration term combined with it, and its basis
 */
public record FitQuality(double chiSquare, int degreesOfFreedom, int pointsUsed, double residualRmsDb,
                         OptionalDouble residualRmsDeg, UncertaintyBasis basis, CalibrationTerm calibration) {

    /** χ²/ν, near 1 when the point uncertainties describe the scatter. */
    public double reducedChiSquare() {
        return chiSquare / degreesOfFreedom;
    }
}

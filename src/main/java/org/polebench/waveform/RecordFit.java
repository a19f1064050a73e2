package org.polebench.waveform;

/**
 * One record fitted: both channels' sines at one frequency, and the gain and phase they give.
 *
 * @param frequencyHz            the frequency of both fitted sines
 * @param frequencyUncertaintyHz its standard uncertainty; 0 when it was stated (three-parameter fit)
 * @param frequencyFree          true for the four-parameter fit (frequency fitted), false for the three-parameter
 * @param input                  the input channel's sine
 * @param output                 the output channel's sine
 * @param gainDb                 20·log10(A_out / A_in)
 * @param gainUncertaintyDb      its standard uncertainty
 * @param phaseDeg               φ_out − φ_in folded into (−180°, 180°], lead positive
 * @param phaseUncertaintyDeg    its standard uncertainty
 * @param iterations             the four-parameter fit's iterations; 0 for the three-parameter fit
 */
public record RecordFit(double frequencyHz, double frequencyUncertaintyHz, boolean frequencyFree,
                        FittedSine input, FittedSine output, double gainDb, double gainUncertaintyDb,
                        double phaseDeg, double phaseUncertaintyDeg, int iterations) {
}

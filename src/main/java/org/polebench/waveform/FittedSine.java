package org.polebench.waveform;

/**
 * One channel's fitted sine, y(t) = A·cos(2πf·t + φ) + C, with the standard uncertainties the fit's
 * residuals give (docs/method.md, "Sine fitting of scope records").
 *
 * @param amplitudeVolts     A, the peak amplitude, non-negative
 * @param phaseRad           φ at t = 0 of the record's time axis, folded into (−π, π]
 * @param offsetVolts        C, the DC offset
 * @param amplitudeUncertaintyVolts standard uncertainty of A
 * @param phaseUncertaintyRad       standard uncertainty of φ (frequency known, or referred to the record's middle)
 * @param residualRmsVolts   the root mean square of the residuals
 * @param noiseSigmaVolts    the residuals' standard deviation with the fitted parameters' degrees of
 *                           freedom taken off, the σ̂ of the uncertainties
 */
public record FittedSine(double amplitudeVolts, double phaseRad, double offsetVolts,
                         double amplitudeUncertaintyVolts, double phaseUncertaintyRad,
                         double residualRmsVolts, double noiseSigmaVolts) {
    /** @return the signal-to-noise ratio in dB: the sine's power A²/2 over σ̂² */
    public double snrDb() {
        double noise = noiseSigmaVolts * noiseSigmaVolts;
        return noise > 0 ? 10 * Math.log10(amplitudeVolts * amplitudeVolts / 2 / noise) : Double.POSITIVE_INFINITY;
    }
}

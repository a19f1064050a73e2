package org.polebench.synth;

import java.util.Locale;

/**
 * Gaussian measurement noise added to a synthesized sweep, independent per point.
 *
 * @param gainSigmaDb   standard deviation of the gain in dB, at least 0
 * @param phaseSigmaDeg standard deviation of the phase in degrees, at least 0
 */
public record SweepNoise(double gainSigmaDb, double phaseSigmaDeg) {
    /** The bench noise the issues quote for a good two-channel analyser: 0.05 dB and 0.5°. */
    public static final SweepNoise BENCH = new SweepNoise(0.05, 0.5);
    public static final SweepNoise NONE = new SweepNoise(0, 0);

    public SweepNoise {
        if (!(gainSigmaDb >= 0) || !(phaseSigmaDeg >= 0) || !Double.isFinite(gainSigmaDb + phaseSigmaDeg)) {
            throw new IllegalArgumentException("noise deviations must be finite and at least 0");
        }
    }

    public String describe() {
        return String.format(Locale.ROOT, "Gaussian, %.4g dB and %.4g° standard deviation per point",
                gainSigmaDb, phaseSigmaDeg);
    }
}

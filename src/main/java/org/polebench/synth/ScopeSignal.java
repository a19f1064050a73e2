package org.polebench.synth;

/**
 * What a simulated scope does to the records it serves ({@code simulate}'s scope options).
 *
 * @param samples    samples in each channel's record
 * @param periods    periods of the test frequency one record spans (the simulated timebase; a
 *                   non-whole number, so that no fit can lean on whole periods)
 * @param noiseVolts standard deviation of white Gaussian noise added to every sample, in volts
 * @param bits       resolution of the simulated converter over each channel's range: samples
 *                   are rounded to steps of range/2^(bits−1); 0 leaves ASCII samples at six
 *                   significant figures and blocks at their coding's resolution
 * @param clipVolts  the channels' input limit: samples beyond ±this read ±this (clipping);
 *                   infinite for none
 */
public record ScopeSignal(int samples, double periods, double noiseVolts, int bits, double clipVolts) {
    /** 2000 samples over 4.7 periods, no noise, no added quantisation, no clipping. */
    public static final ScopeSignal PLAIN = new ScopeSignal(2000, 4.7, 0, 0, Double.POSITIVE_INFINITY);

    public ScopeSignal {
        if (samples < 16 || samples > 1_000_000) {
            throw new IllegalArgumentException("a record holds 16 to 1,000,000 samples, not " + samples);
        }
        if (!(periods > 0) || !Double.isFinite(periods)) {
            throw new IllegalArgumentException("the periods in a record must be positive");
        }
        if (!(noiseVolts >= 0) || !Double.isFinite(noiseVolts)) {
            throw new IllegalArgumentException("the noise must be zero or more volts");
        }
        if (bits < 0 || bits > 24) {
            throw new IllegalArgumentException("the converter's bits must be 0 to 24, not " + bits);
        }
        if (!(clipVolts > 0)) {
            throw new IllegalArgumentException("the clipping level must be positive");
        }
    }
}

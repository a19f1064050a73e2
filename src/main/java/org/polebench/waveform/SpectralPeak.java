package org.polebench.waveform;

import org.polebench.InputProblem;

/**
 * The starting frequency of the four-parameter fit: the peak of the record's spectrum,
 * interpolated between bins by Jacobsen's estimator (E. Jacobsen and P. Kootsookos, "Fast,
 * accurate frequency estimators", IEEE Signal Processing Magazine 24(3), 2007):
 * δ = Re[(X[k−1] − X[k+1]) / (2X[k] − X[k−1] − X[k+1])] bins from the largest bin k. Both
 * channels go through one complex FFT (the input as the real part, the output as the imaginary
 * part, each scaled to unit power and with its mean removed) and are separated by the symmetry
 * of a real signal's transform (E. O. Brigham, The Fast Fourier Transform and Its Applications,
 * 1988, on transforming two real functions at once; from memory). Only the record's first 2^k
 * samples are transformed (2^k the largest power of two it holds), which costs the start a
 * little resolution the fit then recovers.
 */
final class SpectralPeak {
    private SpectralPeak() {
    }

    /** @throws InputProblem when neither channel varies, so no frequency can be seen */
    static double estimateHz(WaveformRecord record) throws InputProblem {
        // the largest power of two the record holds: its first `size` samples, at least half of it,
        // are transformed unpadded, which halves the work of padding up and leaves the start
        // within a fraction of the record's own bin, from where the fit converges
        int size = Integer.highestOneBit(record.length());
        int n = size;
        double[] re = new double[size];
        double[] im = new double[size];
        double[] in = record.inputSamples();
        double[] out = record.outputSamples();
        double scaleIn = unitScale(in);
        double scaleOut = unitScale(out);
        if (scaleIn == 0 && scaleOut == 0) {
            throw new InputProblem(record.file(), 0, "both channels are constant, so no frequency can be estimated",
                    "check the probes and the trigger");
        }
        double meanIn = mean(in);
        double meanOut = mean(out);
        for (int i = 0; i < n; i++) {
            re[i] = (in[i] - meanIn) * scaleIn;
            im[i] = (out[i] - meanOut) * scaleOut;
        }
        Radix2Fft.forward(re, im);
        int best = 1;
        double bestPower = -1;
        for (int k = 1; k < size / 2; k++) {
            double power = power(re, im, k, size, true) + power(re, im, k, size, false);
            if (power > bestPower) {
                bestPower = power;
                best = k;
            }
        }
        boolean useInput = power(re, im, best, size, true) >= power(re, im, best, size, false);
        double delta = 0;
        if (best > 1 && best < size / 2 - 1) {
            double[] below = channel(re, im, best - 1, size, useInput);
            double[] at = channel(re, im, best, size, useInput);
            double[] above = channel(re, im, best + 1, size, useInput);
            // (X[k−1] − X[k+1]) / (2X[k] − X[k−1] − X[k+1]), real part
            double nr = below[0] - above[0];
            double ni = below[1] - above[1];
            double dr = 2 * at[0] - below[0] - above[0];
            double di = 2 * at[1] - below[1] - above[1];
            double d2 = dr * dr + di * di;
            if (d2 > 0) {
                delta = Math.max(-0.5, Math.min(0.5, (nr * dr + ni * di) / d2));
            }
        }
        return (best + delta) / (size * record.intervalSeconds());
    }

    /** @return the channel's bin k: X[k] = (Z[k] + Z*[N−k])/2 for the input, (Z[k] − Z*[N−k])/(2j) for the output */
    private static double[] channel(double[] re, double[] im, int k, int size, boolean input) {
        int m = (size - k) % size;
        if (input) {
            return new double[] {(re[k] + re[m]) / 2, (im[k] - im[m]) / 2};
        }
        return new double[] {(im[k] + im[m]) / 2, -(re[k] - re[m]) / 2};
    }

    private static double power(double[] re, double[] im, int k, int size, boolean input) {
        double[] x = channel(re, im, k, size, input);
        return x[0] * x[0] + x[1] * x[1];
    }

    private static double mean(double[] y) {
        double sum = 0;
        for (double v : y) {
            sum += v;
        }
        return sum / y.length;
    }

    /** @return 1/rms of the channel about its mean, or 0 for a constant channel */
    private static double unitScale(double[] y) {
        double m = mean(y);
        double sum = 0;
        for (double v : y) {
            sum += (v - m) * (v - m);
        }
        return sum > 0 ? Math.sqrt(y.length / sum) : 0;
    }
}

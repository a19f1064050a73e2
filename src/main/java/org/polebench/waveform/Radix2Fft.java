package org.polebench.waveform;

/**
 * The in-place iterative radix-2 fast Fourier transform (J. W. Cooley and J. W. Tukey, "An
 * algorithm for the machine calculation of complex Fourier series", Math. Comp. 19, 1965) on two
 * plain arrays, real and imaginary parts. Forward transform, no scaling: X[k] = Σ x[n]·e^(−j2πkn/N).
 * Written here rather than taken from Commons Math because that one allocates an object per
 * complex sample, and a 100,000-sample record is transformed once per record.
 */
final class Radix2Fft {
    private Radix2Fft() {
    }

    /** @return the smallest power of two at or above n */
    static int size(int n) {
        int size = 1;
        while (size < n) {
            size <<= 1;
        }
        return size;
    }

    /**
     * @param re real parts, length a power of two; replaced by the transform's
     * @param im imaginary parts, the same length
     */
    static void forward(double[] re, double[] im) {
        int n = re.length;
        if (Integer.bitCount(n) != 1 || im.length != n) {
            throw new IllegalArgumentException("the FFT needs two arrays of one power-of-two length, had " + n);
        }
        // bit-reversal permutation
        for (int i = 1, j = 0; i < n; i++) {
            int bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1) {
                j ^= bit;
            }
            j ^= bit;
            if (i < j) {
                double t = re[i];
                re[i] = re[j];
                re[j] = t;
                t = im[i];
                im[i] = im[j];
                im[j] = t;
            }
        }
        // one table of twiddles e^(−j2πk/N), k < N/2: Math.cos and Math.sin for the first eighth
        // of the turn and the rest by the quarter-turn symmetries (exact), so no rounding grows
        // along the table; a stage of length L takes every (N/L)-th
        int halfN = n >> 1;
        int quarter = n >> 2;
        double[] cos = new double[Math.max(halfN, 1)];
        double[] sin = new double[Math.max(halfN, 1)];
        for (int k = 0; k <= n >> 3 && k < halfN; k++) {
            double angle = 2 * Math.PI * k / n;
            cos[k] = Math.cos(angle);
            sin[k] = -Math.sin(angle);
        }
        for (int k = (n >> 3) + 1; k <= quarter && k < halfN; k++) {
            // angle = π/2 − angle(quarter − k)
            cos[k] = -sin[quarter - k];
            sin[k] = -cos[quarter - k];
        }
        for (int k = quarter + 1; k < halfN; k++) {
            // angle = π/2 + angle(k − quarter)
            cos[k] = sin[k - quarter];
            sin[k] = -cos[k - quarter];
        }
        for (int length = 2; length <= n; length <<= 1) {
            int half = length >> 1;
            int stride = n / length;
            for (int start = 0; start < n; start += length) {
                for (int k = 0; k < half; k++) {
                    double wr = cos[k * stride];
                    double wi = sin[k * stride];
                    int p = start + k;
                    int q = p + half;
                    double tr = wr * re[q] - wi * im[q];
                    double ti = wr * im[q] + wi * re[q];
                    re[q] = re[p] - tr;
                    im[q] = im[p] - ti;
                    re[p] += tr;
                    im[p] += ti;
                }
            }
        }
    }
}

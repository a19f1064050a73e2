package org.polebench.waveform;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.transform.DftNormalization;
import org.apache.commons.math3.transform.FastFourierTransformer;
import org.apache.commons.math3.transform.TransformType;
import org.junit.jupiter.api.Test;

class Radix2FftTest {
    @Test
    void agreesWithCommonsMathsTransform() {
        // an independent library: Commons Math's FastFourierTransformer, standard normalisation
        // (no scaling forward, the same sign convention e^(−j2πkn/N))
        Random random = new Random(42);
        for (int n : new int[] {1, 2, 8, 1024}) {
            double[] re = new double[n];
            double[] im = new double[n];
            Complex[] input = new Complex[n];
            for (int i = 0; i < n; i++) {
                re[i] = random.nextGaussian();
                im[i] = random.nextGaussian();
                input[i] = new Complex(re[i], im[i]);
            }
            Complex[] expected = new FastFourierTransformer(DftNormalization.STANDARD).transform(input,
                    TransformType.FORWARD);
            Radix2Fft.forward(re, im);
            for (int k = 0; k < n; k++) {
                // rounding grows as log2(N)·ε·√N at most: 1e-11 is ample for N = 1024
                assertEquals(expected[k].getReal(), re[k], 1e-11, "n " + n + " bin " + k);
                assertEquals(expected[k].getImaginary(), im[k], 1e-11, "n " + n + " bin " + k);
            }
        }
    }

    @Test
    void sizeIsTheNextPowerOfTwo() {
        // definition of the zero-padded length
        assertEquals(1, Radix2Fft.size(1));
        assertEquals(1024, Radix2Fft.size(1000));
        assertEquals(1024, Radix2Fft.size(1024));
        assertEquals(131072, Radix2Fft.size(100_000));
    }
}

package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * A test's ground truth: H(s) = K·sᵐ·Π(s − zᵢ)/Π(s − pᵢ)·1/(1 + s/ω_h) written out directly in
 * complex arithmetic here, independent of the fitter's model code, and sweeps sampled from it.
 * Poles and zeros are given in Hz as negative real parts (complex ones as re, im pairs).
 */
public final class KnownResponse {
    final double gain;
    final int dcZeros;
    final double[][] zerosHz;
    final double[][] polesHz;
    final double highBandPoleHz;

    /**
     * @param zerosHz finite zeros, each {re, im} in Hz (complex ones with their conjugate)
     * @param polesHz low-band poles, each {re, im} in Hz
     * @param highBandPoleHz the high-band pole's frequency, or NaN for none
     */
    public KnownResponse(double gain, int dcZeros, double[][] zerosHz, double[][] polesHz, double highBandPoleHz) {
        this.gain = gain;
        this.dcZeros = dcZeros;
        this.zerosHz = zerosHz;
        this.polesHz = polesHz;
        this.highBandPoleHz = highBandPoleHz;
    }

    public static double[][] real(double... hz) {
        double[][] out = new double[hz.length][];
        for (int i = 0; i < hz.length; i++) {
            out[i] = new double[]{hz[i], 0};
        }
        return out;
    }

    /** {re, im} of H(j2πf); frequencies enter in Hz throughout (the 2π cancels in every factor but K). */
    double[] at(double f) {
        double re = gain;
        double im = 0;
        for (int i = 0; i < dcZeros; i++) {
            double t = -im * f;
            im = re * f;
            re = t;
        }
        for (double[] z : zerosHz) {
            double[] m = mul(re, im, -z[0], f - z[1]);
            re = m[0];
            im = m[1];
        }
        for (double[] p : polesHz) {
            double[] d = div(re, im, -p[0], f - p[1]);
            re = d[0];
            im = d[1];
        }
        if (!Double.isNaN(highBandPoleHz)) {
            double[] d = div(re, im, 1, f / highBandPoleHz);
            re = d[0];
            im = d[1];
        }
        return new double[]{re, im};
    }

    double gainDb(double f) {
        double[] h = at(f);
        return 20 * Math.log10(Math.hypot(h[0], h[1]));
    }

    double phaseDeg(double f) {
        double[] h = at(f);
        return Math.toDegrees(Math.atan2(h[1], h[0]));
    }

    /** Log-spaced frequencies from lowHz to highHz. */
    public static double[] logSpaced(double lowHz, double highHz, int n) {
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            f[i] = lowHz * Math.pow(highHz / lowHz, i / (double) (n - 1));
        }
        return f;
    }

    public Sweep sweep(double[] frequencies, boolean withPhase) {
        List<SweepPoint> points = new ArrayList<>();
        for (double f : frequencies) {
            points.add(withPhase ? SweepPoint.of(f, gainDb(f), phaseDeg(f)) : SweepPoint.magnitudeOnly(f, gainDb(f)));
        }
        return new Sweep(Provenance.inMemory("synthetic test sweep"), points);
    }

    /**
     * A noisy sweep whose points state their standard uncertainties (the noise's own σ).
     *
     * @param sigmaDb  normal noise on the gain, dB
     * @param sigmaDeg normal noise on the phase, degrees
     */
    public Sweep noisySweep(double[] frequencies, double sigmaDb, double sigmaDeg, Random random, boolean stateUncertainty) {
        List<SweepPoint> points = new ArrayList<>();
        for (double f : frequencies) {
            points.add(new SweepPoint(f, gainDb(f) + sigmaDb * random.nextGaussian(),
                    OptionalDouble.of(phaseDeg(f) + sigmaDeg * random.nextGaussian()),
                    stateUncertainty ? OptionalDouble.of(sigmaDb) : OptionalDouble.empty(),
                    stateUncertainty ? OptionalDouble.of(sigmaDeg) : OptionalDouble.empty()));
        }
        return new Sweep(Provenance.inMemory("synthetic noisy test sweep"), points);
    }

    private static double[] mul(double a, double b, double c, double d) {
        return new double[]{a * c - b * d, a * d + b * c};
    }

    private static double[] div(double a, double b, double c, double d) {
        double m = c * c + d * d;
        return new double[]{(a * c + b * d) / m, (b * c - a * d) / m};
    }
}

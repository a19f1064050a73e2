package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.TestFigures;
import org.polebench.sweep.CalibrationAccuracy;

/**
 * Monte Carlo over 500 seeded noisy sweeps of a known common-emitter response, against the
 * Cramér–Rao bound (Kay, Fundamentals of Statistical Signal Processing, vol. 1, 1993, ch. 3):
 * for normal noise of known σ on gain (dB) and phase (°), I = Σₖ ∇θ ln|H|·∇θ ln|H|ᵀ/σ_g² +
 * ∇θ arg H·∇θ arg Hᵀ/σ_φ² and var(θ̂ᵢ) ≥ (I⁻¹)ᵢᵢ. The gradient here is a central difference of
 * {@link KnownResponse} in θ = (K, p₁, p₂, p₃, z₁) in Hz, and I is inverted by EJML: nothing of
 * the fitter's own model, Jacobian or covariance is used.
 *
 * <p>Bands: a standard deviation from M = 500 trials has relative spread 1/√(2(M − 1)) ≈ 3.2 %
 * (normal data: var(s²) = 2σ⁴/(M − 1), common practice), so the spread must lie within [0.9, 1.2] × √CRB: the 1.2 above,
 * and three of those spreads below (an efficient estimator cannot beat the bound without bias).
 * Coverage of k·u over 500 trials has binomial σ = √(0.95·0.05/500) ≈ 1 %: the 95 ± 3 %.
 */
class CramerRaoTest {
    private static final int TRIALS = 500;
    private static final double SIGMA_DB = 0.05;
    private static final double SIGMA_DEG = 0.5;
    private static final double[] POLES_HZ = {3, 16, 180};
    private static final double ZERO_HZ = 4.2;
    private static final double GAIN = 42;
    private static final double[] FREQUENCIES = KnownResponse.logSpaced(1, 50_000, 100);
    /**
     * These sweeps carry independent point noise only, so they say their flat calibration error
     * is zero; otherwise the fit would add the default or the points' u as one (issue 13, which
     * CalibrationCoverageTest checks) and the bound here is the noise's alone.
     */
    private static final CalibrationAccuracy NO_CALIBRATION_ERROR = new CalibrationAccuracy(OptionalDouble.of(0),
            OptionalDouble.of(0), "test: point noise only, no calibration error");

    private static KnownResponse truth(double[] theta) {
        return new KnownResponse(theta[0], 2, KnownResponse.real(-theta[4]),
                KnownResponse.real(-theta[1], -theta[2], -theta[3]), Double.NaN);
    }

    /** √(I⁻¹)ᵢᵢ for θ = (K, p1, p2, p3, z1), each in its own unit (ratio, Hz). */
    private static double[] cramerRaoStandardDeviations() {
        double[] theta = {GAIN, POLES_HZ[0], POLES_HZ[1], POLES_HZ[2], ZERO_HZ};
        int n = theta.length;
        DMatrixRMaj info = new DMatrixRMaj(n, n);
        double sg = SIGMA_DB * Math.log(10) / 20;
        double sp = Math.toRadians(SIGMA_DEG);
        for (double f : FREQUENCIES) {
            double[] dMag = new double[n];
            double[] dArg = new double[n];
            for (int i = 0; i < n; i++) {
                double h = 1e-6 * theta[i];
                double[] up = theta.clone();
                double[] down = theta.clone();
                up[i] += h;
                down[i] -= h;
                double[] hu = truth(up).at(f);
                double[] hd = truth(down).at(f);
                dMag[i] = (Math.log(Math.hypot(hu[0], hu[1])) - Math.log(Math.hypot(hd[0], hd[1]))) / (2 * h);
                dArg[i] = Math.IEEEremainder(Math.atan2(hu[1], hu[0]) - Math.atan2(hd[1], hd[0]), 2 * Math.PI) / (2 * h);
            }
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    info.add(i, j, dMag[i] * dMag[j] / (sg * sg) + dArg[i] * dArg[j] / (sp * sp));
                }
            }
        }
        DMatrixRMaj inverse = new DMatrixRMaj(n, n);
        assertTrue(CommonOps_DDRM.invert(info, inverse));
        double[] sd = new double[n];
        for (int i = 0; i < n; i++) {
            sd[i] = Math.sqrt(inverse.get(i, i));
        }
        return sd;
    }

    @Test
    void poleSpreadMeetsTheCramerRaoBoundAndCoverageIsNinetyFivePercent() throws InputProblem {
        double[] bound = cramerRaoStandardDeviations();
        KnownResponse truth = truth(new double[]{GAIN, POLES_HZ[0], POLES_HZ[1], POLES_HZ[2], ZERO_HZ});
        SweepFitter fitter = new SweepFitter(FitSettings.defaults());
        Random random = new Random(20_240_501L);
        List<double[]> poles = new ArrayList<>();
        int[] covered = new int[3];
        int zeroCovered = 0;
        int rightOrder = 0;
        List<Double> corners = new ArrayList<>();
        List<Double> cornerU = new ArrayList<>();
        for (int t = 0; t < TRIALS; t++) {
            FitResult result = fitter.fit(truth.noisySweep(FREQUENCIES, SIGMA_DB, SIGMA_DEG, random, true)
                    .withCalibration(NO_CALIBRATION_ERROR));
            if (result.structure().lowBandPoles() != 3 || result.structure().dcZeros() != 2
                    || result.structure().highBandPole()) {
                continue;
            }
            rightOrder++;
            List<FittedRoot> sorted = result.poles().stream()
                    .sorted(Comparator.comparingDouble(FittedRoot::magnitudeHz)).collect(Collectors.toList());
            double[] p = new double[3];
            for (int i = 0; i < 3; i++) {
                FittedRoot root = sorted.get(i);
                p[i] = root.magnitudeHz();
                double expanded = result.coverageFactor() * root.uMagnitudeHz();
                covered[i] += Math.abs(p[i] - POLES_HZ[i]) <= expanded ? 1 : 0;
            }
            poles.add(p);
            FittedRoot zero = result.zeros().get(result.zeros().size() - 1);
            zeroCovered += Math.abs(zero.magnitudeHz() - ZERO_HZ) <= result.coverageFactor() * zero.uMagnitudeHz() ? 1 : 0;
            corners.add(result.lowerCornerModelHz().orElseThrow().value());
            cornerU.add(result.lowerCornerModelHz().orElseThrow().standardUncertainty());
        }
        // BIC adds a spurious pole–zero pair when noise alone lowers χ² by 2·ln N ≈ 10.6 (χ² with 2
        // degrees of freedom: e^−5.3 ≈ 0.5 %), about 1 % with the DC-zero alternatives; 97 % is that
        // plus three binomial σ (0.45 %) and a margin
        double[] ratio = new double[3];
        double[] coverage = new double[3];
        StringBuilder figures = new StringBuilder("right order in " + rightOrder + " of " + TRIALS);
        for (int i = 0; i < 3; i++) {
            final int pole = i;
            double[] values = poles.stream().mapToDouble(v -> v[pole]).toArray();
            ratio[i] = standardDeviation(values) / bound[i + 1];
            coverage[i] = covered[i] / (double) rightOrder;
            figures.append(String.format(Locale.ROOT, "%npole %s Hz: spread / CRB = %.4f, coverage %.4f",
                    POLES_HZ[i], ratio[i], coverage[i]));
        }
        double zeroCoverage = zeroCovered / (double) rightOrder;
        double spread = standardDeviation(corners.stream().mapToDouble(Double::doubleValue).toArray());
        double meanU = cornerU.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        figures.append(String.format(Locale.ROOT, "%ncoverage of the zero %.4f%ncorner spread / propagated u = %.4f",
                zeroCoverage, spread / meanU));
        TestFigures.keep(getClass(), "poleSpreadMeetsTheCramerRaoBoundAndCoverageIsNinetyFivePercent", figures.toString());
        assertTrue(rightOrder >= 0.97 * TRIALS, "right order in " + rightOrder + " of " + TRIALS);
        for (int i = 0; i < 3; i++) {
            assertTrue(ratio[i] >= 0.9 && ratio[i] <= 1.2, "pole " + POLES_HZ[i] + " Hz: spread / CRB = " + ratio[i]);
            assertEquals(0.95, coverage[i], 0.03, "coverage of pole " + POLES_HZ[i] + " Hz");
        }
        assertEquals(0.95, zeroCoverage, 0.03, "coverage of the zero");
        // the corner's propagated u against its Monte Carlo spread: the same 3.2 % statistics,
        // ±10 % leaves room for the first-order propagation's own error
        assertEquals(1, spread / meanU, 0.1, "corner spread / propagated u");
    }

    // without stated uncertainties the scale is Type A (χ²/ν) and k = t(ν): coverage still 95 ± 3 %
    @Test
    void typeAUncertaintiesAlsoCoverNinetyFivePercent() throws InputProblem {
        KnownResponse truth = truth(new double[]{GAIN, POLES_HZ[0], POLES_HZ[1], POLES_HZ[2], ZERO_HZ});
        // defaults 0.05 dB / 0.5° set only the ratio of the weights; the true noise is twice that
        SweepFitter fitter = new SweepFitter(FitSettings.defaults().withPoleCount(3).withDcZeros(2));
        Random random = new Random(77L);
        int[] covered = new int[3];
        for (int t = 0; t < TRIALS; t++) {
            FitResult result = fitter.fit(truth.noisySweep(FREQUENCIES, 2 * SIGMA_DB, 2 * SIGMA_DEG, random, false)
                    .withCalibration(NO_CALIBRATION_ERROR));
            assertEquals(UncertaintyBasis.FROM_RESIDUALS, result.quality().basis());
            List<FittedRoot> sorted = result.poles().stream()
                    .sorted(Comparator.comparingDouble(FittedRoot::magnitudeHz)).collect(Collectors.toList());
            for (int i = 0; i < 3; i++) {
                double expanded = result.coverageFactor() * sorted.get(i).uMagnitudeHz();
                covered[i] += Math.abs(sorted.get(i).magnitudeHz() - POLES_HZ[i]) <= expanded ? 1 : 0;
            }
        }
        TestFigures.keep(getClass(), "typeAUncertaintiesAlsoCoverNinetyFivePercent", IntStream.range(0, 3)
                .mapToObj(i -> String.format(Locale.ROOT, "pole %s Hz: coverage %.4f", POLES_HZ[i], covered[i] / (double) TRIALS))
                .collect(Collectors.joining("\n")));
        for (int i = 0; i < 3; i++) {
            assertEquals(0.95, covered[i] / (double) TRIALS, 0.03, "coverage of pole " + POLES_HZ[i] + " Hz");
        }
    }

    private static double standardDeviation(double[] values) {
        double mean = 0;
        for (double v : values) {
            mean += v;
        }
        mean /= values.length;
        double ss = 0;
        for (double v : values) {
            ss += (v - mean) * (v - mean);
        }
        return Math.sqrt(ss / (values.length - 1));
    }
}

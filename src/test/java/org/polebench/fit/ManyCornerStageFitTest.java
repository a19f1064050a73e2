package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * A two-stage amplifier's low band with five closely spaced poles, three zeros at DC and two
 * finite zeros below the poles: the case where the Sanathanan–Koerner estimate's zeros sit near
 * (not at) DC and a DC-zero count read off them alone missed the true one.
 */
class ManyCornerStageFitTest {
    private static final double[] POLES_HZ = {2.9, 3.3, 3.9, 8.2, 10.3};
    private static final double[] ZEROS_HZ = {0.48, 1.59};
    private static final int DC_ZEROS = 3;
    private static final double MIDBAND_DB = 55.45;

    /** 20·log10|H(j2πf)| of the closed form H = K·s³(s + z₁)(s + z₂)/Π(s + pᵢ), every factor in Hz. */
    private static double gainDb(double f) {
        double db = MIDBAND_DB + DC_ZEROS * 20 * Math.log10(f);
        for (double z : ZEROS_HZ) {
            db += 10 * Math.log10(z * z + f * f);
        }
        for (double p : POLES_HZ) {
            db -= 10 * Math.log10(p * p + f * f);
        }
        return db;
    }

    /** arg H in degrees, continuous (not wrapped): +90° per DC zero, as a bench instrument may unwrap. */
    private static double phaseDeg(double f) {
        double rad = DC_ZEROS * Math.PI / 2;
        for (double z : ZEROS_HZ) {
            rad += Math.atan(f / z);
        }
        for (double p : POLES_HZ) {
            rad -= Math.atan(f / p);
        }
        return Math.toDegrees(rad);
    }

    /** The closed form's lower −3 dB corner: where the gain is 3.0103 dB under midband, above every root. */
    private static double trueCornerHz() {
        double halfPowerDb = 10 * Math.log10(2);
        return new BrentSolver(1e-12, 1e-12).solve(200, f -> gainDb(f) - MIDBAND_DB + halfPowerDb, 10, 200);
    }

    // synthetic case with known truth (the closed form above, not the stage code); seeded noise
    // 0.05 dB / 0.5° stated as each point's uncertainty, 81 points over the synthesizer's band
    @Test
    void fiveCloselySpacedPolesWithThreeDcZerosFitWithinTheNoise() throws InputProblem {
        Random random = new Random(20261201L);
        List<SweepPoint> points = new ArrayList<>();
        for (double f : KnownResponse.logSpaced(0.5389, 4850.1, 81)) {
            points.add(new SweepPoint(f, gainDb(f) + 0.05 * random.nextGaussian(),
                    OptionalDouble.of(phaseDeg(f) + 0.5 * random.nextGaussian()),
                    OptionalDouble.of(0.05), OptionalDouble.of(0.5)));
        }
        Sweep sweep = new Sweep(Provenance.inMemory("synthetic five-pole two-stage sweep"), points);
        FitResult result = new SweepFitter(FitSettings.defaults().withMaxPoles(5)).fit(sweep);

        // χ² with ν ≈ 150 has relative spread √(2/ν) ≈ 0.12, so χ²/ν < 2 holds for a model within
        // the noise and fails by orders of magnitude for a wrong one (41 000 before the fix)
        assertTrue(result.quality().reducedChiSquare() < 2, "chi-square/nu " + result.quality().reducedChiSquare());
        // synthetic truth: three DC zeros (the closed form's s³), exact, as DC zeros are structural
        assertEquals(DC_ZEROS, result.structure().dcZeros());
        // synthetic truth: the closed form's corner (Brent root above); 3 U: the fitted corner's expanded uncertainty covers ≈ 95 %; 3 U leaves room for the
        // bias of merging close poles when BIC picks fewer than five
        Estimate corner = result.lowerCornerModelHz().orElseThrow();
        assertEquals(trueCornerHz(), corner.value(), 3 * corner.expandedUncertainty());
    }
}

package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

/**
 * Issue 4: a double real pole (two coupling capacitors with equal time constants) fitted as two
 * real poles a hair apart, or as a pair at damping ratio near one, must be quoted with finite
 * uncertainties that cover the truth, never as a root whose propagated uncertainty is infinite.
 * Truth: H = K·s²/(s + a)², K = 10, a = 2π·20 Hz, written out in {@link KnownResponse}; as one
 * quadratic factor it is ω₀ = a, ζ = 1 exactly (closed form).
 */
class DoubleRealPoleTest {
    private static final double POLE_HZ = 20;
    private static final KnownResponse TRUTH = new KnownResponse(10, 2, new double[0][],
            KnownResponse.real(-POLE_HZ, -POLE_HZ), Double.NaN);
    private static final int TRIALS = 40;

    @Test
    void aDoublePoleIsQuotedTogetherWithFiniteUncertaintiesThatCoverIt() throws InputProblem {
        SweepFitter fitter = new SweepFitter(FitSettings.defaults());
        Random random = new Random(20_261_202L);
        int covered = 0;
        int clustered = 0;
        for (int t = 0; t < TRIALS; t++) {
            // 0.05 dB / 0.5° stated per point, as a two-channel analyser (seeded noise)
            FitResult result = fitter.fit(TRUTH.noisySweep(KnownResponse.logSpaced(1, 20_000, 100), 0.05, 0.5,
                    random, true));
            double k = result.coverageFactor();
            List<FittedRoot> poles = result.poles().stream().filter(r -> r.status() == RootStatus.FITTED)
                    .collect(Collectors.toList());
            for (FittedRoot pole : poles) {
                // every quoted number is finite: the root's own, or its cluster's
                assertTrue(Double.isFinite(pole.uRealRadPerS()) && Double.isFinite(pole.uImaginaryRadPerS())
                        && Double.isFinite(pole.uMagnitudeRadPerS()), "trial " + t + ": " + pole);
            }
            Optional<RootCluster> cluster = poles.stream().map(FittedRoot::cluster).filter(Optional::isPresent)
                    .map(Optional::get).findFirst();
            boolean hit;
            if (cluster.isPresent()) {
                clustered++;
                RootCluster c = cluster.get();
                assertEquals(2, c.roots(), "trial " + t + ": the double pole's two roots");
                hit = Math.abs(c.meanHz() - POLE_HZ) <= k * c.uMeanHz();
                if (c.dampingRatio().isPresent()) {
                    // closed form: a double root is a quadratic factor at ζ = 1
                    hit &= Math.abs(c.dampingRatio().getAsDouble() - 1) <= k * c.uDampingRatio();
                }
            } else {
                hit = poles.stream().allMatch(r -> Math.abs(r.magnitudeHz() - POLE_HZ) <= k * r.uMagnitudeHz());
            }
            covered += hit ? 1 : 0;
        }
        // a k = 2 interval covers with probability 95 %: 34 or more of 40 fails for a correct
        // procedure with binomial probability 0.34 % (before the fix the two roots' own first-order
        // intervals, 0.5 Hz wide around 18.6 and 21.5 Hz, missed 20 Hz whenever they split)
        assertTrue(covered >= 34, "covered in " + covered + " of " + TRIALS);
        // ζ = 1 lies within ζ's k = 2 interval in 95 % of fits: 34 of 40, as above
        assertTrue(clustered >= 34, "quoted together in " + clustered + " of " + TRIALS);
    }

    // two well separated poles (3 and 16 Hz, the common-emitter benchmark stage) stay two quotes
    @Test
    void wellSeparatedPolesAreNotClustered() throws InputProblem {
        KnownResponse stage = new KnownResponse(42, 2, KnownResponse.real(-4.2), KnownResponse.real(-3, -16, -180),
                Double.NaN);
        FitResult result = new SweepFitter(FitSettings.defaults())
                .fit(stage.noisySweep(KnownResponse.logSpaced(1, 50_000, 100), 0.05, 0.5, new Random(9), true));
        // synthetic truth: the poles lie a factor 5 and more apart, tens of their uncertainties
        assertTrue(result.poles().stream().allMatch(r -> r.cluster().isEmpty()));
        assertTrue(result.zeros().stream().allMatch(r -> r.cluster().isEmpty()));
    }
}

package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.junit.jupiter.api.Test;

class RandomEffectsTest {
    @Test
    void threeReadingsWorkedByHand() {
        // y = 0, 2, 4 with u = 1: w = 1, ȳ = 2, Q = 4 + 0 + 4 = 8, Σw − Σw²/Σw = 3 − 1 = 2,
        // τ² = (8 − 2)/2 = 3, w* = 1/4, μ = 2, u(μ) = 1/√(3/4) (DerSimonian and Laird 1986, by hand)
        PooledEstimate p = RandomEffects.pool(List.of(0.0, 2.0, 4.0), List.of(1.0, 1.0, 1.0));
        assertEquals(2, p.mean(), 1e-14);
        assertEquals(Math.sqrt(3), p.tau(), 1e-14);
        assertEquals(1 / Math.sqrt(0.75), p.uMean(), 1e-14);
        assertEquals(8, p.q(), 1e-14);
    }

    @Test
    void unequalUncertaintiesWorkedByHand() {
        // y = 0, 3 with u = 1, 0.5: w = 1, 4; ȳ = 12/5 = 2.4; Q = 2.4² + 4·0.6² = 7.2;
        // Σw − Σw²/Σw = 5 − 17/5 = 1.6; τ² = (7.2 − 1)/1.6 = 3.875; w* = 1/4.875, 1/4.125;
        // μ = 3/4.125 / (1/4.875 + 1/4.125) (by hand)
        PooledEstimate p = RandomEffects.pool(List.of(0.0, 3.0), List.of(1.0, 0.5));
        double w1 = 1 / 4.875;
        double w2 = 1 / 4.125;
        assertEquals(Math.sqrt(3.875), p.tau(), 1e-13);
        assertEquals(3 * w2 / (w1 + w2), p.mean(), 1e-13);
        assertEquals(1 / Math.sqrt(w1 + w2), p.uMean(), 1e-13);
    }

    @Property(tries = 200)
    void agreeingReadingsPoolToTheirMeanWithNoSpread(@ForAll @IntRange(min = 1, max = 40) int k,
                                                     @ForAll @DoubleRange(min = -3, max = 3) double value,
                                                     @ForAll @DoubleRange(min = 0.01, max = 2) double u) {
        // k equal readings with equal u: Q = 0, so τ = 0, μ is the reading and u(μ) = u/√k
        // (the inverse-variance mean of equal weights: an identity)
        List<Double> y = new ArrayList<>();
        List<Double> us = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            y.add(value);
            us.add(u);
        }
        PooledEstimate p = RandomEffects.pool(y, us);
        assertEquals(value, p.mean(), 1e-12 * (1 + Math.abs(value)));
        assertEquals(0, p.tau());
        assertEquals(u / Math.sqrt(k), p.uMean(), 1e-12 * u);
    }

    @Property(tries = 200)
    void equalUncertaintiesPoolToTheArithmeticMean(@ForAll("seeds") long seed) {
        // with one u for all, every weight w* is the same whatever τ², so μ is the plain mean
        // (identity), computed here by Commons Math's Mean
        SplittableRandom random = new SplittableRandom(seed);
        int k = 2 + random.nextInt(30);
        double[] values = new double[k];
        List<Double> y = new ArrayList<>();
        List<Double> u = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            values[i] = random.nextGaussian() * 0.3;
            y.add(values[i]);
            u.add(0.05);
        }
        PooledEstimate p = RandomEffects.pool(y, u);
        assertEquals(new Mean().evaluate(values), p.mean(), 1e-12);
        assertTrue(p.tau() >= 0);
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Long> seeds() {
        return net.jqwik.api.Arbitraries.longs();
    }

    @Test
    void theIntervalCoversTheTrueLotMeanAboutAsOftenAsItSays() {
        // synthetic lots with known truth: 40 boards, true ln-factors from N(μ = −0.386, τ = 0.05),
        // readings with u from 0.01 to 0.05 (seed 16). μ̂ ± 1.96u(μ̂) should hold μ in about 95 % of
        // 1,000 lots; a binomial 95 % of 1,000 has a standard deviation of 0.7 %, and DL's u is a
        // little optimistic at small k (it ignores the uncertainty of τ̂²), so 92 % to 98 %
        SplittableRandom random = new SplittableRandom(16);
        double mu = Math.log(0.68);
        double tau = 0.05;
        int covered = 0;
        int lots = 1000;
        double tauSum = 0;
        for (int lot = 0; lot < lots; lot++) {
            List<Double> y = new ArrayList<>();
            List<Double> u = new ArrayList<>();
            for (int b = 0; b < 40; b++) {
                double ub = 0.01 + 0.04 * random.nextDouble();
                y.add(mu + tau * random.nextGaussian() + ub * random.nextGaussian());
                u.add(ub);
            }
            PooledEstimate p = RandomEffects.pool(y, u);
            if (Math.abs(p.mean() - mu) <= 1.96 * p.uMean()) {
                covered++;
            }
            tauSum += p.tau();
        }
        double coverage = covered / (double) lots;
        assertTrue(coverage >= 0.92 && coverage <= 0.98, "coverage " + coverage);
        // τ̂ is unbiased in τ² only; its mean over the lots lies near 0.05 (within 10 %)
        assertEquals(tau, tauSum / lots, 0.1 * tau);
    }
}

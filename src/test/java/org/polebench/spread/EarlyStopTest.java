package org.polebench.spread;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/**
 * Issue 15: the tolerance spread stops once its 5, 50 and 95 % points are known to the stated
 * precision, at the same board for the same seed, says how many boards it drew, and tells its
 * progress after every batch.
 */
class EarlyStopTest {
    private static final double[] POINTS = {0.05, 0.50, 0.95};

    @Test
    void anEarlyStopAgreesWithTheFullSpreadWithinItsStatedPrecision() throws InputProblem {
        Stage stage = demo("geophone-two-stage.stage.yaml");
        CornerSpread early = new ToleranceSpread(10_000, ToleranceSpread.DEFAULT_SEED).lowerCorner(stage);
        CornerSpread full = new ToleranceSpread(10_000, ToleranceSpread.DEFAULT_SEED).withPrecision(0).lowerCorner(stage);
        String figures = String.format(Locale.ROOT, "stopped at %d of %d boards", early.samplesDrawn(),
                early.samplesPlanned());
        assertTrue(early.stoppedEarly() && early.samplesDrawn() % ToleranceSpread.CHECK_EVERY == 0, figures);
        assertEquals(ToleranceSpread.DEFAULT_PRECISION, early.stoppedAt());
        assertEquals(10_000, full.samplesDrawn());
        assertTrue(!full.stoppedEarly() && full.stoppedAt() == 0);
        for (double p : POINTS) {
            // the full spread as the reference (a synthetic truth from more draws of the same
            // boards): the early percentile within the stated ±0.5 %, the width of a 95 %
            // interval; the early draws are the first of the full spread's, so they are nested
            double reference = full.percentileHz(p).getAsDouble();
            double estimate = early.percentileHz(p).getAsDouble();
            assertEquals(reference, estimate, ToleranceSpread.DEFAULT_PRECISION * reference, figures + ", p = " + p);
        }
    }

    @Test
    void theStopIsTheFirstCheckWhereEveryIntervalIsNarrowEnough() throws InputProblem {
        // the rule recomputed from the full spread's draws in order, with the exact binomial
        // interval of Hahn and Meeker (Statistical Intervals, 1991, 5.2) computed here by
        // counting: l is the largest rank with P(B < l) ≤ 2.5 %, u the smallest with P(B < u) ≥ 97.5 %
        Stage stage = demo("geophone-two-stage.stage.yaml");
        CornerSpread early = new ToleranceSpread(10_000, 7L).lowerCorner(stage);
        int expected = 10_000;
        for (int n = ToleranceSpread.CHECK_EVERY; n < 10_000; n += ToleranceSpread.CHECK_EVERY) {
            // a spread of n boards draws the same first n boards (one generator, in order)
            List<Double> first = new ToleranceSpread(n, 7L).withPrecision(0).lowerCorner(stage).cornersHz();
            if (narrow(first, ToleranceSpread.DEFAULT_PRECISION)) {
                expected = n;
                break;
            }
        }
        assertEquals(expected, early.samplesDrawn());
        // and the same seed stops at the same board, with the same corners (repeatable)
        assertEquals(early, new ToleranceSpread(10_000, 7L).withThreads(1).lowerCorner(stage));
    }

    @Test
    void progressIsToldAfterEveryBatchUpToTheBoardsDrawn() throws InputProblem {
        Stage stage = demo("vibration-buffer-cs.stage.yaml");
        List<Integer> told = new ArrayList<>();
        CornerSpread spread = new ToleranceSpread(1_000, 3L).lowerCorner(stage, (drawn, planned) -> {
            assertEquals(1_000, planned);
            told.add(drawn);
        });
        // 1000 boards in batches of 200: told at 200, 400, …, 1000 (no check falls before the end)
        assertEquals(List.of(200, 400, 600, 800, 1000), told);
        assertEquals(1_000, spread.samplesDrawn());
    }

    private static boolean narrow(List<Double> corners, double precision) {
        double[] sorted = corners.stream().filter(c -> !Double.isNaN(c) && c > 0).mapToDouble(Double::doubleValue)
                .sorted().toArray();
        int n = sorted.length;
        if (n < ToleranceSpread.CHECK_EVERY / 2) {
            return false;
        }
        List<Double> list = new ArrayList<>();
        for (double v : sorted) {
            list.add(v);
        }
        CornerSpread spread = new CornerSpread(n, 0, 0, list);
        for (double p : POINTS) {
            int[] ranks = binomialRanks(n, p);
            double halfWidth = (sorted[ranks[1] - 1] - sorted[ranks[0] - 1]) / 2;
            if (halfWidth > precision * spread.percentileHz(p).getAsDouble()) {
                return false;
            }
        }
        return true;
    }

    // the binomial (n, p) CDF summed term by term in logs (no library): the 2.5 % point l (the
    // smallest k with P(B ≤ k) ≥ 0.025) and one above the 97.5 % point
    private static int[] binomialRanks(int n, double p) {
        double cumulative = 0;
        int low = -1;
        int high = -1;
        double lnTerm = n * Math.log1p(-p);
        for (int k = 0; k <= n && high < 0; k++) {
            if (k > 0) {
                lnTerm += Math.log((double) (n - k + 1) / k) + Math.log(p) - Math.log1p(-p);
            }
            cumulative += Math.exp(lnTerm);
            if (low < 0 && cumulative >= 0.025) {
                low = k;
            }
            if (cumulative >= 0.975) {
                high = k + 1;
            }
        }
        return new int[] {Math.max(1, low), Math.min(n, high)};
    }

    private static Stage demo(String fileName) throws InputProblem {
        return new StageReader().read(Path.of("sample-measurements", fileName)).stage();
    }
}

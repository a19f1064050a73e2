package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** Predicted and measured roots paired by the least total |ln|s_pred| − ln|s_meas|| (issue 14). */
class RootPairingTest {

    @Test
    void aNearRootIsNotLeftFreeWhileAFarOneIsPaired() {
        // issue 14: nearest-first put a root beside a far one while a near one stayed free.
        // By hand: pairing 2 with 1.5 first (|ln 4/3| = 0.288) leaves 1 beside 10 (ln 10 = 2.303),
        // 2.590 in all; 1 with 1.5 and 2 with 10 cost ln 1.5 + ln 5 = 0.405 + 1.609 = 2.015.
        int[] partner = Reconciler.pairing(new double[]{1, 2}, new double[]{1.5, 10});
        assertArrayEquals(new int[]{0, 1}, partner);
    }

    @Test
    void dcIsPairedOnlyWithDc() {
        // by the rule stated in Reconciler.matches: a DC zero is never set beside a finite root
        int[] partner = Reconciler.pairing(new double[]{0, 0, 5}, new double[]{7, 0});
        assertEquals(0, partner[2], "the finite root pairs with the finite one");
        assertEquals(0, partner[0] + partner[1], "one DC zero pairs with the measured DC zero (1), the other alone (−1)");
        assertEquals(1, Math.max(partner[0], partner[1]));
    }

    @Test
    void agreesWithBruteForceOverEveryPairing() {
        // the source of truth: every partial one-to-one pairing enumerated; the best has the most
        // pairs, then the least total distance (the rule Reconciler.matches states). Seed 14.
        // 1e-9: sums of a few logarithms, compared after different orders of addition.
        Random random = new Random(14);
        for (int trial = 0; trial < 400; trial++) {
            int p = random.nextInt(7);
            int m = random.nextInt(7);
            double[] predicted = roots(random, p);
            double[] measured = roots(random, m);
            int[] partner = Reconciler.pairing(predicted, measured);
            double[] best = {-1, Double.POSITIVE_INFINITY};
            bruteForce(predicted, measured, 0, new boolean[m], 0, 0, best);
            double[] found = score(predicted, measured, partner);
            assertEquals(best[0], found[0], "pairs, trial " + trial);
            assertEquals(best[1], found[1], 1e-9, "total distance, trial " + trial);
        }
    }

    @Test
    void squareAssignmentAgreesWithBruteForceOverPermutations() {
        // every permutation of up to 7 columns tried; seed 1955 (Kuhn's year); 1e-9 as above
        Random random = new Random(1955);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + random.nextInt(7);
            double[][] cost = new double[n][n];
            for (double[] row : cost) {
                for (int j = 0; j < n; j++) {
                    row[j] = random.nextInt(4) == 0 ? random.nextInt(5) : 10 * random.nextDouble();
                }
            }
            int[] column = MinimumCostAssignment.solve(cost);
            boolean[] used = new boolean[n];
            double total = 0;
            for (int i = 0; i < n; i++) {
                assertEquals(false, used[column[i]], "each column once");
                used[column[i]] = true;
                total += cost[i][column[i]];
            }
            assertEquals(permutations(cost, 0, new boolean[n]), total, 1e-9, "trial " + trial);
        }
    }

    private static double[] roots(Random random, int count) {
        double[] roots = new double[count];
        for (int i = 0; i < count; i++) {
            // one in five at DC; the rest spread over four decades of rad/s
            roots[i] = random.nextInt(5) == 0 ? 0 : Math.pow(10, 4 * random.nextDouble());
        }
        return roots;
    }

    private static double[] score(double[] predicted, double[] measured, int[] partner) {
        int pairs = 0;
        double total = 0;
        for (int i = 0; i < predicted.length; i++) {
            if (partner[i] >= 0) {
                pairs++;
                total += lnDistance(predicted[i], measured[partner[i]]);
            }
        }
        return new double[]{pairs, total};
    }

    private static void bruteForce(double[] predicted, double[] measured, int i, boolean[] used, int pairs,
                                   double total, double[] best) {
        if (i == predicted.length) {
            if (pairs > best[0] || (pairs == best[0] && total < best[1])) {
                best[0] = pairs;
                best[1] = total;
            }
            return;
        }
        bruteForce(predicted, measured, i + 1, used, pairs, total, best);
        for (int j = 0; j < measured.length; j++) {
            boolean allowed = (predicted[i] == 0) == (measured[j] == 0);
            if (!used[j] && allowed) {
                used[j] = true;
                bruteForce(predicted, measured, i + 1, used, pairs + 1, total + lnDistance(predicted[i], measured[j]),
                        best);
                used[j] = false;
            }
        }
    }

    private static double lnDistance(double a, double b) {
        return a == 0 && b == 0 ? 0 : Math.abs(Math.log(a) - Math.log(b));
    }

    private static double permutations(double[][] cost, int row, boolean[] used) {
        if (row == cost.length) {
            return 0;
        }
        double best = Double.POSITIVE_INFINITY;
        for (int j = 0; j < cost.length; j++) {
            if (!used[j]) {
                used[j] = true;
                best = Math.min(best, cost[row][j] + permutations(cost, row + 1, used));
                used[j] = false;
            }
        }
        return best;
    }
}

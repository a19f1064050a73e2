package org.polebench.lot;

import java.util.ArrayList;
import java.util.List;

/**
 * Applies the Western Electric run rules ({@link RunRule}) to a sequence. A rule is broken at a
 * point when the pattern is complete there and the point itself belongs to it (it lies in the
 * zone, on the side, the pattern names), so each signal is flagged where it could first be
 * seen. A zero σ (every point equal) breaks no rule.
 */
final class RunRules {
    /**
     * A point within 1e-9σ of a zone edge or of the centre line is taken as on it (not beyond,
     * and on neither side), so that round-off in the mean cannot decide a rule.
     */
    private static final double EDGE = 1e-9;

    private RunRules() {
    }

    /** @return the rules broken, in rule order; a rule not broken is left out */
    static List<RuleBreak> breaks(double[] x, double centre, double sigma) {
        List<RuleBreak> out = new ArrayList<>();
        if (!(sigma > 0)) {
            return out;
        }
        double[] z = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            z[i] = (x[i] - centre) / sigma;
        }
        for (RunRule rule : RunRule.values()) {
            List<Integer> points = new ArrayList<>();
            for (int i = 0; i < z.length; i++) {
                if (completes(rule, z, i)) {
                    points.add(i);
                }
            }
            if (!points.isEmpty()) {
                out.add(new RuleBreak(rule, points));
            }
        }
        return out;
    }

    private static boolean completes(RunRule rule, double[] z, int i) {
        switch (rule) {
            case BEYOND_3_SIGMA:
                return Math.abs(z[i]) > 3 + EDGE;
            case TWO_OF_THREE_BEYOND_2_SIGMA:
                return count(z, i, 3, 2, 2);
            case FOUR_OF_FIVE_BEYOND_1_SIGMA:
                return count(z, i, 5, 1, 4);
            default:
                return count(z, i, 8, 0, 8);
        }
    }

    /**
     * @return whether the window of {@code length} points ending at {@code i} holds at least
     *         {@code needed} points beyond {@code zone} σ on the side of point i, point i among them
     */
    private static boolean count(double[] z, int i, int length, double zone, int needed) {
        if (i + 1 < length || Math.abs(z[i]) <= EDGE) {
            return false;
        }
        double side = Math.signum(z[i]);
        if (!(side * z[i] > zone + EDGE)) {
            return false;
        }
        int beyond = 0;
        for (int j = i - length + 1; j <= i; j++) {
            if (side * z[j] > zone + EDGE) {
                beyond++;
            }
        }
        return beyond >= needed;
    }
}

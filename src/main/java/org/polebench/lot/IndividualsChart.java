package org.polebench.lot;

import java.util.ArrayList;
import java.util.List;

/**
 * A Shewhart individuals chart of one quantity in test order (Montgomery, Introduction to
 * Statistical Quality Control, "Control charts for individual measurements"): the centre line is
 * the mean, σ is estimated from the average moving range of two successive points as
 * σ̂ = MR̄/d₂ with d₂ = 1.128 for n = 2, and the control limits are the centre ± 3σ̂. The
 * moving-range estimate follows the short-term variation, so a drift or a step in the lot
 * widens the limits less than the overall standard deviation would. The limits are trial limits
 * revised as Montgomery describes for a first look at a process (phase I): the points beyond
 * them are set aside and the centre and MR̄ computed again from the rest (the moving ranges
 * between successive points kept), until no kept point lies beyond; a decade slip among forty
 * boards would otherwise lift the centre above every sound board and widen the limits around
 * it. The run rules are then applied to every point against the revised limits.
 *
 * @param quantity        which figure
 * @param points          the boards' values in test order
 * @param centre          the centre line, the mean of the points
 * @param averageMovingRange MR̄, the mean of |xᵢ − xᵢ₋₁|
 * @param sigma           σ̂ = MR̄/1.128
 * @param lowerLimit      centre − 3σ̂
 * @param upperLimit      centre + 3σ̂
 * @param breaks          for each run rule broken, the points where its pattern completes
 * @param setAside        the points left out of the centre and MR̄ (beyond the trial limits),
 *                        ascending indices
 */
public record IndividualsChart(LotQuantity quantity, List<ChartPoint> points, double centre,
                               double averageMovingRange, double sigma, double lowerLimit, double upperLimit,
                               List<RuleBreak> breaks, List<Integer> setAside) {
    /** d₂ for moving ranges of two points (Montgomery, table of control chart constants). */
    public static final double D2 = 1.128;

    public IndividualsChart {
        points = List.copyOf(points);
        breaks = List.copyOf(breaks);
        setAside = List.copyOf(setAside);
    }

    /** @return how many points the centre and the limits rest on */
    public int pointsUsed() {
        return points.size() - setAside.size();
    }

    /**
     * @param points at least two, in test order
     */
    static IndividualsChart of(LotQuantity quantity, List<ChartPoint> points) {
        if (points.size() < 2) {
            throw new IllegalArgumentException("an individuals chart needs two points, had " + points.size());
        }
        double[] x = new double[points.size()];
        for (int i = 0; i < x.length; i++) {
            x[i] = points.get(i).value();
        }
        boolean[] kept = new boolean[x.length];
        java.util.Arrays.fill(kept, true);
        double[] fit = centreAndRange(x, kept);
        for (int round = 0; round < x.length; round++) {
            double sigma = fit[1] / D2;
            boolean[] next = kept.clone();
            int left = 0;
            for (int i = 0; i < x.length; i++) {
                next[i] = kept[i] && Math.abs(x[i] - fit[0]) <= 3 * sigma * (1 + 1e-12);
                left += next[i] ? 1 : 0;
            }
            if (java.util.Arrays.equals(next, kept) || left < 2) {
                break;
            }
            kept = next;
            fit = centreAndRange(x, kept);
        }
        List<Integer> setAside = new ArrayList<>();
        for (int i = 0; i < x.length; i++) {
            if (!kept[i]) {
                setAside.add(i);
            }
        }
        double sigma = fit[1] / D2;
        return new IndividualsChart(quantity, points, fit[0], fit[1], sigma, fit[0] - 3 * sigma, fit[0] + 3 * sigma,
                RunRules.breaks(x, fit[0], sigma), setAside);
    }

    /** @return {mean, mean moving range} of the kept points, ranges between successive kept points */
    private static double[] centreAndRange(double[] x, boolean[] kept) {
        double sum = 0;
        int n = 0;
        double ranges = 0;
        int r = 0;
        int previous = -1;
        for (int i = 0; i < x.length; i++) {
            if (!kept[i]) {
                continue;
            }
            sum += x[i];
            n++;
            if (previous >= 0) {
                ranges += Math.abs(x[i] - x[previous]);
                r++;
            }
            previous = i;
        }
        return new double[]{sum / n, r == 0 ? 0 : ranges / r};
    }

    /** @return the indices of the points that break any rule, ascending, each once */
    public List<Integer> flagged() {
        boolean[] marked = new boolean[points.size()];
        for (RuleBreak b : breaks) {
            for (int i : b.points()) {
                marked[i] = true;
            }
        }
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < marked.length; i++) {
            if (marked[i]) {
                out.add(i);
            }
        }
        return out;
    }
}

package org.polebench.lot;

import java.util.ArrayList;
import java.util.List;

/**
 * A Shewhart individuals chart of one quantity in test order (Montgomery, Introduction to
 * Statistical Quality Control, "Control charts for individual measurements"): the centre line is
 * the mean, σ is estimated from the average moving range of two successive points as
 * σ̂ = MR̄/d₂ with d₂ = 1.128 for n = 2, and the control limits are the centre ± 3σ̂. The
 * moving-range estimate follows the short-term variation, so a drift or a step in the lot
 * widens the limits less than the overall standard deviation would.
 *
 * @param quantity        which figure
 * @param points          the boards' values in test order
 * @param centre          the centre line, the mean of the points
 * @param averageMovingRange MR̄, the mean of |xᵢ − xᵢ₋₁|
 * @param sigma           σ̂ = MR̄/1.128
 * @param lowerLimit      centre − 3σ̂
 * @param upperLimit      centre + 3σ̂
 * @param breaks          for each run rule broken, the points where its pattern completes
 */
public record IndividualsChart(LotQuantity quantity, List<ChartPoint> points, double centre,
                               double averageMovingRange, double sigma, double lowerLimit, double upperLimit,
                               List<RuleBreak> breaks) {
    /** d₂ for moving ranges of two points (Montgomery, table of control chart constants). */
    public static final double D2 = 1.128;

    public IndividualsChart {
        points = List.copyOf(points);
        breaks = List.copyOf(breaks);
    }

    /**
     * @param points at least two, in test order
     */
    static IndividualsChart of(LotQuantity quantity, List<ChartPoint> points) {
        if (points.size() < 2) {
            throw new IllegalArgumentException("an individuals chart needs two points, had " + points.size());
        }
        double sum = 0;
        double ranges = 0;
        for (int i = 0; i < points.size(); i++) {
            sum += points.get(i).value();
            if (i > 0) {
                ranges += Math.abs(points.get(i).value() - points.get(i - 1).value());
            }
        }
        double centre = sum / points.size();
        double mrBar = ranges / (points.size() - 1);
        double sigma = mrBar / D2;
        double[] x = new double[points.size()];
        for (int i = 0; i < x.length; i++) {
            x[i] = points.get(i).value();
        }
        return new IndividualsChart(quantity, points, centre, mrBar, sigma, centre - 3 * sigma,
                centre + 3 * sigma, RunRules.breaks(x, centre, sigma));
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

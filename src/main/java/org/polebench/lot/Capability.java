package org.polebench.lot;

import java.util.OptionalDouble;

/**
 * The process capability index Cpk of one quantity against the stage's limits (Montgomery,
 * Introduction to Statistical Quality Control, "Process capability ratios"):
 * Cpk = min(USL − μ, μ − LSL)/(3σ), with μ the lot's mean and σ the within-lot σ̂ = MR̄/1.128 of
 * the individuals chart (both from the points within its revised limits). When the stage gives
 * one limit only, the index is one-sided: Cpu = (USL − μ)/(3σ) or Cpl = (μ − LSL)/(3σ). Ppk,
 * the same with the mean and the sample standard deviation of every board, is given beside it:
 * Cpk well above Ppk says the lot drifted, stepped or holds boards far out.
 *
 * @param quantity   which figure
 * @param lowerLimit the lower specification limit, when the stage gives one
 * @param upperLimit the upper specification limit, when the stage gives one
 * @param mean       μ, the centre line of the individuals chart
 * @param sigma      σ̂ = MR̄/1.128
 * @param cpk        the index; infinite when σ̂ is 0
 * @param ppk        the index with every board's mean and sample standard deviation
 * @param boards     how many boards' values Cpk rests on (those within the chart's limits)
 * @param allBoards  how many boards' values Ppk rests on
 */
public record Capability(LotQuantity quantity, OptionalDouble lowerLimit, OptionalDouble upperLimit, double mean,
                         double sigma, double cpk, double ppk, int boards, int allBoards) {

    /** @return true when the stage gives only one of the two limits (Cpu or Cpl) */
    public boolean oneSided() {
        return lowerLimit.isPresent() != upperLimit.isPresent();
    }

    /**
     * @return the index, or empty when the stage gives no limit for the quantity or there are
     *         fewer than two boards
     */
    static java.util.Optional<Capability> of(IndividualsChart chart, double overallMean, double overallSd,
                                             OptionalDouble lower, OptionalDouble upper) {
        if (lower.isEmpty() && upper.isEmpty()) {
            return java.util.Optional.empty();
        }
        double mean = chart.centre();
        return java.util.Optional.of(new Capability(chart.quantity(), lower, upper, mean, chart.sigma(),
                index(mean, chart.sigma(), lower, upper), index(overallMean, overallSd, lower, upper), chart.pointsUsed(),
                chart.points().size()));
    }

    private static double index(double mean, double sigma, OptionalDouble lower, OptionalDouble upper) {
        double index = Double.POSITIVE_INFINITY;
        if (upper.isPresent()) {
            index = Math.min(index, (upper.getAsDouble() - mean) / (3 * sigma));
        }
        if (lower.isPresent()) {
            index = Math.min(index, (mean - lower.getAsDouble()) / (3 * sigma));
        }
        return index;
    }
}

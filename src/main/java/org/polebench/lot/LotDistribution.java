package org.polebench.lot;

import java.util.List;

/**
 * One measured quantity across a lot against its predicted band: the quantiles of the boards'
 * values (Hyndman and Fan 1996, definition 7) and how many lie in the band.
 *
 * @param quantity    which figure
 * @param valuesSorted every board's value, ascending (Hz or dB)
 * @param minimum     the smallest value
 * @param q05         the 5th percentile
 * @param q25         the lower quartile
 * @param median      the median
 * @param q75         the upper quartile
 * @param q95         the 95th percentile
 * @param maximum     the largest value
 * @param mean        the arithmetic mean
 * @param standardDeviation the sample standard deviation (n − 1); NaN for one board
 * @param predicted   the stage's predicted band for this quantity
 * @param insideBand  boards whose value lies within the predicted band
 */
public record LotDistribution(LotQuantity quantity, List<Double> valuesSorted, double minimum, double q05, double q25,
                              double median, double q75, double q95, double maximum, double mean,
                              double standardDeviation, PredictedBand predicted, int insideBand) {
    public LotDistribution {
        valuesSorted = List.copyOf(valuesSorted);
    }

    /** @return boards with a value */
    public int boards() {
        return valuesSorted.size();
    }

    /**
     * @param values  the boards' values in any order, at least one
     * @param band    the predicted band
     */
    static LotDistribution of(LotQuantity quantity, List<Double> values, PredictedBand band) {
        List<Double> sorted = values.stream().sorted().toList();
        double sum = 0;
        int inside = 0;
        for (double v : sorted) {
            sum += v;
            if (band.holds(v)) {
                inside++;
            }
        }
        double mean = sum / sorted.size();
        double squares = 0;
        for (double v : sorted) {
            squares += (v - mean) * (v - mean);
        }
        double sd = sorted.size() > 1 ? Math.sqrt(squares / (sorted.size() - 1)) : Double.NaN;
        return new LotDistribution(quantity, sorted, sorted.get(0), Quantiles.of(sorted, 0.05),
                Quantiles.of(sorted, 0.25), Quantiles.of(sorted, 0.5), Quantiles.of(sorted, 0.75),
                Quantiles.of(sorted, 0.95), sorted.get(sorted.size() - 1), mean, sd, band, inside);
    }
}

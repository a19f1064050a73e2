package org.polebench.lot;

import java.util.List;

/**
 * Sample quantiles by linear interpolation between order statistics: Hyndman and Fan, "Sample
 * quantiles in statistical packages", The American Statistician 50(4), 1996, definition 7, the
 * one {@link org.polebench.spread.CornerSpread} uses, so a measured and a predicted percentile
 * are read alike.
 */
final class Quantiles {
    private Quantiles() {
    }

    /**
     * @param sorted   ascending, at least one value
     * @param fraction in [0, 1]
     */
    static double of(List<Double> sorted, double fraction) {
        if (sorted.isEmpty()) {
            throw new IllegalArgumentException("a quantile needs at least one value");
        }
        if (!(fraction >= 0 && fraction <= 1)) {
            throw new IllegalArgumentException("a quantile fraction lies in [0, 1], was " + fraction);
        }
        double position = fraction * (sorted.size() - 1);
        int below = (int) Math.floor(position);
        int above = Math.min(sorted.size() - 1, below + 1);
        double weight = position - below;
        return sorted.get(below) * (1 - weight) + sorted.get(above) * weight;
    }
}

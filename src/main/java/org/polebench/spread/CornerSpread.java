package org.polebench.spread;

import java.util.List;
import java.util.OptionalDouble;

/**
 * The predicted lower corner's distribution over the part tolerances.
 *
 * @param samplesDrawn   how many boards were drawn
 * @param seed           the random seed, so that the spread can be repeated
 * @param biasFailures   draws whose bias left the active region (not in {@code cornersHz})
 * @param cornersHz      the exact lower corner of every analysed draw, ascending, in Hz
 * @param samplesPlanned how many boards the spread would have drawn had it not stopped early
 * @param stoppedAt      the relative precision to which the 5, 50 and 95 % points were known
 *                       when the spread stopped early (their 95 % intervals' half-widths,
 *                       {@link ToleranceSpread}); 0 when every planned board was drawn
 */
public record CornerSpread(int samplesDrawn, long seed, int biasFailures, List<Double> cornersHz, int samplesPlanned,
                           double stoppedAt) {
    public CornerSpread {
        cornersHz = List.copyOf(cornersHz);
    }

    /** A spread that drew every planned board. */
    public CornerSpread(int samplesDrawn, long seed, int biasFailures, List<Double> cornersHz) {
        this(samplesDrawn, seed, biasFailures, cornersHz, samplesDrawn, 0);
    }

    /** @return whether the spread stopped before its planned number of boards */
    public boolean stoppedEarly() {
        return samplesDrawn < samplesPlanned;
    }

    /**
     * @param fraction in [0, 1], e.g. 0.05 for the 5th percentile
     * @return the percentile by linear interpolation between order statistics (Hyndman and Fan
     *         1996, definition 7, the common default); empty when no draw was analysed
     */
    public OptionalDouble percentileHz(double fraction) {
        if (!(fraction >= 0 && fraction <= 1)) {
            throw new IllegalArgumentException("a percentile fraction lies in [0, 1], was " + fraction);
        }
        int n = cornersHz.size();
        if (n == 0) {
            return OptionalDouble.empty();
        }
        double position = fraction * (n - 1);
        int below = (int) Math.floor(position);
        int above = Math.min(n - 1, below + 1);
        double weight = position - below;
        return OptionalDouble.of(cornersHz.get(below) * (1 - weight) + cornersHz.get(above) * weight);
    }

    /**
     * @return the fraction of analysed draws whose corner lies at or below {@code cornerHz}: where a
     *         measured corner falls in the design spread; empty when no draw was analysed
     */
    public OptionalDouble fractionAtOrBelow(double cornerHz) {
        int n = cornersHz.size();
        if (n == 0) {
            return OptionalDouble.empty();
        }
        int low = 0;
        int high = n;
        while (low < high) {
            int mid = (low + high) >>> 1;
            if (cornersHz.get(mid) <= cornerHz) {
                low = mid + 1;
            } else {
                high = mid;
            }
        }
        return OptionalDouble.of(low / (double) n);
    }

    public int analysed() {
        return cornersHz.size();
    }
}

package org.polebench.sweep;

import java.util.Arrays;
import java.util.OptionalDouble;

/**
 * Reads the midband level and a rough lower −3 dB corner straight from a sweep's points,
 * with no model: a check of the data, not the fit.
 *
 * <ul>
 * <li>Midband level: the median of the top decile of gain values (at least one point), which
 *     ignores a single high outlier or a little peaking.</li>
 * <li>Corner: from the point of highest gain, scan down in frequency to the first point more
 *     than 10·log10(2) ≈ 3.01 dB (half power) below the midband level, and interpolate linearly
 *     in gain (dB) against log frequency between it and the point above.</li>
 * <li>Reaching above: when the highest-gain point is the sweep's top point and the gain rose
 *     by more than {@link #RISING_DB_PER_OCTAVE} dB over the top octave, the sweep is still on
 *     the low-frequency slope and its midband is unknown. A first-order high-pass rises
 *     0.34 dB over the octave up to 6× its corner (closed form), so a sweep that ends there
 *     still counts as levelled off.</li>
 * </ul>
 */
public final class RoughLowerCorner {
    /** A rise steeper than this over the top octave means the sweep has not levelled off. */
    public static final double RISING_DB_PER_OCTAVE = 0.5;
    private static final double HALF_POWER_DB = 10 * Math.log10(2);

    public LowerCornerEstimate estimate(Sweep sweep) {
        int n = sweep.size();
        // read from the packed columns: a 10-million-point sweep needs one copy of its gains here, not two
        PackedPoints gains = sweep.packed();
        double[] sorted = new double[n];
        int highest = 0;
        for (int i = 0; i < n; i++) {
            sorted[i] = gains.gainDb(i);
            if (sorted[i] > sorted[highest]) {
                highest = i;
            }
        }
        Arrays.sort(sorted);
        int top = Math.max(1, (int) Math.ceil(n / 10.0));
        double midband = median(sorted, n - top, n);
        boolean reachesAbove = !(highest == n - 1 && riseOverTopOctave(sweep) > RISING_DB_PER_OCTAVE);
        double target = midband - HALF_POWER_DB;
        OptionalDouble corner = OptionalDouble.empty();
        boolean reachesBelow = false;
        for (int i = highest - 1; i >= 0; i--) {
            if (gains.gainDb(i) < target) {
                reachesBelow = true;
                double logLow = Math.log(gains.frequencyHz(i));
                double logHigh = Math.log(gains.frequencyHz(i + 1));
                double t = (target - gains.gainDb(i)) / (gains.gainDb(i + 1) - gains.gainDb(i));
                corner = OptionalDouble.of(Math.exp(logLow + t * (logHigh - logLow)));
                break;
            }
        }
        return new LowerCornerEstimate(midband, reachesAbove ? corner : OptionalDouble.empty(), reachesBelow,
                reachesAbove);
    }

    private static double median(double[] sorted, int from, int to) {
        int n = to - from;
        int mid = from + n / 2;
        return n % 2 == 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
    }

    /** @return the gain rise in dB over the top octave, scaled to an octave when the sweep spans less */
    private static double riseOverTopOctave(Sweep sweep) {
        int n = sweep.size();
        double topHz = sweep.highestHz();
        double topGain = sweep.points().get(n - 1).gainDb();
        double octaveDown = topHz / 2;
        if (sweep.lowestHz() >= octaveDown) {
            double octaves = Math.log(topHz / sweep.lowestHz()) / Math.log(2);
            return (topGain - sweep.points().get(0).gainDb()) / octaves;
        }
        for (int i = n - 2; i >= 0; i--) {
            double f = sweep.points().get(i).frequencyHz();
            if (f <= octaveDown) {
                double fAbove = sweep.points().get(i + 1).frequencyHz();
                double t = Math.log(octaveDown / f) / Math.log(fAbove / f);
                double g = sweep.points().get(i).gainDb()
                        + t * (sweep.points().get(i + 1).gainDb() - sweep.points().get(i).gainDb());
                return topGain - g;
            }
        }
        return 0;
    }
}

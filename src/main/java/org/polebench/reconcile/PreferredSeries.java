package org.polebench.reconcile;

import java.util.List;

/**
 * The IEC 60063:2015 preferred-number series E6, E12 and E24, as published (hard-coded,
 * because rounding 10^(n/24) gives wrong members such as 2.6 for 2.7 and 8.3 for 8.2).
 * A part's tolerance chooses the series it is sold in: ±20 % E6, ±10 % E12, ±5 % and tighter
 * E24 (the E48 and E96 tables are not carried; a 1 % part is matched against E24, which is a
 * subset of neither E48 nor E96, so its nearest value is stated as an E24 one).
 */
public enum PreferredSeries {
    E6(List.of(1.0, 1.5, 2.2, 3.3, 4.7, 6.8)),
    E12(List.of(1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2)),
    E24(List.of(1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
            3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1));

    private final List<Double> decade;

    PreferredSeries(List<Double> decade) {
        this.decade = decade;
    }

    /** @return the members of one decade, 1.0 up to below 10 */
    public List<Double> decade() {
        return decade;
    }

    /**
     * @param halfWidthFraction the larger side of the part's tolerance band, e.g. 0.2 for ±20 %
     *                          or 0.8 for −20 %/+80 %
     */
    public static PreferredSeries forTolerance(double halfWidthFraction) {
        if (halfWidthFraction >= 0.2 - 1e-12) {
            return E6;
        }
        if (halfWidthFraction >= 0.1 - 1e-12) {
            return E12;
        }
        return E24;
    }

    /**
     * The member nearest to a value, compared in log space (a ratio error, as tolerances are).
     *
     * @param value positive, in any unit
     * @return the nearest member, in the same unit
     */
    public double nearest(double value) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new IllegalArgumentException("a preferred value needs a positive value, was " + value);
        }
        double exponent = Math.floor(Math.log10(value));
        double best = Double.NaN;
        double bestDistance = Double.POSITIVE_INFINITY;
        // neighbours across the decade boundary: 9.6 is nearer 10 than 9.1 in E24
        for (int shift = -1; shift <= 1; shift++) {
            double scale = Math.pow(10, exponent + shift);
            for (double member : decade) {
                double candidate = member * scale;
                double distance = Math.abs(Math.log(candidate / value));
                if (distance < bestDistance) {
                    bestDistance = distance;
                    best = candidate;
                }
            }
        }
        // a member times a power of ten carries float noise (4.7 × 1e-6); print-stable rounding
        return Double.parseDouble(String.format(java.util.Locale.ROOT, "%.3e", best));
    }
}

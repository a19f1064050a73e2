package org.polebench.fit;

/**
 * A value with its standard uncertainty u and the coverage factor k of its expanded
 * uncertainty U = k·u (GUM, JCGM 100:2008, 6.2–6.3). The unit is that of the field holding it.
 *
 * @param value               the estimate
 * @param standardUncertainty u, non-negative
 * @param coverageFactor      k, 2 when the point uncertainties were stated and consistent,
 *                            otherwise Student's t for the fit's degrees of freedom at 95.45 %
 */
public record Estimate(double value, double standardUncertainty, double coverageFactor) {
    public Estimate {
        if (!(standardUncertainty >= 0) || !(coverageFactor > 0)) {
            throw new IllegalArgumentException("an uncertainty needs u >= 0 and k > 0, had u = "
                    + standardUncertainty + ", k = " + coverageFactor);
        }
    }

    /** U = k·u. */
    public double expandedUncertainty() {
        return coverageFactor * standardUncertainty;
    }
}

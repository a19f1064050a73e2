package org.polebench.fit;

import java.util.List;
import java.util.OptionalDouble;

/**
 * Poles (or zeros) that the data do not separate from one another, quoted together: a double
 * pole fitted as two real poles a hair apart, a pair whose damping ratio lies within its
 * uncertainty of one (complex or two real roots cannot be told), a cluster of close corners. Each
 * member's own position has no usable first-order uncertainty there (the roots of a quadratic
 * move as the square root of its coefficients near a double root, so the derivative is infinite),
 * while the members' geometric mean, and for one fitted pair its damping ratio, are determined.
 *
 * @param labels        the members' labels, such as p1, p4
 * @param roots         how many roots (a pair counts two)
 * @param meanRadPerS   geometric mean of the members' |root|, rad/s: ω₀ of a pair, the corner
 *                      the cluster sets
 * @param uMeanRadPerS  its standard uncertainty, rad/s
 * @param dampingRatio  ζ of s² + 2ζω₀s + ω₀² when the members are the two roots of one fitted pair
 *                      (the fit's own coordinates, so ζ's uncertainty is first-order sound);
 *                      empty for a cluster of separately fitted roots, whose ζ ≥ 1 by construction
 *                      and has no first-order uncertainty at ζ = 1
 * @param uDampingRatio standard uncertainty of ζ; 0 when no damping ratio is quoted
 */
public record RootCluster(List<String> labels, int roots, double meanRadPerS, double uMeanRadPerS,
                          OptionalDouble dampingRatio, double uDampingRatio) {
    public RootCluster {
        labels = List.copyOf(labels);
        if (roots < 2 || !(uMeanRadPerS >= 0) || !Double.isFinite(uMeanRadPerS) || !(uDampingRatio >= 0)) {
            throw new IllegalArgumentException("a cluster needs two roots and finite, non-negative uncertainties");
        }
    }

    public double meanHz() {
        return meanRadPerS / (2 * Math.PI);
    }

    public double uMeanHz() {
        return uMeanRadPerS / (2 * Math.PI);
    }
}

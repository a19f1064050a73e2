package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.solvers.LaguerreSolver;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.exception.MathIllegalStateException;

/**
 * Roots of a real polynomial, sorted into real roots and complex-conjugate pairs. Laguerre's
 * method (Commons Math) for degree two and up; a root whose imaginary part is below 1e-7 of its
 * modulus is taken as real (round-off of a real root, not a pair).
 */
final class PolynomialRoots {
    private static final double REAL_TOLERANCE = 1e-7;
    /**
     * Bound on Laguerre iterations: the default is unbounded, and a degenerate polynomial (a
     * linearised estimate gone wrong) can then keep the solver turning for ever.
     */
    private static final int MAX_EVALUATIONS = 10_000;

    final List<Double> real = new ArrayList<>();
    /** One member of each pair, the one with positive imaginary part. */
    final List<Complex> pairs = new ArrayList<>();

    private PolynomialRoots() {
    }

    /**
     * @param ascending coefficients c₀ + c₁v + …
     * @return the roots, or null when the polynomial is degenerate (a non-finite coefficient, a
     *         zero leading one) or the solver does not converge
     */
    static PolynomialRoots of(double[] ascending) {
        PolynomialRoots roots = new PolynomialRoots();
        int degree = ascending.length - 1;
        if (degree == 0) {
            return roots;
        }
        if (ascending[degree] == 0) {
            // a root at infinity: the estimate is degenerate (and Laguerre's method would not stop)
            return null;
        }
        if (degree == 1) {
            roots.real.add(-ascending[0] / ascending[1]);
            return roots;
        }
        for (double c : ascending) {
            if (!Double.isFinite(c)) {
                return null;
            }
        }
        Complex[] all;
        try {
            all = new LaguerreSolver().solveAllComplex(ascending, 0, MAX_EVALUATIONS);
        } catch (MathIllegalStateException | IllegalArgumentException failed) {
            return null;
        }
        List<Complex> upper = new ArrayList<>();
        for (Complex r : all) {
            if (Math.abs(r.getImaginary()) <= REAL_TOLERANCE * r.abs()) {
                roots.real.add(r.getReal());
            } else if (r.getImaginary() > 0) {
                upper.add(r);
            }
        }
        // each pair needs both halves; unbalanced halves mean the solver did not converge cleanly
        int lower = degree - roots.real.size() - upper.size();
        if (lower != upper.size()) {
            return null;
        }
        roots.pairs.addAll(upper);
        return roots;
    }

    /** Roots already sorted: real ones and the upper member of each pair. */
    static PolynomialRoots of(List<Double> real, List<Complex> upperPairs) {
        PolynomialRoots roots = new PolynomialRoots();
        roots.real.addAll(real);
        roots.pairs.addAll(upperPairs);
        return roots;
    }

    /** Ascending coefficients of the monic polynomial with the given roots (conjugates implied for pairs). */
    static double[] monicFrom(List<Double> realRoots, List<Complex> upperPairs) {
        double[] poly = {1};
        for (double r : realRoots) {
            poly = times(poly, new double[]{-r, 1});
        }
        for (Complex c : upperPairs) {
            poly = times(poly, new double[]{c.abs() * c.abs(), -2 * c.getReal(), 1});
        }
        return poly;
    }

    private static double[] times(double[] a, double[] b) {
        double[] out = new double[a.length + b.length - 1];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                out[i + j] += a[i] * b[j];
            }
        }
        return out;
    }
}

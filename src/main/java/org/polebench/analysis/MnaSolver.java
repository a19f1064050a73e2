package org.polebench.analysis;

import java.util.Optional;
import org.polebench.linalg.RealLu;

/**
 * Factors an {@link MnaSystem} once (LU with partial pivoting, {@link RealLu}: the arithmetic of
 * Commons Math's LU without its wrappers) and solves it for any excitation. The singularity test is relative: a pivot below {@code relativePivot} times
 * the largest matrix entry counts as zero (Commons Math's own threshold is absolute).
 */
public final class MnaSolver {
    /** Default relative pivot threshold: far above round-off on well-posed stages (about 1e-16). */
    public static final double DEFAULT_RELATIVE_PIVOT = 1e-13;

    /**
     * τ of threshold pivoting ({@link RealLu}): a node's own conductance stays its pivot unless
     * some entry below it is a thousand times larger, so that a cascade's transconductances do
     * not shrink the later pivots by the cascade's gain (docs/method.md, "Port reduction").
     */
    static final double DIAGONAL_PREFERENCE = 1e-3;

    private final double relativePivot;

    public MnaSolver() {
        this(DEFAULT_RELATIVE_PIVOT);
    }

    public MnaSolver(double relativePivot) {
        this.relativePivot = relativePivot;
    }

    /** @return the factored system, or empty when the matrix is singular */
    public Optional<Factored> factor(MnaSystem system) {
        double[][] m = system.matrixView();
        double largest = 0;
        for (double[] row : m) {
            largest = Math.max(largest, largestMagnitude(row));
        }
        RealLu lu = new RealLu(m, relativePivot * largest, DIAGONAL_PREFERENCE);
        return lu.isNonSingular() ? Optional.of(new Factored(system, lu)) : Optional.empty();
    }

    /** @return the largest |entry| of a row (one row per call: see RealLu on loops in hot methods) */
    static double largestMagnitude(double[] row) {
        double largest = 0;
        for (double v : row) {
            largest = Math.max(largest, Math.abs(v));
        }
        return largest;
    }

    /** One factorisation of one system. */
    public static final class Factored {
        private final MnaSystem system;
        private final RealLu lu;

        private Factored(MnaSystem system, RealLu lu) {
            this.system = system;
            this.lu = lu;
        }

        /** @return the unknowns (node voltages in volts, then scaled source currents) */
        public double[] solve(double[] rhs) {
            return lu.solve(rhs);
        }

        /** @return the solution with source {@code source} at 1 V and every other source at 0 V */
        public double[] solveUnitSource(int source) {
            return solve(system.sourceExcitation(source, 1));
        }

        public MnaSystem system() {
            return system;
        }
    }
}

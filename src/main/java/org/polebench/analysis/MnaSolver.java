package org.polebench.analysis;

import java.util.Optional;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.LUDecomposition;

/**
 * Factors an {@link MnaSystem} once (Commons Math LU with partial pivoting) and solves it for
 * any excitation. The singularity test is relative: a pivot below {@code relativePivot} times
 * the largest matrix entry counts as zero (Commons Math's own threshold is absolute).
 */
public final class MnaSolver {
    /** Default relative pivot threshold: far above round-off on well-posed stages (about 1e-16). */
    public static final double DEFAULT_RELATIVE_PIVOT = 1e-13;

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
            for (double v : row) {
                largest = Math.max(largest, Math.abs(v));
            }
        }
        LUDecomposition lu = new LUDecomposition(new Array2DRowRealMatrix(m, false), relativePivot * largest);
        DecompositionSolver solver = lu.getSolver();
        return solver.isNonSingular() ? Optional.of(new Factored(system, solver)) : Optional.empty();
    }

    /** One factorisation of one system. */
    public static final class Factored {
        private final MnaSystem system;
        private final DecompositionSolver solver;

        private Factored(MnaSystem system, DecompositionSolver solver) {
            this.system = system;
            this.solver = solver;
        }

        /** @return the unknowns (node voltages in volts, then scaled source currents) */
        public double[] solve(double[] rhs) {
            return solver.solve(new ArrayRealVector(rhs, false)).toArray();
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

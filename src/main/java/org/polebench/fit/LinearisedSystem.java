package org.polebench.fit;

/**
 * One linearised least-squares problem A·c ≈ b of a Sanathanan–Koerner step: real rows (real and
 * imaginary parts of each point's equation, each divided by the point's standard uncertainty) and
 * unknowns c = (numerator coefficients, then the denominator's non-leading coefficients). Kept as
 * its own value so that a test can solve the very same system with another library. A is held by
 * columns, as the Householder solve works down whole columns.
 */
final class LinearisedSystem {
    private final double[][] columns;
    private final double[] rhs;

    /** @param columns A by columns, each of length rhs.length (taken, not copied) */
    LinearisedSystem(double[][] columns, double[] rhs) {
        this.columns = columns;
        this.rhs = rhs;
    }

    int rows() {
        return rhs.length;
    }

    int columns() {
        return columns.length;
    }

    double entry(int row, int column) {
        return columns[column][row];
    }

    double rhs(int row) {
        return rhs[row];
    }

    /** A by rows. */
    double[][] copyOfMatrix() {
        double[][] copy = new double[rows()][columns()];
        for (int j = 0; j < columns.length; j++) {
            for (int i = 0; i < rhs.length; i++) {
                copy[i][j] = columns[j][i];
            }
        }
        return copy;
    }

    /** A by columns. */
    double[][] copyOfColumns() {
        double[][] copy = new double[columns.length][];
        for (int j = 0; j < columns.length; j++) {
            copy[j] = columns[j].clone();
        }
        return copy;
    }

    double[] copyOfRhs() {
        return rhs.clone();
    }
}

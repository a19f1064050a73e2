package org.polebench.fit;

/**
 * One linearised least-squares problem A·c ≈ b of a Sanathanan–Koerner step: real rows (real and
 * imaginary parts of each point's equation, each divided by the point's standard uncertainty) and
 * unknowns c = (numerator coefficients, then the denominator's non-leading coefficients). Kept as
 * its own value so that a test can solve the very same system with another library.
 */
final class LinearisedSystem {
    private final double[][] matrix;
    private final double[] rhs;

    LinearisedSystem(double[][] matrix, double[] rhs) {
        this.matrix = matrix;
        this.rhs = rhs;
    }

    int rows() {
        return rhs.length;
    }

    int columns() {
        return matrix[0].length;
    }

    double entry(int row, int column) {
        return matrix[row][column];
    }

    double rhs(int row) {
        return rhs[row];
    }

    double[][] copyOfMatrix() {
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < matrix.length; i++) {
            copy[i] = matrix[i].clone();
        }
        return copy;
    }

    double[] copyOfRhs() {
        return rhs.clone();
    }
}

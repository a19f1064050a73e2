package org.polebench.circuit;

/**
 * Real LU factorisation with partial pivoting, PA = LU, by right-looking Gaussian elimination
 * that skips zero multipliers and zero entries of the pivot row (Golub and Van Loan, Matrix
 * Computations, 4th ed., algorithm 3.4.1): an MNA matrix is mostly zeros, and a unit source's
 * right-hand side has one non-zero, so most of the dense work is multiplying by zero. The pivot
 * rule and singularity test are those of Commons Math's {@code LUDecomposition}: the first
 * largest entry of the column, singular when its magnitude is below an absolute threshold; the
 * factors agree with that class's to round-off. Shared by the DC bias solve here and the
 * small-signal MNA solves of the analysis package. Immutable after construction.
 */
public final class RealLu {
    private final double[][] lu;
    private final int[] pivot;
    private final boolean singular;

    /**
     * @param matrix             square; not changed
     * @param singularThreshold  an absolute pivot magnitude below which the matrix is singular
     */
    public RealLu(double[][] matrix, double singularThreshold) {
        int m = matrix.length;
        lu = new double[m][];
        for (int i = 0; i < m; i++) {
            lu[i] = matrix[i].clone();
        }
        pivot = new int[m];
        for (int row = 0; row < m; row++) {
            pivot[row] = row;
        }
        singular = !factor(singularThreshold);
    }

    private boolean factor(double singularThreshold) {
        int m = lu.length;
        int[] nonZero = new int[m];
        for (int col = 0; col < m; col++) {
            int max = col;
            double largest = Double.NEGATIVE_INFINITY;
            for (int row = col; row < m; row++) {
                double size = Math.abs(lu[row][col]);
                if (size > largest) {
                    largest = size;
                    max = row;
                }
            }
            if (Math.abs(lu[max][col]) < singularThreshold) {
                return false;
            }
            if (max != col) {
                double[] t = lu[max];
                lu[max] = lu[col];
                lu[col] = t;
                int p = pivot[max];
                pivot[max] = pivot[col];
                pivot[col] = p;
            }
            double[] pivotRow = lu[col];
            int count = 0;
            for (int j = col + 1; j < m; j++) {
                if (pivotRow[j] != 0) {
                    nonZero[count++] = j;
                }
            }
            double diagonal = pivotRow[col];
            for (int row = col + 1; row < m; row++) {
                double[] luRow = lu[row];
                if (luRow[col] == 0) {
                    continue;
                }
                double multiplier = luRow[col] / diagonal;
                luRow[col] = multiplier;
                for (int n = 0; n < count; n++) {
                    int j = nonZero[n];
                    luRow[j] -= multiplier * pivotRow[j];
                }
            }
        }
        return true;
    }

    public boolean isNonSingular() {
        return !singular;
    }

    /** @return x with A·x = b; b is not changed; only for a non-singular matrix */
    public double[] solve(double[] b) {
        if (singular) {
            throw new IllegalStateException("the matrix is singular");
        }
        int m = lu.length;
        double[] x = new double[m];
        for (int row = 0; row < m; row++) {
            x[row] = b[pivot[row]];
        }
        for (int col = 0; col < m; col++) {
            double xCol = x[col];
            if (xCol == 0) {
                continue;
            }
            for (int i = col + 1; i < m; i++) {
                x[i] -= xCol * lu[i][col];
            }
        }
        for (int col = m - 1; col >= 0; col--) {
            x[col] /= lu[col][col];
            double xCol = x[col];
            if (xCol == 0) {
                continue;
            }
            for (int i = 0; i < col; i++) {
                x[i] -= xCol * lu[i][col];
            }
        }
        return x;
    }

    /** @return A⁻¹, column by column with {@link #solve}; only for a non-singular matrix */
    public double[][] inverse() {
        int m = lu.length;
        double[][] inverse = new double[m][m];
        double[] unit = new double[m];
        for (int j = 0; j < m; j++) {
            unit[j] = 1;
            double[] column = solve(unit);
            unit[j] = 0;
            for (int i = 0; i < m; i++) {
                inverse[i][j] = column[i];
            }
        }
        return inverse;
    }
}

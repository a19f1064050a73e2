package org.polebench.analysis;

/**
 * Dense real LU factorisation with partial pivoting, PA = LU, in the left-looking (Crout)
 * order of Commons Math's {@code LUDecomposition} (3.6.1), operation for operation, so that
 * factors, solutions and singularity verdicts are bit-for-bit those of that class, without its
 * matrix and vector wrappers on every solve (Golub and Van Loan, Matrix Computations, 4th ed.,
 * section 3.4). The pivot is the first largest entry of the column; the matrix counts as
 * singular when that pivot's magnitude is below the threshold. Immutable after construction.
 */
final class RealLu {
    private final double[][] lu;
    private final int[] pivot;
    private final boolean singular;

    /**
     * @param matrix             square; not changed
     * @param singularThreshold  an absolute pivot magnitude below which the matrix is singular
     */
    RealLu(double[][] matrix, double singularThreshold) {
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
        for (int col = 0; col < m; col++) {
            for (int row = 0; row < col; row++) {
                double[] luRow = lu[row];
                double sum = luRow[col];
                for (int i = 0; i < row; i++) {
                    sum -= luRow[i] * lu[i][col];
                }
                luRow[col] = sum;
            }
            int max = col;
            double largest = Double.NEGATIVE_INFINITY;
            for (int row = col; row < m; row++) {
                double[] luRow = lu[row];
                double sum = luRow[col];
                for (int i = 0; i < col; i++) {
                    sum -= luRow[i] * lu[i][col];
                }
                luRow[col] = sum;
                if (Math.abs(sum) > largest) {
                    largest = Math.abs(sum);
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
            double diagonal = lu[col][col];
            for (int row = col + 1; row < m; row++) {
                lu[row][col] /= diagonal;
            }
        }
        return true;
    }

    boolean isNonSingular() {
        return !singular;
    }

    /** @return x with A·x = b; b is not changed; only for a non-singular matrix */
    double[] solve(double[] b) {
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
            for (int i = col + 1; i < m; i++) {
                x[i] -= xCol * lu[i][col];
            }
        }
        for (int col = m - 1; col >= 0; col--) {
            x[col] /= lu[col][col];
            double xCol = x[col];
            for (int i = 0; i < col; i++) {
                x[i] -= xCol * lu[i][col];
            }
        }
        return x;
    }

    /** @return A⁻¹, column by column with {@link #solve}; only for a non-singular matrix */
    double[][] inverse() {
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

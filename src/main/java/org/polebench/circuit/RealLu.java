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
 *
 * <p>The factors sit in one array, row by row, and a pivot swaps row offsets, not entries.
 * Each method holds one loop over one row or column and leaves the next level to the one it
 * calls, and no outer loop runs an iteration whose inner range is empty: a tolerance spread
 * factors thousands of small matrices in a cold JVM, where a method whose single call runs
 * hundreds of loop iterations is compiled twice (once mid-loop, once whole), and a triangular
 * loop nest whose inner loop is empty at one end of the outer range makes HotSpot's compiled
 * code (profiled loop predication) fall back and compile again.
 */
public final class RealLu {
    private final int m;
    /** the factors: row r of L\U starts at {@code offset[r]} */
    private final double[] lu;
    private final int[] offset;
    private final int[] pivot;
    private final boolean singular;

    /**
     * @param matrix             square; not changed
     * @param singularThreshold  an absolute pivot magnitude below which the matrix is singular
     */
    public RealLu(double[][] matrix, double singularThreshold) {
        m = matrix.length;
        lu = new double[m * m];
        offset = new int[m];
        pivot = new int[m];
        for (int row = 0; row < m; row++) {
            System.arraycopy(matrix[row], 0, lu, row * m, m);
            offset[row] = row * m;
            pivot[row] = row;
        }
        singular = !factor(singularThreshold);
    }

    private boolean factor(double singularThreshold) {
        int[] nonZero = new int[m];
        for (int col = 0; col < m - 1; col++) {
            int max = largestBelow(col);
            if (Math.abs(lu[offset[max] + col]) < singularThreshold) {
                return false;
            }
            if (max != col) {
                int t = offset[max];
                offset[max] = offset[col];
                offset[col] = t;
                int p = pivot[max];
                pivot[max] = pivot[col];
                pivot[col] = p;
            }
            eliminateBelow(col, nonZero, nonZeroAfter(col, nonZero));
        }
        // the last pivot has no rows below it to eliminate
        return m == 0 || !(Math.abs(lu[offset[m - 1] + m - 1]) < singularThreshold);
    }

    /** @return the first row at or below {@code col} with the largest magnitude in column {@code col} */
    private int largestBelow(int col) {
        int max = col;
        double largest = Double.NEGATIVE_INFINITY;
        for (int row = col; row < m; row++) {
            double size = Math.abs(lu[offset[row] + col]);
            if (size > largest) {
                largest = size;
                max = row;
            }
        }
        return max;
    }

    /** @return how many columns after {@code col} the pivot row has non-zero, listed in {@code nonZero} */
    private int nonZeroAfter(int col, int[] nonZero) {
        int start = offset[col];
        int count = 0;
        for (int j = col + 1; j < m; j++) {
            if (lu[start + j] != 0) {
                nonZero[count++] = j;
            }
        }
        return count;
    }

    private void eliminateBelow(int col, int[] nonZero, int count) {
        if (count == 0) {
            // a pivot row empty after its diagonal changes nothing below but the multipliers
            storeMultipliers(col);
            return;
        }
        int pivotStart = offset[col];
        double diagonal = lu[pivotStart + col];
        for (int row = col + 1; row < m; row++) {
            int start = offset[row];
            if (lu[start + col] != 0) {
                double multiplier = lu[start + col] / diagonal;
                lu[start + col] = multiplier;
                subtractPivotRow(start, pivotStart, multiplier, nonZero, count);
            }
        }
    }

    private void storeMultipliers(int col) {
        double diagonal = lu[offset[col] + col];
        for (int row = col + 1; row < m; row++) {
            lu[offset[row] + col] /= diagonal;
        }
    }

    private void subtractPivotRow(int start, int pivotStart, double multiplier, int[] nonZero, int count) {
        for (int n = 0; n < count; n++) {
            int j = nonZero[n];
            lu[start + j] -= multiplier * lu[pivotStart + j];
        }
    }

    public boolean isNonSingular() {
        return !singular;
    }

    /** @return x with A·x = b; b is not changed; only for a non-singular matrix */
    public double[] solve(double[] b) {
        if (singular) {
            throw new IllegalStateException("the matrix is singular");
        }
        double[] x = new double[m];
        for (int row = 0; row < m; row++) {
            x[row] = b[pivot[row]];
        }
        // the last column has nothing below it and the first nothing above: they stay out of
        // the loops, whose inner ranges are then never empty (see the class comment)
        for (int col = 0; col < m - 1; col++) {
            if (x[col] != 0) {
                subtractColumn(x, col, x[col], col + 1, m);
            }
        }
        for (int col = m - 1; col > 0; col--) {
            x[col] /= lu[offset[col] + col];
            if (x[col] != 0) {
                subtractColumn(x, col, x[col], 0, col);
            }
        }
        if (m > 0) {
            x[0] /= lu[offset[0]];
        }
        return x;
    }

    /** x[i] −= xCol·(L\U)[i][col] for rows from ≤ i &lt; to */
    private void subtractColumn(double[] x, int col, double xCol, int from, int to) {
        for (int i = from; i < to; i++) {
            x[i] -= xCol * lu[offset[i] + col];
        }
    }

    private static void setColumn(double[][] matrix, int j, double[] column) {
        for (int i = 0; i < column.length; i++) {
            matrix[i][j] = column[i];
        }
    }

    /** @return A⁻¹, column by column with {@link #solve}; only for a non-singular matrix */
    public double[][] inverse() {
        double[][] inverse = new double[m][m];
        double[] unit = new double[m];
        for (int j = 0; j < m; j++) {
            unit[j] = 1;
            setColumn(inverse, j, solve(unit));
            unit[j] = 0;
        }
        return inverse;
    }
}

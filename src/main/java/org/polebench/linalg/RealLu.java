package org.polebench.linalg;

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
 * <p>The factors sit in one array, row by row, and a pivot swaps row offsets, not entries, so
 * a row keeps its place in the array (the row of the original matrix) for good. The
 * elimination lists the non-zero entries of L column by column and of U row by row as it makes
 * them, and the substitutions run over those lists only: the same operations as the dense loops, less
 * the ones with a zero factor (a 17-unknown MNA matrix factors into about a hundred non-zeros
 * of the 272 off the diagonal).
 *
 * <p>Each method holds one loop over one row or column and leaves the next level to the one it
 * calls, and no outer loop runs an iteration whose inner range is empty: a tolerance spread
 * factors thousands of small matrices in a cold JVM, where a method whose single call runs
 * hundreds of loop iterations is compiled twice (once mid-loop, once whole), and a triangular
 * loop nest whose inner loop is empty at one end of the outer range makes HotSpot's compiled
 * code (profiled loop predication) fall back and compile again.
 */
public final class RealLu {
    private final int m;
    /** the factors: row r of L\U starts at {@code offset[r]}, which is {@code pivot[r]·m} */
    private final double[] lu;
    private final int[] offset;
    private final int[] pivot;
    /** τ of threshold pivoting; 0 for plain partial pivoting. */
    private final double diagonalPreference;
    private final boolean singular;
    /** per column c: the array rows (original rows) below the diagonal where L is non-zero */
    private final int[] lowerStart;
    private final int[] lowerRows;
    /** per row r: the columns of U right of the diagonal where U is non-zero, from the right */
    private final int[] upperStart;
    private final int[] upperColumns;

    /**
     * @param matrix             square; not changed
     * @param singularThreshold  an absolute pivot magnitude below which the matrix is singular
     */
    public RealLu(double[][] matrix, double singularThreshold) {
        this(matrix, singularThreshold, 0);
    }

    /**
     * Threshold partial pivoting: the diagonal entry stays the pivot while it is at least
     * {@code diagonalPreference} times the largest entry below it in its column, and partial
     * pivoting decides otherwise (Duff, Erisman and Reid, Direct Methods for Sparse Matrices,
     * 1986, 5.4; from memory). Growth is then bounded by (1 + 1/τ) per step instead of 2. Nodal
     * matrices want it: in a cascade of amplifying stages each transconductance exceeds the
     * conductances of its column, and partial pivoting, taking the transconductance's row,
     * shrinks every later pivot by the stage's gain, to 1e-18 of the largest entry after eight
     * stages of 35 dB, so that a fixed relative pivot test calls a regular matrix singular.
     *
     * @param matrix             square; not changed
     * @param singularThreshold  an absolute pivot magnitude below which the matrix is singular
     * @param diagonalPreference τ in (0, 1], or 0 for plain partial pivoting
     */
    public RealLu(double[][] matrix, double singularThreshold, double diagonalPreference) {
        this.diagonalPreference = diagonalPreference;
        m = matrix.length;
        lu = new double[m * m];
        offset = new int[m];
        pivot = new int[m];
        for (int row = 0; row < m; row++) {
            System.arraycopy(matrix[row], 0, lu, row * m, m);
            offset[row] = row * m;
            pivot[row] = row;
        }
        int capacity = m * (m - 1) / 2;
        lowerStart = new int[m + 1];
        lowerRows = new int[capacity];
        upperStart = new int[m + 1];
        upperColumns = new int[capacity];
        singular = !factor(singularThreshold);
    }

    private boolean factor(double singularThreshold) {
        int lower = 0;
        int upper = 0;
        for (int col = 0; col < m - 1; col++) {
            int max = largestBelow(col);
            if (diagonalPreference > 0
                    && Math.abs(lu[offset[col] + col]) >= diagonalPreference * Math.abs(lu[offset[max] + col])) {
                max = col;
            }
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
            // the pivot row is final now: its non-zeros right of the diagonal are row col of U
            upperStart[col] = upper;
            upper = nonZeroAfter(col, upper);
            int count = upper - upperStart[col];
            lowerStart[col] = lower;
            if (count == 0) {
                // a pivot row empty after its diagonal changes nothing below but the multipliers
                lower = storeMultipliers(col, lower);
            } else {
                lower = eliminateBelow(col, upperStart[col], count, lower);
            }
        }
        if (m > 0) {
            lowerStart[m - 1] = lower;
            upperStart[m - 1] = upper;
        }
        lowerStart[m] = lower;
        upperStart[m] = upper;
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

    /** @return the length of U's column list after the pivot row's non-zeros after {@code col} are appended */
    private int nonZeroAfter(int col, int upper) {
        // from the right, the order in which the back substitution takes them
        int start = offset[col];
        for (int j = m - 1; j > col; j--) {
            if (lu[start + j] != 0) {
                upperColumns[upper++] = j;
            }
        }
        return upper;
    }

    /** @return the length of the list of L's non-zeros after column col's are appended */
    private int eliminateBelow(int col, int first, int count, int lower) {
        int pivotStart = offset[col];
        double diagonal = lu[pivotStart + col];
        for (int row = col + 1; row < m; row++) {
            int start = offset[row];
            if (lu[start + col] != 0) {
                double multiplier = lu[start + col] / diagonal;
                lu[start + col] = multiplier;
                lowerRows[lower++] = pivot[row];
                subtractPivotRow(start, pivotStart, multiplier, first, count);
            }
        }
        return lower;
    }

    private void subtractPivotRow(int start, int pivotStart, double multiplier, int first, int count) {
        for (int n = first; n < first + count; n++) {
            int j = upperColumns[n];
            lu[start + j] -= multiplier * lu[pivotStart + j];
        }
    }

    private int storeMultipliers(int col, int lower) {
        double diagonal = lu[offset[col] + col];
        for (int row = col + 1; row < m; row++) {
            int at = offset[row] + col;
            if (lu[at] != 0) {
                lu[at] /= diagonal;
                lowerRows[lower++] = pivot[row];
            }
        }
        return lower;
    }

    public boolean isNonSingular() {
        return !singular;
    }

    /** @return x with A·x = b; b is not changed; only for a non-singular matrix */
    public double[] solve(double[] b) {
        if (singular) {
            throw new IllegalStateException("the matrix is singular");
        }
        // forward substitution by array row: row pivot[c] is the c-th of P·A
        double[] y = b.clone();
        for (int col = 0; col < m - 1; col++) {
            double yCol = y[pivot[col]];
            if (yCol != 0 && lowerStart[col] < lowerStart[col + 1]) {
                subtractLower(y, col, yCol);
            }
        }
        double[] x = new double[m];
        for (int row = 0; row < m; row++) {
            x[row] = y[pivot[row]];
        }
        // back substitution by rows of U, each row's terms from the right: the order in which
        // the column by column form subtracts them, so the sums are the same to the bit; the
        // last row has nothing right of its diagonal and stays out of the loop
        if (m > 0) {
            x[m - 1] /= lu[offset[m - 1] + m - 1];
        }
        for (int row = m - 2; row >= 0; row--) {
            if (upperStart[row] < upperStart[row + 1]) {
                x[row] = subtractUpper(x, row);
            }
            x[row] /= lu[offset[row] + row];
        }
        return x;
    }

    /** y[r] −= yCol·L[r][col] over the array rows r where L is non-zero below the diagonal */
    private void subtractLower(double[] y, int col, double yCol) {
        for (int e = lowerStart[col]; e < lowerStart[col + 1]; e++) {
            int row = lowerRows[e];
            y[row] -= yCol * lu[row * m + col];
        }
    }

    /** @return x[row] − Σ U[row][j]·x[j] over the non-zeros right of the diagonal, from the right */
    private double subtractUpper(double[] x, int row) {
        int start = offset[row];
        double sum = x[row];
        for (int e = upperStart[row]; e < upperStart[row + 1]; e++) {
            int j = upperColumns[e];
            sum -= x[j] * lu[start + j];
        }
        return sum;
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

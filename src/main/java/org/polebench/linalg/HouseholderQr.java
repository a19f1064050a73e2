package org.polebench.linalg;

import java.util.Optional;

/**
 * The Householder QR factorisation A = Q·R of a tall m×n matrix of full column rank (Golub and
 * Van Loan, Matrix Computations, 3rd ed., algorithms 5.1.1 and 5.2.1): least squares
 * min ‖A·x − b‖, and AᵀA's inverse and ln det taken from R alone (AᵀA = RᵀR), so that the
 * normal equations are never formed. Forming AᵀA squares the condition number: a matrix whose
 * columns span 1e9 in scale gives an AᵀA that a Cholesky factor no longer sees as positive
 * definite (κ² ≈ 1e18 ≥ 1/u), while QR is backward stable on A itself (Higham, Accuracy and
 * Stability of Numerical Algorithms, 2nd ed., 2002, 19.3 and 20.2).
 *
 * <p>The matrix is handed over by columns ({@code columns[j][i]} is A_ij), the layout in which
 * the back-solve keeps its Jacobians; Q is kept as its n reflectors. Immutable after
 * construction.
 */
public final class HouseholderQr {
    private final int rows;
    /** Column j holds R's entries above the diagonal in [0, j) and reflector j's vector in [j, m). */
    private final double[][] factored;
    private final double[] diagonal;
    /** 2/‖v_j‖² of reflector j: H_j = I − β_j·v_j·v_jᵀ. */
    private final double[] beta;

    private HouseholderQr(int rows, double[][] factored, double[] diagonal, double[] beta) {
        this.rows = rows;
        this.factored = factored;
        this.diagonal = diagonal;
        this.beta = beta;
    }

    /**
     * @param columns A by columns, each of length {@code rows}; not changed
     * @param rows    m, at least the number of columns
     * @return the factors, or empty when A is rank deficient (a column with nothing left after
     *         the reflections of those before it) or holds a value that is not finite
     */
    public static Optional<HouseholderQr> ofColumns(double[][] columns, int rows) {
        return ofColumns(columns, rows, columns.length * Math.ulp(1.0));
    }

    /**
     * @param rankTolerance the smallest |R_jj|/max|R_jj| taken as nonzero: n·u (the default) for
     *                      rank deficiency to working precision; √u for a matrix whose AᵀA must
     *                      be of full rank to working precision (a column determined to less
     *                      than u relative in AᵀA is not determined at all)
     * @return as {@link #ofColumns(double[][], int)}, with this threshold for rank deficiency
     */
    public static Optional<HouseholderQr> ofColumns(double[][] columns, int rows, double rankTolerance) {
        int n = columns.length;
        if (rows < n) {
            throw new IllegalArgumentException("QR least squares needs at least as many rows as columns");
        }
        double[][] a = new double[n][];
        for (int j = 0; j < n; j++) {
            if (columns[j].length < rows) {
                throw new IllegalArgumentException("column " + j + " is shorter than " + rows);
            }
            a[j] = java.util.Arrays.copyOf(columns[j], rows);
            for (int i = 0; i < rows; i++) {
                if (!Double.isFinite(a[j][i])) {
                    return Optional.empty();
                }
            }
        }
        double[] diagonal = new double[n];
        double[] beta = new double[n];
        for (int k = 0; k < n; k++) {
            double[] v = a[k];
            double norm = norm(v, k, rows);
            if (!(norm > 0) || !Double.isFinite(norm)) {
                return Optional.empty();
            }
            // the sign opposite to the leading entry's: v_k = a_kk + sign·‖a‖ adds, never cancels
            double alpha = v[k] >= 0 ? -norm : norm;
            v[k] -= alpha;
            double vv = 0;
            for (int i = k; i < rows; i++) {
                vv += v[i] * v[i];
            }
            diagonal[k] = alpha;
            beta[k] = 2 / vv;
            for (int j = k + 1; j < n; j++) {
                reflect(v, beta[k], a[j], k, rows);
            }
        }
        // a diagonal this small against the largest is zero to working precision: A is rank
        // deficient and (AᵀA)⁻¹ meaningless (Golub and Van Loan, 5.5.7, numerical rank)
        double largest = 0;
        for (double d : diagonal) {
            largest = Math.max(largest, Math.abs(d));
        }
        for (double d : diagonal) {
            if (Math.abs(d) <= largest * rankTolerance) {
                return Optional.empty();
            }
        }
        return Optional.of(new HouseholderQr(rows, a, diagonal, beta));
    }

    // ‖x[from, to)‖ scaled by its largest entry, so that squares neither overflow nor underflow
    private static double norm(double[] x, int from, int to) {
        double scale = 0;
        for (int i = from; i < to; i++) {
            scale = Math.max(scale, Math.abs(x[i]));
        }
        if (scale == 0 || !Double.isFinite(scale)) {
            return scale;
        }
        double sum = 0;
        for (int i = from; i < to; i++) {
            double t = x[i] / scale;
            sum += t * t;
        }
        return scale * Math.sqrt(sum);
    }

    // x ← (I − β·v·vᵀ)·x on rows [k, m)
    private static void reflect(double[] v, double beta, double[] x, int k, int rows) {
        double s = 0;
        for (int i = k; i < rows; i++) {
            s += v[i] * x[i];
        }
        s *= beta;
        for (int i = k; i < rows; i++) {
            x[i] -= s * v[i];
        }
    }

    /** @return n, the number of columns */
    public int columns() {
        return diagonal.length;
    }

    /** @return Qᵀ·b (length m): its first n entries are what R·x must match */
    public double[] transposedQTimes(double[] b) {
        if (b.length < rows) {
            throw new IllegalArgumentException("the right-hand side is shorter than " + rows);
        }
        double[] y = java.util.Arrays.copyOf(b, rows);
        for (int k = 0; k < diagonal.length; k++) {
            reflect(factored[k], beta[k], y, k, rows);
        }
        return y;
    }

    /** @return x minimising ‖A·x − b‖ (b of length m) */
    public double[] solve(double[] b) {
        double[] y = transposedQTimes(b);
        return backSubstitute(java.util.Arrays.copyOf(y, diagonal.length));
    }

    /** @return x with R·x = y (y of length n) */
    public double[] backSubstitute(double[] y) {
        int n = diagonal.length;
        double[] x = y.clone();
        for (int i = n - 1; i >= 0; i--) {
            double sum = x[i];
            for (int j = i + 1; j < n; j++) {
                sum -= factored[j][i] * x[j];
            }
            x[i] = sum / diagonal[i];
        }
        return x;
    }

    /** @return R, n×n upper triangular (its diagonal may be negative: the sign is Q's choice) */
    public double[][] r() {
        int n = diagonal.length;
        double[][] r = new double[n][n];
        for (int i = 0; i < n; i++) {
            r[i][i] = diagonal[i];
            for (int j = i + 1; j < n; j++) {
                r[i][j] = factored[j][i];
            }
        }
        return r;
    }

    /** @return ln det(AᵀA) = 2·Σ ln|R_jj|, with no AᵀA formed */
    public double lnDeterminantOfGram() {
        double sum = 0;
        for (double d : diagonal) {
            sum += Math.log(Math.abs(d));
        }
        return 2 * sum;
    }

    /**
     * @return (AᵀA)⁻¹ = R⁻¹·R⁻ᵀ: R⁻¹ by back substitution on the unit vectors (upper triangular,
     *         so column j needs rows [0, j] only), then the product; the covariance of a least
     *         squares estimate with unit-weighted rows
     */
    public double[][] gramInverse() {
        int n = diagonal.length;
        double[][] inverseColumns = new double[n][];
        for (int j = 0; j < n; j++) {
            double[] x = new double[n];
            x[j] = 1 / diagonal[j];
            for (int i = j - 1; i >= 0; i--) {
                double sum = 0;
                for (int l = i + 1; l <= j; l++) {
                    sum -= factored[l][i] * x[l];
                }
                x[i] = sum / diagonal[i];
            }
            inverseColumns[j] = x;
        }
        // (R⁻¹R⁻ᵀ)_ab = Σ_j (R⁻¹)_aj·(R⁻¹)_bj, over j ≥ max(a, b) where both are nonzero
        double[][] gram = new double[n][n];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b <= a; b++) {
                double sum = 0;
                for (int j = a; j < n; j++) {
                    sum += inverseColumns[j][a] * inverseColumns[j][b];
                }
                gram[a][b] = sum;
                gram[b][a] = sum;
            }
        }
        return gram;
    }
}

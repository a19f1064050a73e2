package org.polebench.linalg;

import java.util.Optional;

/**
 * The Cholesky factor L·Lᵀ of a small symmetric positive-definite matrix (Golub and Van Loan,
 * Matrix Computations, 3rd ed., algorithm 4.2.1): solves, the inverse and ln det for the
 * normal equations and the Laplace evidence.
 */
public final class Cholesky {
    private final double[][] l;

    private Cholesky(double[][] l) {
        this.l = l;
    }

    /** @return the factor, or empty when the matrix is not positive definite */
    public static Optional<Cholesky> of(double[][] a) {
        int n = a.length;
        double[][] l = new double[n][n];
        for (int j = 0; j < n; j++) {
            double diagonal = a[j][j];
            for (int m = 0; m < j; m++) {
                diagonal -= l[j][m] * l[j][m];
            }
            if (!(diagonal > 0) || !Double.isFinite(diagonal)) {
                return Optional.empty();
            }
            l[j][j] = Math.sqrt(diagonal);
            for (int i = j + 1; i < n; i++) {
                double sum = a[i][j];
                for (int m = 0; m < j; m++) {
                    sum -= l[i][m] * l[j][m];
                }
                l[i][j] = sum / l[j][j];
            }
        }
        return Optional.of(new Cholesky(l));
    }

    /** @return x with A·x = r */
    public double[] solve(double[] r) {
        int n = l.length;
        double[] x = r.clone();
        for (int i = 0; i < n; i++) {
            double sum = x[i];
            for (int m = 0; m < i; m++) {
                sum -= l[i][m] * x[m];
            }
            x[i] = sum / l[i][i];
        }
        for (int i = n - 1; i >= 0; i--) {
            double sum = x[i];
            for (int m = i + 1; m < n; m++) {
                sum -= l[m][i] * x[m];
            }
            x[i] = sum / l[i][i];
        }
        return x;
    }

    /** @return A⁻¹ */
    public double[][] inverse() {
        int n = l.length;
        double[][] inverse = new double[n][];
        for (int j = 0; j < n; j++) {
            double[] unit = new double[n];
            unit[j] = 1;
            inverse[j] = solve(unit);
        }
        return inverse;
    }

    /** @return ln det A = 2·Σ ln L_ii */
    public double lnDeterminant() {
        double sum = 0;
        for (int i = 0; i < l.length; i++) {
            sum += Math.log(l[i][i]);
        }
        return 2 * sum;
    }
}

package org.polebench.reconcile;

/**
 * LU factors of a small dense complex matrix with partial pivoting (Golub and Van Loan, Matrix
 * Computations, 3rd ed., algorithm 3.4.1), solving M·x = r and Mᵀ·x = r with the same factors.
 * The matrix is given as real and imaginary parts and overwritten by the factors. One instance
 * per thread and task; it keeps work arrays between calls.
 */
final class SmallComplexLu {
    private final int n;
    private final double[][] re;
    private final double[][] im;
    private final int[] pivot;

    SmallComplexLu(int n) {
        this.n = n;
        this.re = new double[n][n];
        this.im = new double[n][n];
        this.pivot = new int[n];
    }

    /** @return the real part to fill before {@link #factor()} */
    double[][] real() {
        return re;
    }

    /** @return the imaginary part to fill before {@link #factor()} */
    double[][] imaginary() {
        return im;
    }

    /** @return false when a pivot is exactly zero (the matrix is singular) */
    boolean factor() {
        for (int col = 0; col < n; col++) {
            int best = col;
            double bestSize = re[col][col] * re[col][col] + im[col][col] * im[col][col];
            for (int row = col + 1; row < n; row++) {
                double size = re[row][col] * re[row][col] + im[row][col] * im[row][col];
                if (size > bestSize) {
                    best = row;
                    bestSize = size;
                }
            }
            if (bestSize == 0) {
                return false;
            }
            pivot[col] = best;
            if (best != col) {
                double[] swap = re[best];
                re[best] = re[col];
                re[col] = swap;
                swap = im[best];
                im[best] = im[col];
                im[col] = swap;
            }
            double pr = re[col][col];
            double pi = im[col][col];
            for (int row = col + 1; row < n; row++) {
                // l = m[row][col] / pivot
                double ar = re[row][col];
                double ai = im[row][col];
                double lr = (ar * pr + ai * pi) / bestSize;
                double li = (ai * pr - ar * pi) / bestSize;
                re[row][col] = lr;
                im[row][col] = li;
                double[] rr = re[row];
                double[] ri = im[row];
                double[] cr = re[col];
                double[] ci = im[col];
                for (int j = col + 1; j < n; j++) {
                    rr[j] -= lr * cr[j] - li * ci[j];
                    ri[j] -= lr * ci[j] + li * cr[j];
                }
            }
        }
        return true;
    }

    /** Solves M·x = r in place (r given as real and imaginary parts). */
    void solve(double[] xr, double[] xi) {
        for (int col = 0; col < n; col++) {
            int p = pivot[col];
            if (p != col) {
                double s = xr[p];
                xr[p] = xr[col];
                xr[col] = s;
                s = xi[p];
                xi[p] = xi[col];
                xi[col] = s;
            }
        }
        for (int i = 1; i < n; i++) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = 0; j < i; j++) {
                sr -= re[i][j] * xr[j] - im[i][j] * xi[j];
                si -= re[i][j] * xi[j] + im[i][j] * xr[j];
            }
            xr[i] = sr;
            xi[i] = si;
        }
        for (int i = n - 1; i >= 0; i--) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = i + 1; j < n; j++) {
                sr -= re[i][j] * xr[j] - im[i][j] * xi[j];
                si -= re[i][j] * xi[j] + im[i][j] * xr[j];
            }
            divide(sr, si, re[i][i], im[i][i], xr, xi, i);
        }
    }

    /** Solves Mᵀ·x = r in place (plain transpose, not the conjugate). */
    void solveTransposed(double[] xr, double[] xi) {
        // Mᵀ = Uᵀ·Lᵀ·P: solve Uᵀ·z = r, then Lᵀ·w = z, then x = Pᵀ·w
        for (int i = 0; i < n; i++) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = 0; j < i; j++) {
                sr -= re[j][i] * xr[j] - im[j][i] * xi[j];
                si -= re[j][i] * xi[j] + im[j][i] * xr[j];
            }
            divide(sr, si, re[i][i], im[i][i], xr, xi, i);
        }
        for (int i = n - 2; i >= 0; i--) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = i + 1; j < n; j++) {
                sr -= re[j][i] * xr[j] - im[j][i] * xi[j];
                si -= re[j][i] * xi[j] + im[j][i] * xr[j];
            }
            xr[i] = sr;
            xi[i] = si;
        }
        for (int col = n - 1; col >= 0; col--) {
            int p = pivot[col];
            if (p != col) {
                double s = xr[p];
                xr[p] = xr[col];
                xr[col] = s;
                s = xi[p];
                xi[p] = xi[col];
                xi[col] = s;
            }
        }
    }

    private static void divide(double ar, double ai, double br, double bi, double[] xr, double[] xi, int i) {
        double size = br * br + bi * bi;
        xr[i] = (ar * br + ai * bi) / size;
        xi[i] = (ai * br - ar * bi) / size;
    }
}

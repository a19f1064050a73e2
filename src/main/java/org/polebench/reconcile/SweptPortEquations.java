package org.polebench.reconcile;

import java.util.Arrays;

/**
 * The low-band port equations (Y + jω·Cd)·x = r (DESIGN.md "Port reduction"; Y in siemens, C
 * in farads, ω in rad/s) factored and solved at every frequency of a sweep at once: the
 * elimination runs with the frequency as the innermost loop, so long, branch-free loops over
 * flat arrays replace thousands of k×k ones, and the compiler can vectorise them.
 *
 * <p>Gaussian elimination with partial pivoting (Golub and Van Loan, Matrix Computations, 3rd
 * ed., algorithm 3.4.1), the pivot chosen frequency by frequency: each frequency gets exactly
 * the operations, and so the rounding, of {@link SmallComplexLu} on its own matrix. The row
 * exchanges are needed: a transistor's transconductance puts entries far larger than the
 * diagonal below it at the low end of a sweep. One instance per thread and task: it holds the
 * factors.
 */
final class SweptPortEquations {
    private final int k;
    private final double[] omegas;
    /** Entry (i, j) of the matrix, then of its factors, at every frequency: [i·k + j][n]. */
    private final double[][] re;
    private final double[][] im;
    /** 1/U_ii per frequency: [i][n]. */
    private final double[][] inverseRe;
    private final double[][] inverseIm;
    /** The row brought up for each column at each frequency: [column][n]. */
    private final int[][] pivot;

    /** @param omegas the sweep's angular frequencies, rad/s */
    SweptPortEquations(int k, double[] omegas) {
        this.k = k;
        this.omegas = omegas.clone();
        int f = omegas.length;
        this.re = new double[k * k][f];
        this.im = new double[k * k][f];
        this.inverseRe = new double[k][f];
        this.inverseIm = new double[k][f];
        this.pivot = new int[k][f];
    }

    int frequencies() {
        return omegas.length;
    }

    /**
     * Factors Y + jω_n·Cd at every frequency.
     *
     * @param y      Y row-major, k·k, siemens
     * @param farads C_i, the diagonal of Cd
     * @return false when the matrix is singular (an exactly zero pivot) at some frequency
     */
    boolean factor(double[] y, double[] farads) {
        int f = omegas.length;
        for (int e = 0; e < k * k; e++) {
            Arrays.fill(re[e], y[e]);
            Arrays.fill(im[e], 0);
        }
        for (int i = 0; i < k; i++) {
            double[] diagonal = im[i * k + i];
            for (int n = 0; n < f; n++) {
                diagonal[n] = omegas[n] * farads[i];
            }
        }
        for (int col = 0; col < k; col++) {
            if (!exchangeRows(col)) {
                return false;
            }
            double[] pr = re[col * k + col];
            double[] pi = im[col * k + col];
            double[] qr = inverseRe[col];
            double[] qi = inverseIm[col];
            for (int n = 0; n < f; n++) {
                // 1/p = conj(p)/|p|²: one division per pivot, so the rest only multiplies
                double scale = 1 / (pr[n] * pr[n] + pi[n] * pi[n]);
                qr[n] = pr[n] * scale;
                qi[n] = -pi[n] * scale;
            }
            for (int row = col + 1; row < k; row++) {
                double[] lr = re[row * k + col];
                double[] li = im[row * k + col];
                for (int n = 0; n < f; n++) {
                    double ar = lr[n];
                    double ai = li[n];
                    lr[n] = ar * qr[n] - ai * qi[n];
                    li[n] = ar * qi[n] + ai * qr[n];
                }
                for (int j = col + 1; j < k; j++) {
                    double[] tr = re[row * k + j];
                    double[] ti = im[row * k + j];
                    double[] ur = re[col * k + j];
                    double[] ui = im[col * k + j];
                    for (int n = 0; n < f; n++) {
                        tr[n] -= lr[n] * ur[n] - li[n] * ui[n];
                        ti[n] -= lr[n] * ui[n] + li[n] * ur[n];
                    }
                }
            }
        }
        return true;
    }

    // partial pivoting, frequency by frequency: the row of the largest |entry| in this column
    // (the first of equals) comes up; false when the whole column below is zero
    private boolean exchangeRows(int col) {
        int[] chosen = pivot[col];
        for (int n = 0; n < omegas.length; n++) {
            int best = col;
            double[] ar = re[col * k + col];
            double[] ai = im[col * k + col];
            double bestSize = ar[n] * ar[n] + ai[n] * ai[n];
            for (int row = col + 1; row < k; row++) {
                ar = re[row * k + col];
                ai = im[row * k + col];
                double size = ar[n] * ar[n] + ai[n] * ai[n];
                if (size > bestSize) {
                    best = row;
                    bestSize = size;
                }
            }
            if (bestSize == 0) {
                return false;
            }
            chosen[n] = best;
            if (best != col) {
                for (int j = 0; j < k; j++) {
                    swap(re[best * k + j], re[col * k + j], n);
                    swap(im[best * k + j], im[col * k + j], n);
                }
            }
        }
        return true;
    }

    private static void swap(double[] a, double[] b, int n) {
        double kept = a[n];
        a[n] = b[n];
        b[n] = kept;
    }

    /**
     * Solves M·x = r at every frequency for a real right-hand side the same at all of them.
     *
     * @param r  the right-hand side, k long
     * @param xr out: Re x, [i][n]
     * @param xi out: Im x, [i][n]
     */
    void solve(double[] r, double[][] xr, double[][] xi) {
        int f = omegas.length;
        fill(r, xr, xi);
        for (int col = 0; col < k; col++) {
            permute(col, xr, xi);
        }
        for (int i = 1; i < k; i++) {
            for (int j = 0; j < i; j++) {
                subtractProduct(re[i * k + j], im[i * k + j], xr[j], xi[j], xr[i], xi[i], f);
            }
        }
        for (int i = k - 1; i >= 0; i--) {
            for (int j = i + 1; j < k; j++) {
                subtractProduct(re[i * k + j], im[i * k + j], xr[j], xi[j], xr[i], xi[i], f);
            }
            multiply(inverseRe[i], inverseIm[i], xr[i], xi[i], f);
        }
    }

    /** As {@link #solve} with Mᵀ (the plain transpose, not the conjugate). */
    void solveTransposed(double[] r, double[][] xr, double[][] xi) {
        int f = omegas.length;
        fill(r, xr, xi);
        // Mᵀ = Uᵀ·Lᵀ·P: solve Uᵀ·z = r, then Lᵀ·w = z, then x = Pᵀ·w
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < i; j++) {
                subtractProduct(re[j * k + i], im[j * k + i], xr[j], xi[j], xr[i], xi[i], f);
            }
            multiply(inverseRe[i], inverseIm[i], xr[i], xi[i], f);
        }
        for (int i = k - 2; i >= 0; i--) {
            for (int j = i + 1; j < k; j++) {
                subtractProduct(re[j * k + i], im[j * k + i], xr[j], xi[j], xr[i], xi[i], f);
            }
        }
        for (int col = k - 1; col >= 0; col--) {
            permute(col, xr, xi);
        }
    }

    // the row exchange chosen for this column, frequency by frequency
    private void permute(int col, double[][] xr, double[][] xi) {
        int[] chosen = pivot[col];
        for (int n = 0; n < omegas.length; n++) {
            int p = chosen[n];
            if (p != col) {
                swap(xr[p], xr[col], n);
                swap(xi[p], xi[col], n);
            }
        }
    }

    private void fill(double[] r, double[][] xr, double[][] xi) {
        for (int i = 0; i < k; i++) {
            Arrays.fill(xr[i], 0, omegas.length, r[i]);
            Arrays.fill(xi[i], 0, omegas.length, 0);
        }
    }

    // s −= a·x over every frequency, complex
    private static void subtractProduct(double[] ar, double[] ai, double[] xr, double[] xi, double[] sr, double[] si,
                                        int f) {
        for (int n = 0; n < f; n++) {
            sr[n] -= ar[n] * xr[n] - ai[n] * xi[n];
            si[n] -= ar[n] * xi[n] + ai[n] * xr[n];
        }
    }

    // s ← q·s over every frequency, complex
    private static void multiply(double[] qr, double[] qi, double[] sr, double[] si, int f) {
        for (int n = 0; n < f; n++) {
            double r = sr[n];
            double i = si[n];
            sr[n] = r * qr[n] - i * qi[n];
            si[n] = r * qi[n] + i * qr[n];
        }
    }
}

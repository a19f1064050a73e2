package org.polebench.linalg;

import java.util.Arrays;

/**
 * The port equations (Y + jω·Cd)·x = r of a reduced model (docs/method.md, "Port reduction"; Y in
 * siemens, C in farads, ω in rad/s) factored and solved at every frequency of a sweep at once.
 * The elimination runs with the frequency as the innermost loop: long, branch-free loops over
 * flat arrays replace thousands of k×k ones, and the compiler can vectorise them. The same form
 * serves a state-space model's jωI − A (Y = −A, every C = 1).
 *
 * <p>Gaussian elimination with partial pivoting (Golub and Van Loan, Matrix Computations, 3rd
 * ed., algorithm 3.4.1), the pivot chosen frequency by frequency, so each frequency gets the
 * operations of a k×k pivoted LU of its own matrix. The exchanges are needed: a transistor's
 * transconductance puts entries far larger than the diagonal below it at the low end of a
 * sweep. Singular case: an exactly zero column below the diagonal at some frequency, reported by
 * {@link #factor}. One instance per thread and task: it holds the factors.
 */
public final class SweptPortEquations {
    private final int k;
    private final double[] omegas;
    /** Entry (i, j) of the matrix, then of its factors, at every frequency: [i·k + j][n]. */
    private final double[][] re;
    private final double[][] im;
    /** 1/U_ii per frequency: [i][n]. */
    private final double[][] inverseRe;
    private final double[][] inverseIm;
    /** Work: the row brought up for the current column, per frequency. */
    private final int[] chosen;
    /** The row of M that sits at each row of the factors, per frequency: [row][n]. */
    private final int[][] origin;
    private final int[] votes;
    private final double[][] workRe;
    private final double[][] workIm;
    /** Work: the largest |entry|² found so far in the pivot search, per frequency. */
    private final double[] largest;

    /** @param omegas the sweep's angular frequencies, rad/s */
    public SweptPortEquations(int k, double[] omegas) {
        this.k = k;
        this.omegas = omegas.clone();
        int f = omegas.length;
        this.re = new double[k * k][f];
        this.im = new double[k * k][f];
        this.inverseRe = new double[k][f];
        this.inverseIm = new double[k][f];
        this.chosen = new int[f];
        this.origin = new int[k][f];
        this.votes = new int[k];
        this.workRe = new double[k][f];
        this.workIm = new double[k][f];
        this.largest = new double[f];
    }

    public int frequencies() {
        return omegas.length;
    }

    /** @return k, the number of ports */
    public int order() {
        return k;
    }

    /**
     * Factors Y + jω_n·Cd at every frequency.
     *
     * @param y      Y row-major, k·k, siemens
     * @param farads C_i, the diagonal of Cd
     * @return false when the matrix is singular (an exactly zero pivot) at some frequency
     */
    public boolean factor(double[] y, double[] farads) {
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
        for (int i = 0; i < k; i++) {
            Arrays.fill(origin[i], i);
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
    // (the first of equals) comes up; false when the whole column below is zero. The search runs
    // along each row's frequencies; only the frequencies that need an exchange are touched then.
    private boolean exchangeRows(int col) {
        int f = omegas.length;
        double[] ar = re[col * k + col];
        double[] ai = im[col * k + col];
        for (int n = 0; n < f; n++) {
            largest[n] = ar[n] * ar[n] + ai[n] * ai[n];
            chosen[n] = col;
        }
        boolean exchange = false;
        for (int row = col + 1; row < k; row++) {
            ar = re[row * k + col];
            ai = im[row * k + col];
            for (int n = 0; n < f; n++) {
                double size = ar[n] * ar[n] + ai[n] * ai[n];
                if (size > largest[n]) {
                    largest[n] = size;
                    chosen[n] = row;
                    exchange = true;
                }
            }
        }
        for (int n = 0; n < f; n++) {
            if (largest[n] == 0) {
                return false;
            }
        }
        if (!exchange) {
            return true;
        }
        // across a sweep one row usually wins at most frequencies: exchanging the row arrays
        // themselves serves all of those at once, and the others are put right one by one
        int common = commonest(chosen, col);
        if (common != col) {
            for (int j = 0; j < k; j++) {
                exchange(re, common * k + j, col * k + j);
                exchange(im, common * k + j, col * k + j);
            }
            exchange(origin, common, col);
        }
        for (int n = 0; n < f; n++) {
            int best = chosen[n];
            if (best == common) {
                continue;
            }
            if (common != col) {
                swapRows(common, col, n);
            }
            if (best != col) {
                swapRows(best, col, n);
            }
        }
        return true;
    }

    private int commonest(int[] chosen, int col) {
        Arrays.fill(votes, 0);
        for (int row : chosen) {
            votes[row]++;
        }
        int common = col;
        for (int row = col + 1; row < k; row++) {
            if (votes[row] > votes[common]) {
                common = row;
            }
        }
        return common;
    }

    private void swapRows(int a, int b, int n) {
        for (int j = 0; j < k; j++) {
            swap(re[a * k + j], re[b * k + j], n);
            swap(im[a * k + j], im[b * k + j], n);
        }
        int kept = origin[a][n];
        origin[a][n] = origin[b][n];
        origin[b][n] = kept;
    }

    private static <T> void exchange(T[] rows, int a, int b) {
        T kept = rows[a];
        rows[a] = rows[b];
        rows[b] = kept;
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
    public void solve(double[] r, double[][] xr, double[][] xi) {
        int f = omegas.length;
        // P·M = L·U, so L·U·x = P·r
        for (int i = 0; i < k; i++) {
            int[] from = origin[i];
            double[] to = xr[i];
            for (int n = 0; n < f; n++) {
                to[n] = r[from[n]];
            }
            Arrays.fill(xi[i], 0);
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
    public void solveTransposed(double[] r, double[][] xr, double[][] xi) {
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
        for (int i = 0; i < k; i++) {
            int[] to = origin[i];
            double[] wr = xr[i];
            double[] wi = xi[i];
            for (int n = 0; n < f; n++) {
                workRe[to[n]][n] = wr[n];
                workIm[to[n]][n] = wi[n];
            }
        }
        for (int i = 0; i < k; i++) {
            System.arraycopy(workRe[i], 0, xr[i], 0, f);
            System.arraycopy(workIm[i], 0, xi[i], 0, f);
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

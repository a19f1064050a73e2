package org.polebench.reconcile;

/**
 * LU factors of a small dense complex matrix with partial pivoting (Golub and Van Loan, Matrix
 * Computations, 3rd ed., algorithm 3.4.1), solving M·x = r and Mᵀ·x = r with the same factors.
 * The matrix is held row-major in flat real and imaginary arrays (entry (i, j) at i·n + j),
 * filled by the caller and overwritten by the factors; flat arrays keep the inner loops free of
 * row lookups, which matters at thousands of small solves per back-solve. One instance per
 * thread and task.
 */
final class SmallComplexLu {
    private final int n;
    private final double[] re;
    private final double[] im;
    private final int[] pivot;
    /** 1/U_ii: one division per pivot, so the elimination and both solves only multiply. */
    private final double[] inverseRe;
    private final double[] inverseIm;

    SmallComplexLu(int n) {
        this.n = n;
        this.re = new double[n * n];
        this.im = new double[n * n];
        this.pivot = new int[n];
        this.inverseRe = new double[n];
        this.inverseIm = new double[n];
    }

    /** @return the real part, row-major, to fill before {@link #factor()} */
    double[] real() {
        return re;
    }

    /** @return the imaginary part, row-major, to fill before {@link #factor()} */
    double[] imaginary() {
        return im;
    }

    /** @return false when a pivot is exactly zero (the matrix is singular) */
    boolean factor() {
        for (int col = 0; col < n; col++) {
            int best = col;
            int at = col * n + col;
            double bestSize = re[at] * re[at] + im[at] * im[at];
            for (int row = col + 1; row < n; row++) {
                int e = row * n + col;
                double size = re[e] * re[e] + im[e] * im[e];
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
                for (int j = 0; j < n; j++) {
                    int a = best * n + j;
                    int b = col * n + j;
                    double swap = re[a];
                    re[a] = re[b];
                    re[b] = swap;
                    swap = im[a];
                    im[a] = im[b];
                    im[b] = swap;
                }
            }
            int diagonal = col * n + col;
            // 1/p = conj(p)/|p|²: divisions are the slowest operation in these small kernels
            double scale = 1 / bestSize;
            double qr = re[diagonal] * scale;
            double qi = -im[diagonal] * scale;
            inverseRe[col] = qr;
            inverseIm[col] = qi;
            int c = col * n;
            for (int row = col + 1; row < n; row++) {
                int e = row * n + col;
                double ar = re[e];
                double ai = im[e];
                double lr = ar * qr - ai * qi;
                double li = ar * qi + ai * qr;
                re[e] = lr;
                im[e] = li;
                int r = row * n;
                for (int j = col + 1; j < n; j++) {
                    double cr = re[c + j];
                    double ci = im[c + j];
                    re[r + j] -= lr * cr - li * ci;
                    im[r + j] -= lr * ci + li * cr;
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
            int r = i * n;
            for (int j = 0; j < i; j++) {
                sr -= re[r + j] * xr[j] - im[r + j] * xi[j];
                si -= re[r + j] * xi[j] + im[r + j] * xr[j];
            }
            xr[i] = sr;
            xi[i] = si;
        }
        for (int i = n - 1; i >= 0; i--) {
            double sr = xr[i];
            double si = xi[i];
            int r = i * n;
            for (int j = i + 1; j < n; j++) {
                sr -= re[r + j] * xr[j] - im[r + j] * xi[j];
                si -= re[r + j] * xi[j] + im[r + j] * xr[j];
            }
            xr[i] = sr * inverseRe[i] - si * inverseIm[i];
            xi[i] = sr * inverseIm[i] + si * inverseRe[i];
        }
    }

    /** Solves Mᵀ·x = r in place (plain transpose, not the conjugate). */
    void solveTransposed(double[] xr, double[] xi) {
        // Mᵀ = Uᵀ·Lᵀ·P: solve Uᵀ·z = r, then Lᵀ·w = z, then x = Pᵀ·w
        for (int i = 0; i < n; i++) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = 0; j < i; j++) {
                int e = j * n + i;
                sr -= re[e] * xr[j] - im[e] * xi[j];
                si -= re[e] * xi[j] + im[e] * xr[j];
            }
            xr[i] = sr * inverseRe[i] - si * inverseIm[i];
            xi[i] = sr * inverseIm[i] + si * inverseRe[i];
        }
        for (int i = n - 2; i >= 0; i--) {
            double sr = xr[i];
            double si = xi[i];
            for (int j = i + 1; j < n; j++) {
                int e = j * n + i;
                sr -= re[e] * xr[j] - im[e] * xi[j];
                si -= re[e] * xi[j] + im[e] * xr[j];
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
}

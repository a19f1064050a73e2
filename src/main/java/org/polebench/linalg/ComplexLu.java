package org.polebench.linalg;

/**
 * Dense complex LU factorisation with partial pivoting, PA = LU, on separate real and imaginary
 * arrays (Golub and Van Loan, Matrix Computations, 4th ed., algorithm 3.4.1, carried over to
 * complex arithmetic). Factors in place: the arrays passed in are overwritten, so a caller that
 * evaluates a response at many frequencies reuses them and allocates nothing per frequency.
 * One instance holds one factorisation and is not shared between threads.
 */
public final class ComplexLu {
    private final int n;
    private final double[][] re;
    private final double[][] im;
    private final int[] pivot;

    /** @param re real parts, n×n, overwritten by the factors
     *  @param im imaginary parts, n×n, overwritten by the factors */
    public ComplexLu(double[][] re, double[][] im) {
        this.n = re.length;
        this.re = re;
        this.im = im;
        this.pivot = new int[n];
    }

    /** @return false when a pivot is exactly zero (the matrix is singular) */
    public boolean factor() {
        for (int col = 0; col < n; col++) {
            int best = col;
            double bestSize = -1;
            for (int row = col; row < n; row++) {
                double size = Math.abs(re[row][col]) + Math.abs(im[row][col]);
                if (size > bestSize) {
                    bestSize = size;
                    best = row;
                }
            }
            pivot[col] = best;
            if (bestSize == 0) {
                return false;
            }
            if (best != col) {
                double[] t = re[best];
                re[best] = re[col];
                re[col] = t;
                t = im[best];
                im[best] = im[col];
                im[col] = t;
            }
            double pr = re[col][col];
            double pi = im[col][col];
            double scale = 1 / (pr * pr + pi * pi);
            double invR = pr * scale;
            double invI = -pi * scale;
            for (int row = col + 1; row < n; row++) {
                double ar = re[row][col];
                double ai = im[row][col];
                if (ar == 0 && ai == 0) {
                    continue;
                }
                double lr = ar * invR - ai * invI;
                double li = ar * invI + ai * invR;
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

    /** Solves A·x = b in place: on return {@code br, bi} hold x. */
    public void solve(double[] br, double[] bi) {
        for (int i = 0; i < n; i++) {
            int p = pivot[i];
            if (p != i) {
                double t = br[p];
                br[p] = br[i];
                br[i] = t;
                t = bi[p];
                bi[p] = bi[i];
                bi[i] = t;
            }
        }
        for (int i = 0; i < n; i++) {
            double sr = br[i];
            double si = bi[i];
            for (int j = 0; j < i; j++) {
                sr -= re[i][j] * br[j] - im[i][j] * bi[j];
                si -= re[i][j] * bi[j] + im[i][j] * br[j];
            }
            br[i] = sr;
            bi[i] = si;
        }
        for (int i = n - 1; i >= 0; i--) {
            double sr = br[i];
            double si = bi[i];
            for (int j = i + 1; j < n; j++) {
                sr -= re[i][j] * br[j] - im[i][j] * bi[j];
                si -= re[i][j] * bi[j] + im[i][j] * br[j];
            }
            divideInto(br, bi, i, sr, si, re[i][i], im[i][i]);
        }
    }

    /** Solves Aᵀ·x = b in place (plain transpose, not conjugate): with PA = LU, Aᵀ = UᵀLᵀP. */
    public void solveTransposed(double[] br, double[] bi) {
        for (int i = 0; i < n; i++) {
            double sr = br[i];
            double si = bi[i];
            for (int j = 0; j < i; j++) {
                sr -= re[j][i] * br[j] - im[j][i] * bi[j];
                si -= re[j][i] * bi[j] + im[j][i] * br[j];
            }
            divideInto(br, bi, i, sr, si, re[i][i], im[i][i]);
        }
        for (int i = n - 1; i >= 0; i--) {
            double sr = br[i];
            double si = bi[i];
            for (int j = i + 1; j < n; j++) {
                sr -= re[j][i] * br[j] - im[j][i] * bi[j];
                si -= re[j][i] * bi[j] + im[j][i] * br[j];
            }
            br[i] = sr;
            bi[i] = si;
        }
        for (int i = n - 1; i >= 0; i--) {
            int p = pivot[i];
            if (p != i) {
                double t = br[p];
                br[p] = br[i];
                br[i] = t;
                t = bi[p];
                bi[p] = bi[i];
                bi[i] = t;
            }
        }
    }

    private static void divideInto(double[] br, double[] bi, int i, double sr, double si, double dr, double di) {
        double scale = 1 / (dr * dr + di * di);
        br[i] = (sr * dr + si * di) * scale;
        bi[i] = (si * dr - sr * di) * scale;
    }
}

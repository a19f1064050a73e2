package org.polebench.linalg;

import java.util.Arrays;
import java.util.Comparator;
import java.util.Optional;
import org.apache.commons.math3.exception.MathArithmeticException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.LUDecomposition;

/**
 * Eigenvalues and eigenvectors of a real non-symmetric matrix, the recipe of docs/method.md, "Poles and zeros": Commons Math's
 * {@link EigenDecomposition} tests 2×2 Schur blocks against an absolute 1e-12, so it runs on
 * A/‖A‖ and the eigenvalues are scaled back; |Im λ| below {@code realShare}·|λ| is taken as real;
 * Σλ is checked against trace A, Πλ against an LU determinant, and each eigenpair by its
 * residual. Eigenvectors come from two steps of inverse iteration at a shift just off each
 * eigenvalue (Golub and Van Loan, Matrix Computations, 4th ed., §7.6.1), right ones from
 * A − μI and left ones from its transpose with the same factors. Immutable.
 */
public final class EigenSolver {
    /** |Im λ| below this share of |λ| is round-off: the eigenvalue is real (docs/method.md, "Poles and zeros"). */
    public static final double DEFAULT_REAL_SHARE = 1e-9;
    /** A scaled eigenvalue below this is taken as exactly zero (a structural zero at DC). */
    public static final double ZERO_SHARE = 1e-9;
    private static final int INVERSE_ITERATIONS = 3;

    private final double realShare;

    public EigenSolver() {
        this(DEFAULT_REAL_SHARE);
    }

    public EigenSolver(double realShare) {
        this.realShare = realShare;
    }


    /**
     * @param a         a square matrix (not changed); the eigenvalues come back in its units
     * @param snapZeros make eigenvalues below {@link #ZERO_SHARE}·‖A‖ exactly 0 (for zeros at DC)
     * @return the eigenpairs sorted by magnitude, then by descending imaginary part, with the
     * checks; empty when the eigenvalue iteration does not converge
     */
    public Optional<Eigenpairs> eigenpairs(double[][] original, boolean snapZeros) {
        int n = original.length;
        if (n == 0) {
            return Optional.of(new Eigenpairs(new double[0], new double[0], new double[0][][], new double[0][][], 0, 0, 0));
        }
        double[] balance = new double[n];
        double[][] a = balanced(original, balance);
        double scale = 0;
        for (double[] row : a) {
            for (double v : row) {
                scale = Math.max(scale, Math.abs(v));
            }
        }
        if (scale == 0) {
            scale = 1;
        }
        double[][] scaled = new double[n][n];
        double frobenius = 0;
        double trace = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                scaled[i][j] = a[i][j] / scale;
                frobenius += scaled[i][j] * scaled[i][j];
            }
            trace += scaled[i][i];
        }
        frobenius = Math.sqrt(frobenius);
        double[] re;
        double[] im;
        try {
            EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(scaled, false));
            re = eigen.getRealEigenvalues();
            im = eigen.getImagEigenvalues();
        } catch (MathIllegalStateException | MathArithmeticException e) {
            return Optional.empty();
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
            double magnitude = Math.hypot(re[i], im[i]);
            if (Math.abs(im[i]) < realShare * magnitude) {
                im[i] = 0;
            }
            if (snapZeros && magnitude < ZERO_SHARE) {
                re[i] = 0;
                im[i] = 0;
            }
        }
        final double[] r0 = re;
        final double[] i0 = im;
        Arrays.sort(order, Comparator.<Integer>comparingDouble(i -> Math.hypot(r0[i], i0[i]))
                .thenComparingDouble(i -> -i0[i]));
        double[] sre = new double[n];
        double[] sim = new double[n];
        double absSum = 0;
        double sumRe = 0;
        double prodRe = 1;
        double prodIm = 0;
        for (int i = 0; i < n; i++) {
            sre[i] = re[order[i]];
            sim[i] = im[order[i]];
            absSum += Math.hypot(sre[i], sim[i]);
            sumRe += sre[i];
            double pr = prodRe * sre[i] - prodIm * sim[i];
            prodIm = prodRe * sim[i] + prodIm * sre[i];
            prodRe = pr;
        }
        double traceError = absSum > 0 ? Math.abs(sumRe - trace) / absSum : 0;
        double det = new LUDecomposition(new Array2DRowRealMatrix(scaled, false), 0).getDeterminant();
        double detSize = Math.max(Math.abs(det), Math.hypot(prodRe, prodIm));
        double detError = detSize > 1e-300 ? Math.hypot(prodRe - det, prodIm) / detSize : 0;

        double[][][] right = new double[n][][];
        double[][][] left = new double[n][][];
        double maxResidual = 0;
        double[][] mr = new double[n][n];
        double[][] mi = new double[n][n];
        for (int m = 0; m < n; m++) {
            double[][] vectors = eigenvectors(scaled, sre[m], sim[m], mr, mi);
            right[m] = new double[][] {vectors[0], vectors[1]};
            left[m] = new double[][] {vectors[2], vectors[3]};
            maxResidual = Math.max(maxResidual, residual(scaled, sre[m], sim[m], vectors[0], vectors[1]) / frobenius);
        }
        for (int i = 0; i < n; i++) {
            sre[i] *= scale;
            sim[i] *= scale;
        }
        for (int m = 0; m < n; m++) {
            // back from D⁻¹·A·D: right vectors D·v, left vectors D⁻¹·w, each to unit length again
            unbalance(right[m], balance, false);
            unbalance(left[m], balance, true);
        }
        return Optional.of(new Eigenpairs(sre, sim, right, left, traceError, detError, maxResidual));
    }

    /**
     * Balancing (Parlett and Reinsch, "Balancing a matrix for calculation of eigenvalues and
     * eigenvectors", Numer. Math. 13, 1969; Golub and Van Loan, Matrix Computations, 4th ed.,
     * 7.5.7): D⁻¹·A·D with D a diagonal of powers of 2 (exact) that makes each row and column of
     * similar size. The eigenvalues are A's; the Hessenberg QR then sees a matrix of far smaller
     * norm. A cascade of amplifying stages needs it: its port admittances carry the cascade's
     * gain (1e11 after six stages of 38 dB) below the diagonal, and the QR iteration did not
     * converge on that matrix unbalanced.
     *
     * @param d filled with D's diagonal
     */
    private static double[][] balanced(double[][] a, double[] d) {
        int n = a.length;
        double[][] b = new double[n][];
        for (int i = 0; i < n; i++) {
            b[i] = a[i].clone();
            d[i] = 1;
        }
        boolean done = false;
        for (int sweep = 0; sweep < 100 && !done; sweep++) {
            done = true;
            for (int i = 0; i < n; i++) {
                double c = 0;
                double r = 0;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        c += Math.abs(b[j][i]);
                        r += Math.abs(b[i][j]);
                    }
                }
                if (c == 0 || r == 0) {
                    continue;
                }
                double sum = c + r;
                double f = 1;
                while (c < r / 2) {
                    f *= 2;
                    c *= 4;
                }
                while (c >= 2 * r) {
                    f /= 2;
                    c /= 4;
                }
                if ((c + r) / f < 0.95 * sum) {
                    done = false;
                    d[i] *= f;
                    for (int j = 0; j < n; j++) {
                        b[i][j] /= f;
                        b[j][i] *= f;
                    }
                }
            }
        }
        return b;
    }

    private static void unbalance(double[][] vector, double[] d, boolean left) {
        double[] re = vector[0];
        double[] im = vector[1];
        double norm = 0;
        for (int i = 0; i < re.length; i++) {
            double f = left ? 1 / d[i] : d[i];
            re[i] *= f;
            im[i] *= f;
            norm += re[i] * re[i] + im[i] * im[i];
        }
        norm = Math.sqrt(norm);
        for (int i = 0; i < re.length; i++) {
            re[i] /= norm;
            im[i] /= norm;
        }
    }

    // Inverse iteration at μ = λ + δ: δ is far below the gap to any other eigenvalue of a stage,
    // and keeps the factors away from an exactly zero pivot.
    private static double[][] eigenvectors(double[][] a, double lr, double li, double[][] mr, double[][] mi) {
        int n = a.length;
        double shift = 1e-11 * Math.hypot(lr, li) + 1e-14;
        ComplexLu lu = new ComplexLu(mr, mi);
        // an exactly zero pivot needs a larger shift; three tries cover any matrix (the third is 1e6 larger)
        for (int attempt = 0; attempt < 3; attempt++, shift *= 1e3) {
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    mr[i][j] = a[i][j];
                    mi[i][j] = 0;
                }
                mr[i][i] -= lr + shift;
                mi[i][i] -= li + shift;
            }
            if (lu.factor()) {
                break;
            }
        }
        double[] vr = new double[n];
        double[] vi = new double[n];
        double[] wr = new double[n];
        double[] wi = new double[n];
        for (int i = 0; i < n; i++) {
            // a start vector with no special direction
            vr[i] = 1 + 0.37 * i;
            vi[i] = 0.11 * (n - i);
            wr[i] = vr[i];
            wi[i] = vi[i];
        }
        for (int step = 0; step < INVERSE_ITERATIONS; step++) {
            lu.solve(vr, vi);
            normalise(vr, vi);
            lu.solveTransposed(wr, wi);
            normalise(wr, wi);
        }
        return new double[][] {vr, vi, wr, wi};
    }

    private static void normalise(double[] xr, double[] xi) {
        double norm = 0;
        for (int i = 0; i < xr.length; i++) {
            norm += xr[i] * xr[i] + xi[i] * xi[i];
        }
        norm = 1 / Math.sqrt(norm);
        for (int i = 0; i < xr.length; i++) {
            xr[i] *= norm;
            xi[i] *= norm;
        }
    }

    private static double residual(double[][] a, double lr, double li, double[] vr, double[] vi) {
        double sum = 0;
        for (int i = 0; i < a.length; i++) {
            double rr = -(lr * vr[i] - li * vi[i]);
            double ri = -(lr * vi[i] + li * vr[i]);
            for (int j = 0; j < a.length; j++) {
                rr += a[i][j] * vr[j];
                ri += a[i][j] * vi[j];
            }
            sum += rr * rr + ri * ri;
        }
        return Math.sqrt(sum);
    }
}

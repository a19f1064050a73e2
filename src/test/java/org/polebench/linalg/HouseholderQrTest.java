package org.polebench.linalg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.junit.jupiter.api.Test;

/**
 * Householder QR least squares against EJML (test scope, an independent library), against the
 * closed form of a straight-line fit, and on a stacked matrix whose columns span nine decades,
 * where the explicit normal equations lose the small eigenvalues and QR keeps them.
 */
class HouseholderQrTest {
    private static final long SEED = 2026_1202L;
    private static final double U = Math.ulp(1.0) / 2;

    @Test
    void leastSquaresSolutionAndGramInverseAgreeWithEjml() {
        SplittableRandom random = new SplittableRandom(SEED);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + random.nextInt(12);
            int m = n + random.nextInt(30);
            DMatrixRMaj a = new DMatrixRMaj(m, n);
            double[][] columns = new double[n][m];
            for (int i = 0; i < m; i++) {
                for (int j = 0; j < n; j++) {
                    double v = random.nextDouble(-1, 1) + (i == j ? 2 : 0);
                    a.set(i, j, v);
                    columns[j][i] = v;
                }
            }
            double[] b = new double[m];
            for (int i = 0; i < m; i++) {
                b[i] = random.nextDouble(-1, 1);
            }
            // EJML's own Householder QR least-squares solver and its inverse of AᵀA
            LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.leastSquares(m, n);
            assertTrue(solver.setA(a.copy()));
            DMatrixRMaj expected = new DMatrixRMaj(n, 1);
            solver.solve(new DMatrixRMaj(m, 1, true, b), expected);
            DMatrixRMaj gram = new DMatrixRMaj(n, n);
            CommonOps_DDRM.multTransA(a, a, gram);
            DMatrixRMaj gramInverse = new DMatrixRMaj(n, n);
            assertTrue(CommonOps_DDRM.invert(gram.copy(), gramInverse));
            double kappa = NormOps_DDRM.conditionP2(a);

            HouseholderQr qr = HouseholderQr.ofColumns(columns, m).orElseThrow();
            double[] x = qr.solve(b);
            // the least-squares solution's sensitivity is of order κ² (Higham, Accuracy and
            // Stability of Numerical Algorithms, 2nd ed., 20.1); 100·m·u·κ² leaves room for the
            // constants the bound leaves out, while a wrong reflector shows at order 1
            double tolerance = 100 * m * U * kappa * kappa;
            for (int j = 0; j < n; j++) {
                assertEquals(expected.get(j), x[j], tolerance * Math.max(1, Math.abs(expected.get(j))),
                        "trial " + trial + ", x" + j);
            }
            double[][] ours = qr.gramInverse();
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    assertEquals(gramInverse.get(i, j), ours[i][j], tolerance * Math.max(1, Math.abs(gramInverse.get(i, j))),
                            "trial " + trial + ", (AᵀA)⁻¹ " + i + "," + j);
                }
            }
            // ln det(AᵀA) against EJML's LU determinant of the formed AᵀA (well conditioned here)
            assertEquals(Math.log(CommonOps_DDRM.det(gram)), qr.lnDeterminantOfGram(), tolerance * n,
                    "trial " + trial + ", ln det");
        }
    }

    @Test
    void straightLineFitHasTheClosedFormSlopeInterceptAndVariances() {
        // y = a + b·x at x = 0..9 with unit weights; the closed forms are the textbook ones:
        // b = Sxy/Sxx, a = ȳ − b·x̄, var b = 1/Sxx, var a = Σx²/(n·Sxx) (common practice)
        int n = 10;
        double[][] columns = new double[2][n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            columns[0][i] = 1;
            columns[1][i] = i;
            y[i] = 3 - 0.5 * i + (i % 3 == 0 ? 0.1 : -0.05);
        }
        double meanX = 4.5;
        double meanY = 0;
        for (double v : y) {
            meanY += v / n;
        }
        double sxx = 0;
        double sxy = 0;
        double sumX2 = 0;
        for (int i = 0; i < n; i++) {
            sxx += (i - meanX) * (i - meanX);
            sxy += (i - meanX) * (y[i] - meanY);
            sumX2 += i * i;
        }
        HouseholderQr qr = HouseholderQr.ofColumns(columns, n).orElseThrow();
        double[] fit = qr.solve(y);
        double[][] covariance = qr.gramInverse();
        // 1e-13: a few hundred roundings on numbers of order 10
        assertEquals(sxy / sxx, fit[1], 1e-13);
        assertEquals(meanY - sxy / sxx * meanX, fit[0], 1e-13);
        assertEquals(1 / sxx, covariance[1][1], 1e-15);
        assertEquals(sumX2 / (n * sxx), covariance[0][0], 1e-15);
        assertEquals(-meanX / sxx, covariance[0][1], 1e-15);
        // ln det(AᵀA) = ln(n·Sxx) for the design [1, x] (the determinant of the 2×2 moment matrix)
        assertEquals(Math.log(n * sxx), qr.lnDeterminantOfGram(), 1e-13);
    }

    @Test
    void priorRowsUnderColumnsNineDecadesApartKeepTheirCovariance() {
        // A = [Q·D; I]: D = diag(1, 10, …, 1e9), Q an exact reflector I − 2wwᵀ/wᵀw, then the unit
        // prior rows. AᵀA = D·D + I, so (AᵀA)⁻¹ = diag(1/(d²+1)) and ln det = Σ ln(d²+1) exactly.
        // Formed explicitly, AᵀA has entries near 1e18 beside the unit prior part, which
        // rounding (1e18·u ≈ 100) wipes out: the normal equations cannot see the priors there.
        int n = 10;
        int m = 2 * n;
        double[] w = new double[n];
        SplittableRandom random = new SplittableRandom(SEED + 1);
        double ww = 0;
        for (int i = 0; i < n; i++) {
            w[i] = random.nextDouble(-1, 1);
            ww += w[i] * w[i];
        }
        double[][] columns = new double[n][m];
        double[] d = new double[n];
        double lnDet = 0;
        for (int j = 0; j < n; j++) {
            d[j] = Math.pow(10, j);
            for (int i = 0; i < n; i++) {
                columns[j][i] = ((i == j ? 1 : 0) - 2 * w[i] * w[j] / ww) * d[j];
            }
            columns[j][n + j] = 1;
            lnDet += Math.log(d[j] * d[j] + 1);
        }
        Optional<HouseholderQr> qr = HouseholderQr.ofColumns(columns, m);
        assertTrue(qr.isPresent());
        double[][] covariance = qr.get().gramInverse();
        for (int j = 0; j < n; j++) {
            // backward stability perturbs A by about u·‖A‖ = 1e9·u ≈ 1e-7 relative to the unit
            // singular values, so 1e-6 relative; the off-diagonal entries are zero by construction
            assertEquals(1 / (d[j] * d[j] + 1), covariance[j][j], 1e-6 / (d[j] * d[j] + 1), "variance " + j);
            for (int i = 0; i < j; i++) {
                assertEquals(0, covariance[i][j], 1e-6, "covariance " + i + "," + j);
            }
        }
        assertEquals(lnDet, qr.get().lnDeterminantOfGram(), 1e-6);
    }

    @Test
    void aRepeatedColumnIsRankDeficient() {
        // the second column equals the first: rank 1 by construction
        double[][] columns = {{1, 2, 3, 4}, {1, 2, 3, 4}};
        assertTrue(HouseholderQr.ofColumns(columns, 4).isEmpty());
        // and a column with a value that is not a number is refused rather than factored
        assertTrue(HouseholderQr.ofColumns(new double[][] {{1, Double.NaN, 3}}, 3).isEmpty());
    }
}

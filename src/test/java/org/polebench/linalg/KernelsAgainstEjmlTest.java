package org.polebench.linalg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.synth.BoardSynthesizer;

/**
 * The linalg kernels against EJML (test scope, an independent library) on seeded random
 * matrices: the real LU's solve and inverse, the complex LU's solve and transposed solve,
 * the eigenvalue recipe's eigenvalues and vectors, and the
 * swept port LU's solves at every frequency (on random equations and on a demo stage's).
 *
 * <p>Tolerances: an LU solve with pivoting is backward stable, so two of them agree
 * to about n·u·κ(A) relative to the solution (Higham, Accuracy and Stability of Numerical
 * Algorithms, 2nd ed., §9.3 and §10.1; u = 2⁻⁵³ ≈ 1.1e-16). Each check below computes κ∞(A) with
 * EJML and allows 100·n·u·κ∞(A): a factor 100 over the bound's own size for the constants the
 * bound leaves out, while a wrong pivot, sign or index shows at order 1.
 */
class KernelsAgainstEjmlTest {
    private static final long SEED = 2026_0512L;
    private static final long PORT_SEED = 2026_0501L;
    private static final double U = Math.ulp(1.0) / 2;
    private static final int TRIALS = 200;

    @Test
    void realLuSolvesAndInvertsAsEjml() {
        SplittableRandom random = new SplittableRandom(SEED);
        for (int trial = 0; trial < TRIALS; trial++) {
            int n = 1 + random.nextInt(15);
            double[][] a = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    // about two thirds zeros, as in an MNA matrix; a unit diagonal keeps most draws regular
                    a[i][j] = (i == j ? 1 : 0) + (random.nextInt(3) == 0 ? gaussian(random) : 0);
                }
            }
            double[] b = gaussians(random, n);
            DMatrixRMaj m = new DMatrixRMaj(a);
            DMatrixRMaj inverse = new DMatrixRMaj(n, n);
            if (!CommonOps_DDRM.invert(m.copy(), inverse)) {
                continue;   // singular by chance: the next test covers that case
            }
            double kappa = NormOps_DDRM.inducedPInf(m) * NormOps_DDRM.inducedPInf(inverse);
            DMatrixRMaj expected = new DMatrixRMaj(n, 1);
            assertTrue(CommonOps_DDRM.solve(m.copy(), new DMatrixRMaj(n, 1, true, b), expected));

            RealLu lu = new RealLu(a, 1e-300);
            assertTrue(lu.isNonSingular(), "trial " + trial);
            assertClose(expected.data, lu.solve(b), 100 * n * U * kappa, "trial " + trial + ", x");
            double[][] ours = lu.inverse();
            for (int i = 0; i < n; i++) {
                double[] row = new double[n];
                System.arraycopy(inverse.data, i * n, row, 0, n);
                assertClose(row, ours[i], 100 * n * U * kappa, "trial " + trial + ", inverse row " + i);
            }
        }
    }

    @Test
    void dependentRowsAreSingular() {
        // the second row is twice the first: singular by construction
        double[][] a = {{1, 2, 0}, {2, 4, 0}, {0, 1, 3}};
        assertFalse(new RealLu(a, 1e-12).isNonSingular());
        // EJML's invert does not refuse it (its check is not a pivot threshold), but its LU
        // determinant is zero to round-off: det = 0 by construction
        assertEquals(0, CommonOps_DDRM.det(new DMatrixRMaj(a)), 1e-12);
    }

    @Test
    void complexLuSolvesAndSolvesTransposedAsEjml() {
        SplittableRandom random = new SplittableRandom(SEED + 1);
        for (int trial = 0; trial < TRIALS; trial++) {
            int n = 1 + random.nextInt(12);
            double[][] re = new double[n][n];
            double[][] im = new double[n][n];
            ZMatrixRMaj m = new ZMatrixRMaj(n, n);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    re[i][j] = gaussian(random) + (i == j ? 2 : 0);
                    im[i][j] = gaussian(random);
                    m.set(i, j, re[i][j], im[i][j]);
                }
            }
            double kappa = complexConditionInf(m);
            double[] br = gaussians(random, n);
            double[] bi = gaussians(random, n);
            double[][] expected = complexSolve(m, br, bi);
            double[][] expectedT = complexSolve(CommonOps_ZDRM.transpose(m, null), br, bi);

            ComplexLu lu = new ComplexLu(re, im);
            assertTrue(lu.factor(), "trial " + trial);
            double[] xr = br.clone();
            double[] xi = bi.clone();
            lu.solve(xr, xi);
            double[] tr = br.clone();
            double[] ti = bi.clone();
            lu.solveTransposed(tr, ti);
            double tolerance = 100 * n * U * kappa;
            assertClose(expected[0], expected[1], xr, xi, tolerance, "trial " + trial + ", A·x = b");
            assertClose(expectedT[0], expectedT[1], tr, ti, tolerance, "trial " + trial + ", Aᵀ·x = b");
        }
    }

    @Test
    void eigenvaluesAndVectorsAgreeWithEjml() {
        SplittableRandom random = new SplittableRandom(SEED + 3);
        EigenSolver solver = new EigenSolver();
        for (int trial = 0; trial < TRIALS; trial++) {
            int n = 1 + random.nextInt(10);
            double scale = Math.pow(10, -3 + 9 * random.nextDouble());   // a state matrix's 1/s, over decades
            double[][] a = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    a[i][j] = scale * gaussian(random);
                }
            }
            DMatrixRMaj m = new DMatrixRMaj(a);
            double norm = NormOps_DDRM.normF(m);
            EigenDecomposition_F64<DMatrixRMaj> reference = DecompositionFactory_DDRM.eig(n, false);
            assertTrue(reference.decompose(m.copy()));
            List<Complex_F64> theirs = new ArrayList<>();
            for (int i = 0; i < reference.getNumberOfEigenvalues(); i++) {
                theirs.add(reference.getEigenvalue(i));
            }

            Eigenpairs ours = solver.eigenpairs(a, false).orElseThrow();
            assertEquals(n, ours.size());
            for (int k = 0; k < n; k++) {
                double[][] v = ours.right(k);
                double[][] w = ours.left(k);
                // the eigenvalue's condition number 1/|wᵀv| (Golub and Van Loan, 4th ed., §7.2.2;
                // both vectors of unit norm): a perturbation of size u·‖A‖ moves λ by about that times κ
                double dotRe = 0;
                double dotIm = 0;
                for (int i = 0; i < n; i++) {
                    dotRe += w[0][i] * v[0][i] - w[1][i] * v[1][i];
                    dotIm += w[0][i] * v[1][i] + w[1][i] * v[0][i];
                }
                double kappa = 1 / Math.hypot(dotRe, dotIm);
                // both libraries are backward stable (Schur by QR iterations): 1000·n·u·κ·‖A‖_F
                // allows for the constants and for the scaling step's rounding
                double tolerance = 1000 * n * U * kappa * norm;
                Complex_F64 nearest = nearest(theirs, ours.re(k), ours.im(k));
                assertEquals(nearest.real, ours.re(k), tolerance, "trial " + trial + ", Re λ" + k);
                assertEquals(nearest.imaginary, ours.im(k), tolerance, "trial " + trial + ", Im λ" + k);
                theirs.remove(nearest);
                // the right vector checked by EJML's own product: ‖A·v − λv‖ ≤ tolerance
                ZMatrixRMaj za = new ZMatrixRMaj(n, n);
                ZMatrixRMaj zv = new ZMatrixRMaj(n, 1);
                for (int i = 0; i < n; i++) {
                    zv.set(i, 0, v[0][i], v[1][i]);
                    for (int j = 0; j < n; j++) {
                        za.set(i, j, a[i][j], 0);
                    }
                }
                ZMatrixRMaj av = new ZMatrixRMaj(n, 1);
                CommonOps_ZDRM.mult(za, zv, av);
                double residual = 0;
                for (int i = 0; i < n; i++) {
                    double rr = av.getReal(i, 0) - (ours.re(k) * v[0][i] - ours.im(k) * v[1][i]);
                    double ri = av.getImag(i, 0) - (ours.re(k) * v[1][i] + ours.im(k) * v[0][i]);
                    residual += rr * rr + ri * ri;
                }
                assertTrue(Math.sqrt(residual) <= tolerance, "trial " + trial + ", residual of v" + k);
            }
        }
    }

    private static Complex_F64 nearest(List<Complex_F64> values, double re, double im) {
        Complex_F64 best = values.get(0);
        for (Complex_F64 c : values) {
            if (Math.hypot(c.real - re, c.imaginary - im) < Math.hypot(best.real - re, best.imaginary - im)) {
                best = c;
            }
        }
        return best;
    }

    private static double complexConditionInf(ZMatrixRMaj m) {
        ZMatrixRMaj inverse = new ZMatrixRMaj(m.numRows, m.numCols);
        assertTrue(CommonOps_ZDRM.invert(m.copy(), inverse));
        return infNorm(m) * infNorm(inverse);
    }

    private static double infNorm(ZMatrixRMaj m) {
        double norm = 0;
        for (int i = 0; i < m.numRows; i++) {
            double row = 0;
            for (int j = 0; j < m.numCols; j++) {
                row += Math.hypot(m.getReal(i, j), m.getImag(i, j));
            }
            norm = Math.max(norm, row);
        }
        return norm;
    }

    private static double[][] complexSolve(ZMatrixRMaj m, double[] br, double[] bi) {
        int n = br.length;
        ZMatrixRMaj b = new ZMatrixRMaj(n, 1);
        for (int i = 0; i < n; i++) {
            b.set(i, 0, br[i], bi[i]);
        }
        ZMatrixRMaj x = new ZMatrixRMaj(n, 1);
        assertTrue(CommonOps_ZDRM.solve(m.copy(), b, x));
        double[][] out = new double[2][n];
        for (int i = 0; i < n; i++) {
            out[0][i] = x.getReal(i, 0);
            out[1][i] = x.getImag(i, 0);
        }
        return out;
    }

    /** Asserts max |expected − actual| ≤ relative · max |expected|. */
    private static void assertClose(double[] expected, double[] actual, double relative, String what) {
        double size = 0;
        double difference = 0;
        for (int i = 0; i < expected.length; i++) {
            size = Math.max(size, Math.abs(expected[i]));
            difference = Math.max(difference, Math.abs(expected[i] - actual[i]));
        }
        assertTrue(difference <= relative * size, what + ": difference " + difference + " of " + size);
    }

    private static void assertClose(double[] expectedRe, double[] expectedIm, double[] re, double[] im, double relative,
                                    String what) {
        double size = 0;
        double difference = 0;
        for (int i = 0; i < re.length; i++) {
            size = Math.max(size, Math.hypot(expectedRe[i], expectedIm[i]));
            difference = Math.max(difference, Math.hypot(expectedRe[i] - re[i], expectedIm[i] - im[i]));
        }
        assertTrue(difference <= relative * size, what + ": difference " + difference + " of " + size);
    }

    private static double gaussian(SplittableRandom random) {
        // Box–Muller (SplittableRandom has no nextGaussian in Java 17)
        return Math.sqrt(-2 * Math.log(1 - random.nextDouble())) * Math.cos(2 * Math.PI * random.nextDouble());
    }

    private static double[] gaussians(SplittableRandom random, int n) {
        double[] values = new double[n];
        for (int i = 0; i < n; i++) {
            values[i] = gaussian(random);
        }
        return values;
    }

    @Test
    void demoStagePortEquationsMatchEjmlAtEverySweptFrequency() throws InputProblem {
        // the geophone stage's Y needs row exchanges at most frequencies (its transconductance
        // entries dwarf the diagonal): the case the per-frequency pivoting is for
        Stage stage = new StageReader().read(Path.of("sample-measurements", "geophone-two-stage.stage.yaml")).stage();
        SmallSignalNetwork network = new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage));
        StateModel model = ((Reduction.StateSpace) new PortReduction().reduce(network, Band.LOW)).model();
        int k = model.order();
        double[] y = new double[k * k];
        double[] farads = new double[k];
        double[] b = new double[k];
        for (int i = 0; i < k; i++) {
            farads[i] = model.farads(i);
            b[i] = -model.farads(i) * model.b()[i];
            for (int j = 0; j < k; j++) {
                y[i * k + j] = model.admittanceSiemens(i, j);
            }
        }
        double[] omegas = omegas(BoardSynthesizer.logSpaced(0.5, 5000, 100).stream()
                .mapToDouble(Double::doubleValue).toArray());
        assertMatchesEjml(y, farads, b, model.c(), omegas);
    }

    @Test
    void randomPortEquationsMatchEjml() {
        SplittableRandom random = new SplittableRandom(PORT_SEED);
        for (int trial = 0; trial < 200; trial++) {
            int k = 1 + random.nextInt(6);
            double[] y = new double[k * k];
            double[] farads = new double[k];
            double[] r = new double[k];
            double[] c = new double[k];
            for (int i = 0; i < k; i++) {
                // admittances over four decades and capacitors over three, as in a real stage
                farads[i] = 1e-7 * Math.pow(10, 3 * random.nextDouble());
                r[i] = random.nextDouble() * 2 - 1;
                c[i] = random.nextDouble() * 2 - 1;
                for (int j = 0; j < k; j++) {
                    y[i * k + j] = (random.nextDouble() * 2 - 1) * Math.pow(10, -5 + 4 * random.nextDouble());
                }
            }
            double[] hz = new double[1 + random.nextInt(40)];
            for (int n = 0; n < hz.length; n++) {
                hz[n] = Math.pow(10, -1 + 5 * random.nextDouble());
            }
            assertMatchesEjml(y, farads, r, c, omegas(hz));
        }
    }

    @Test
    void aPortWithNoAdmittanceAndNoCapacitanceIsSingular() {
        // column 1 of Y is zero and C_1 = 0: M's second column vanishes at every frequency
        double[] y = {2e-3, 0, 1e-3, 0};
        SweptPortEquations equations = new SweptPortEquations(2, omegas(new double[] {10, 100}));
        assertFalse(equations.factor(y, new double[] {1e-6, 0}));
    }

    private static void assertMatchesEjml(double[] y, double[] farads, double[] r, double[] c, double[] omegas) {
        int k = farads.length;
        SweptPortEquations equations = new SweptPortEquations(k, omegas);
        assertTrue(equations.factor(y, farads));
        double[][] xr = new double[k][omegas.length];
        double[][] xi = new double[k][omegas.length];
        double[][] ur = new double[k][omegas.length];
        double[][] ui = new double[k][omegas.length];
        equations.solve(r, xr, xi);
        equations.solveTransposed(c, ur, ui);
        for (int n = 0; n < omegas.length; n++) {
            ZMatrixRMaj m = new ZMatrixRMaj(k, k);
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < k; j++) {
                    m.set(i, j, y[i * k + j], i == j ? omegas[n] * farads[i] : 0);
                }
            }
            ZMatrixRMaj transposed = CommonOps_ZDRM.transpose(m, null);
            assertSolution(m, r, xr, xi, n);
            assertSolution(transposed, c, ur, ui, n);
        }
    }

    // Both are LU solves with partial pivoting, backward stable (Golub and Van Loan, Matrix
    // Computations, 3rd ed., 3.4.6): their solutions differ by about cond(M)·ε. 1e-11 of the
    // solution's size allows cond(M) up to about 5e4; the largest difference with this seed is
    // 3e-14, while a wrong pivot or a wrong sign shows at order 1.
    private static void assertSolution(ZMatrixRMaj m, double[] r, double[][] xr, double[][] xi, int n) {
        int k = r.length;
        ZMatrixRMaj rhs = new ZMatrixRMaj(k, 1);
        for (int i = 0; i < k; i++) {
            rhs.set(i, 0, r[i], 0);
        }
        ZMatrixRMaj expected = new ZMatrixRMaj(k, 1);
        assertTrue(CommonOps_ZDRM.solve(m.copy(), rhs, expected));
        double size = 0;
        double difference = 0;
        Complex_F64 value = new Complex_F64();
        for (int i = 0; i < k; i++) {
            expected.get(i, 0, value);
            size = Math.max(size, Math.hypot(value.real, value.imaginary));
            difference = Math.max(difference, Math.hypot(value.real - xr[i][n], value.imaginary - xi[i][n]));
        }
        assertTrue(difference <= 1e-11 * size, "frequency " + n + ": difference " + difference + " of " + size);
    }

    private static double[] omegas(double[] hz) {
        double[] omegas = new double[hz.length];
        for (int n = 0; n < hz.length; n++) {
            omegas[n] = 2 * Math.PI * hz[n];
        }
        return omegas;
    }
}

package org.polebench.linalg;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.SplittableRandom;
import org.ejml.data.Complex_F64;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
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
 * The batched port solve against EJML's dense complex LU solve (test scope, an independent
 * library) of the same (Y + jω·Cd)·x = r, one frequency at a time.
 */
class SweptPortEquationsTest {
    private static final long SEED = 2026_0501L;

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
        SplittableRandom random = new SplittableRandom(SEED);
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

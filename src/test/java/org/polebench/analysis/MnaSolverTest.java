package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.apache.commons.math3.complex.Complex;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Band;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.linalg.ComplexLu;

/** Our MNA solves against EJML (an independent linear-algebra library) on the same matrices. */
class MnaSolverTest {
    // both solvers use partial pivoting on matrices with condition below about 1e6:
    // agreement to 1e-10 of the solution's size leaves room for round-off of either
    private static final double AGREEMENT = 1e-10;

    @Test
    void realPortSystemMatchesEjml() {
        SmallSignalNetwork network = Stages.typicalCommonEmitter().network();
        MnaSystem system = MnaSystem.withPorts(network, network.capacitances(Band.LOW), List.of());
        MnaSolver.Factored factored = new MnaSolver().factor(system).orElseThrow();
        DMatrixRMaj a = new DMatrixRMaj(system.matrix());
        for (int source = 0; source < system.sourceCount(); source++) {
            double[] rhs = system.sourceExcitation(source, 1);
            double[] ours = factored.solve(rhs);
            DMatrixRMaj x = new DMatrixRMaj(rhs.length, 1);
            assertTrue(CommonOps_DDRM.solve(a, new DMatrixRMaj(rhs.length, 1, true, rhs), x));
            double size = CommonOps_DDRM.elementMaxAbs(x);
            for (int i = 0; i < rhs.length; i++) {
                assertEquals(x.get(i, 0), ours[i], AGREEMENT * size);
            }
        }
    }

    @Test
    void fullComplexResponseMatchesEjmlAtManyFrequencies() {
        SmallSignalNetwork network = Stages.typicalCommonEmitter().network();
        FullResponse response = new FullResponse(network);
        for (double f = 0.1; f < 1e6; f *= 3.7) {
            double omega = 2 * Math.PI * f;
            double[][][] m = response.matrixAt(omega);
            int n = m[0].length;
            ZMatrixRMaj a = new ZMatrixRMaj(n, n);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    a.set(i, j, m[0][i][j], m[1][i][j]);
                }
            }
            ZMatrixRMaj b = new ZMatrixRMaj(n, 1);
            double[] rhs = response.excitation();
            for (int i = 0; i < n; i++) {
                b.set(i, 0, rhs[i], 0);
            }
            ZMatrixRMaj x = new ZMatrixRMaj(n, 1);
            assertTrue(CommonOps_ZDRM.solve(a, b, x));
            int out = network.outputNode() - 1;
            Complex ours = response.atRadPerS(omega).orElseThrow();
            double size = Math.hypot(x.getReal(out, 0), x.getImag(out, 0));
            assertEquals(x.getReal(out, 0), ours.getReal(), AGREEMENT * size);
            assertEquals(x.getImag(out, 0), ours.getImaginary(), AGREEMENT * size);
        }
    }

    @Test
    void complexLuSolvesAndTransposeSolvesMatchEjml() {
        Random random = new Random(20261201L); // fixed seed
        for (int trial = 0; trial < 50; trial++) {
            int n = 1 + random.nextInt(12);
            double[][] re = new double[n][n];
            double[][] im = new double[n][n];
            ZMatrixRMaj a = new ZMatrixRMaj(n, n);
            ZMatrixRMaj at = new ZMatrixRMaj(n, n);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    re[i][j] = random.nextGaussian();
                    im[i][j] = random.nextGaussian();
                    a.set(i, j, re[i][j], im[i][j]);
                    at.set(j, i, re[i][j], im[i][j]);
                }
            }
            double[] br = new double[n];
            double[] bi = new double[n];
            ZMatrixRMaj b = new ZMatrixRMaj(n, 1);
            for (int i = 0; i < n; i++) {
                br[i] = random.nextGaussian();
                bi[i] = random.nextGaussian();
                b.set(i, 0, br[i], bi[i]);
            }
            ComplexLu lu = new ComplexLu(re, im);
            assertTrue(lu.factor());
            double[] xr = br.clone();
            double[] xi = bi.clone();
            lu.solve(xr, xi);
            double[] yr = br.clone();
            double[] yi = bi.clone();
            lu.solveTransposed(yr, yi);
            ZMatrixRMaj x = new ZMatrixRMaj(n, 1);
            ZMatrixRMaj y = new ZMatrixRMaj(n, 1);
            assertTrue(CommonOps_ZDRM.solve(a, b, x));
            assertTrue(CommonOps_ZDRM.solve(at, b, y));
            // random Gaussian matrices of order ≤ 12 have condition numbers well below 1e6
            double tol = 1e-8 * (1 + CommonOps_ZDRM.elementMaxAbs(x)) ;
            double tolT = 1e-8 * (1 + CommonOps_ZDRM.elementMaxAbs(y));
            for (int i = 0; i < n; i++) {
                assertEquals(x.getReal(i, 0), xr[i], tol);
                assertEquals(x.getImag(i, 0), xi[i], tol);
                assertEquals(y.getReal(i, 0), yr[i], tolT);
                assertEquals(y.getImag(i, 0), yi[i], tolT);
            }
        }
    }
}

package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;

class PoleFinderTest {

    /**
     * Regression for the Commons Math 3.6.1 trap (docs/method.md, "Poles and zeros"): on matrices whose eigenvalues
     * span 10…10⁷, unscaled EigenDecomposition returned false complex pairs for about a quarter.
     */
    @Test
    void eigenvaluesSpanningSixDecadesStayReal() {
        Random random = new Random(7_2026L); // fixed seed
        PoleFinder finder = new PoleFinder();
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + random.nextInt(5);
            double[] truth = new double[n];
            for (int i = 0; i < n; i++) {
                truth[i] = -Math.pow(10, 1 + 6 * random.nextDouble());
            }
            // A = V·diag(λ)·V⁻¹ with a random well-conditioned V: eigenvalues known by construction
            double[][] v = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    v[i][j] = (i == j ? 2 : 0) + 0.5 * random.nextGaussian();
                }
            }
            RealMatrix vm = new Array2DRowRealMatrix(v);
            RealMatrix a = vm.multiply(new Array2DRowRealMatrix(diagonal(truth)))
                    .multiply(new LUDecomposition(vm).getSolver().getInverse());
            Spectrum s = finder.spectrum(a.getData()).orElseThrow();
            double[] sorted = truth.clone();
            Arrays.sort(sorted);
            List<ComplexFrequency> roots = s.roots();
            for (int i = 0; i < n; i++) {
                ComplexFrequency root = roots.get(n - 1 - i);
                assertTrue(root.isReal(), "trial " + trial + ": " + roots);
                // each eigenvalue to 1e-6 of its size: round-off is ε·‖A‖·cond(V), and the
                // smallest is 10⁶ times below ‖A‖
                assertEquals(sorted[i], root.realRadPerS(), 1e-6 * Math.abs(sorted[i]));
            }
            // the checks of docs/method.md, "Poles and zeros": trace, determinant, residual
            assertTrue(s.traceRelativeError() < 1e-12, "trace " + s.traceRelativeError());
            assertTrue(s.determinantRelativeError() < 1e-6, "det " + s.determinantRelativeError());
            assertTrue(s.maxRelativeResidual() < 1e-9, "residual " + s.maxRelativeResidual());
        }
    }

    @Test
    void complexPairOfAKnownMatrixIsFound() {
        // [[σ, ω], [−ω, σ]] has eigenvalues σ ± jω (closed form)
        Spectrum s = new PoleFinder().spectrum(new double[][] {{-30, 400}, {-400, -30}}).orElseThrow();
        assertEquals(new ComplexFrequency(-30, 400), s.roots().get(0));
        assertEquals(new ComplexFrequency(-30, -400), s.roots().get(1));
    }

    private static double[][] diagonal(double[] values) {
        double[][] d = new double[values.length][values.length];
        for (int i = 0; i < values.length; i++) {
            d[i][i] = values[i];
        }
        return d;
    }
}

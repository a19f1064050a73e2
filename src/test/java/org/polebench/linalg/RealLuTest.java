package org.polebench.linalg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.LUDecomposition;
import org.junit.jupiter.api.Test;

class RealLuTest {

    @Test
    void sparseSystemsSolveAsCommonsMathSolvesThem() {
        Random random = new Random(20_261_201L);
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + random.nextInt(18);
            double[][] m = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    // about two thirds zeros, as in an MNA matrix; a non-zero diagonal keeps it regular
                    m[i][j] = i == j ? 1 + random.nextDouble() : random.nextInt(3) == 0 ? random.nextGaussian() : 0;
                }
            }
            double[] b = new double[n];
            b[random.nextInt(n)] = 1;
            b[random.nextInt(n)] += random.nextGaussian();

            RealLu lu = new RealLu(m, 1e-300);
            DecompositionSolver reference = new LUDecomposition(new Array2DRowRealMatrix(m)).getSolver();

            // Commons Math's LU is the independent reference. 1e-10 of the solution's size (1e-8
            // absolute for the inverse): both pivot alike and differ only in the order of rounding,
            // about 1e-16 times the condition number, which for these seeded matrices stays far
            // below 1e6 (found by running them; a failure here would first mean an ill-posed draw)
            assertTrue(lu.isNonSingular());
            double[] x = lu.solve(b);
            double[] expected = reference.solve(new ArrayRealVector(b)).toArray();
            double[][] inverse = lu.inverse();
            double[][] expectedInverse = reference.getInverse().getData();
            double size = 0;
            for (double v : expected) {
                size = Math.max(size, Math.abs(v));
            }
            for (int i = 0; i < n; i++) {
                assertEquals(expected[i], x[i], 1e-10 * size, "trial " + trial + ", x" + i);
                for (int j = 0; j < n; j++) {
                    assertEquals(expectedInverse[i][j], inverse[i][j], 1e-8, "trial " + trial);
                }
            }
        }
    }

    @Test
    void dependentRowsAreSingularAtTheThreshold() {
        // the second row is twice the first: singular by construction
        double[][] m = {{1, 2, 0}, {2, 4, 0}, {0, 1, 3}};

        assertFalse(new RealLu(m, 1e-12).isNonSingular());
        assertFalse(new LUDecomposition(new Array2DRowRealMatrix(m), 1e-12).getSolver().isNonSingular());
    }
}

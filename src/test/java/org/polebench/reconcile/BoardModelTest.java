package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.synth.BoardSynthesizer;

/**
 * The back-solve's board model, evaluated over a whole sweep at once, against the complex MNA
 * solve of the same board ({@link FullResponse}, which needs no port reduction) and its own
 * derivatives against central differences.
 */
class BoardModelTest {
    private static final double[] FREQUENCIES_HZ = BoardSynthesizer.logSpaced(0.5, 5000, 100).stream()
            .mapToDouble(Double::doubleValue).toArray();
    /**
     * Capacitors off by up to a decade, both bias currents and both β moved, the first two
     * resistors moved (the bias solved again), a flat gain of +0.87 dB.
     */
    private static final double[] THETA = theta();

    private static double[] theta() {
        try {
            DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
            int resistors = demo.stage.resistors().size();
            double[] theta = new double[5 + 2 + 2 + resistors + 1];
            double[] head = {0.1, -0.2, -Math.log(10), 0.3, 0.05, -0.15, 0.1, 0.2, -0.3, 0.05, -0.04};
            System.arraycopy(head, 0, theta, 0, head.length);
            theta[theta.length - 1] = 0.1;
            return theta;
        } catch (InputProblem problem) {
            throw new IllegalStateException(problem);
        }
    }

    @Test
    void responseMatchesTheFullMnaSolveOfTheSameBoard() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        BoardModel model = new BoardModel(demo.stage, demo.points, demo.model, FREQUENCIES_HZ);
        assertEquals(THETA.length, model.parameterCount());
        int f = FREQUENCIES_HZ.length;
        double[] hr = new double[f];
        double[] hi = new double[f];
        assertTrue(model.evaluate(THETA, hr, hi, null, null, null, true));
        FullResponse full = new FullResponse(model.network(THETA));
        double gain = Math.exp(THETA[THETA.length - 1]);
        double worst = 0;
        for (int n = 0; n < f; n++) {
            Complex expected = full.atHz(FREQUENCIES_HZ[n]).orElseThrow().multiply(gain);
            worst = Math.max(worst, new Complex(hr[n], hi[n]).subtract(expected).abs() / expected.abs());
        }
        // H_low·H_high/D is exact only when the bands lie decades apart (BoardModel's Javadoc);
        // over this sweep the product's own error reaches 3e-4 (at its 5 kHz top), so 1e-3. A
        // wrong sign, port order or capacitor scaling shows at order 1 at the low end.
        assertTrue(worst < 1e-3, "largest relative difference " + worst);
    }

    @Test
    void derivativesMatchCentralDifferencesOfTheResponse() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        BoardModel model = new BoardModel(demo.stage, demo.points, demo.model, FREQUENCIES_HZ);
        int f = FREQUENCIES_HZ.length;
        int p = model.parameterCount();
        int k = model.capacitors().size();
        int networkParameters = model.board().size();
        double[] hr = new double[f];
        double[] hi = new double[f];
        double[][] dRe = new double[p][f];
        double[][] dIm = new double[p][f];
        boolean[] bias = new boolean[networkParameters];
        java.util.Arrays.fill(bias, true);
        assertTrue(model.evaluate(THETA, hr, hi, dRe, dIm, bias, true));
        double h = 1e-4;
        for (int j = 0; j < p; j++) {
            double[] up = THETA.clone();
            double[] down = THETA.clone();
            up[j] += h;
            down[j] -= h;
            double[] ur = new double[f];
            double[] ui = new double[f];
            double[] lr = new double[f];
            double[] li = new double[f];
            assertTrue(model.evaluate(up, ur, ui, null, null, null, true));
            assertTrue(model.evaluate(down, lr, li, null, null, null, true));
            boolean isBias = j >= k && j < k + networkParameters;
            // central difference: truncation h²/6·|d³lnH/dθ³| (Nocedal and Wright, Numerical
            // Optimization, 2nd ed., 8.1), up to 1.3e-7 here against columns of order 1, so 1e-6
            // for the capacitor and gain columns, which are exact. A network column (bias, β,
            // resistor) is a forward difference of step 1e-6, high band included: 1e-4.
            double tolerance = isBias ? 1e-4 : 1e-6;
            for (int n = 0; n < f; n++) {
                Complex ratio = new Complex(ur[n], ui[n]).divide(new Complex(lr[n], li[n]));
                double expectedRe = Math.log(ratio.abs()) / (2 * h);
                double expectedIm = ratio.getArgument() / (2 * h);
                assertEquals(expectedRe, dRe[j][n], tolerance, "parameter " + j + ", frequency " + n);
                assertEquals(expectedIm, dIm[j][n], tolerance, "parameter " + j + ", frequency " + n);
            }
        }
    }
}

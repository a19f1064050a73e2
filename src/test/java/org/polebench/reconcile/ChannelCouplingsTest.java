package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The channel couplings' factors against the first-order RC high-pass jω/(jω + ω_c) (closed
 * form: −10·log10 2 = −3.0103 dB and +45° at the corner; −20 dB per decade and +90° far below
 * it), a ratio of two couplings against the product of the closed forms, and the derivatives
 * against central differences.
 */
class ChannelCouplingsTest {
    private static final double[] OMEGAS = {2 * Math.PI * 0.33, 2 * Math.PI * 3.3, 2 * Math.PI * 33, 2 * Math.PI * 3300};

    @Test
    void anOutputCouplingIsTheFirstOrderHighPass() {
        ChannelCouplings couplings = new ChannelCouplings(0, new int[] {1});
        double[] lnMagnitude = new double[OMEGAS.length];
        double[] phase = new double[OMEGAS.length];
        couplings.apply(new double[] {Math.log(3.3)}, new boolean[] {true}, OMEGAS, lnMagnitude, phase, null, null);
        // at the corner: |H| = 1/√2, arg H = 45°
        assertEquals(-10 * Math.log10(2), 20 * Math.log10(Math.exp(lnMagnitude[1])), 1e-12);
        assertEquals(45, Math.toDegrees(phase[1]), 1e-12);
        // a decade below: |H| = 0.1/√1.01, arg = atan(10)
        assertEquals(Math.log(0.1 / Math.sqrt(1.01)), lnMagnitude[0], 1e-12);
        assertEquals(Math.atan(10), phase[0], 1e-12);
        // three decades above: nearly flat
        assertEquals(-0.5 * Math.log(1 + 1e-6), lnMagnitude[3], 1e-15);
    }

    @Test
    void anInactiveCouplingIsDcAndARatioDividesTheInputOut() {
        ChannelCouplings couplings = new ChannelCouplings(2, new int[] {1, -1});
        double[] theta = {0.3, -0.2, Math.log(2), Math.log(5)};
        double[] lnMagnitude = new double[OMEGAS.length];
        double[] phase = new double[OMEGAS.length];
        couplings.apply(theta, new boolean[] {true, true, false, false}, OMEGAS, lnMagnitude, phase, null, null);
        for (int k = 0; k < OMEGAS.length; k++) {
            assertEquals(0, lnMagnitude[k], 0);
            assertEquals(0, phase[k], 0);
        }
        couplings.apply(theta, new boolean[] {true, true, true, true}, OMEGAS, lnMagnitude, phase, null, null);
        for (int k = 0; k < OMEGAS.length; k++) {
            // (jω/(jω+ωa)) / (jω/(jω+ωb)) = (jω+ωb)/(jω+ωa)
            double w = OMEGAS[k];
            double a = 2 * Math.PI * 2;
            double b = 2 * Math.PI * 5;
            double expected = 0.5 * Math.log((w * w + b * b) / (w * w + a * a));
            assertEquals(expected, lnMagnitude[k], 1e-12);
            assertEquals(Math.atan2(w, b) - Math.atan2(w, a), phase[k], 1e-12);
        }
    }

    @Test
    void theDerivativesAreThoseOfCentralDifferences() {
        ChannelCouplings couplings = new ChannelCouplings(0, new int[] {1, -1});
        double[] theta = {Math.log(3.3), Math.log(1.7)};
        boolean[] active = {true, true};
        double[][] dMagnitude = new double[2][OMEGAS.length];
        double[][] dPhase = new double[2][OMEGAS.length];
        couplings.apply(theta, active, OMEGAS, new double[OMEGAS.length], new double[OMEGAS.length], dMagnitude, dPhase);
        double h = 1e-5;
        for (int c = 0; c < 2; c++) {
            double[] up = theta.clone();
            double[] down = theta.clone();
            up[c] += h;
            down[c] -= h;
            double[] mUp = new double[OMEGAS.length];
            double[] pUp = new double[OMEGAS.length];
            double[] mDown = new double[OMEGAS.length];
            double[] pDown = new double[OMEGAS.length];
            couplings.apply(up, active, OMEGAS, mUp, pUp, null, null);
            couplings.apply(down, active, OMEGAS, mDown, pDown, null, null);
            for (int k = 0; k < OMEGAS.length; k++) {
                // central difference error O(h²) ~ 1e-10 on these O(1) curves
                assertEquals((mUp[k] - mDown[k]) / (2 * h), dMagnitude[c][k], 1e-8);
                assertEquals((pUp[k] - pDown[k]) / (2 * h), dPhase[c][k], 1e-8);
            }
        }
    }
}

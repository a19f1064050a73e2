package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;

/** The exact identities between a low-band model and its poles (docs/method.md, "Exact identities"). */
final class Identities {
    // eigenvalues of a well-scaled matrix to round-off times their condition (below 1e4 on
    // these stages): 1e-9 relative
    static final double RELATIVE = 1e-9;

    private Identities() {
    }

    static void assertLowBandIdentities(StateModel m, Spectrum poles) {
        int k = m.order();
        double sumInverseTau = 0;
        for (int i = 0; i < k; i++) {
            sumInverseTau += m.admittanceSiemens(i, i) / m.farads(i);
        }
        Complex sum = Complex.ZERO;
        Complex product = Complex.ONE;
        Complex pairs = Complex.ZERO;
        for (int i = 0; i < k; i++) {
            Complex pi = complex(poles.roots().get(i));
            sum = sum.add(pi);
            product = product.multiply(pi.negate());
            for (int j = i + 1; j < k; j++) {
                pairs = pairs.add(pi.multiply(complex(poles.roots().get(j))));
            }
        }
        // Σ 1/τ_i = −Σ p_i (docs/method.md, "Exact identities": both are trace(−A))
        assertEquals(sumInverseTau, -sum.getReal(), RELATIVE * sumInverseTau);
        // Σ_{i<j} (Y_ii·Y_jj − Y_ij·Y_ji)/(C_i·C_j) = Σ_{i<j} p_i·p_j (docs/method.md, "Exact identities")
        double pairSum = 0;
        for (int i = 0; i < k; i++) {
            for (int j = i + 1; j < k; j++) {
                pairSum += (m.admittanceSiemens(i, i) * m.admittanceSiemens(j, j)
                        - m.admittanceSiemens(i, j) * m.admittanceSiemens(j, i)) / (m.farads(i) * m.farads(j));
            }
        }
        double pairScale = sumInverseTau * sumInverseTau;
        assertEquals(pairSum, pairs.getReal(), RELATIVE * pairScale);
        // det Y / Π C_i = Π(−p_i) (docs/method.md, "Exact identities")
        double[][] y = new double[k][k];
        double capacitanceProduct = 1;
        for (int i = 0; i < k; i++) {
            capacitanceProduct *= m.farads(i);
            for (int j = 0; j < k; j++) {
                y[i][j] = m.admittanceSiemens(i, j);
            }
        }
        double detRatio = new LUDecomposition(new Array2DRowRealMatrix(y), 0).getDeterminant() / capacitanceProduct;
        assertEquals(detRatio, product.getReal(), RELATIVE * Math.abs(detRatio));
    }

    static Complex complex(ComplexFrequency f) {
        return new Complex(f.realRadPerS(), f.imaginaryRadPerS());
    }
}

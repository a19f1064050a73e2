package org.polebench.analysis;

import java.util.List;

/**
 * How one pole moves with each port capacitor: ∂ln|p|/∂ln C_i = −Re(w_i·v_i / wᵀv) from the
 * right and left eigenvectors (first-order eigenvalue perturbation, ∂λ = wᵀ·∂A·v / wᵀv;
 * Wilkinson, The Algebraic Eigenvalue Problem, 1965), because ∂A/∂ln C_i is minus row i of A.
 * For each pole the values sum to −1.
 *
 * @param pole        the pole in rad/s
 * @param repeated    true when the pole is (numerically) repeated or defective, |wᵀv| below
 *                    1e-6 for unit vectors: its derivative is then not defined
 * @param lnMagnitudePerLnC one value per port capacitor in port order; empty when repeated
 */
public record PoleSensitivity(ComplexFrequency pole, boolean repeated, List<Double> lnMagnitudePerLnC) {
    public PoleSensitivity {
        lnMagnitudePerLnC = List.copyOf(lnMagnitudePerLnC);
    }
}

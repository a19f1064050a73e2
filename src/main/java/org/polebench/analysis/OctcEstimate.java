package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * The open-circuit time-constant estimate of the upper corner, ωH ≈ 1/Σ τ_i° with
 * τ_i° = C_i·(Y⁻¹)_ii (DESIGN.md, "Numerics"). Σ τ_i° equals trace(−A⁻¹) = −Σ 1/poles exactly.
 *
 * @param terms          one per high-band port, in port order
 * @param cornerRadPerS  1/Σ τ_i° in rad/s
 */
public record OctcEstimate(List<OctcTerm> terms, double cornerRadPerS) {
    public OctcEstimate {
        terms = List.copyOf(terms);
    }

    /** @return the estimate for a high-band model of order at least 1 */
    public static OctcEstimate of(StateModel highBand) {
        int k = highBand.order();
        double sum = 0;
        for (int i = 0; i < k; i++) {
            sum += highBand.farads(i) * highBand.inverseAdmittanceOhms(i, i);
        }
        List<OctcTerm> terms = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            double ohms = highBand.inverseAdmittanceOhms(i, i);
            double seconds = highBand.farads(i) * ohms;
            terms.add(new OctcTerm(highBand.capacitorNames().get(i), highBand.farads(i), ohms, seconds, seconds / sum));
        }
        return new OctcEstimate(terms, 1 / sum);
    }

    /** @return Σ τ_i° in seconds */
    public double timeConstantSumSeconds() {
        return 1 / cornerRadPerS;
    }

    public double cornerHz() {
        return cornerRadPerS / (2 * Math.PI);
    }
}

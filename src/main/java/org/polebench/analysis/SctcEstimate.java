package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * The short-circuit time-constant estimate of the lower corner, ωL ≈ Σ 1/τ_i with
 * τ_i = C_i/Y_ii (docs/method.md, "SCTC and OCTC estimates"). Σ 1/τ_i equals −Σ poles exactly (it is trace(−A));
 * ωL itself is only estimated by it (a dominant-pole assumption).
 *
 * @param terms            one per low-band capacitor, in port order
 * @param cornerRadPerS    Σ 1/τ_i in rad/s
 */
public record SctcEstimate(List<SctcTerm> terms, double cornerRadPerS) {
    public SctcEstimate {
        terms = List.copyOf(terms);
    }

    /** @return the estimate for a low-band model; a model of order 0 gives no terms and 0 rad/s */
    public static SctcEstimate of(StateModel lowBand) {
        int k = lowBand.order();
        double sum = 0;
        for (int i = 0; i < k; i++) {
            sum += lowBand.admittanceSiemens(i, i) / lowBand.farads(i);
        }
        List<SctcTerm> terms = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            double ohms = 1 / lowBand.admittanceSiemens(i, i);
            double seconds = lowBand.farads(i) * ohms;
            terms.add(new SctcTerm(lowBand.capacitorNames().get(i), lowBand.farads(i), ohms, seconds, 1 / seconds / sum));
        }
        return new SctcEstimate(terms, sum);
    }

    /** @return the estimated lower corner in Hz, (Σ 1/τ_i)/2π */
    public double cornerHz() {
        return cornerRadPerS / (2 * Math.PI);
    }
}

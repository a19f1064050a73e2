package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * The open-circuit time-constant estimate of the upper corner, ωH ≈ 1/Σ τ_i° with
 * τ_i° = C_i·(Y⁻¹)_ii (docs/method.md, "SCTC and OCTC estimates"). Σ τ_i° equals trace(−A⁻¹) = trace(Y⁻¹·Cf) = −Σ 1/poles
 * exactly, link capacitors included.
 *
 * @param terms          one per high-band port in port order, then one per link capacitor
 * @param cornerRadPerS  1/Σ τ_i° in rad/s
 */
public record OctcEstimate(List<OctcTerm> terms, double cornerRadPerS) {
    public OctcEstimate {
        terms = List.copyOf(terms);
    }

    /**
     * @return the estimate for a high-band model of order at least 1: one term per port, then
     * one per link capacitor (seeing q_lᵀ·Y⁻¹·q_l; 0 Ω for one across the sources)
     */
    public static OctcEstimate of(StateModel highBand) {
        int k = highBand.order();
        List<String> links = highBand.linkCapacitorNames();
        double[] farads = new double[k + links.size()];
        double[] ohms = new double[farads.length];
        List<String> names = new ArrayList<>(highBand.capacitorNames());
        names.addAll(links);
        for (int i = 0; i < k; i++) {
            farads[i] = highBand.farads(i);
            ohms[i] = highBand.inverseAdmittanceOhms(i, i);
        }
        for (int l = 0; l < links.size(); l++) {
            farads[k + l] = highBand.linkFarads(l);
            ohms[k + l] = highBand.linkOpenCircuitOhms(l);
        }
        double sum = 0;
        for (int i = 0; i < farads.length; i++) {
            sum += farads[i] * ohms[i];
        }
        List<OctcTerm> terms = new ArrayList<>(farads.length);
        for (int i = 0; i < farads.length; i++) {
            double seconds = farads[i] * ohms[i];
            terms.add(new OctcTerm(names.get(i), farads[i], ohms[i], seconds, seconds / sum));
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

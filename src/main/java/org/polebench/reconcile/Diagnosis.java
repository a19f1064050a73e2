package org.polebench.reconcile;

import java.util.List;

/**
 * The ranked single-fault hypotheses of one sweep.
 *
 * @param hypotheses        most probable first; probabilities sum to 1
 * @param noiseScale        the factor (at least 1) applied to every stated or default point σ
 *                          before the evidence was computed: √(χ²/ν) of the best hypothesis when
 *                          that exceeds 1, so that model mismatch does not give overconfident
 *                          probabilities (a Birge-ratio correction)
 * @param defaultGainSigmaDb the gain σ used where the sweep stated none, dB
 * @param defaultPhaseSigmaDeg the phase σ used where the sweep stated none, degrees
 * @param usedPhase         false for a magnitude-only sweep, whose real residuals alone were used
 */
public record Diagnosis(List<Hypothesis> hypotheses, double noiseScale, double defaultGainSigmaDb,
                        double defaultPhaseSigmaDeg, boolean usedPhase) {
    public Diagnosis {
        hypotheses = List.copyOf(hypotheses);
    }

    /** @return the most probable hypothesis */
    public Hypothesis top() {
        return hypotheses.get(0);
    }
}

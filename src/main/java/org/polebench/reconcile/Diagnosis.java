package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;

/**
 * The ranked fault hypotheses of one sweep.
 *
 * @param hypotheses  most probable first; probabilities sum to 1 over those ranked
 * @param noise       how the point σ were set and scaled before the evidence was computed
 * @param usedPhase   false for a magnitude-only sweep, whose real residuals alone were used
 * @param pairsRanked whether two-fault hypotheses were ranked (only when no single one explains
 *                    the sweep)
 * @param residuals   what the most probable hypothesis leaves unexplained
 */
public record Diagnosis(List<Hypothesis> hypotheses, NoiseBasis noise, boolean usedPhase, boolean pairsRanked,
                        BestResiduals residuals) {
    public Diagnosis {
        hypotheses = List.copyOf(hypotheses);
    }

    /** @return the most probable hypothesis, whose back-solve the report shows */
    public Hypothesis top() {
        return hypotheses.get(0);
    }

    /**
     * @return the most probable hypothesis that may be named: "no fault", or one whose freed
     *         parts the sweep identifies; empty when the most probable is one the sweep cannot
     *         identify (a hypothesis the tool marks as not identifiable is never named)
     */
    public Optional<Hypothesis> mostLikely() {
        Hypothesis first = top();
        return first.kind() == HypothesisKind.NONE || first.identifiable() ? Optional.of(first) : Optional.empty();
    }
}

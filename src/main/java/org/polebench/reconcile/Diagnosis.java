package org.polebench.reconcile;

import java.util.ArrayList;
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
 * @param biasSetters per transistor, the resistors that set its bias current
 */
public record Diagnosis(List<Hypothesis> hypotheses, NoiseBasis noise, boolean usedPhase, boolean pairsRanked,
                        BestResiduals residuals, List<BiasSetters> biasSetters) {
    /** A hypothesis this probable is held with confidence; below it the ranking is unsure. */
    public static final double CONFIDENT = 0.9;
    /**
     * How much more a shared cause must hold than the most probable hypothesis before it is
     * named instead: a tenth, so that one member with a trace of company is not renamed.
     */
    static final double SHARED_MARGIN = 0.1;

    public Diagnosis {
        hypotheses = List.copyOf(hypotheses);
        biasSetters = List.copyOf(biasSetters);
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

    /** @return whether a bench hypothesis explains the sweep (see {@link ReconcileResult#chainTakenOut}) */
    static boolean chainTakenOut(Diagnosis diagnosis, ModelAdequacy adequacy) {
        Hypothesis top = diagnosis.top();
        return adequacy.explained() && top.kind() == HypothesisKind.BENCH && top.identifiable();
    }

    /**
     * A wrong divider resistor, a wrong emitter resistor and a transistor whose current is off
     * for its own reasons give nearly the same sweep: each moves the bias current, and β spread
     * hides what else the resistor changes. The evidence then splits among them, and no one of
     * them is held with confidence; but that the current is off, the sweep does show.
     *
     * @return the transistor whose bias-cause hypotheses (identifiable single faults) together
     *         hold at least {@value #SHARED_MARGIN} more than the most probable hypothesis, when
     *         that one is below {@value #CONFIDENT} and at least two members share the evidence;
     *         empty otherwise
     */
    public Optional<SharedCause> sharedCause() {
        double topProbability = top().probability();
        if (topProbability >= CONFIDENT) {
            return Optional.empty();
        }
        SharedCause best = null;
        for (BiasSetters setters : biasSetters) {
            List<Hypothesis> members = new ArrayList<>();
            double sum = 0;
            for (Hypothesis hypothesis : hypotheses) {
                Optional<ParameterEstimate> culprit = hypothesis.culprit();
                if (culprit.isPresent() && hypothesis.identifiable() && setters.covers(culprit.get().parameter())) {
                    members.add(hypothesis);
                    sum += hypothesis.probability();
                }
            }
            if (members.size() >= 2 && sum >= topProbability + SHARED_MARGIN
                    && (best == null || sum > best.probability())) {
                best = new SharedCause(setters.transistor(), members, sum);
            }
        }
        return Optional.ofNullable(best);
    }
}

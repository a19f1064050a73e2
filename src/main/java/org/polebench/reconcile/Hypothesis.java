package org.polebench.reconcile;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One single-fault hypothesis, ranked by its Laplace evidence.
 *
 * @param kind               none, capacitor, bias or gain
 * @param part               the capacitor or transistor it frees; empty for none and gain
 * @param priorProbability   its probability before the sweep (DESIGN.md "Conventions")
 * @param logEvidence        ln of the Laplace evidence, up to a constant shared by all hypotheses
 * @param probability        its posterior probability among the ranked hypotheses
 * @param culprit            the freed parameter's estimate; empty for "none"
 * @param nearestPreferred   for a capacitor, the nearest IEC 60063 value of the series its
 *                           tolerance belongs to, in farads
 * @param decadeSlip         the nearest preferred value is the nominal times a power of ten
 *                           other than 1 (47 µF fitted as 4.7 µF)
 * @param statement          the hypothesis in plain words
 * @param backSolve          the MAP of every parameter under this hypothesis
 */
public record Hypothesis(HypothesisKind kind, Optional<String> part, double priorProbability, double logEvidence,
                         double probability, Optional<ParameterEstimate> culprit, OptionalDouble nearestPreferred,
                         boolean decadeSlip, String statement, BackSolve backSolve) {

    /** @return "no fault", a part id, or "gain calibration" */
    public String label() {
        if (kind == HypothesisKind.NONE) {
            return "no fault";
        }
        if (kind == HypothesisKind.GAIN) {
            return "gain calibration";
        }
        return part.orElse("?") + (kind == HypothesisKind.BIAS ? " bias current" : "");
    }
}

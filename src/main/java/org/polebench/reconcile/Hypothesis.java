package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;

/**
 * One fault hypothesis, ranked by its Laplace evidence.
 *
 * @param kind             none, capacitor, resistor, bias, gain, bench or double
 * @param faults           what it frees: nothing for none, one part for a single fault, two for
 *                         a double
 * @param priorProbability its probability before the sweep (docs/method.md, "The hypotheses")
 * @param logEvidence      ln of the Laplace evidence, up to a constant shared by all hypotheses
 * @param probability      its posterior probability among the ranked hypotheses
 * @param identifiable     whether the sweep identifies every part it frees; one that does not is
 *                         never named as the most likely
 * @param backSolve        the MAP of every parameter under this hypothesis
 */
public record Hypothesis(HypothesisKind kind, List<PartReading> faults, double priorProbability, double logEvidence,
                         double probability, boolean identifiable, BackSolve backSolve) {
    public Hypothesis {
        faults = List.copyOf(faults);
    }

    /** @return the one part a single fault frees; empty for none, gain and double */
    public Optional<String> part() {
        return faults.size() == 1 ? faults.get(0).estimate().parameter().part() : Optional.empty();
    }

    /** @return the freed parameter's estimate of a single fault; empty for none and double */
    public Optional<ParameterEstimate> culprit() {
        return faults.size() == 1 ? Optional.of(faults.get(0).estimate()) : Optional.empty();
    }

    /**
     * @return "no fault", a part id, "Q1 bias current", "flat gain error", "C2 and RE1", or a
     *         measuring-chain element ("AC-coupled output channel")
     */
    public String label() {
        if (kind == HypothesisKind.NONE) {
            return "no fault";
        }
        if (kind == HypothesisKind.DOUBLE) {
            return label(faults.get(0)) + " and " + label(faults.get(1));
        }
        if (kind == HypothesisKind.BENCH) {
            return faults.isEmpty() ? "generator output resistance"
                    : faults.size() > 1 ? "unequal channel AC couplings" : "AC-coupled output channel";
        }
        return label(faults.get(0));
    }

    /** @return the measuring-chain element a bench hypothesis names: "output-channel", or both channels */
    public Optional<String> element() {
        if (kind != HypothesisKind.BENCH) {
            return Optional.empty();
        }
        if (faults.isEmpty()) {
            return Optional.of("generator");
        }
        return Optional.of(faults.stream().map(f -> f.estimate().parameter().label())
                .collect(java.util.stream.Collectors.joining(" and ")));
    }

    private static String label(PartReading reading) {
        ModelParameter parameter = reading.estimate().parameter();
        if (parameter.kind() == ParameterKind.GAIN) {
            return "flat gain error";
        }
        return parameter.label() + (parameter.kind() == ParameterKind.BIAS ? " bias current" : "");
    }
}

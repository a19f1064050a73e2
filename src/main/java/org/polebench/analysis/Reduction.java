package org.polebench.analysis;

import java.util.List;
import java.util.Optional;
import org.polebench.circuit.Band;

/**
 * The result of reducing one band of a network to its capacitor ports: a model, or what
 * prevents one. Callers ask {@link #stateModel()} and {@link #singular()} rather than testing
 * the type, so a new kind of result must say what it gives before anything compiles.
 */
public sealed interface Reduction permits Reduction.StateSpace, Reduction.Singular {

    /** @return the state-space model, empty when the reduction is singular */
    Optional<StateModel> stateModel();

    /** @return the named singular case, empty when there is a model */
    Optional<Singular> singular();

    /** The ports reduced to a state-space model. */
    record StateSpace(StateModel model) implements Reduction {
        @Override
        public Optional<StateModel> stateModel() {
            return Optional.of(model);
        }

        @Override
        public Optional<Singular> singular() {
            return Optional.empty();
        }
    }

    /**
     * A named singular case.
     *
     * @param kind   what went wrong
     * @param band   the band whose reduction failed
     * @param parts  the capacitors (or the {@code stimulus}, or other elements) involved, by name
     * @param nodes  the node names involved; empty when the case is about parts only
     * @param detail one sentence for the user, naming parts and nodes
     */
    record Singular(SingularCase kind, Band band, List<String> parts, List<String> nodes, String detail)
            implements Reduction, PredictionOutcome {
        public Singular {
            parts = List.copyOf(parts);
            nodes = List.copyOf(nodes);
        }

        @Override
        public Optional<StateModel> stateModel() {
            return Optional.empty();
        }

        @Override
        public Optional<Singular> singular() {
            return Optional.of(this);
        }

        @Override
        public Optional<Prediction> prediction() {
            return Optional.empty();
        }
    }
}

package org.polebench.analysis;

import java.util.List;
import org.polebench.circuit.Band;

/** The result of reducing one band of a network to its capacitor ports: a model, or what prevents one. */
public sealed interface Reduction permits Reduction.StateSpace, Reduction.Singular {

    /** The ports reduced to a state-space model. */
    record StateSpace(StateModel model) implements Reduction {
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
    }
}

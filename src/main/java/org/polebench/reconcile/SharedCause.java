package org.polebench.reconcile;

import java.util.List;

/**
 * A transistor's bias current as the cause the sweep does show, when the evidence splits among
 * the parts that could have set it: the transistor's own bias-current hypothesis and those of
 * its bias-setting resistors ({@link BiasSetters}). Each alone is unsure; together they hold
 * more than the most probable one does.
 *
 * @param transistor  the transistor's designator
 * @param members     the single-fault hypotheses of the group, most probable first
 * @param probability their probabilities summed
 */
public record SharedCause(String transistor, List<Hypothesis> members, double probability) {
    public SharedCause {
        members = List.copyOf(members);
    }
}

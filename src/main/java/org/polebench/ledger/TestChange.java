package org.polebench.ledger;

import java.util.List;

/**
 * What changed from one test of a board to the next (before and after rework, say).
 *
 * @param before the earlier test
 * @param after  the later test
 * @param parts  every part both tests back-solved, the largest move first (in standard
 *               uncertainties of the difference)
 */
public record TestChange(RecordedTest before, RecordedTest after, List<PartMove> parts) {
    public TestChange {
        parts = List.copyOf(parts);
    }

    /** @return whether the overall outcome differs (pass, fail, incomplete, input problem) */
    public boolean verdictChanged() {
        return before.outcome().outcome() != after.outcome().outcome();
    }

    /** @return the parts that moved beyond the two tests' uncertainties, the largest move first */
    public List<PartMove> moved() {
        return parts.stream().filter(PartMove::moved).toList();
    }

    /** @return whether the two tests were reconciled against different stage files */
    public boolean stageChanged() {
        return !before.stageSha256().equals(after.stageSha256());
    }
}

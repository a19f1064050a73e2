package org.polebench.ledger;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.lot.BoardOutcome.PartFactor;

/**
 * Every test of one board in time order, and what changed between consecutive tests: which
 * part's back-solved value moved and by how much, and whether the verdict changed.
 *
 * @param boardId the board
 * @param tests   its tests, earliest first
 */
public record BoardHistory(String boardId, List<RecordedTest> tests) {
    public BoardHistory {
        tests = List.copyOf(tests);
    }

    /** @return one change per pair of consecutive tests, in time order */
    public List<TestChange> changes() {
        List<TestChange> changes = new ArrayList<>();
        for (int i = 1; i < tests.size(); i++) {
            changes.add(between(tests.get(i - 1), tests.get(i)));
        }
        return changes;
    }

    /** Pairs the parts both tests back-solved, by name. */
    static TestChange between(RecordedTest before, RecordedTest after) {
        Map<String, PartFactor> earlier = new LinkedHashMap<>();
        for (PartFactor factor : before.outcome().parts()) {
            earlier.put(factor.part(), factor);
        }
        List<PartMove> moves = new ArrayList<>();
        for (PartFactor later : after.outcome().parts()) {
            PartFactor first = earlier.get(later.part());
            if (first != null && Double.isFinite(first.lnFactor()) && Double.isFinite(later.lnFactor())) {
                moves.add(new PartMove(later.part(), first.lnFactor(), finite(first.uLnFactor()), later.lnFactor(),
                        finite(later.uLnFactor())));
            }
        }
        moves.sort(Comparator.comparingDouble(PartMove::zScore).reversed());
        return new TestChange(before, after, moves);
    }

    private static double finite(double u) {
        return Double.isFinite(u) ? u : 0;
    }
}

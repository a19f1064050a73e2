package org.polebench.lot;

import java.util.List;

/**
 * The points at which one run rule's pattern is complete.
 *
 * @param rule   which rule
 * @param points the indices into the chart's points (test order) where the pattern completes,
 *               ascending
 */
public record RuleBreak(RunRule rule, List<Integer> points) {
    public RuleBreak {
        points = List.copyOf(points);
    }
}

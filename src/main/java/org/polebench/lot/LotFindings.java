package org.polebench.lot;

import java.util.List;

/**
 * What a lot of boards says that one board cannot (issue 16; docs/method.md, "What a lot says").
 *
 * <p>A board tested more than once (before and after rework) counts once in the yield, by its
 * last test; the statistics of the lot as built (the spread, the control chart, Cpk, the Pareto
 * and the systematic shifts) read each board's first test, which shows the board as it left
 * assembly.
 *
 * @param lot            the lot's name
 * @param tests          every test given, in test order
 * @param counts         the outcomes of each board's last test
 * @param firstPass      the outcomes of each board's first test (first-pass yield)
 * @param byStation      {@code counts} by the station of the last test, by name
 * @param byDay          {@code counts} by the UTC date of the last test, ascending
 * @param quantities     the lower corner and the midband gain, in that order
 * @param culprits       the Pareto of culprits, most boards first
 * @param parts          each part's pooled reading across the lot, in order of first appearance
 * @param seed           the seed of the predicted tolerance spread
 * @param draws          boards drawn for it
 */
public record LotFindings(String lot, List<BoardOutcome> tests, OutcomeCounts counts, OutcomeCounts firstPass,
                          List<GroupCounts> byStation, List<GroupCounts> byDay, List<QuantityFindings> quantities,
                          List<Culprit> culprits, List<PartShift> parts, long seed, int draws) {
    public LotFindings {
        tests = List.copyOf(tests);
        byStation = List.copyOf(byStation);
        byDay = List.copyOf(byDay);
        quantities = List.copyOf(quantities);
        culprits = List.copyOf(culprits);
        parts = List.copyOf(parts);
    }

    /** @return the parts whose lot mean lies outside their tolerance band */
    public List<PartShift> systematic() {
        return parts.stream().filter(p -> p.finding() == PartShift.Finding.SYSTEMATIC).toList();
    }

    /** @return the findings of one quantity */
    public QuantityFindings quantity(LotQuantity quantity) {
        return quantities.stream().filter(q -> q.quantity() == quantity).findFirst().orElseThrow();
    }

    /** @return the boards counted (each once) */
    public int boards() {
        return counts.boards();
    }

    /** @return failed and unexplained boards the Pareto counts */
    public int culpritBoards() {
        return culprits.stream().mapToInt(Culprit::boards).sum();
    }
}

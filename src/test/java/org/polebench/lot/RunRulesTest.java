package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The Western Electric rules (Statistical Quality Control Handbook, 1956, as Montgomery lists
 * them) on sequences built to break one rule each, in units of σ about a centre of 0; the
 * expected flags are read off the sequences by hand.
 */
class RunRulesTest {
    private static List<RuleBreak> breaks(double... z) {
        return RunRules.breaks(z, 0, 1);
    }

    @Test
    void ruleOneFlagsEachPointBeyondThreeSigmaEitherSide() {
        assertEquals(List.of(new RuleBreak(RunRule.BEYOND_3_SIGMA, List.of(1, 3))),
                breaks(0.5, 3.2, -0.5, -3.1, 0.2));
    }

    @Test
    void ruleTwoNeedsTwoOfThreeBeyondTwoSigmaOnOneSide() {
        // 2.5 at 1 and 2.2 at 3, within three points of each other: complete at 3.
        // −2.5 at 5 and +2.5 at 6 are on opposite sides and do not count together
        assertEquals(List.of(new RuleBreak(RunRule.TWO_OF_THREE_BEYOND_2_SIGMA, List.of(3))),
                breaks(0, 2.5, 0.3, 2.2, 0, -2.5, 2.5, 0, 0));
    }

    @Test
    void ruleThreeNeedsFourOfFiveBeyondOneSigmaOnOneSide() {
        // 1.5, 1.2, 0.2, 1.1, 1.3: four of five beyond 1σ above, complete at index 5 (the
        // fourth); the next, 1.4 at 6, still has four of the last five (2, 4, 5, 6 and 3 is 0.2)
        assertEquals(List.of(new RuleBreak(RunRule.FOUR_OF_FIVE_BEYOND_1_SIGMA, List.of(5, 6))),
                breaks(0, 1.5, 1.2, 0.2, 1.1, 1.3, 1.4, -0.5, 0));
    }

    @Test
    void ruleFourNeedsEightInARowOnOneSideOfTheCentre() {
        // eight points below the centre from index 1 to 8, a ninth at 9: complete at 8 and 9
        assertEquals(List.of(new RuleBreak(RunRule.EIGHT_ON_ONE_SIDE, List.of(8, 9))),
                breaks(0.4, -0.1, -0.2, -0.3, -0.1, -0.5, -0.2, -0.4, -0.3, -0.6, 0.3));
    }

    @Test
    void sevenOnOneSideBreaksNothing() {
        assertEquals(List.of(), breaks(0.1, 0.2, 0.3, 0.1, 0.2, 0.3, 0.1, -0.1, 0.1));
    }
}

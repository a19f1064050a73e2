package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class LimitCheckTest {
    private static final OptionalDouble NONE = OptionalDouble.empty();

    // Hand-built cases on either side of a 20 Hz upper limit with U = 0.5 Hz, ILAC-G8:09/2019 4.2.
    @Test
    void simpleAcceptancePassesInsideAndOnTheLimit() {
        assertTrue(LimitCheck.decide("lower corner", "Hz", 19.9, 0.5, 2, NONE, OptionalDouble.of(20), DecisionRule.SIMPLE).pass());
        assertTrue(LimitCheck.decide("lower corner", "Hz", 20.0, 0.5, 2, NONE, OptionalDouble.of(20), DecisionRule.SIMPLE).pass());
        assertFalse(LimitCheck.decide("lower corner", "Hz", 20.1, 0.5, 2, NONE, OptionalDouble.of(20), DecisionRule.SIMPLE).pass());
    }

    @Test
    void guardedAcceptanceNeedsTheExpandedUncertaintyAsMargin() {
        // w = U: pass at 19.5 Hz (margin 0.5 = U), fail at 19.6 Hz (margin 0.4 < U)
        assertTrue(LimitCheck.decide("lower corner", "Hz", 19.5, 0.5, 2, NONE, OptionalDouble.of(20), DecisionRule.GUARDED).pass());
        assertFalse(LimitCheck.decide("lower corner", "Hz", 19.6, 0.5, 2, NONE, OptionalDouble.of(20), DecisionRule.GUARDED).pass());
    }

    @Test
    void twoSidedLimitReportsTheNearestMargin() {
        // midband gain 18.2 dB against 17..19 dB: margins 1.2 and 0.8, the nearest is 0.8
        LimitCheck check = LimitCheck.decide("midband gain", "dB", 18.2, 0.1, 2,
                OptionalDouble.of(17), OptionalDouble.of(19), DecisionRule.SIMPLE);
        assertEquals(0.8, check.marginToLimit(), 1e-12);
        assertTrue(check.pass());
        LimitCheck low = LimitCheck.decide("midband gain", "dB", 16.5, 0.1, 2,
                OptionalDouble.of(17), OptionalDouble.of(19), DecisionRule.SIMPLE);
        assertEquals(-0.5, low.marginToLimit(), 1e-12);
        assertFalse(low.pass());
    }

    @Test
    void verdictFailsWhenAnyCheckFailsAndIsIncompleteWhenThereIsNothingToCheck() {
        LimitCheck good = LimitCheck.decide("a", "Hz", 1, 0, 2, NONE, OptionalDouble.of(2), DecisionRule.SIMPLE);
        LimitCheck bad = LimitCheck.decide("b", "Hz", 3, 0, 2, NONE, OptionalDouble.of(2), DecisionRule.SIMPLE);
        assertEquals("pass", new Verdict(DecisionRule.SIMPLE, List.of(good), List.of()).overall().word());
        assertEquals("fail", new Verdict(DecisionRule.SIMPLE, List.of(good, bad), List.of()).overall().word());
        // issue 11: a stage with no limits has nothing the sweep showed to pass, so the result is
        // incomplete, not a pass
        Verdict none = new Verdict(DecisionRule.SIMPLE, List.of(), List.of());
        assertTrue(none.nothingToCheck());
        assertEquals("incomplete", none.overall().word());
        assertFalse(none.passed());
    }
}

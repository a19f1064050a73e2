package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Limits;

/**
 * Hand-built cases on either side of each limit and exactly at the guard band (ILAC-G8:09/2019
 * 4.2.1 simple acceptance: "within" includes the limit; 4.2.2 guarded with w = U). Values are
 * binary fractions so that every margin is exact and the guard-band cases test the rule, not
 * round-off.
 */
class LimitAssessmentTest {
    private static final OptionalDouble NONE = OptionalDouble.empty();
    // lower corner 10..20 Hz, gain 50..56 dB, upper corner at least 50 kHz
    private static final Limits LIMITS = new Limits(OptionalDouble.of(20), OptionalDouble.of(10),
            OptionalDouble.of(50_000), OptionalDouble.of(50), OptionalDouble.of(56), 0);
    private static final LimitAssessment ASSESSMENT = new LimitAssessment();

    private static Conformity assess(double cornerHz, double gainDb, double upperHz, DecisionRule rule) {
        return ASSESSMENT.assess(LIMITS, new MeasuredQuantity(cornerHz, 0.5, 2, "test"),
                new MeasuredQuantity(gainDb, 0.25, 2, "test"), new MeasuredQuantity(upperHz, 1000, 2, "test"), rule);
    }

    private static boolean passes(Conformity conformity, String quantity) {
        return conformity.verdict().checks().stream().filter(c -> c.quantity().equals(quantity)).findFirst()
                .orElseThrow().pass();
    }

    @Test
    void lowerCornerMaximumUnderBothRules() {
        assertTrue(passes(assess(19.75, 53, 60_000, DecisionRule.SIMPLE), LimitAssessment.LOWER_CORNER));
        assertTrue(passes(assess(20, 53, 60_000, DecisionRule.SIMPLE), LimitAssessment.LOWER_CORNER));
        assertFalse(passes(assess(20.25, 53, 60_000, DecisionRule.SIMPLE), LimitAssessment.LOWER_CORNER));
        // guard band U = 0.5 Hz: 19.5 has margin exactly U (passes), 19.75 has 0.25 < U (fails)
        assertTrue(passes(assess(19.5, 53, 60_000, DecisionRule.GUARDED), LimitAssessment.LOWER_CORNER));
        assertFalse(passes(assess(19.75, 53, 60_000, DecisionRule.GUARDED), LimitAssessment.LOWER_CORNER));
    }

    @Test
    void lowerCornerMinimumUnderBothRules() {
        assertTrue(passes(assess(10.25, 53, 60_000, DecisionRule.SIMPLE), LimitAssessment.LOWER_CORNER));
        assertFalse(passes(assess(9.75, 53, 60_000, DecisionRule.SIMPLE), LimitAssessment.LOWER_CORNER));
        assertTrue(passes(assess(10.5, 53, 60_000, DecisionRule.GUARDED), LimitAssessment.LOWER_CORNER));
        assertFalse(passes(assess(10.25, 53, 60_000, DecisionRule.GUARDED), LimitAssessment.LOWER_CORNER));
    }

    @Test
    void midbandGainWindowUnderBothRules() {
        assertTrue(passes(assess(15, 55.75, 60_000, DecisionRule.SIMPLE), LimitAssessment.MIDBAND_GAIN));
        assertFalse(passes(assess(15, 56.125, 60_000, DecisionRule.SIMPLE), LimitAssessment.MIDBAND_GAIN));
        assertTrue(passes(assess(15, 50, 60_000, DecisionRule.SIMPLE), LimitAssessment.MIDBAND_GAIN));
        assertFalse(passes(assess(15, 49.875, 60_000, DecisionRule.SIMPLE), LimitAssessment.MIDBAND_GAIN));
        // U = 0.25 dB: 55.75 and 50.25 sit exactly at the guard band and pass; 55.875 fails
        assertTrue(passes(assess(15, 55.75, 60_000, DecisionRule.GUARDED), LimitAssessment.MIDBAND_GAIN));
        assertTrue(passes(assess(15, 50.25, 60_000, DecisionRule.GUARDED), LimitAssessment.MIDBAND_GAIN));
        assertFalse(passes(assess(15, 55.875, 60_000, DecisionRule.GUARDED), LimitAssessment.MIDBAND_GAIN));
        assertFalse(passes(assess(15, 50.125, 60_000, DecisionRule.GUARDED), LimitAssessment.MIDBAND_GAIN));
    }

    @Test
    void upperCornerMinimumUnderBothRules() {
        assertTrue(passes(assess(15, 53, 50_000, DecisionRule.SIMPLE), LimitAssessment.UPPER_CORNER));
        assertFalse(passes(assess(15, 53, 49_000, DecisionRule.SIMPLE), LimitAssessment.UPPER_CORNER));
        assertTrue(passes(assess(15, 53, 51_000, DecisionRule.GUARDED), LimitAssessment.UPPER_CORNER));
        assertFalse(passes(assess(15, 53, 50_500, DecisionRule.GUARDED), LimitAssessment.UPPER_CORNER));
    }

    @Test
    void overallFailsWhenOneCheckFailsAndEachCheckCarriesItsMargin() {
        Conformity good = assess(15, 53, 60_000, DecisionRule.SIMPLE);
        assertEquals(OverallResult.PASS, good.verdict().overall());
        Conformity bad = assess(15, 57, 60_000, DecisionRule.SIMPLE);
        assertEquals(OverallResult.FAIL, bad.verdict().overall());
        LimitCheck gain = bad.verdict().checks().get(1);
        // 57 dB against 56 dB max: margin −1 dB, value and U carried through
        assertEquals(-1, gain.marginToLimit(), 0);
        assertEquals(57, gain.value(), 0);
        assertEquals(0.25, gain.expandedUncertainty(), 0);
    }

    // issue 11: a limit whose quantity the sweep does not determine is named with its reason and
    // never passed; with no failing decided check the result is incomplete
    @Test
    void aQuantityTheSweepDoesNotDetermineLeavesItsLimitNotDecidedAndTheResultIncomplete() {
        Conformity conformity = ASSESSMENT.assess(LIMITS, new MeasuredQuantity(15, 0.5, 2, "test"),
                new MeasuredQuantity(53, 0.25, 2, "test"), MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND),
                DecisionRule.SIMPLE);
        assertEquals(2, conformity.verdict().checks().size());
        assertEquals(1, conformity.verdict().notDecided().size());
        NotDecidedCheck upper = conformity.verdict().notDecided().get(0);
        assertEquals(LimitAssessment.UPPER_CORNER, upper.quantity());
        assertEquals(NotDecided.OUTSIDE_SWEPT_BAND, upper.reason());
        assertEquals(OverallResult.INCOMPLETE, conformity.verdict().overall());
        assertFalse(conformity.verdict().passed());
    }

    // a model-derived corner far inside its limit is still not a pass: only the sweep decides
    @Test
    void aValueShownOnlyFromTheModelIsNotDecidedEvenWellInsideItsLimit() {
        Conformity conformity = ASSESSMENT.assess(LIMITS,
                MeasuredQuantity.shownOnly(15, 0.5, 2, "model", NotDecided.FROM_MODEL_ONLY),
                new MeasuredQuantity(53, 0.25, 2, "test"), new MeasuredQuantity(60_000, 1000, 2, "test"),
                DecisionRule.SIMPLE);
        assertEquals(OverallResult.INCOMPLETE, conformity.verdict().overall());
        NotDecidedCheck lower = conformity.verdict().notDecided().get(0);
        assertEquals(LimitAssessment.LOWER_CORNER, lower.quantity());
        assertEquals(15, lower.shown().value().getAsDouble(), 0);
    }

    @Test
    void aFailingDecidedCheckMakesTheResultFailEvenWithALimitNotDecided() {
        Conformity conformity = ASSESSMENT.assess(LIMITS, new MeasuredQuantity(25, 0.5, 2, "test"),
                MeasuredQuantity.shownOnly(53, 0.25, 2, "model", NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP),
                MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND), DecisionRule.SIMPLE);
        assertEquals(OverallResult.FAIL, conformity.verdict().overall());
        assertEquals(2, conformity.verdict().notDecided().size());
    }

    @Test
    void onlyTheLimitsTheStageNamesAreAssessed() {
        Limits onlyLower = new Limits(OptionalDouble.of(20), NONE, NONE, NONE, NONE, 0);
        Verdict verdict = ASSESSMENT.assess(onlyLower, new MeasuredQuantity(15, 0.5, 2, "test"),
                MeasuredQuantity.absent(NotDecided.MIDBAND_NOT_REACHED),
                MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND), DecisionRule.SIMPLE).verdict();
        assertEquals(1, verdict.checks().size());
        assertTrue(verdict.notDecided().isEmpty());
        assertEquals(OverallResult.PASS, verdict.overall());
        assertTrue(ASSESSMENT.assess(Limits.none(), MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND),
                MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND),
                MeasuredQuantity.absent(NotDecided.OUTSIDE_SWEPT_BAND), DecisionRule.SIMPLE).verdict().nothingToCheck());
    }
}

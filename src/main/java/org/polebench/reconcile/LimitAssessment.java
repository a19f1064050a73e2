package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.polebench.circuit.Limits;

/**
 * Holds the lower corner, midband gain and upper corner against the stage's limits under one
 * decision rule (ILAC-G8:09/2019 §4.2; docs/method.md, "The verdict"). A limit is decided only from a
 * quantity the sweep determines ({@link MeasuredQuantity#determinedBySweep()}); every other
 * limit becomes a {@link NotDecidedCheck} with its reason, never a pass (issue 11). Stateless.
 */
public final class LimitAssessment {
    public static final String LOWER_CORNER = "lower corner";
    public static final String MIDBAND_GAIN = "midband gain";
    public static final String UPPER_CORNER = "upper corner";

    public Conformity assess(Limits limits, MeasuredQuantity lowerCornerHz, MeasuredQuantity midbandGainDb,
                             MeasuredQuantity upperCornerHz, DecisionRule rule) {
        List<LimitCheck> checks = new ArrayList<>();
        List<NotDecidedCheck> notDecided = new ArrayList<>();
        check(LOWER_CORNER, "Hz", lowerCornerHz, limits.lowerCornerMinHz(), limits.lowerCornerMaxHz(), rule, checks,
                notDecided);
        check(MIDBAND_GAIN, "dB", midbandGainDb, limits.midbandGainMinDb(), limits.midbandGainMaxDb(), rule, checks,
                notDecided);
        check(UPPER_CORNER, "Hz", upperCornerHz, limits.upperCornerMinHz(), OptionalDouble.empty(), rule, checks,
                notDecided);
        return new Conformity(new Verdict(rule, checks, notDecided));
    }

    private static void check(String quantity, String unit, MeasuredQuantity measured, OptionalDouble min,
                              OptionalDouble max, DecisionRule rule, List<LimitCheck> checks,
                              List<NotDecidedCheck> notDecided) {
        if (min.isEmpty() && max.isEmpty()) {
            return;
        }
        if (!measured.determinedBySweep()) {
            notDecided.add(new NotDecidedCheck(quantity, unit, min, max, measured));
            return;
        }
        checks.add(LimitCheck.decide(quantity, unit, measured.value().getAsDouble(), measured.expandedUncertainty(),
                measured.coverageFactor(), min, max, rule));
    }
}

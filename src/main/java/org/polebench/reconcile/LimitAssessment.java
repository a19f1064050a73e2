package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.circuit.Limits;

/**
 * Holds the measured lower corner, midband gain and upper corner against the stage's limits
 * under one decision rule (ILAC-G8:09/2019 §4.2; DESIGN.md "Verdict"). A limit whose quantity
 * was not measured is reported as not checked. Stateless.
 */
public final class LimitAssessment {
    public static final String LOWER_CORNER = "lower corner";
    public static final String MIDBAND_GAIN = "midband gain";
    public static final String UPPER_CORNER = "upper corner";

    public Conformity assess(Limits limits, Optional<MeasuredQuantity> lowerCornerHz,
                             Optional<MeasuredQuantity> midbandGainDb, Optional<MeasuredQuantity> upperCornerHz,
                             DecisionRule rule) {
        List<LimitCheck> checks = new ArrayList<>();
        List<String> notChecked = new ArrayList<>();
        check(LOWER_CORNER, "Hz", lowerCornerHz, limits.lowerCornerMinHz(), limits.lowerCornerMaxHz(), rule, checks,
                notChecked, "the sweep gives no lower corner (the gain never falls 3 dB within it)");
        check(MIDBAND_GAIN, "dB", midbandGainDb, limits.midbandGainMinDb(), limits.midbandGainMaxDb(), rule, checks,
                notChecked, "no midband gain was measured");
        check(UPPER_CORNER, "Hz", upperCornerHz, limits.upperCornerMinHz(), OptionalDouble.empty(), rule, checks,
                notChecked, "the sweep stops below the upper rolloff, so the upper corner was not measured");
        return new Conformity(new Verdict(rule, checks), notChecked);
    }

    private static void check(String quantity, String unit, Optional<MeasuredQuantity> measured, OptionalDouble min,
                              OptionalDouble max, DecisionRule rule, List<LimitCheck> checks, List<String> notChecked,
                              String why) {
        if (min.isEmpty() && max.isEmpty()) {
            return;
        }
        if (measured.isEmpty()) {
            notChecked.add(String.format(Locale.ROOT, "%s limit not checked: %s", quantity, why));
            return;
        }
        MeasuredQuantity value = measured.get();
        checks.add(LimitCheck.decide(quantity, unit, value.value(), value.expandedUncertainty(), min, max, rule));
    }
}

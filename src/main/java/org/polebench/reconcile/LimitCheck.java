package org.polebench.reconcile;

import java.util.OptionalDouble;

/**
 * One measured quantity held against its limits and decided under a rule.
 *
 * @param quantity            what is checked, in words ("lower corner", "midband gain")
 * @param unit                the unit of value, limits and margin ("Hz", "dB")
 * @param value               the measured value
 * @param expandedUncertainty U = k·u, in the same unit; 0 when unknown
 * @param coverageFactor      the k of that U, printed beside it
 * @param min                 the lower limit, if any
 * @param max                 the upper limit, if any
 * @param marginToLimit       distance from the value to the nearest limit, positive inside the
 *                            limits and negative outside (the guard band is not subtracted)
 * @param pass                the decision under {@code rule}
 * @param rule                the decision rule applied
 */
public record LimitCheck(String quantity, String unit, double value, double expandedUncertainty, double coverageFactor,
                         OptionalDouble min, OptionalDouble max, double marginToLimit, boolean pass,
                         DecisionRule rule) {

    /**
     * Decides one check.
     *
     * @throws IllegalArgumentException when neither limit is given, or the value or U is not finite
     */
    public static LimitCheck decide(String quantity, String unit, double value, double expandedUncertainty,
                                    double coverageFactor, OptionalDouble min, OptionalDouble max, DecisionRule rule) {
        if (min.isEmpty() && max.isEmpty()) {
            throw new IllegalArgumentException(quantity + ": a check needs a lower or an upper limit");
        }
        if (!Double.isFinite(value) || !(expandedUncertainty >= 0) || !Double.isFinite(expandedUncertainty)) {
            throw new IllegalArgumentException(quantity + ": value and uncertainty must be finite");
        }
        double margin = Double.POSITIVE_INFINITY;
        if (min.isPresent()) {
            margin = Math.min(margin, value - min.getAsDouble());
        }
        if (max.isPresent()) {
            margin = Math.min(margin, max.getAsDouble() - value);
        }
        double guard = rule.guardBand(expandedUncertainty);
        // simple acceptance: a value exactly on the limit is inside it (ILAC-G8 4.2.1 "within")
        boolean pass = margin >= guard;
        return new LimitCheck(quantity, unit, value, expandedUncertainty, coverageFactor, min, max, margin, pass, rule);
    }
}

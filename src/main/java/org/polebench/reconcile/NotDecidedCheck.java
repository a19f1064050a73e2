package org.polebench.reconcile;

import java.util.OptionalDouble;

/**
 * A limit of the stage that this sweep does not decide (issue 11): named in the verdict, never
 * counted as passed.
 *
 * @param quantity what the limit holds, in words ("lower corner", "midband gain")
 * @param unit     the unit of the limits and of any value shown ("Hz", "dB")
 * @param min      the lower limit, if any
 * @param max      the upper limit, if any
 * @param shown    the quantity as far as it is known: a value for information (or none), its
 *                 source, and why the sweep does not determine it
 */
public record NotDecidedCheck(String quantity, String unit, OptionalDouble min, OptionalDouble max,
                              MeasuredQuantity shown) {
    public NotDecidedCheck {
        if (shown.determinedBySweep()) {
            throw new IllegalArgumentException(quantity + ": a quantity the sweep determines is decided, not listed "
                    + "as not decided");
        }
        if (min.isEmpty() && max.isEmpty()) {
            throw new IllegalArgumentException(quantity + ": a check needs a lower or an upper limit");
        }
    }

    /** @return why the sweep does not decide this limit */
    public NotDecided reason() {
        return shown.notDecided().get();
    }
}

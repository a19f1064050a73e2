package org.polebench.reconcile;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * A quantity a limit is held against, with where it came from and whether the sweep itself
 * determines it (issue 11). A quantity the sweep does not determine may still carry a value to
 * show (the back-solved model's corner, say), labelled by its source, but no limit is decided
 * from it.
 *
 * @param value               the value, in the check's unit; empty when there is none to show
 * @param expandedUncertainty U = k·u in the same unit, at least 0; 0 when there is no value
 * @param coverageFactor      the k of that U (the fit's Student-t factor, or the back-solve's 2),
 *                            printed beside U wherever the quantity appears; NaN when there is no value
 * @param source              how it was measured, in words ("the fitted midband gain"); empty
 *                            when there is no value
 * @param notDecided          empty when the sweep determines the quantity, else why not
 */
public record MeasuredQuantity(OptionalDouble value, double expandedUncertainty, double coverageFactor, String source,
                               Optional<NotDecided> notDecided) {
    public MeasuredQuantity {
        if (value.isEmpty() && notDecided.isEmpty()) {
            throw new IllegalArgumentException("a quantity the sweep determines needs a value");
        }
    }

    /** A quantity the sweep determines. */
    public MeasuredQuantity(double value, double expandedUncertainty, double coverageFactor, String source) {
        this(OptionalDouble.of(value), expandedUncertainty, coverageFactor, source, Optional.empty());
    }

    /** @return a value shown for information only: the sweep does not determine it, for {@code why} */
    public static MeasuredQuantity shownOnly(double value, double expandedUncertainty, double coverageFactor,
                                             String source, NotDecided why) {
        return new MeasuredQuantity(OptionalDouble.of(value), expandedUncertainty, coverageFactor, source,
                Optional.of(why));
    }

    /** @return no value at all, and why the sweep does not determine one */
    public static MeasuredQuantity absent(NotDecided why) {
        return new MeasuredQuantity(OptionalDouble.empty(), 0, Double.NaN, "", Optional.of(why));
    }

    /** @return true when a limit may be decided from this quantity */
    public boolean determinedBySweep() {
        return notDecided.isEmpty();
    }
}

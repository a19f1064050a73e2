package org.polebench.report;

import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.fit.FitResult;
import org.polebench.fit.FittedRoot;
import org.polebench.reconcile.LimitAssessment;
import org.polebench.reconcile.MeasuredQuantity;
import org.polebench.reconcile.NotDecidedCheck;
import org.polebench.reconcile.Reconciler;
import org.polebench.reconcile.SweepDetermination;
import org.polebench.units.EngineeringValue;
import org.polebench.units.MeasuredValueFormat;

/**
 * The sentence that says which limit the sweep did not decide and why (issue 11), as the text
 * summary, {@code not_checked} in the JSON and the HTML report print it. The figures it names
 * (χ²/ν, the fitted band's ends, the corners) are those the rules of {@link SweepDetermination}
 * used.
 */
final class NotDecidedStatement {

    String of(NotDecidedCheck check, FitResult fit) {
        String head = check.quantity() + " limit not decided: ";
        MeasuredQuantity shown = check.shown();
        switch (check.reason()) {
            case FIT_DOES_NOT_DESCRIBE_SWEEP:
                return head + String.format(Locale.ROOT, "the rational fit does not describe the sweep "
                                + "(χ²/ν = %.3g, above %s), so the sweep does not determine the %s%s",
                        fit.quality().reducedChiSquare(),
                        MeasuredValueFormat.sixFigures(Reconciler.FIT_ADEQUATE_CHI_SQUARE), check.quantity(),
                        shown.value().isPresent() ? "; the value shown is for information only" : "");
            case FROM_MODEL_ONLY:
                return head + "the sweep shows no " + check.quantity() + " of its own (the fit quotes none)"
                        + (shown.value().isPresent() ? "; the value shown comes from " + shown.source() + " alone" : "");
            case OUTSIDE_SWEPT_BAND:
                if (check.quantity().equals(LimitAssessment.UPPER_CORNER)) {
                    Optional<FittedRoot> pole = SweepDetermination.highBandPole(fit);
                    return head + "the sweep stops below the upper rolloff (its last fitted point is at "
                            + hz(fit.band().highHz()) + ")" + (pole.isPresent()
                            ? "; the fitted high-band pole at " + hz(pole.get().magnitudeHz()) + " lies above it"
                            : "");
                }
                return head + "the sweep does not reach the " + check.quantity() + " (its lowest fitted point, "
                        + hz(fit.band().lowHz()) + ", is not below it)" + shownFrom(check);
            case MIDBAND_NOT_REACHED:
                OptionalDouble lower = SweepDetermination.fitLowerCornerHz(fit);
                Optional<FittedRoot> high = SweepDetermination.highBandPole(fit);
                String clearance = MeasuredValueFormat.sixFigures(SweepDetermination.MIDBAND_CLEARANCE);
                return head + "no swept point lies on the midband plateau, a factor of " + clearance + " above the "
                        + "fitted lower corner" + (lower.isPresent() ? " (" + hz(lower.getAsDouble()) + ")" : "")
                        + (high.isPresent() ? " and below the fitted upper corner (" + hz(high.get().magnitudeHz())
                        + ")" : "") + ", so the sweep does not determine the midband gain";
            default:
                throw new IllegalStateException("no sentence for " + check.reason());
        }
    }

    private static String shownFrom(NotDecidedCheck check) {
        return check.shown().value().isPresent() ? "; the value shown comes from " + check.shown().source() : "";
    }

    private static String hz(double hz) {
        return EngineeringValue.format(hz, "Hz", 4);
    }
}

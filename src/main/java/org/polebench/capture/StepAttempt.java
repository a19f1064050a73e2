package org.polebench.capture;

import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.ReadingConversion;

/** The result of one attempt at a point: the point, or a failure and its reason. */
final class StepAttempt {
    /** How one attempt went wrong, and whether repeating the step could help. */
    enum Failure {
        NO_ANSWER(true), UNREADABLE(true), ERROR(true),
        /** The instrument's overrange value: the same level at the same frequency would read the same. */
        SATURATED(false),
        /** A reading that {@link ReadingConversion} drops, as import drops its row: a repeat would read the same. */
        LEFT_OUT(false);

        final boolean worthRepeating;

        Failure(boolean worthRepeating) {
            this.worthRepeating = worthRepeating;
        }
    }

    /** null when the attempt failed */
    final SweepPoint point;
    /** null when the attempt gave a point */
    final Failure failure;
    final String reason;
    /** the frequency the attempt was at, in Hz; NaN when it is not known (a streamed line unread) */
    final double frequencyHz;

    private StepAttempt(SweepPoint point, Failure failure, String reason, double frequencyHz) {
        this.point = point;
        this.failure = failure;
        this.reason = reason;
        this.frequencyHz = frequencyHz;
    }

    static StepAttempt of(SweepPoint point) {
        return new StepAttempt(point, null, "", point.frequencyHz());
    }

    static StepAttempt failed(Failure failure, String reason) {
        return new StepAttempt(null, failure, reason, Double.NaN);
    }

    /** A point left out for a reason a repeat would meet again (a record that cannot be fitted). */
    static StepAttempt leftOut(double frequencyHz, String reason) {
        return new StepAttempt(null, Failure.LEFT_OUT, reason, frequencyHz);
    }

    static StepAttempt leftOut(double frequencyHz, ReadingConversion.Dropped dropped) {
        return new StepAttempt(null, Failure.LEFT_OUT, dropped.message(), frequencyHz);
    }
}

package org.polebench.ledger;

import java.time.Duration;
import java.util.Optional;
import org.polebench.lot.BoardOutcome.Outcome;

/**
 * A batch's counts at one moment.
 *
 * @param boards        the sweep files the batch takes
 * @param passed        boards whose verdict passed
 * @param failed        boards whose verdict failed
 * @param incomplete    boards whose verdict is incomplete
 * @param inputProblems boards whose sweep could not be reconciled (recorded as input problems)
 * @param earlier       of those, the boards the ledger already held from an earlier run
 * @param elapsed       time since the batch started
 */
public record BatchTally(int boards, int passed, int failed, int incomplete, int inputProblems, int earlier,
                         Duration elapsed) {

    /** @return the boards done so far */
    public int done() {
        return passed + failed + incomplete + inputProblems;
    }

    /** @return the fraction of done boards that passed, 0 to 1; empty before any is done */
    public Optional<Double> yield() {
        return done() == 0 ? Optional.empty() : Optional.of(passed / (double) done());
    }

    /**
     * @return the time left at the rate of the boards reconciled in this run (those the ledger
     *         already held cost next to nothing and are left out of the rate); empty until one is
     */
    public Optional<Duration> timeLeft() {
        int worked = done() - earlier;
        if (worked <= 0) {
            return Optional.empty();
        }
        double perBoardNanos = elapsed.toNanos() / (double) worked;
        return Optional.of(Duration.ofNanos(Math.round(perBoardNanos * (boards - done()))));
    }

    /** @return this tally with one more board of the given outcome, at the given time */
    BatchTally with(Outcome outcome, boolean wasEarlier, Duration at) {
        int e = earlier + (wasEarlier ? 1 : 0);
        switch (outcome) {
            case PASS:
                return new BatchTally(boards, passed + 1, failed, incomplete, inputProblems, e, at);
            case FAIL:
                return new BatchTally(boards, passed, failed + 1, incomplete, inputProblems, e, at);
            case INCOMPLETE:
                return new BatchTally(boards, passed, failed, incomplete + 1, inputProblems, e, at);
            default:
                return new BatchTally(boards, passed, failed, incomplete, inputProblems + 1, e, at);
        }
    }
}

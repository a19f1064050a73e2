package org.polebench.lot;

/**
 * How many boards passed, failed, were incomplete, or stopped at an input problem.
 *
 * @param passed        boards whose test passed
 * @param failed        boards whose test failed
 * @param incomplete    boards whose verdict was not decided (a limit could not be checked)
 * @param inputProblems boards whose sweep or files could not be read
 */
public record OutcomeCounts(int passed, int failed, int incomplete, int inputProblems) {
    public OutcomeCounts {
        if (passed < 0 || failed < 0 || incomplete < 0 || inputProblems < 0) {
            throw new IllegalArgumentException("counts are not negative");
        }
    }

    public static OutcomeCounts none() {
        return new OutcomeCounts(0, 0, 0, 0);
    }

    /** @return every board counted */
    public int boards() {
        return passed + failed + incomplete + inputProblems;
    }

    /**
     * @return passed over every board counted, input problems included: a board whose test did
     *         not show it good is not yield; NaN when no board was counted
     */
    public double yield() {
        int boards = boards();
        return boards == 0 ? Double.NaN : passed / (double) boards;
    }

    /** @return these counts with one more board of that outcome */
    public OutcomeCounts plus(BoardOutcome.Outcome outcome) {
        switch (outcome) {
            case PASS:
                return new OutcomeCounts(passed + 1, failed, incomplete, inputProblems);
            case FAIL:
                return new OutcomeCounts(passed, failed + 1, incomplete, inputProblems);
            case INCOMPLETE:
                return new OutcomeCounts(passed, failed, incomplete + 1, inputProblems);
            default:
                return new OutcomeCounts(passed, failed, incomplete, inputProblems + 1);
        }
    }
}

package org.polebench.cli;

/** The exit codes polebench documents in docs/user-guide.md ("Reading the output") and {@code --help}. */
public final class ExitCodes {
    public static final int OK = 0;
    /** A verdict failed: the board does not meet its limits. */
    public static final int VERDICT_FAILED = 1;
    /** Bad input or usage: a stage file, sweep, profile or option is at fault. */
    public static final int BAD_INPUT = 2;
    /** An instrument or I/O fault: a port, a file that cannot be written, a timeout. */
    public static final int INSTRUMENT_OR_IO = 3;
    /**
     * A verdict is incomplete: no decided check failed, but the sweep does not decide some limit
     * (a corner outside the swept band, a value from the stage model alone, a fit that does not
     * describe the sweep) or the stage names no limits. Never a pass (issue 11).
     */
    public static final int INCOMPLETE = 4;

    private ExitCodes() {
    }
}

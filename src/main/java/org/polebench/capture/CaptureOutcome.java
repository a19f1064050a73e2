package org.polebench.capture;

import java.nio.file.Path;
import java.util.List;

/**
 * How a live capture ended: every planned point measured, or stopped with the completed points
 * on disk. Code that treats the two differently calls {@link #match} with a {@link Cases}, so
 * a new way of ending fails to compile until every such place handles it.
 */
public sealed interface CaptureOutcome permits CaptureOutcome.Completed, CaptureOutcome.Stopped {
    /** @return the canonical sweep file */
    Path sweepFile();

    /** @return the transcript of every line sent and received */
    Path transcript();

    /** @return points on disk */
    int points();

    /** @return what the user should know, one message each */
    List<String> warnings();

    /** @return what {@code cases} gives for this outcome */
    <R> R match(Cases<R> cases);

    /** One method per outcome: adding one breaks every implementation until it handles it. */
    interface Cases<R> {
        R completed(Completed completed);

        R stopped(Stopped stopped);
    }

    /**
     * @param skipped planned points that were left out (a reading at full scale or at the floor)
     */
    record Completed(Path sweepFile, Path transcript, int points, int skipped, List<String> warnings)
            implements CaptureOutcome {
        public Completed {
            warnings = List.copyOf(warnings);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.completed(this);
        }
    }

    /**
     * @param reason   why it stopped
     * @param message  what happened, in the user's terms, naming the frequency and the command
     * @param total    the points of the plan
     */
    record Stopped(StopReason reason, String message, Path sweepFile, Path transcript, int points, int total,
                   List<String> warnings) implements CaptureOutcome {
        public Stopped {
            warnings = List.copyOf(warnings);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.stopped(this);
        }
    }

    /** Why a capture stopped before its end. */
    enum StopReason {
        /** The port or connection vanished. */
        PORT_LOST,
        /** An instrument did not answer within the timeout, the retries included. */
        NO_ANSWER,
        /** The answers stayed unreadable or erroneous through every retry. */
        BAD_ANSWERS,
        /** The instrument reported errors after the setup commands. */
        SETUP_REFUSED,
        /** The user asked it to stop (Ctrl-C). */
        INTERRUPTED
    }
}

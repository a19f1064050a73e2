package org.polebench.capture;

/**
 * What a live capture reports while it runs, for a progress display. Called on the capture's
 * own thread; a listener must return quickly and must not throw.
 */
public interface CaptureListener {
    /** An instrument answered its identity query. */
    default void identified(String instrument, String identity) {
    }

    /** The sweep starts (or resumes) at point {@code firstPoint} (1-based) of {@code total}. */
    default void started(int firstPoint, int total) {
    }

    /** One point was measured and is on disk. */
    default void point(CaptureProgress progress) {
    }

    /** A step failed and is being repeated. */
    default void retrying(double frequencyHz, String reason, int attempt, int allowed) {
    }

    /** Something the user should know that does not stop the capture. */
    default void warning(String message) {
    }

    /** A listener that ignores everything. */
    static CaptureListener silent() {
        return new CaptureListener() {
        };
    }
}

package org.polebench.capture;

/** A stop of a capture: why, and what to tell the user. Thrown inside a capture and caught by it. */
final class CaptureHalt extends Exception {
    private static final long serialVersionUID = 1L;

    final CaptureOutcome.StopReason reason;

    CaptureHalt(CaptureOutcome.StopReason reason, String message) {
        super(message, null, false, false);
        this.reason = reason;
    }
}

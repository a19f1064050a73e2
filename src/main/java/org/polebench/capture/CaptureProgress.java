package org.polebench.capture;

import java.time.Duration;
import org.polebench.sweep.SweepPoint;

/**
 * Where a capture is, after a point.
 *
 * @param pointNumber the point just measured, 1-based in the plan
 * @param total       the points of the plan (for a streaming instrument, as it announced them)
 * @param point       what was measured
 * @param timeLeft    the estimated time to the end: the remaining settling times plus the
 *                    remaining points times the mean overhead per point so far
 */
public record CaptureProgress(int pointNumber, int total, SweepPoint point, Duration timeLeft) {
}

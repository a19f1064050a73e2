package org.polebench.sweep;

import java.util.List;
import java.util.Optional;

/**
 * One bench sweep, strictly ascending in frequency, and where it came from. Either every
 * point has a phase or none has (a magnitude-only instrument); importers enforce this with
 * a clear message before building one.
 *
 * @param calibration the instrument's accuracy as a calibration error common to every point,
 *                    when the profile it was read with states one; empty otherwise (the fit then
 *                    takes it from the points' own uncertainties or a default, docs/method.md)
 */
public record Sweep(Provenance source, List<SweepPoint> points, Optional<CalibrationAccuracy> calibration) {
    public Sweep {
        points = List.copyOf(points);
        calibration = calibration == null ? Optional.empty() : calibration;
        if (points.size() < 2) {
            throw new IllegalArgumentException("a sweep needs two points, had " + points.size());
        }
        boolean phase = points.get(0).hasPhase();
        for (int i = 1; i < points.size(); i++) {
            if (!(points.get(i).frequencyHz() > points.get(i - 1).frequencyHz())) {
                throw new IllegalArgumentException("sweep frequencies must be strictly ascending at point " + i);
            }
            if (points.get(i).hasPhase() != phase) {
                throw new IllegalArgumentException("point " + i + " differs from point 0 in having a phase");
            }
        }
    }

    /** A sweep whose instrument states no accuracy. */
    public Sweep(Provenance source, List<SweepPoint> points) {
        this(source, points, Optional.empty());
    }

    /** @return the same points and source with this calibration accuracy */
    public Sweep withCalibration(CalibrationAccuracy accuracy) {
        return new Sweep(source, points, Optional.of(accuracy));
    }

    /** @return true when every point carries a phase */
    public boolean hasPhase() {
        return points.get(0).hasPhase();
    }

    public int size() {
        return points.size();
    }

    public double lowestHz() {
        return points.get(0).frequencyHz();
    }

    public double highestHz() {
        return points.get(points.size() - 1).frequencyHz();
    }
}

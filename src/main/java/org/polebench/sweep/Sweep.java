package org.polebench.sweep;

import java.util.List;
import java.util.Optional;

/**
 * One bench sweep, strictly ascending in frequency, and where it came from. Its points are
 * held as {@link PackedPoints}, whatever list they were given in. Either every
 * point has a phase or none has (a magnitude-only instrument); importers enforce this with
 * a clear message before building one.
 *
 * @param calibration the instrument's accuracy as a calibration error common to every point,
 *                    when the profile it was read with states one; empty otherwise (the fit then
 *                    takes it from the points' own uncertainties or a default, docs/method.md)
 */
public record Sweep(Provenance source, List<SweepPoint> points, Optional<CalibrationAccuracy> calibration) {
    public Sweep {
        // packed, not List.copyOf: the same immutability at a third of the memory (PackedPoints)
        PackedPoints packed = PackedPoints.of(points);
        points = packed;
        calibration = calibration == null ? Optional.empty() : calibration;
        if (packed.size() < 2) {
            throw new IllegalArgumentException("a sweep needs two points, had " + packed.size());
        }
        for (int i = 1; i < packed.size(); i++) {
            if (!(packed.frequencyHz(i) > packed.frequencyHz(i - 1))) {
                throw new IllegalArgumentException("sweep frequencies must be strictly ascending at point " + i);
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
        return packed().hasPhase();
    }

    public int size() {
        return points.size();
    }

    public double lowestHz() {
        return packed().frequencyHz(0);
    }

    public double highestHz() {
        return packed().frequencyHz(points.size() - 1);
    }

    /** @return the points as columns, for loops over millions of points that need no records */
    public PackedPoints packed() {
        return (PackedPoints) points;
    }
}

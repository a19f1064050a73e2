package org.polebench.sweep;

import java.util.List;

/**
 * One bench sweep, strictly ascending in frequency, and where it came from. Either every
 * point has a phase or none has (a magnitude-only instrument); importers enforce this with
 * a clear message before building one.
 */
public record Sweep(Provenance source, List<SweepPoint> points) {
    public Sweep {
        points = List.copyOf(points);
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

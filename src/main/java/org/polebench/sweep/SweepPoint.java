package org.polebench.sweep;

import java.util.OptionalDouble;

/**
 * One measured point of a sweep: gain V(out)/V(in) at one frequency.
 *
 * @param frequencyHz          test frequency, positive
 * @param gainDb               20·log10 |H|
 * @param phaseDeg             arg H in degrees, leads positive; empty for a magnitude-only instrument
 * @param gainUncertaintyDb    standard uncertainty of gainDb; empty when unknown
 * @param phaseUncertaintyDeg  standard uncertainty of phaseDeg; empty when unknown
 */
public record SweepPoint(double frequencyHz, double gainDb, OptionalDouble phaseDeg,
                         OptionalDouble gainUncertaintyDb, OptionalDouble phaseUncertaintyDeg) {
    public SweepPoint {
        if (!(frequencyHz > 0) || !Double.isFinite(frequencyHz)) {
            throw new IllegalArgumentException("frequency must be positive and finite, was " + frequencyHz);
        }
        if (!Double.isFinite(gainDb)) {
            throw new IllegalArgumentException("gain must be finite, was " + gainDb);
        }
        if (phaseDeg.isPresent() && !Double.isFinite(phaseDeg.getAsDouble())) {
            throw new IllegalArgumentException("phase must be finite, was " + phaseDeg.getAsDouble());
        }
    }

    /** A point with gain and phase and no stated uncertainty. */
    public static SweepPoint of(double frequencyHz, double gainDb, double phaseDeg) {
        return new SweepPoint(frequencyHz, gainDb, OptionalDouble.of(phaseDeg),
                OptionalDouble.empty(), OptionalDouble.empty());
    }

    /** A magnitude-only point with no stated uncertainty. */
    public static SweepPoint magnitudeOnly(double frequencyHz, double gainDb) {
        return new SweepPoint(frequencyHz, gainDb, OptionalDouble.empty(),
                OptionalDouble.empty(), OptionalDouble.empty());
    }

    public boolean hasPhase() {
        return phaseDeg.isPresent();
    }
}

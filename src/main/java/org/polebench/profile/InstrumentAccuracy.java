package org.polebench.profile;

import java.util.OptionalDouble;

/**
 * An instrument's stated accuracy, such as ±0.05 dB and ±0.5°, used as every point's default
 * uncertainty. A maker's ± figure is read as the half-width of a rectangular distribution,
 * so the standard uncertainty is half-width/√3 (GUM, JCGM 100:2008, 4.3.7).
 *
 * @param gainHalfWidthDb  ± figure for gain in dB; empty when not stated
 * @param phaseHalfWidthDeg ± figure for phase in degrees; empty when not stated
 */
public record InstrumentAccuracy(OptionalDouble gainHalfWidthDb, OptionalDouble phaseHalfWidthDeg) {
    private static final double SQRT3 = Math.sqrt(3.0);

    public InstrumentAccuracy {
        if (gainHalfWidthDb.isPresent() && !(gainHalfWidthDb.getAsDouble() >= 0)) {
            throw new IllegalArgumentException("gain accuracy must be non-negative");
        }
        if (phaseHalfWidthDeg.isPresent() && !(phaseHalfWidthDeg.getAsDouble() >= 0)) {
            throw new IllegalArgumentException("phase accuracy must be non-negative");
        }
    }

    public static InstrumentAccuracy unstated() {
        return new InstrumentAccuracy(OptionalDouble.empty(), OptionalDouble.empty());
    }

    /** @return the standard uncertainty of gain in dB (half-width/√3), or empty */
    public OptionalDouble gainStandardUncertaintyDb() {
        return gainHalfWidthDb.isPresent() ? OptionalDouble.of(gainHalfWidthDb.getAsDouble() / SQRT3)
                : OptionalDouble.empty();
    }

    /** @return the standard uncertainty of phase in degrees (half-width/√3), or empty */
    public OptionalDouble phaseStandardUncertaintyDeg() {
        return phaseHalfWidthDeg.isPresent() ? OptionalDouble.of(phaseHalfWidthDeg.getAsDouble() / SQRT3)
                : OptionalDouble.empty();
    }
}

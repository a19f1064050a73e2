package org.polebench.report;

import java.util.OptionalDouble;

/**
 * One point of a response drawn on a Bode plot.
 *
 * @param frequencyHz positive
 * @param gainDb      20·log10|H|
 * @param phaseDeg    arg H in degrees, leads positive; empty when not known
 */
public record ResponsePoint(double frequencyHz, double gainDb, OptionalDouble phaseDeg) {
    public ResponsePoint {
        if (!(frequencyHz > 0) || !Double.isFinite(frequencyHz)) {
            throw new IllegalArgumentException("a Bode plot needs positive frequencies, had " + frequencyHz);
        }
    }
}

package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.polebench.fit.FitBand;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootStatus;

/**
 * The rules of issue 11 as {@link SweepDetermination} states them, on hand-made bands and corners
 * either side of each edge: a lower corner must lie above the lowest fitted point, a midband
 * point at least 10 times above the lower corner (and 10 times below a fitted upper one), an
 * upper corner at or below the highest fitted point; nothing is decided from a fit that does
 * not describe the sweep.
 */
class SweepDeterminationTest {
    private static final SweepDetermination RULES = new SweepDetermination();
    private static final FitBand BAND = new FitBand(1, 1000);
    // one point a decade from 1 Hz to 1 kHz
    private static final List<Double> POINTS = List.of(1.0, 10.0, 100.0, 1000.0);
    private static final Optional<NotDecided> DECIDED = Optional.empty();

    private static Optional<FittedRoot> pole(double hz, RootStatus status) {
        return Optional.of(new FittedRoot("ph", new Complex(-2 * Math.PI * hz, 0), 1, 0, 1, status));
    }

    @Test
    void aLowerCornerIsDecidedOnlyFromAnAdequateFitWhoseBandReachesBelowIt() {
        assertEquals(DECIDED, RULES.lowerCorner(true, true, 20, BAND));
        assertEquals(Optional.of(NotDecided.OUTSIDE_SWEPT_BAND), RULES.lowerCorner(true, true, 1, BAND));
        assertEquals(Optional.of(NotDecided.OUTSIDE_SWEPT_BAND), RULES.lowerCorner(true, true, 0.5, BAND));
        assertEquals(Optional.of(NotDecided.FROM_MODEL_ONLY), RULES.lowerCorner(true, false, 20, BAND));
        assertEquals(Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP), RULES.lowerCorner(false, true, 20, BAND));
    }

    @Test
    void theMidbandGainNeedsAPointAFactorOfTenClearOfEachFittedCorner() {
        // corner 100 Hz: the 1 kHz point is exactly 10 times above it
        assertEquals(DECIDED, RULES.midbandGain(true, OptionalDouble.of(100), OptionalDouble.empty(), BAND, POINTS));
        assertEquals(Optional.of(NotDecided.MIDBAND_NOT_REACHED),
                RULES.midbandGain(true, OptionalDouble.of(101), OptionalDouble.empty(), BAND, POINTS));
        // an upper corner at 5 kHz leaves 100 Hz (≤ 500 Hz) but not 1 kHz
        assertEquals(DECIDED, RULES.midbandGain(true, OptionalDouble.of(10), OptionalDouble.of(5000), BAND, POINTS));
        assertEquals(Optional.of(NotDecided.MIDBAND_NOT_REACHED),
                RULES.midbandGain(true, OptionalDouble.of(20), OptionalDouble.of(5000), BAND, POINTS));
        // no fitted lower corner: it lies more than a decade below the band, every point clears it
        assertEquals(DECIDED, RULES.midbandGain(true, OptionalDouble.empty(), OptionalDouble.empty(), BAND, POINTS));
        // a point outside the fitted band does not count
        assertEquals(Optional.of(NotDecided.MIDBAND_NOT_REACHED), RULES.midbandGain(true, OptionalDouble.of(100),
                OptionalDouble.empty(), new FitBand(1, 999), POINTS));
        assertEquals(Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP),
                RULES.midbandGain(false, OptionalDouble.of(1), OptionalDouble.empty(), BAND, POINTS));
    }

    @Test
    void anUpperCornerIsDecidedOnlyFromAFittedHighBandPoleInsideTheBand() {
        assertEquals(DECIDED, RULES.upperCorner(true, pole(800, RootStatus.FITTED), BAND));
        assertEquals(DECIDED, RULES.upperCorner(true, pole(1000, RootStatus.FITTED), BAND));
        assertEquals(Optional.of(NotDecided.OUTSIDE_SWEPT_BAND), RULES.upperCorner(true, pole(1200, RootStatus.FITTED), BAND));
        assertEquals(Optional.of(NotDecided.OUTSIDE_SWEPT_BAND),
                RULES.upperCorner(true, pole(800, RootStatus.UNIDENTIFIABLE), BAND));
        assertEquals(Optional.of(NotDecided.OUTSIDE_SWEPT_BAND), RULES.upperCorner(true, Optional.empty(), BAND));
        assertEquals(Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP),
                RULES.upperCorner(false, pole(800, RootStatus.FITTED), BAND));
    }
}

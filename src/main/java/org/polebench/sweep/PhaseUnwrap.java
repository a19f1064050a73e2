package org.polebench.sweep;

/**
 * Folding and unwrapping of phase in degrees. Unwrapping adds whole turns so that successive
 * points differ by at most half a turn (the usual rule, e.g. Oppenheim and Schafer,
 * Discrete-Time Signal Processing, on phase unwrapping; from memory), anchored at one point
 * whose reported value is kept.
 */
public final class PhaseUnwrap {
    private PhaseUnwrap() {
    }

    /** @return the angle folded into (−180°, 180°] */
    public static double fold(double degrees) {
        double folded = degrees - 360.0 * Math.floor(degrees / 360.0);   // [0, 360)
        return folded > 180.0 ? folded - 360.0 : folded;
    }

    /**
     * Unwraps in place outward from {@code anchor}, which keeps its value.
     *
     * @param phaseDeg phases in frequency order
     */
    public static void unwrap(double[] phaseDeg, int count, int anchor) {
        for (int i = anchor + 1; i < count; i++) {
            phaseDeg[i] = nearestTurn(phaseDeg[i], phaseDeg[i - 1]);
        }
        for (int i = anchor - 1; i >= 0; i--) {
            phaseDeg[i] = nearestTurn(phaseDeg[i], phaseDeg[i + 1]);
        }
    }

    /** @return degrees plus the whole number of turns that brings it nearest to reference */
    public static double nearestTurn(double degrees, double reference) {
        double turns = Math.rint((reference - degrees) / 360.0);
        return degrees + 360.0 * turns;
    }
}

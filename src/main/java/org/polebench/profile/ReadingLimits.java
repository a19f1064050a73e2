package org.polebench.profile;

import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Where an instrument's readings stop meaning anything. Readings past a limit are dropped,
 * each with a warning naming its line.
 *
 * @param noiseFloorDb      a gain at or below this (dB) is noise; empty for none
 * @param amplitudeFloor    an amplitude at or below this (in the profile's amplitude unit) is
 *                          noise; amplitude profiles only; empty for none
 * @param fullScale         an amplitude at or above this (profile's amplitude unit) is clipped;
 *                          empty for none
 * @param overloadMarkers   cell texts an instrument prints instead of a number when its input
 *                          saturates (compared ignoring case), such as {@code OVL}
 */
public record ReadingLimits(OptionalDouble noiseFloorDb, OptionalDouble amplitudeFloor, OptionalDouble fullScale,
                            List<String> overloadMarkers) {
    /** The markers assumed when a profile names none; common practice on bench instruments. */
    public static final List<String> USUAL_OVERLOAD_MARKERS = List.of("OVL", "OVLD", "OVER", "OVERLOAD", "CLIP");

    public ReadingLimits {
        overloadMarkers = overloadMarkers.stream().map(m -> m.strip().toUpperCase(Locale.ROOT)).toList();
    }

    public static ReadingLimits none() {
        return new ReadingLimits(OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                USUAL_OVERLOAD_MARKERS);
    }

    /** @return true when the text (already stripped) is one of the overload markers */
    public boolean isOverloadMarker(CharSequence text) {
        if (text.length() == 0 || text.length() > 12 || Character.isDigit(text.charAt(text.length() - 1))) {
            return false;
        }
        String upper = text.toString().toUpperCase(Locale.ROOT);
        return overloadMarkers.contains(upper);
    }
}

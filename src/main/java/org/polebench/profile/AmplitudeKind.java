package org.polebench.profile;

import java.util.Optional;

/**
 * Which amplitude an instrument reports. Whether a reading is peak, peak-to-peak or RMS is
 * the device's choice (PITFALLS, SCPI), so a profile must say. A gain from two amplitudes of
 * the same kind does not depend on it; limits (full scale, floor) and a generator level do.
 */
public enum AmplitudeKind {
    PEAK_TO_PEAK("Vpp"),
    RMS("Vrms"),
    PEAK("Vpk");

    private final String symbol;

    AmplitudeKind(String symbol) {
        this.symbol = symbol;
    }

    public String symbol() {
        return symbol;
    }

    public static Optional<AmplitudeKind> parse(String text) {
        return ProfileWords.lookup(values(), AmplitudeKind::symbol, text);
    }
}

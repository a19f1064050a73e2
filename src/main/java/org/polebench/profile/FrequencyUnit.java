package org.polebench.profile;

import java.util.Optional;

/** The unit an instrument writes its test frequencies in. */
public enum FrequencyUnit {
    HZ("Hz", 1.0),
    KHZ("kHz", 1e3),
    MHZ("MHz", 1e6);

    private final String symbol;
    private final double hertzPerUnit;

    FrequencyUnit(String symbol, double hertzPerUnit) {
        this.symbol = symbol;
        this.hertzPerUnit = hertzPerUnit;
    }

    public String symbol() {
        return symbol;
    }

    /** @return hertz in one of this unit: 1, 1000 or 1e6 */
    public double hertzPerUnit() {
        return hertzPerUnit;
    }

    /** @param text {@code Hz}, {@code kHz} or {@code MHz}, in any letter case */
    public static Optional<FrequencyUnit> parse(String text) {
        return ProfileWords.lookup(values(), FrequencyUnit::symbol, text);
    }
}

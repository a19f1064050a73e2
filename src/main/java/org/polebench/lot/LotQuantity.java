package org.polebench.lot;

/** A measured figure that every board of a lot gives, with its unit. */
public enum LotQuantity {
    /** The board's lower −3 dB corner, in Hz. */
    LOWER_CORNER("lower corner", "Hz"),
    /** The board's midband gain, in dB. */
    MIDBAND_GAIN("midband gain", "dB");

    private final String words;
    private final String unit;

    LotQuantity(String words, String unit) {
        this.words = words;
        this.unit = unit;
    }

    /** @return the quantity in words: "lower corner", "midband gain" */
    public String words() {
        return words;
    }

    /** @return its unit symbol: Hz or dB */
    public String unit() {
        return unit;
    }

    /** @return the word used in JSON: lower_corner, midband_gain */
    public String key() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }
}

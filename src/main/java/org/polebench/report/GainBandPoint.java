package org.polebench.report;

/**
 * One frequency of a shaded gain band (a tolerance spread of a prediction, say).
 *
 * @param frequencyHz positive
 * @param lowDb       lower edge of the band, dB
 * @param highDb      upper edge, dB, not below {@code lowDb}
 */
public record GainBandPoint(double frequencyHz, double lowDb, double highDb) {
    public GainBandPoint {
        if (!(frequencyHz > 0) || !(highDb >= lowDb)) {
            throw new IllegalArgumentException("a band point needs f > 0 and high >= low");
        }
    }
}

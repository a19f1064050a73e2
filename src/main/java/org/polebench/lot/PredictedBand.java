package org.polebench.lot;

/**
 * What the stage predicts for one quantity over its part tolerances: the nominal stage's value
 * and the central band of the drawn boards (docs/method.md, "Tolerance spread").
 *
 * @param nominal  the nominal stage's value (Hz or dB); NaN when the stage has none
 * @param low      the (1 − coverage)/2 percentile of the drawn boards; NaN when none was analysed
 * @param high     the (1 + coverage)/2 percentile
 * @param coverage the central fraction of drawn boards between {@code low} and {@code high}
 * @param drawn    boards drawn
 * @param analysed drawn boards that could be analysed (a bias out of region is not)
 * @param seed     the seed of the draws, so the band can be repeated
 */
public record PredictedBand(double nominal, double low, double high, double coverage, int drawn, int analysed,
                            long seed) {
    /** @return whether the value lies within [low, high]; false when the band is unknown */
    public boolean holds(double value) {
        return value >= low && value <= high;
    }
}

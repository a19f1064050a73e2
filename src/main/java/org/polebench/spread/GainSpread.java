package org.polebench.spread;

import java.util.List;

/**
 * The gain of a stage over its part tolerances at each of a set of frequencies: a band that
 * holds the central {@code coverage} of the drawn boards at every frequency.
 *
 * @param frequenciesHz ascending, positive
 * @param lowDb         per frequency, the (1 − coverage)/2 percentile of 20·log10|H|, dB
 * @param highDb        per frequency, the (1 + coverage)/2 percentile, dB
 * @param coverage      the central fraction the band holds, such as 0.95
 * @param boardsDrawn   boards drawn
 * @param biasFailures  drawn boards whose bias left the active region (not in the band)
 * @param seed          the random seed of the draws
 */
public record GainSpread(List<Double> frequenciesHz, List<Double> lowDb, List<Double> highDb, double coverage,
                         int boardsDrawn, int biasFailures, long seed) {
    public GainSpread {
        frequenciesHz = List.copyOf(frequenciesHz);
        lowDb = List.copyOf(lowDb);
        highDb = List.copyOf(highDb);
        if (lowDb.size() != frequenciesHz.size() || highDb.size() != frequenciesHz.size()) {
            throw new IllegalArgumentException("a gain spread needs one low and one high value per frequency");
        }
    }

    /** @return boards whose gain is in the band */
    public int boardsAnalysed() {
        return boardsDrawn - biasFailures;
    }
}

package org.polebench.fit;

/**
 * The frequency range a fit uses, inclusive at both ends.
 *
 * @param lowHz  lowest frequency used, positive
 * @param highHz highest frequency used, above {@code lowHz}
 */
public record FitBand(double lowHz, double highHz) {
    public FitBand {
        if (!(lowHz > 0) || !(highHz > lowHz) || !Double.isFinite(highHz)) {
            throw new IllegalArgumentException("a fit band needs 0 < low < high, was " + lowHz + ":" + highHz);
        }
    }

    public boolean contains(double frequencyHz) {
        return frequencyHz >= lowHz && frequencyHz <= highHz;
    }
}

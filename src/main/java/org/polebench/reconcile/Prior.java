package org.polebench.reconcile;

/**
 * A normal prior on a log-scale parameter such as φ = ln(C/C_nom), from a tolerance band.
 *
 * <p>The band is read as rectangular in ln(value) (GUM, JCGM 100:2008, 4.3.7): for a band
 * [b−, b+] in ln, the centre is (b− + b+)/2 and the standard uncertainty (b+ − b−)/√12. So
 * ±10 % gives u ≈ 0.058 and −20 %/+80 % gives centre 0.182, u = 0.234.
 *
 * @param mean              prior mean of the log-scale parameter
 * @param standardDeviation prior standard deviation, positive
 */
public record Prior(double mean, double standardDeviation) {
    public Prior {
        if (!Double.isFinite(mean) || !(standardDeviation > 0) || !Double.isFinite(standardDeviation)) {
            throw new IllegalArgumentException("a prior needs a finite mean and a positive deviation");
        }
    }

    /**
     * @param lowFraction  the band's lower side as a fraction, e.g. −0.2 for −20 %
     * @param highFraction the band's upper side, e.g. 0.8 for +80 %
     */
    public static Prior fromBand(double lowFraction, double highFraction) {
        if (!(lowFraction > -1) || !(highFraction > lowFraction)) {
            throw new IllegalArgumentException("a tolerance band needs -100 % < low < high, was "
                    + lowFraction + " to " + highFraction);
        }
        double lower = Math.log1p(lowFraction);
        double upper = Math.log1p(highFraction);
        return new Prior((lower + upper) / 2, (upper - lower) / Math.sqrt(12));
    }

    /** A gain-calibration prior: a symmetric band of ± {@code halfWidthDb}, read as rectangular in dB. */
    public static Prior fromGainBandDb(double halfWidthDb) {
        if (!(halfWidthDb > 0)) {
            throw new IllegalArgumentException("a gain band needs a positive half-width, was " + halfWidthDb);
        }
        return new Prior(0, halfWidthDb / Math.sqrt(3));
    }
}

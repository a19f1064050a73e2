package org.polebench.lot;

/**
 * A board whose reading of a part lies far from the lot's distribution of that part, kept out of
 * the pooled estimate.
 *
 * @param boardId           the board
 * @param lnFactor          its reading, ln(value/nominal)
 * @param uLnFactor         the reading's standard uncertainty
 * @param outsideTolerance  whether the reading ± 2u lies wholly outside the part's tolerance band:
 *                          a single-board fault; else the board reads as designed while the lot
 *                          does not
 */
public record ApartBoard(String boardId, double lnFactor, double uLnFactor, boolean outsideTolerance) {
    /** @return the reading as a factor on the nominal value */
    public double factor() {
        return Math.exp(lnFactor);
    }
}

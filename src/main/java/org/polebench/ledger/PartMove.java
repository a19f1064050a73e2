package org.polebench.ledger;

/**
 * One part's back-solved value from one test of a board to the next.
 *
 * @param part     the part's name (C2, RE, Q1 bias, gain …)
 * @param before   ln(value/nominal) at the earlier test
 * @param uBefore  its standard uncertainty
 * @param after    ln(value/nominal) at the later test
 * @param uAfter   its standard uncertainty
 */
public record PartMove(String part, double before, double uBefore, double after, double uAfter) {
    /**
     * A move counts when it exceeds twice the standard uncertainty of the difference, about the 95 %
     * level for a normal difference (GUM, JCGM 100:2008, G.1.3, k = 2).
     */
    public static final double SIGNIFICANT = 2;

    /** @return the later value over the earlier one: 1.47 when the part reads 47 % higher */
    public double ratio() {
        return Math.exp(after - before);
    }

    /**
     * @return the move in standard uncertainties of the difference, the two tests taken as
     *         independent (each back-solve is from its own sweep); infinite when neither has an
     *         uncertainty and the values differ
     */
    public double zScore() {
        double u = Math.sqrt(uBefore * uBefore + uAfter * uAfter);
        double delta = Math.abs(after - before);
        return u > 0 ? delta / u : delta > 0 ? Double.POSITIVE_INFINITY : 0;
    }

    /** @return whether the part moved beyond what the two tests' uncertainties explain */
    public boolean moved() {
        return zScore() >= SIGNIFICANT;
    }
}

package org.polebench.reconcile;

import java.util.List;

/**
 * The lower corner's change from the stage as designed to the back-solved board, apportioned
 * along the path between them ({@link CornerApportionment}).
 *
 * @param lnCornerRatio     ln(f_back-solved / f_predicted), the change apportioned
 * @param uLnCorner         its standard uncertainty
 * @param shares            each low-band capacitor's term, in port order
 * @param otherContribution the bias currents', β's and freed resistors' term together
 * @param otherShare        that term over the change; NaN when the change is within twice its
 *                          uncertainty (as every capacitor's share then)
 */
public record Apportionment(double lnCornerRatio, double uLnCorner, List<CapacitorShare> shares,
                            double otherContribution, double otherShare) {
    public Apportionment {
        shares = List.copyOf(shares);
    }
}

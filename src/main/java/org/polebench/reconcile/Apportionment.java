package org.polebench.reconcile;

import java.util.List;

/**
 * The measured lower corner's error split among the low-band capacitors, to first order.
 *
 * @param lnCornerRatio ln(f_measured / f_predicted), the relative corner error
 * @param uLnCorner     the standard uncertainty of that ratio, from the measured corner's
 * @param shares        one per low-band capacitor, in port order
 */
public record Apportionment(double lnCornerRatio, double uLnCorner, List<CapacitorShare> shares) {
    public Apportionment {
        shares = List.copyOf(shares);
    }
}

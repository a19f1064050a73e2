package org.polebench.analysis;

import org.polebench.linalg.RealLu;

/**
 * Y⁻¹ (ohms) of one port reduction, from the LU of the row-scaled Y that the reduction's
 * singularity test makes: (R·Y)⁻¹ = Y⁻¹·R⁻¹, so Y⁻¹ = (R·Y)⁻¹·R with R the row scales. The
 * inverse is formed on first use only, since the lower corner never needs it (a tolerance
 * spread's boards never ask) while the OCTC terms and the link resistances do. Safe to share
 * between threads: two first uses at once form the same matrix twice.
 */
final class AdmittanceInverse {
    private final RealLu equilibrated;
    private final double[] rowScale;
    private volatile double[][] inverse;

    /** @param equilibrated the non-singular LU of R·Y; {@code rowScale} holds R's diagonal */
    AdmittanceInverse(RealLu equilibrated, double[] rowScale) {
        this.equilibrated = equilibrated;
        this.rowScale = rowScale;
    }

    /** @return (Y⁻¹)_ij in ohms */
    double ohms(int i, int j) {
        return matrix()[i][j];
    }

    /** @return Y⁻¹; not to be changed */
    double[][] matrix() {
        double[][] formed = inverse;
        if (formed == null) {
            formed = equilibrated.inverse();
            for (double[] row : formed) {
                unscale(row);
            }
            inverse = formed;
        }
        return formed;
    }

    // one row per call: see RealLu on loops in methods that a cold spread calls thousands of times
    private void unscale(double[] row) {
        for (int j = 0; j < row.length; j++) {
            row[j] *= rowScale[j];
        }
    }
}

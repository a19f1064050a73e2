package org.polebench.fit;

import java.util.Arrays;

/**
 * Finds the few bad points of a sweep. Refits the chosen model by iteratively reweighted least
 * squares with a robust loss (Holland and Welsch, Communications in Statistics A6(9), 1977), so a
 * bad point cannot pull the model towards itself, then marks every point whose gain or phase
 * residual exceeds the threshold in units of its standard uncertainty, or of the robust scale
 * 1.4826·median|r/σ| when that is larger (the data scatter more than stated).
 */
final class OutlierScreen {
    private static final int IRLS_ROUNDS = 3;
    private static final double MAD_TO_SIGMA = 1.4826;

    private final LogResidualFit refinement = new LogResidualFit();

    /**
     * How far out each point stands, in σ. The robust refit is skipped when no point of the plain
     * fit stands out even half as far as the threshold: a point's plain residual is (1 − h) times
     * its robust one for leverage h, and no leverage in a sweep of many points comes near ½.
     */
    double[] standardisedResiduals(PreparedSweep data, RefinedFit fit, RobustLoss loss, double threshold) {
        double[] p = fit.parameters.clone();
        double[] weights = new double[data.size()];
        double[] e = standardised(data, fit.model, p);
        double largest = 0;
        for (double v : e) {
            largest = Math.max(largest, v);
        }
        if (largest < threshold / 2) {
            return e;
        }
        for (int round = 0; round < IRLS_ROUNDS; round++) {
            for (int k = 0; k < weights.length; k++) {
                weights[k] = loss.weight(e[k]);
            }
            RefinedFit robust = refinement.refine(data, fit.model, p, weights);
            if (robust == null) {
                break;
            }
            p = robust.parameters;
            e = standardised(data, fit.model, p);
        }
        return e;
    }

    private static double[] standardised(PreparedSweep data, RationalModel model, double[] p) {
        int n = data.size();
        double[] value = new double[data.residualCount()];
        double[][] jacobian = new double[value.length][];
        LogResidualFit.evaluate(data, model, p, value, jacobian);
        double[] z = new double[value.length];
        for (int r = 0; r < value.length; r++) {
            z[r] = Math.abs(value[r]) / (r < n ? data.sigmaGain[r] : data.sigmaPhase[r - n]);
        }
        double[] sorted = z.clone();
        Arrays.sort(sorted);
        double median = sorted.length % 2 == 1 ? sorted[sorted.length / 2]
                : 0.5 * (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]);
        double scale = Math.max(1, MAD_TO_SIGMA * median);
        double[] e = new double[n];
        for (int k = 0; k < n; k++) {
            e[k] = (data.hasPhase ? Math.max(z[k], z[n + k]) : z[k]) / scale;
        }
        return e;
    }
}

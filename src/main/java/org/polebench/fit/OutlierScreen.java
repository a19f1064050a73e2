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
     * How far out each point stands, in σ. The robust refit is skipped when no point could reach
     * the threshold even with the pull of its own residual removed: a point's residual with
     * itself left out is r/(1 − h) for leverage h = gᵀ(JᵀWJ)⁻¹g (Cook and Weisberg, Residuals and
     * Influence in Regression, 1982, §2.2), so the plain fit already shows every point that the
     * robust one could drop.
     */
    double[] standardisedResiduals(PreparedSweep data, RefinedFit fit, RobustLoss loss, double threshold) {
        double[] p = fit.parameters.clone();
        double[] weights = new double[data.size()];
        double[] e = standardised(data, fit.model, p);
        if (fit.inverseInformation != null && !anyCouldReach(data, fit, e, threshold)) {
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

    private static boolean anyCouldReach(PreparedSweep data, RefinedFit fit, double[] e, double threshold) {
        int n = data.size();
        double[] value = new double[data.residualCount()];
        double[][] jacobian = new double[value.length][];
        LogResidualFit.evaluate(data, fit.model, fit.parameters, value, jacobian);
        double[][] c = fit.inverseInformation;
        for (int k = 0; k < n; k++) {
            double h = leverage(jacobian[k], data.sigmaGain[k], c);
            if (data.hasPhase) {
                h = Math.max(h, leverage(jacobian[n + k], data.sigmaPhase[k], c));
            }
            if (h >= 1 || e[k] >= threshold * (1 - h)) {
                return true;
            }
        }
        return false;
    }

    private static double leverage(double[] gradient, double sigma, double[][] c) {
        double h = 0;
        for (int i = 0; i < gradient.length; i++) {
            double row = 0;
            for (int j = 0; j < gradient.length; j++) {
                row += c[i][j] * gradient[j];
            }
            h += gradient[i] * row;
        }
        return h / (sigma * sigma);
    }

    private static double[] standardised(PreparedSweep data, RationalModel model, double[] p) {
        int n = data.size();
        double[] value = new double[data.residualCount()];
        LogResidualFit.evaluate(data, model, p, value, (double[]) null);
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

package org.polebench.reconcile;

import java.util.Arrays;
import java.util.Optional;
import org.polebench.linalg.HouseholderQr;

/**
 * The misfit's linear model at one point θ₀: the data rows' residuals r and Jacobian J (gain
 * rows first) from one evaluation with every parameter active. From it, any hypothesis'
 * Gauss–Newton step from θ₀ (its own priors and parameters) and the drop of ‖r‖² it promises,
 * and the MAP that step reaches if the model is quadratic (Nocedal and Wright, Numerical
 * Optimization, 2nd ed., 10.3). Every solve is a QR factorisation of the stacked matrix
 * [J; diag(1/σ)], never of JᵀJ (docs/method.md, "Least squares by QR"). One Jacobian serves
 * every hypothesis judged there: the resistors from the no-fault MAP, the second faults from a
 * single fault's MAP. Immutable.
 */
final class QuadraticModel {
    private final double[] theta;
    /** ∂r/∂θ_j over the data rows, by parameter. */
    private final double[][] columns;
    /** The data rows' residuals at θ₀. */
    private final double[] residuals;
    private final int magnitudeRows;

    /** A Gauss–Newton step δ and the drop of ‖r‖² it promises, gᵀ(JᵀJ + Σp⁻¹)⁻¹g. */
    static final class Step {
        final double[] delta;
        final double drop;

        Step(double[] delta, double drop) {
            this.delta = delta;
            this.drop = drop;
        }
    }

    private QuadraticModel(double[] theta, double[][] columns, double[] residuals, int magnitudeRows) {
        this.theta = theta;
        this.columns = columns;
        this.residuals = residuals;
        this.magnitudeRows = magnitudeRows;
    }

    /**
     * @param every a misfit with every parameter active, at the stated σ
     * @return the model at θ, or null where the board's model is undefined there
     */
    static QuadraticModel at(Misfit every, double[] theta) {
        int p = every.parameters();
        double[] r = new double[every.rows()];
        double[][] jacobian = new double[p][every.rows()];
        if (!every.evaluate(theta, r, jacobian, false, null)) {
            return null;
        }
        int rows = every.dataRows();
        double[][] columns = new double[p][];
        for (int j = 0; j < p; j++) {
            columns[j] = Arrays.copyOf(jacobian[j], rows);
        }
        return new QuadraticModel(theta.clone(), columns, Arrays.copyOf(r, rows), every.magnitudeRows());
    }

    /**
     * @return δ minimising ‖r + J·δ‖² + Σ((θ₀ + δ − μ)/σ)² over the hypothesis' active
     *         parameters, by QR of [J; diag(1/σ)], with its promised drop ‖Q₁ᵀb‖² (b the stacked
     *         residual, so that gᵀH⁻¹g = bᵀA(AᵀA)⁻¹Aᵀb); null when the stacked matrix is rank deficient
     */
    Step step(Prior[] priors, boolean[] active) {
        int p = theta.length;
        int rows = residuals.length;
        int[] index = activeIndex(active);
        int n = index.length;
        double[][] stacked = new double[n][rows + n];
        double[] b = new double[rows + n];
        System.arraycopy(residuals, 0, b, 0, rows);
        for (int c = 0; c < n; c++) {
            int j = index[c];
            double sigma = priors[j].standardDeviation();
            System.arraycopy(columns[j], 0, stacked[c], 0, rows);
            stacked[c][rows + c] = 1 / sigma;
            b[rows + c] = (theta[j] - priors[j].mean()) / sigma;
        }
        Optional<HouseholderQr> qr = HouseholderQr.ofColumns(stacked, rows + n);
        if (qr.isEmpty()) {
            return null;
        }
        double[] qtb = Arrays.copyOf(qr.get().transposedQTimes(b), n);
        double drop = 0;
        for (double v : qtb) {
            drop += v * v;
        }
        double[] solved = qr.get().backSubstitute(qtb);
        double[] delta = new double[p];
        for (int c = 0; c < n; c++) {
            delta[index[c]] = -solved[c];
        }
        return new Step(delta, drop);
    }

    private static int[] activeIndex(boolean[] active) {
        int n = 0;
        for (boolean a : active) {
            n += a ? 1 : 0;
        }
        int[] index = new int[n];
        int c = 0;
        for (int j = 0; j < active.length; j++) {
            if (active[j]) {
                index[c++] = j;
            }
        }
        return index;
    }

    /**
     * The MAP one step from θ₀ if the model is linear, with no evaluation of the board:
     * θ = θ₀ + δ, χ² = ‖r + Jδ‖² (gain rows apart), H = JᵀJ + Σp⁻¹ over the hypothesis'
     * parameters (through the QR of the stacked matrix). Exact for a model linear in θ; meant
     * for a step that promises a small drop, where the objective is near quadratic and the
     * step lands close to the MAP.
     *
     * @return the point, or null when its stacked matrix is rank deficient
     */
    MapPoint endOf(Step step, Prior[] priors, boolean[] active) {
        int p = theta.length;
        int rows = residuals.length;
        double[] end = theta.clone();
        double[] delta = step.delta;
        double[] moved = residuals.clone();
        double priorMisfit = 0;
        double[] sigma = new double[p];
        for (int a = 0; a < p; a++) {
            sigma[a] = priors[a].standardDeviation();
            if (!active[a]) {
                continue;
            }
            double[] column = columns[a];
            for (int k = 0; k < rows; k++) {
                moved[k] += column[k] * delta[a];
            }
            double z = (theta[a] + delta[a] - priors[a].mean()) / sigma[a];
            priorMisfit += z * z;
            end[a] += delta[a];
        }
        double data2 = 0;
        double gain2 = 0;
        for (int k = 0; k < rows; k++) {
            data2 += moved[k] * moved[k];
            if (k < magnitudeRows) {
                gain2 += moved[k] * moved[k];
            }
        }
        return MapPoint.of(end, data2, gain2, priorMisfit, columns, rows, magnitudeRows, sigma, active, true, 0);
    }
}

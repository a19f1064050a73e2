package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.linalg.Cholesky;

/**
 * The misfit's quadratic model at one point θ₀: JᵀJ and Jᵀr of the data rows, with the gain
 * rows' part kept apart, from one Jacobian with every parameter active. From it, any
 * hypothesis' Gauss–Newton step from θ₀ (its own priors and parameters) and the drop of ‖r‖² it
 * promises, and the MAP that step reaches if the model is quadratic (Nocedal and Wright,
 * Numerical Optimization, 2nd ed., 10.3). One Jacobian serves every hypothesis judged there:
 * the resistors from the no-fault MAP, the second faults from a single fault's MAP. Immutable.
 */
final class QuadraticModel {
    private final double[] theta;
    private final double[][] normal;
    private final double[] gradient;
    private final double[][] magnitudeNormal;
    private final double[] magnitudeGradient;

    /** A Gauss–Newton step δ and the drop of ‖r‖² it promises, gᵀ(JᵀJ + Σp⁻¹)⁻¹g. */
    static final class Step {
        final double[] delta;
        final double drop;

        Step(double[] delta, double drop) {
            this.delta = delta;
            this.drop = drop;
        }
    }

    private QuadraticModel(double[] theta, double[][] normal, double[] gradient, double[][] magnitudeNormal,
                           double[] magnitudeGradient) {
        this.theta = theta;
        this.normal = normal;
        this.gradient = gradient;
        this.magnitudeNormal = magnitudeNormal;
        this.magnitudeGradient = magnitudeGradient;
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
        int gainRows = every.magnitudeRows();
        double[][] normal = new double[p][p];
        double[] gradient = new double[p];
        double[][] magnitudeNormal = new double[p][p];
        double[] magnitudeGradient = new double[p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b <= a; b++) {
                double gain = dot(jacobian[a], jacobian[b], 0, gainRows);
                double all = gain + dot(jacobian[a], jacobian[b], gainRows, rows);
                magnitudeNormal[a][b] = gain;
                magnitudeNormal[b][a] = gain;
                normal[a][b] = all;
                normal[b][a] = all;
            }
            magnitudeGradient[a] = dot(jacobian[a], r, 0, gainRows);
            gradient[a] = magnitudeGradient[a] + dot(jacobian[a], r, gainRows, rows);
        }
        return new QuadraticModel(theta.clone(), normal, gradient, magnitudeNormal, magnitudeGradient);
    }

    private static double dot(double[] a, double[] b, int from, int to) {
        double sum = 0;
        for (int k = from; k < to; k++) {
            sum += a[k] * b[k];
        }
        return sum;
    }

    /**
     * @return δ = −(JᵀJ + Σp⁻¹)⁻¹·g over the hypothesis' active parameters at θ₀, with its
     *         promised drop; null when that normal matrix is singular
     */
    Step step(Prior[] priors, boolean[] active) {
        int p = theta.length;
        double[][] matrix = new double[p][p];
        double[] g = new double[p];
        for (int a = 0; a < p; a++) {
            if (!active[a]) {
                matrix[a][a] = 1;
                continue;
            }
            double sigma = priors[a].standardDeviation();
            for (int b = 0; b < p; b++) {
                matrix[a][b] = active[b] ? normal[a][b] : 0;
            }
            matrix[a][a] += 1 / (sigma * sigma);
            g[a] = gradient[a] + (theta[a] - priors[a].mean()) / (sigma * sigma);
        }
        Optional<Cholesky> factor = Cholesky.of(matrix);
        if (factor.isEmpty()) {
            return null;
        }
        double[] solved = factor.get().solve(g);
        double drop = 0;
        for (int a = 0; a < p; a++) {
            drop += g[a] * solved[a];
            solved[a] = -solved[a];
        }
        return new Step(solved, drop);
    }

    /**
     * The MAP one step from θ₀ if the model is quadratic, with no evaluation of the board:
     * θ = θ₀ + δ, χ² = ‖r + Jδ‖² (gain rows apart), H = JᵀJ + Σp⁻¹ over the hypothesis'
     * parameters. Exact for a model linear in θ; meant for a step that promises a small drop,
     * where the objective is near quadratic and the step lands close to the MAP.
     *
     * @param from the point this model was made at, for its χ² (at the same σ)
     * @return the point, or null when its Hessian is not positive definite
     */
    MapPoint endOf(Step step, Prior[] priors, boolean[] active, MapPoint from) {
        int p = theta.length;
        double[] end = theta.clone();
        double[] delta = step.delta;
        double data2 = from.dataChiSquared();
        double gain2 = from.magnitudeChiSquared();
        double[][] hessian = new double[p][p];
        double[][] gainHessian = new double[p][p];
        double priorMisfit = 0;
        for (int a = 0; a < p; a++) {
            if (!active[a]) {
                hessian[a][a] = 1;
                continue;
            }
            data2 += 2 * gradient[a] * delta[a];
            gain2 += 2 * magnitudeGradient[a] * delta[a];
            for (int b = 0; b < p; b++) {
                if (active[b]) {
                    data2 += delta[a] * normal[a][b] * delta[b];
                    gain2 += delta[a] * magnitudeNormal[a][b] * delta[b];
                    hessian[a][b] = normal[a][b];
                    gainHessian[a][b] = magnitudeNormal[a][b];
                }
            }
            double sigma = priors[a].standardDeviation();
            hessian[a][a] += 1 / (sigma * sigma);
            double z = (theta[a] + delta[a] - priors[a].mean()) / sigma;
            priorMisfit += z * z;
            end[a] += delta[a];
        }
        Optional<Cholesky> factor = Cholesky.of(hessian);
        if (factor.isEmpty() || !(data2 >= 0) || !(gain2 >= 0)) {
            return null;
        }
        return new MapPoint(end, data2, Math.min(gain2, data2), priorMisfit, hessian, gainHessian,
                factor.get().inverse(), factor.get().lnDeterminant(), active, true, 0);
    }
}

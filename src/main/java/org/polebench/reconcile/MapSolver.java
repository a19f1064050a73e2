package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.linalg.Cholesky;

/**
 * Levenberg–Marquardt on a {@link Misfit} (Marquardt, J. SIAM 11(2), 1963; Nocedal and Wright,
 * Numerical Optimization, 2nd ed., 10.3): the step solves (JᵀJ + λ·diag(JᵀJ))·δ = −Jᵀr, is
 * accepted when it lowers ‖r‖², and λ shrinks tenfold on success and grows tenfold on failure.
 * A step longer than {@value #MAX_STEP} on any log-scale parameter is shortened, because the
 * response is strongly nonlinear in ln C and a long Gauss–Newton step can leap over the mode
 * it was heading for. The prior rows keep JᵀJ positive definite. Stateless; per-call state is
 * in locals.
 */
final class MapSolver {
    static final double MAX_STEP = 1.0;
    private static final double INITIAL_LAMBDA = 1e-3;
    private static final double MAX_LAMBDA = 1e12;
    /**
     * A drop of ‖r‖² (χ² units) below which the search has converged: 1e-3 moves a log
     * evidence by 5e-4, far below any difference that changes a ranking.
     */
    private static final double COST_TOLERANCE = 1e-3;
    /** A step this small on every log-scale parameter has converged (1e-9 relative in value). */
    private static final double STEP_TOLERANCE = 1e-9;

    private final int maxIterations;

    MapSolver(int maxIterations) {
        this.maxIterations = maxIterations;
    }

    /** @return the MAP point, or empty when the model is undefined at the start */
    Optional<MapPoint> solve(Misfit misfit, double[] start) {
        return solve(misfit, start, null, true);
    }

    /**
     * @param free         which parameters move, the others staying at their start; null for all.
     *                     A held bias current needs no Jacobian column, so no reductions.
     * @param exactHessian false to skip the final exact evaluation: the point's Hessian is then
     *                     the last iteration's, with reused bias columns (for screening starts,
     *                     and for a phase whose end only starts another)
     * @return the point reached, its Hessian taken over every parameter
     */
    Optional<MapPoint> solve(Misfit misfit, double[] start, boolean[] free, boolean exactHessian) {
        int p = misfit.parameters();
        int rows = misfit.rows();
        boolean[] active = misfit.active();
        free = moving(free, active);
        double[] theta = start.clone();
        double[] r = new double[rows];
        double[][] jacobian = new double[p][rows];
        if (!misfit.evaluate(theta, r, jacobian, false, free)) {
            return Optional.empty();
        }
        double cost = squaredNorm(r);
        double lambda = INITIAL_LAMBDA;
        double[] trialR = new double[rows];
        double[][] trialJacobian = new double[p][rows];
        boolean converged = false;
        int iteration = 0;
        double[][] normal = new double[p][p];
        double[] gradient = new double[p];
        while (iteration < maxIterations && !converged) {
            iteration++;
            normalEquations(jacobian, r, free, normal, gradient);
            hold(free, normal, gradient);
            boolean accepted = false;
            while (!accepted && lambda <= MAX_LAMBDA) {
                double[][] damped = new double[p][p];
                for (int i = 0; i < p; i++) {
                    damped[i] = normal[i].clone();
                    damped[i][i] += lambda * normal[i][i];
                }
                Optional<Cholesky> factor = Cholesky.of(damped);
                if (factor.isEmpty()) {
                    lambda *= 10;
                    continue;
                }
                double[] step = factor.get().solve(gradient);
                double longest = 0;
                for (int j = 0; j < p; j++) {
                    step[j] = -step[j];
                    longest = Math.max(longest, Math.abs(step[j]));
                }
                if (longest > MAX_STEP) {
                    for (int j = 0; j < p; j++) {
                        step[j] *= MAX_STEP / longest;
                    }
                }
                double[] trial = new double[p];
                for (int j = 0; j < p; j++) {
                    trial[j] = theta[j] + step[j];
                }
                // the Jacobian comes with the trial: most trials are accepted, and one pass
                // through the frequencies for both costs less than two
                if (misfit.evaluate(trial, trialR, trialJacobian, false, free)) {
                    double trialCost = squaredNorm(trialR);
                    if (trialCost <= cost) {
                        accepted = true;
                        double drop = cost - trialCost;
                        theta = trial;
                        converged = drop <= COST_TOLERANCE || Math.min(longest, MAX_STEP) < STEP_TOLERANCE;
                        cost = trialCost;
                        lambda = Math.max(lambda / 10, 1e-12);
                        double[] swapR = r;
                        r = trialR;
                        trialR = swapR;
                        double[][] swapJ = jacobian;
                        jacobian = trialJacobian;
                        trialJacobian = swapJ;
                        continue;
                    }
                }
                lambda *= 10;
            }
            if (!accepted) {
                // no step lowers the cost at any damping: a minimum to working precision
                converged = true;
            }
        }
        // the Hessian for the covariance and the evidence: every column fresh and exact
        if (exactHessian && !misfit.evaluate(theta, r, jacobian, true, active)) {
            return Optional.empty();
        }
        normalEquations(jacobian, r, active, normal, gradient);
        hold(active, normal, gradient);
        Optional<Cholesky> factor = Cholesky.of(normal);
        if (factor.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of(new MapPoint(theta, misfit.dataChiSquared(r), misfit.magnitudeChiSquared(r),
                misfit.priorMisfit(r), normal, magnitudeNormal(jacobian, misfit.magnitudeRows(), active),
                factor.get().inverse(), factor.get().lnDeterminant(), active, converged, iteration));
    }

    // the parameters that move: free (all when null) and active
    private static boolean[] moving(boolean[] free, boolean[] active) {
        boolean[] moving = new boolean[active.length];
        for (int j = 0; j < active.length; j++) {
            moving[j] = active[j] && (free == null || free[j]);
        }
        return moving;
    }

    // JᵀJ and Jᵀr from the Jacobian's columns, each entry one contiguous dot product; the rows
    // and columns of held parameters are left zero, for hold() to finish
    private static void normalEquations(double[][] jacobian, double[] r, boolean[] free, double[][] normal,
                                        double[] gradient) {
        int p = gradient.length;
        for (int i = 0; i < p; i++) {
            boolean moves = free == null || free[i];
            double[] column = jacobian[i];
            gradient[i] = moves ? dot(column, r) : 0;
            for (int j = 0; j <= i; j++) {
                normal[i][j] = moves && (free == null || free[j]) ? dot(column, jacobian[j]) : 0;
                normal[j][i] = normal[i][j];
            }
        }
    }

    // JₘᵀJₘ over the gain rows [0, rows) of the active parameters: the gain part of the Hessian,
    // kept so that gain and phase σ can be rescaled apart
    private static double[][] magnitudeNormal(double[][] jacobian, int rows, boolean[] active) {
        int p = active.length;
        double[][] normal = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j <= i && active[i]; j++) {
                if (active[j]) {
                    double sum = 0;
                    double[] a = jacobian[i];
                    double[] b = jacobian[j];
                    for (int k = 0; k < rows; k++) {
                        sum += a[k] * b[k];
                    }
                    normal[i][j] = sum;
                    normal[j][i] = sum;
                }
            }
        }
        return normal;
    }

    // four partial sums: independent additions the processor can overlap
    private static double dot(double[] a, double[] b) {
        int n = a.length;
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int i = 0;
        for (; i + 3 < n; i += 4) {
            s0 += a[i] * b[i];
            s1 += a[i + 1] * b[i + 1];
            s2 += a[i + 2] * b[i + 2];
            s3 += a[i + 3] * b[i + 3];
        }
        for (; i < n; i++) {
            s0 += a[i] * b[i];
        }
        return (s0 + s1) + (s2 + s3);
    }

    /** @return the point θ itself with its exact Hessian, no search; empty where the model is undefined */
    Optional<MapPoint> at(Misfit misfit, double[] theta) {
        int p = misfit.parameters();
        boolean[] active = misfit.active();
        double[] r = new double[misfit.rows()];
        double[][] jacobian = new double[p][misfit.rows()];
        if (!misfit.evaluate(theta, r, jacobian, true, active)) {
            return Optional.empty();
        }
        double[][] normal = new double[p][p];
        double[] gradient = new double[p];
        normalEquations(jacobian, r, active, normal, gradient);
        hold(active, normal, gradient);
        Optional<Cholesky> factor = Cholesky.of(normal);
        if (factor.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of(new MapPoint(theta.clone(), misfit.dataChiSquared(r), misfit.magnitudeChiSquared(r),
                misfit.priorMisfit(r), normal, magnitudeNormal(jacobian, misfit.magnitudeRows(), active),
                factor.get().inverse(), factor.get().lnDeterminant(), active, false, 0));
    }

    // a held or inactive parameter gets a unit row and column and no gradient, so its step is 0
    // and its ln det contribution is 0
    private static void hold(boolean[] free, double[][] normal, double[] gradient) {
        for (int i = 0; i < free.length; i++) {
            if (free[i]) {
                continue;
            }
            gradient[i] = 0;
            for (int j = 0; j < free.length; j++) {
                normal[i][j] = 0;
                normal[j][i] = 0;
            }
            normal[i][i] = 1;
        }
    }

    private static double squaredNorm(double[] r) {
        double sum = 0;
        for (double v : r) {
            sum += v * v;
        }
        return sum;
    }
}

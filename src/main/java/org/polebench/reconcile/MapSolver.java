package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.linalg.HouseholderQr;

/**
 * Levenberg–Marquardt on a {@link Misfit} (Marquardt, J. SIAM 11(2), 1963; Nocedal and Wright,
 * Numerical Optimization, 2nd ed., 10.3): the step is the least-squares solution of
 * [J; √λ·D]·δ ≈ −[r; 0] with D = diag(‖J_j‖) (the same step as (JᵀJ + λ·diag(JᵀJ))·δ = −Jᵀr),
 * is accepted when it lowers ‖r‖², and λ shrinks tenfold on success and grows tenfold on
 * failure. The step comes from QR factors, never from the normal equations: J = Q·R once per
 * iteration, then for each λ the QR of the small [R; √λ·D] with right-hand side [Qᵀr; 0]
 * (Moré, "The Levenberg–Marquardt algorithm: implementation and theory", Lecture Notes in
 * Mathematics 630, 1978; docs/method.md, "Least squares by QR"). Forming JᵀJ squares the
 * condition number, and a long cascade's Jacobian (columns 1e9 apart) made it indefinite in
 * floating point. A step longer than {@value #MAX_STEP} on any log-scale parameter is
 * shortened, because the response is strongly nonlinear in ln C and a long Gauss–Newton step
 * can leap over the mode it was heading for. The prior rows keep J of full column rank.
 * Stateless; per-call state is in locals.
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
        while (iteration < maxIterations && !converged) {
            iteration++;
            Damping damping = Damping.of(jacobian, r, free);
            boolean accepted = damping == null;
            while (!accepted && lambda <= MAX_LAMBDA) {
                double[] step = damping.step(lambda);
                if (step == null) {
                    lambda *= 10;
                    continue;
                }
                double longest = 0;
                for (int j = 0; j < p; j++) {
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
            if (!accepted || damping == null) {
                // no step lowers the cost at any damping (or nothing moves): a minimum to
                // working precision
                converged = true;
            }
        }
        // the Hessian for the covariance and the evidence: every column fresh and exact
        if (exactHessian && !misfit.evaluate(theta, r, jacobian, true, active)) {
            return Optional.empty();
        }
        return Optional.ofNullable(point(misfit, theta, r, jacobian, active, converged, iteration));
    }

    private static MapPoint point(Misfit misfit, double[] theta, double[] r, double[][] jacobian, boolean[] active,
                                  boolean converged, int iterations) {
        double[] sigma = new double[theta.length];
        for (int j = 0; j < sigma.length; j++) {
            sigma[j] = misfit.prior(j).standardDeviation();
        }
        return MapPoint.of(theta, misfit.dataChiSquared(r), misfit.magnitudeChiSquared(r), misfit.priorMisfit(r),
                jacobian, misfit.dataRows(), misfit.magnitudeRows(), sigma, active, converged, iterations);
    }

    /**
     * One iteration's J = Q·R over the moving parameters, with c = the first entries of Qᵀr and
     * D = diag(‖J_j‖), from which each λ's step costs one QR of a 2n×n matrix.
     */
    private static final class Damping {
        private final int[] moving;
        private final int parameters;
        private final double[][] r;
        private final double[] c;
        private final double[] scale;

        private Damping(int[] moving, int parameters, double[][] r, double[] c, double[] scale) {
            this.moving = moving;
            this.parameters = parameters;
            this.r = r;
            this.c = c;
            this.scale = scale;
        }

        /** @return the factors, or null when nothing moves or J is rank deficient */
        static Damping of(double[][] jacobian, double[] residuals, boolean[] free) {
            int n = 0;
            for (boolean f : free) {
                n += f ? 1 : 0;
            }
            if (n == 0) {
                return null;
            }
            int[] moving = new int[n];
            double[][] columns = new double[n][];
            double[] scale = new double[n];
            int c = 0;
            for (int j = 0; j < free.length; j++) {
                if (free[j]) {
                    moving[c] = j;
                    columns[c] = jacobian[j];
                    scale[c] = Math.sqrt(dot(jacobian[j], jacobian[j]));
                    c++;
                }
            }
            Optional<HouseholderQr> qr = HouseholderQr.ofColumns(columns, residuals.length);
            if (qr.isEmpty()) {
                return null;
            }
            double[] qtr = java.util.Arrays.copyOf(qr.get().transposedQTimes(residuals), n);
            return new Damping(moving, free.length, qr.get().r(), qtr, scale);
        }

        /** @return δ over every parameter (0 for a held one), or null when [R; √λ·D] is rank deficient */
        double[] step(double lambda) {
            int n = moving.length;
            double root = Math.sqrt(lambda);
            double[][] columns = new double[n][2 * n];
            for (int j = 0; j < n; j++) {
                for (int i = 0; i <= j; i++) {
                    columns[j][i] = r[i][j];
                }
                columns[j][n + j] = root * scale[j];
            }
            Optional<HouseholderQr> qr = HouseholderQr.ofColumns(columns, 2 * n);
            if (qr.isEmpty()) {
                return null;
            }
            double[] rhs = new double[2 * n];
            for (int i = 0; i < n; i++) {
                rhs[i] = -c[i];
            }
            double[] solved = qr.get().solve(rhs);
            double[] step = new double[parameters];
            for (int j = 0; j < n; j++) {
                step[moving[j]] = solved[j];
            }
            return step;
        }
    }

    // the parameters that move: free (all when null) and active
    private static boolean[] moving(boolean[] free, boolean[] active) {
        boolean[] moving = new boolean[active.length];
        for (int j = 0; j < active.length; j++) {
            moving[j] = active[j] && (free == null || free[j]);
        }
        return moving;
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
        return Optional.ofNullable(point(misfit, theta.clone(), r, jacobian, active, false, 0));
    }

    private static double squaredNorm(double[] r) {
        double sum = 0;
        for (double v : r) {
            sum += v * v;
        }
        return sum;
    }
}

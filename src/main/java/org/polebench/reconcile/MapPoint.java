package org.polebench.reconcile;

import org.polebench.linalg.Cholesky;

/**
 * The maximum a posteriori point of one hypothesis, with what the Laplace approximation needs.
 * Arrays are owned by this object and copied out.
 */
final class MapPoint {
    private final double[] theta;
    private final double dataChiSquared;
    private final double magnitudeChiSquared;
    private final double priorMisfit;
    private final double[][] hessian;
    /** The part of the Hessian from the gain rows alone: JₘᵀJₘ. */
    private final double[][] magnitudeHessian;
    private final boolean[] active;
    private final double[][] covariance;
    private final double lnDetHessian;
    private final boolean converged;
    private final int iterations;

    MapPoint(double[] theta, double dataChiSquared, double magnitudeChiSquared, double priorMisfit,
             double[][] hessian, double[][] magnitudeHessian, double[][] covariance, double lnDetHessian,
             boolean[] active, boolean converged, int iterations) {
        this.theta = theta;
        this.dataChiSquared = dataChiSquared;
        this.magnitudeChiSquared = magnitudeChiSquared;
        this.priorMisfit = priorMisfit;
        this.hessian = hessian;
        this.magnitudeHessian = magnitudeHessian;
        this.active = active.clone();
        this.covariance = covariance;
        this.lnDetHessian = lnDetHessian;
        this.converged = converged;
        this.iterations = iterations;
    }

    /**
     * @return this point's objective, Hessian and covariance with every gain σ times
     *         {@code magnitudeScale} and every phase σ times {@code phaseScale}, at the same θ̂
     *         (the shift of the MAP is second order in the evidence):
     *         χ'² = χₘ²/sₘ² + χₚ²/sₚ², H' = Hₘ/sₘ² + Hₚ/sₚ² + Σp⁻¹, where Hₚ = H − Hₘ − Σp⁻¹
     */
    MapPoint withNoiseScales(double magnitudeScale, double phaseScale, Prior[] priors) {
        int p = theta.length;
        double[][] scaled = new double[p][p];
        double m2 = magnitudeScale * magnitudeScale;
        double p2 = phaseScale * phaseScale;
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                if (!active[i] || !active[j]) {
                    // an inactive parameter keeps its unit row and column
                    scaled[i][j] = hessian[i][j];
                    continue;
                }
                double priorCurvature = i == j ? 1 / (priors[i].standardDeviation() * priors[i].standardDeviation()) : 0;
                double phase = hessian[i][j] - magnitudeHessian[i][j] - priorCurvature;
                scaled[i][j] = magnitudeHessian[i][j] / m2 + phase / p2 + priorCurvature;
            }
        }
        Cholesky factor = Cholesky.of(scaled).orElseThrow(
                () -> new IllegalStateException("a rescaled posterior Hessian is not positive definite"));
        double phaseChiSquared = dataChiSquared - magnitudeChiSquared;
        return new MapPoint(theta, magnitudeChiSquared / m2 + phaseChiSquared / p2, magnitudeChiSquared / m2,
                priorMisfit, scaled, scaleCopy(magnitudeHessian, 1 / m2), factor.inverse(), factor.lnDeterminant(),
                active, converged, iterations);
    }

    private static double[][] scaleCopy(double[][] matrix, double factor) {
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < matrix.length; i++) {
            copy[i] = matrix[i].clone();
            for (int j = 0; j < copy[i].length; j++) {
                copy[i][j] *= factor;
            }
        }
        return copy;
    }

    /** @return Σ of the squared gain residuals at the MAP (at the misfit's σ and scale) */
    double magnitudeChiSquared() {
        return magnitudeChiSquared;
    }

    /** @return Σ of the squared phase residuals at the MAP; 0 for a magnitude-only sweep */
    double phaseChiSquared() {
        return dataChiSquared - magnitudeChiSquared;
    }

    /** @return whether parameter j belongs to this hypothesis (an inactive one sits at its prior mean) */
    boolean active(int j) {
        return active[j];
    }

    /**
     * @return the effective number of parameters the data fix, p_eff = Σ_active (1 − (H⁻¹)_jj/σ_j²):
     *         a parameter the prior alone decides counts 0, one the data pin counts 1 (the trace
     *         of the hat matrix of the linearised problem; Gelman et al., Bayesian Data Analysis,
     *         3rd ed., 2013, 7.2, from memory)
     */
    double effectiveParameters(Prior[] priors) {
        double sum = 0;
        for (int j = 0; j < theta.length; j++) {
            if (active[j]) {
                double sigma = priors[j].standardDeviation();
                sum += Math.max(0, 1 - covariance[j][j] / (sigma * sigma));
            }
        }
        return sum;
    }

    double[] theta() {
        return theta.clone();
    }

    double theta(int j) {
        return theta[j];
    }

    /** @return Σ of the squared data residuals at the MAP (at the misfit's σ and scale) */
    double dataChiSquared() {
        return dataChiSquared;
    }

    /** @return Σ((θ̂ − μ)/σ)² */
    double priorMisfit() {
        return priorMisfit;
    }

    /** @return −2·ln(posterior density) up to a constant: χ² + prior misfit */
    double objective() {
        return dataChiSquared + priorMisfit;
    }

    double covariance(int i, int j) {
        return covariance[i][j];
    }

    double[][] covariance() {
        double[][] copy = new double[covariance.length][];
        for (int i = 0; i < covariance.length; i++) {
            copy[i] = covariance[i].clone();
        }
        return copy;
    }

    double hessian(int i, int j) {
        return hessian[i][j];
    }

    /** @return ln det(JᵀJ + Σp⁻¹) */
    double lnDetHessian() {
        return lnDetHessian;
    }

    boolean converged() {
        return converged;
    }

    int iterations() {
        return iterations;
    }
}

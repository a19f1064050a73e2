package org.polebench.reconcile;

/**
 * The maximum a posteriori point of one hypothesis, with what the Laplace approximation needs.
 * Arrays are owned by this object and copied out.
 */
final class MapPoint {
    private final double[] theta;
    private final double dataChiSquared;
    private final double priorMisfit;
    private final double[][] hessian;
    private final double[][] covariance;
    private final double lnDetHessian;
    private final boolean converged;
    private final int iterations;

    MapPoint(double[] theta, double dataChiSquared, double priorMisfit, double[][] hessian, double[][] covariance,
             double lnDetHessian, boolean converged, int iterations) {
        this.theta = theta;
        this.dataChiSquared = dataChiSquared;
        this.priorMisfit = priorMisfit;
        this.hessian = hessian;
        this.covariance = covariance;
        this.lnDetHessian = lnDetHessian;
        this.converged = converged;
        this.iterations = iterations;
    }

    /**
     * @return this point's objective, Hessian and covariance with every data σ times
     *         {@code scale}, at the same θ̂ (the shift of the MAP is second order in the
     *         evidence): χ²/s², H' = (H − Σp⁻¹)/s² + Σp⁻¹
     */
    MapPoint withNoiseScale(double scale, Prior[] priors) {
        int p = theta.length;
        double[][] scaled = new double[p][p];
        double s2 = scale * scale;
        for (int i = 0; i < p; i++) {
            double priorCurvature = 1 / (priors[i].standardDeviation() * priors[i].standardDeviation());
            for (int j = 0; j < p; j++) {
                double data = hessian[i][j] - (i == j ? priorCurvature : 0);
                scaled[i][j] = data / s2 + (i == j ? priorCurvature : 0);
            }
        }
        Cholesky factor = Cholesky.of(scaled).orElseThrow(
                () -> new IllegalStateException("a rescaled posterior Hessian is not positive definite"));
        return new MapPoint(theta, dataChiSquared / s2, priorMisfit, scaled, factor.inverse(), factor.lnDeterminant(),
                converged, iterations);
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

package org.polebench.reconcile;

import org.polebench.linalg.HouseholderQr;

/**
 * The maximum a posteriori point of one hypothesis, with what the Laplace approximation needs.
 * Arrays are owned by this object and copied out.
 */
final class MapPoint {
    private final double[] theta;
    private final double dataChiSquared;
    private final double magnitudeChiSquared;
    private final double priorMisfit;
    /**
     * The weighted data rows of the Jacobian at θ̂, by parameter (null for an inactive one): the
     * gain rows [0, magnitudeRows), then the phase rows. With the prior rows diag(1/σ_j) under
     * them they are the stacked matrix whose QR gives the Hessian's inverse and determinant.
     */
    private final double[][] dataColumns;
    private final int magnitudeRows;
    /** The prior standard deviation of every parameter, as the Hessian's prior rows have it. */
    private final double[] priorSigma;
    private final boolean[] active;
    private final double[][] covariance;
    private final double lnDetHessian;
    private final boolean converged;
    private final int iterations;

    private MapPoint(double[] theta, double dataChiSquared, double magnitudeChiSquared, double priorMisfit,
                     double[][] dataColumns, int magnitudeRows, double[] priorSigma, boolean[] active,
                     double[][] covariance, double lnDetHessian, boolean converged, int iterations) {
        this.theta = theta;
        this.dataChiSquared = dataChiSquared;
        this.magnitudeChiSquared = magnitudeChiSquared;
        this.priorMisfit = priorMisfit;
        this.dataColumns = dataColumns;
        this.magnitudeRows = magnitudeRows;
        this.priorSigma = priorSigma;
        this.active = active.clone();
        this.covariance = covariance;
        this.lnDetHessian = lnDetHessian;
        this.converged = converged;
        this.iterations = iterations;
    }

    /**
     * The point, with its Laplace covariance H⁻¹ and ln det H for H = JᵀJ + Σp⁻¹ taken from the QR
     * factor of the stacked matrix [J; diag(1/σ)] over the active parameters (H = RᵀR, never
     * formed: docs/method.md, "Least squares by QR").
     *
     * @param columns       the Jacobian by parameter; rows [0, dataRows) are read
     * @param dataRows      the gain rows, then the phase rows
     * @param magnitudeRows the gain rows among them
     * @param priorSigma    σ_j of every parameter's prior row
     * @return the point, or null when the stacked matrix is rank deficient or not finite
     */
    static MapPoint of(double[] theta, double dataChiSquared, double magnitudeChiSquared, double priorMisfit,
                       double[][] columns, int dataRows, int magnitudeRows, double[] priorSigma, boolean[] active,
                       boolean converged, int iterations) {
        double[][] data = new double[theta.length][];
        for (int j = 0; j < theta.length; j++) {
            if (active[j]) {
                data[j] = java.util.Arrays.copyOf(columns[j], dataRows);
            }
        }
        Factor factor = factor(data, priorSigma, active, 1, 1, magnitudeRows);
        if (factor == null) {
            return null;
        }
        return new MapPoint(theta, dataChiSquared, magnitudeChiSquared, priorMisfit, data, magnitudeRows,
                priorSigma.clone(), active, factor.covariance, factor.lnDet, converged, iterations);
    }

    /** H⁻¹ over every parameter (an inactive one keeps a unit entry) and ln det H. */
    private static final class Factor {
        final double[][] covariance;
        final double lnDet;

        Factor(double[][] covariance, double lnDet) {
            this.covariance = covariance;
            this.lnDet = lnDet;
        }
    }

    // QR of [Jₘ/sₘ; Jₚ/sₚ; diag(1/σ)] over the active columns; an inactive parameter gets a unit
    // row and column in H (so H⁻¹ has 1 there and it adds nothing to ln det)
    private static Factor factor(double[][] data, double[] sigma, boolean[] active, double magnitudeFactor,
                                 double phaseFactor, int magnitudeRows) {
        int p = data.length;
        int kept = 0;
        int dataRows = 0;
        for (int j = 0; j < p; j++) {
            if (active[j]) {
                kept++;
                dataRows = data[j].length;
            }
        }
        int[] index = new int[kept];
        double[][] stacked = new double[kept][dataRows + kept];
        int c = 0;
        for (int j = 0; j < p; j++) {
            if (!active[j]) {
                continue;
            }
            index[c] = j;
            double[] column = stacked[c];
            for (int k = 0; k < dataRows; k++) {
                column[k] = data[j][k] * (k < magnitudeRows ? magnitudeFactor : phaseFactor);
            }
            column[dataRows + c] = 1 / sigma[j];
            c++;
        }
        double[][] covariance = new double[p][p];
        for (int j = 0; j < p; j++) {
            if (!active[j]) {
                covariance[j][j] = 1;
            }
        }
        if (kept == 0) {
            return new Factor(covariance, 0);
        }
        java.util.Optional<HouseholderQr> qr = HouseholderQr.ofColumns(stacked, dataRows + kept);
        if (qr.isEmpty()) {
            return null;
        }
        double[][] inverse = qr.get().gramInverse();
        for (int a = 0; a < kept; a++) {
            for (int b = 0; b < kept; b++) {
                covariance[index[a]][index[b]] = inverse[a][b];
            }
        }
        return new Factor(covariance, qr.get().lnDeterminantOfGram());
    }

    /**
     * @return this point's objective, Hessian and covariance with every gain σ times
     *         {@code magnitudeScale} and every phase σ times {@code phaseScale}, at the same θ̂
     *         (the shift of the MAP is second order in the evidence): χ'² = χₘ²/sₘ² + χₚ²/sₚ²,
     *         and H' from the QR of [Jₘ/sₘ; Jₚ/sₚ; diag(1/σ)]
     */
    MapPoint withNoiseScales(double magnitudeScale, double phaseScale) {
        Factor factor = factor(dataColumns, priorSigma, active, 1 / magnitudeScale, 1 / phaseScale, magnitudeRows);
        if (factor == null) {
            throw new IllegalStateException("a rescaled posterior Hessian is rank deficient");
        }
        double m2 = magnitudeScale * magnitudeScale;
        double p2 = phaseScale * phaseScale;
        double[][] scaled = new double[dataColumns.length][];
        for (int j = 0; j < dataColumns.length; j++) {
            if (dataColumns[j] != null) {
                scaled[j] = dataColumns[j].clone();
                for (int k = 0; k < scaled[j].length; k++) {
                    scaled[j][k] /= k < magnitudeRows ? magnitudeScale : phaseScale;
                }
            }
        }
        double phaseChiSquared = dataChiSquared - magnitudeChiSquared;
        return new MapPoint(theta, magnitudeChiSquared / m2 + phaseChiSquared / p2, magnitudeChiSquared / m2,
                priorMisfit, scaled, magnitudeRows, priorSigma, active, factor.covariance, factor.lnDet, converged,
                iterations);
    }

    /**
     * @return the posterior covariance at this MAP with the active parameters' prior rows
     *         1/σ_j in place of this hypothesis' own (for identifiability under the tolerance
     *         priors); null when that stacked matrix is rank deficient
     */
    double[][] covarianceWithPriors(double[] sigma) {
        Factor factor = factor(dataColumns, sigma, active, 1, 1, magnitudeRows);
        return factor == null ? null : factor.covariance;
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

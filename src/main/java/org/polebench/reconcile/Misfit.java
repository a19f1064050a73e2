package org.polebench.reconcile;

/**
 * The stacked, weighted residual vector of one hypothesis: the measured response against the
 * board model (real part ln|H_meas/H_model|/σ, then the wrapped imaginary part arg/σ, per point),
 * then one prior row (θ_j − μ_j)/σ_j per parameter. Minimising half its squared norm is the
 * MAP of a Gaussian likelihood with Gaussian priors. {@code noiseScale} multiplies every
 * data σ (a residual scale estimated from the best hypothesis; 1 to take the sweep's σ as
 * stated). One instance per task and thread: it keeps work arrays.
 */
final class Misfit {
    private final BoardModel model;
    private final MeasuredResponse measured;
    private final Prior[] priors;
    private final double noiseScale;
    private final double[] hr;
    private final double[] hi;
    private final double[][] dr;
    private final double[][] di;
    private double[] biasAtColumns;
    static final double BIAS_REFRESH = 0.03;

    Misfit(BoardModel model, MeasuredResponse measured, Prior[] priors, double noiseScale) {
        if (priors.length != model.parameterCount()) {
            throw new IllegalArgumentException("one prior per parameter");
        }
        this.model = model;
        this.measured = measured;
        this.priors = priors.clone();
        this.noiseScale = noiseScale;
        int n = measured.size();
        this.hr = new double[n];
        this.hi = new double[n];
        this.dr = new double[n][model.parameterCount()];
        this.di = new double[n][model.parameterCount()];
    }

    int parameters() {
        return priors.length;
    }

    int rows() {
        return measured.rows() + priors.length;
    }

    int dataRows() {
        return measured.rows();
    }

    Prior prior(int j) {
        return priors[j];
    }

    double noiseScale() {
        return noiseScale;
    }

    /**
     * @param residuals out, {@link #rows()} long
     * @param jacobian  out, or null: ∂residual/∂θ, rows × parameters
     * @return false where the model is undefined (singular network, H = 0)
     */
    boolean evaluate(double[] theta, double[] residuals, double[][] jacobian) {
        return evaluate(theta, residuals, jacobian, false);
    }

    /**
     * As {@link #evaluate(double[], double[], double[][])}; {@code exact} forces fresh bias
     * columns of the Jacobian, which are otherwise reused until the bias has moved by
     * {@value #BIAS_REFRESH} in ln I (they change slowly, and each costs a reduction).
     */
    boolean evaluate(double[] theta, double[] residuals, double[][] jacobian, boolean exact) {
        return evaluate(theta, residuals, jacobian, exact, true);
    }

    /** @param biasWanted false when the bias parameters are held, so their columns are not needed */
    boolean evaluate(double[] theta, double[] residuals, double[][] jacobian, boolean exact, boolean biasWanted) {
        int caps = model.capacitors().size();
        int m = model.transistors().size();
        boolean fresh = false;
        if (jacobian != null && m > 0 && biasWanted) {
            fresh = exact || biasAtColumns == null;
            for (int j = 0; !fresh && j < m; j++) {
                fresh = Math.abs(theta[caps + j] - biasAtColumns[j]) > BIAS_REFRESH;
            }
        }
        boolean ok = model.evaluate(theta, hr, hi, jacobian == null ? null : dr, jacobian == null ? null : di, fresh);
        if (!ok) {
            return false;
        }
        if (fresh) {
            biasAtColumns = java.util.Arrays.copyOfRange(theta, caps, caps + m);
        }
        int n = measured.size();
        int p = priors.length;
        int row = 0;
        for (int k = 0; k < n; k++) {
            double sigma = measured.sigmaMagnitude(k) * noiseScale;
            residuals[row] = (measured.lnMagnitude(k) - 0.5 * Math.log(hr[k] * hr[k] + hi[k] * hi[k])) / sigma;
            if (jacobian != null) {
                for (int j = 0; j < p; j++) {
                    jacobian[row][j] = -dr[k][j] / sigma;
                }
            }
            row++;
            if (measured.withPhase()) {
                double phaseSigma = measured.sigmaPhase(k) * noiseScale;
                residuals[row] = wrap(measured.phaseRad(k) - Math.atan2(hi[k], hr[k])) / phaseSigma;
                if (jacobian != null) {
                    for (int j = 0; j < p; j++) {
                        jacobian[row][j] = -di[k][j] / phaseSigma;
                    }
                }
                row++;
            }
        }
        for (int j = 0; j < p; j++) {
            residuals[row] = (theta[j] - priors[j].mean()) / priors[j].standardDeviation();
            if (jacobian != null) {
                java.util.Arrays.fill(jacobian[row], 0);
                jacobian[row][j] = 1 / priors[j].standardDeviation();
            }
            row++;
        }
        return true;
    }

    /** @return the data part of the squared residual norm, χ² at the model's σ times the scale */
    double dataChiSquared(double[] residuals) {
        double sum = 0;
        for (int r = 0; r < measured.rows(); r++) {
            sum += residuals[r] * residuals[r];
        }
        return sum;
    }

    /** @return the prior part, Σ((θ − μ)/σ)² */
    double priorMisfit(double[] residuals) {
        double sum = 0;
        for (int r = measured.rows(); r < residuals.length; r++) {
            sum += residuals[r] * residuals[r];
        }
        return sum;
    }

    private static double wrap(double radians) {
        double wrapped = Math.IEEEremainder(radians, 2 * Math.PI);
        return wrapped;
    }
}

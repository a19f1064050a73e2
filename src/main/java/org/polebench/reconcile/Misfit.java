package org.polebench.reconcile;

/**
 * The stacked, weighted residual vector of one hypothesis: the measured response against the
 * board model, the real parts ln|H_meas/H_model|/σ of every point, then the wrapped imaginary
 * parts arg(H_meas/H_model)/σ (with phase), then one prior row (θ_j − μ_j)/σ_j per parameter. Minimising half its squared norm is the
 * MAP of a Gaussian likelihood with Gaussian priors. {@code noiseScale} multiplies every
 * data σ (a residual scale estimated from the best hypothesis; 1 to take the sweep's σ as
 * stated). One instance per task and thread: it keeps work arrays.
 */
final class Misfit {
    private final BoardModel model;
    private final MeasuredResponse measured;
    private final Prior[] priors;
    private final double magnitudeScale;
    private final double phaseScale;
    /** Which parameters this hypothesis has; the others (resistors it does not free) stay at their means. */
    private final boolean[] active;
    private final double[] hr;
    private final double[] hi;
    private final double[][] dr;
    private final double[][] di;
    /** 1/σ per point (the stated σ times the scale): weights multiply, divisions are slow. */
    private final double[] magnitudeWeight;
    private final double[] phaseWeight;
    /** The measuring channels' couplings, after the board model's parameters; none for count 0. */
    private final ChannelCouplings couplings;
    private final double[] modelTheta;
    private final double[] omegas;
    private final double[] lnCoupling;
    private final double[] argCoupling;
    private final double[][] dLnCoupling;
    private final double[][] dArgCoupling;
    /** Per transistor, the bias at which its Jacobian column was last made; null before. */
    private final double[][] columnBias;
    static final double BIAS_REFRESH = 0.1;

    /**
     * @param active         which parameters the hypothesis has, or null for all; an inactive one
     *                       must start and stay at its prior mean, and gets no Jacobian column
     * @param magnitudeScale the factor on every gain σ (a variance component estimated from the
     *                       residuals; 1 to take the sweep's σ as stated)
     * @param phaseScale     the factor on every phase σ, likewise
     */
    Misfit(BoardModel model, MeasuredResponse measured, Prior[] priors, boolean[] active, double magnitudeScale,
           double phaseScale) {
        this(model, measured, priors, active, magnitudeScale, phaseScale,
                new ChannelCouplings(model.parameterCount(), new int[0]));
    }

    /** @param couplings the measuring channels' couplings, whose parameters follow the board model's */
    Misfit(BoardModel model, MeasuredResponse measured, Prior[] priors, boolean[] active, double magnitudeScale,
           double phaseScale, ChannelCouplings couplings) {
        if (priors.length != model.parameterCount() + couplings.count() || couplings.first() != model.parameterCount()) {
            throw new IllegalArgumentException("one prior per parameter");
        }
        this.couplings = couplings;
        this.modelTheta = new double[model.parameterCount()];
        int points = measured.size();
        this.omegas = new double[points];
        for (int k = 0; k < points; k++) {
            omegas[k] = 2 * Math.PI * measured.frequenciesHz()[k];
        }
        this.lnCoupling = new double[points];
        this.argCoupling = new double[points];
        this.dLnCoupling = new double[couplings.count()][points];
        this.dArgCoupling = new double[couplings.count()][points];
        this.model = model;
        this.measured = measured;
        this.priors = priors.clone();
        this.active = new boolean[priors.length];
        for (int j = 0; j < priors.length; j++) {
            this.active[j] = active == null || active[j];
        }
        this.magnitudeScale = magnitudeScale;
        this.phaseScale = phaseScale;
        int n = measured.size();
        this.hr = new double[n];
        this.hi = new double[n];
        this.dr = new double[model.parameterCount()][n];
        this.di = new double[model.parameterCount()][n];
        this.magnitudeWeight = new double[n];
        this.phaseWeight = new double[n];
        for (int k = 0; k < n; k++) {
            magnitudeWeight[k] = 1 / (measured.sigmaMagnitude(k) * magnitudeScale);
            phaseWeight[k] = measured.withPhase() ? 1 / (measured.sigmaPhase(k) * phaseScale) : 0;
        }
        this.columnBias = new double[model.board().size()][];
    }

    int responses() {
        return model.responses();
    }

    int reductions() {
        return model.reductions();
    }

    int parameters() {
        return priors.length;
    }

    int rows() {
        return measured.rows() + priors.length;
    }

    /** @return the gain rows, one per point, which come first */
    int magnitudeRows() {
        return measured.size();
    }

    int dataRows() {
        return measured.rows();
    }

    Prior prior(int j) {
        return priors[j];
    }

    double magnitudeScale() {
        return magnitudeScale;
    }

    double phaseScale() {
        return phaseScale;
    }

    /** @return which parameters this hypothesis has (a copy) */
    boolean[] active() {
        return active.clone();
    }

    boolean active(int j) {
        return active[j];
    }

    /** @return the squared weighted gain residuals, Σ over the points */
    double magnitudeChiSquared(double[] residuals) {
        double sum = 0;
        for (int r = 0; r < measured.size(); r++) {
            sum += residuals[r] * residuals[r];
        }
        return sum;
    }

    /**
     * @param residuals out, {@link #rows()} long
     * @param jacobian  out, or null: ∂residual/∂θ by columns, [parameter][row]
     * @param exact     true forces every active network column of the Jacobian fresh, and the
     *                  high band exact; otherwise a network column is reused until the network
     *                  parameters have moved by {@value #BIAS_REFRESH} in ln since it was made
     *                  (these columns change slowly, and each costs a reduction)
     * @param free      which parameters move, or null for all: a held network parameter needs no
     *                  column (unless {@code exact}); an inactive one never gets one
     * @return false where the model is undefined (singular network, H = 0)
     */
    boolean evaluate(double[] theta, double[] residuals, double[][] jacobian, boolean exact, boolean[] free) {
        int caps = model.capacitors().size();
        int m = model.board().size();
        boolean[] fresh = null;
        if (jacobian != null && m > 0) {
            for (int j = 0; j < m; j++) {
                boolean wanted = active[caps + j] && (exact || free == null || free[caps + j]);
                boolean stale = exact || columnBias[j] == null || moved(theta, caps, columnBias[j]);
                if (wanted && stale) {
                    if (fresh == null) {
                        fresh = new boolean[m];
                    }
                    fresh[j] = true;
                }
            }
        }
        System.arraycopy(theta, 0, modelTheta, 0, modelTheta.length);
        boolean ok = model.evaluate(modelTheta, hr, hi, jacobian == null ? null : dr, jacobian == null ? null : di,
                fresh, exact);
        if (!ok) {
            return false;
        }
        for (int j = 0; fresh != null && j < m; j++) {
            if (fresh[j]) {
                columnBias[j] = java.util.Arrays.copyOfRange(theta, caps, caps + m);
            }
        }
        int n = measured.size();
        int p = priors.length;
        int own = modelTheta.length;
        java.util.Arrays.fill(lnCoupling, 0);
        java.util.Arrays.fill(argCoupling, 0);
        if (couplings.count() > 0) {
            couplings.apply(theta, active, omegas, lnCoupling, argCoupling, jacobian == null ? null : dLnCoupling,
                    dArgCoupling);
        }
        for (int k = 0; k < n; k++) {
            residuals[k] = (measured.lnMagnitude(k) - 0.5 * Math.log(hr[k] * hr[k] + hi[k] * hi[k]) - lnCoupling[k])
                    * magnitudeWeight[k];
        }
        if (measured.withPhase()) {
            for (int k = 0; k < n; k++) {
                residuals[n + k] = wrap(measured.phaseRad(k) - Math.atan2(hi[k], hr[k]) - argCoupling[k])
                        * phaseWeight[k];
            }
        }
        int priorRow = measured.rows();
        for (int j = 0; j < p; j++) {
            residuals[priorRow + j] = (theta[j] - priors[j].mean()) / priors[j].standardDeviation();
        }
        if (jacobian == null) {
            return true;
        }
        for (int j = 0; j < p; j++) {
            double[] column = jacobian[j];
            double[] magnitude = j < own ? dr[j] : dLnCoupling[j - own];
            for (int k = 0; k < n; k++) {
                column[k] = -magnitude[k] * magnitudeWeight[k];
            }
            if (measured.withPhase()) {
                double[] phase = j < own ? di[j] : dArgCoupling[j - own];
                for (int k = 0; k < n; k++) {
                    column[n + k] = -phase[k] * phaseWeight[k];
                }
            }
            java.util.Arrays.fill(column, priorRow, priorRow + p, 0);
            column[priorRow + j] = 1 / priors[j].standardDeviation();
        }
        return true;
    }

    private static boolean moved(double[] theta, int caps, double[] at) {
        for (int j = 0; j < at.length; j++) {
            if (Math.abs(theta[caps + j] - at[j]) > BIAS_REFRESH) {
                return true;
            }
        }
        return false;
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

package org.polebench.reconcile;

/**
 * The measuring channels' AC couplings as factors on the modelled reading, for the bench
 * hypotheses: each coupling is a first-order high-pass jω/(jω + ω_c) on its channel's reading
 * (an RC coupling network, Horowitz and Hill, The Art of Electronics, 3rd ed., 1.7.1), on the
 * output channel's reading, or divided out of a ratio when it sits on the input channel. The
 * parameters are ln(f_c/1 Hz), placed after the board model's own; a coupling whose parameter
 * the hypothesis does not have is absent (DC coupling), not at its prior's mean.
 *
 * <p>In the log domain of {@link Misfit} the factor adds: ln B = s·(ln jω − ln(jω + ω_c)), with
 * s = +1 on the output and −1 on the input, and ∂ln B/∂ln ω_c = −s·ω_c/(jω + ω_c).
 */
final class ChannelCouplings {
    private final int first;
    private final int[] signs;

    /**
     * @param first the index of the first coupling parameter (the board model's parameter count)
     * @param signs +1 for an output-channel coupling, −1 for an input-channel one, in parameter order
     */
    ChannelCouplings(int first, int[] signs) {
        this.first = first;
        this.signs = signs.clone();
    }

    int first() {
        return first;
    }

    int count() {
        return signs.length;
    }

    /**
     * Adds the active couplings' ln|B| and arg B at each frequency, and writes their columns
     * ∂ln|B|/∂θ and ∂arg B/∂θ (zero for an inactive one).
     *
     * @param dMagnitude out, or null: [coupling][point]
     */
    void apply(double[] theta, boolean[] active, double[] omegas, double[] lnMagnitude, double[] phase,
               double[][] dMagnitude, double[][] dPhase) {
        for (int c = 0; c < signs.length; c++) {
            int j = first + c;
            if (dMagnitude != null) {
                java.util.Arrays.fill(dMagnitude[c], 0);
                java.util.Arrays.fill(dPhase[c], 0);
            }
            if (!active[j]) {
                continue;
            }
            double corner = 2 * Math.PI * Math.exp(theta[j]);
            double s = signs[c];
            for (int k = 0; k < omegas.length; k++) {
                double w = omegas[k];
                double size = w * w + corner * corner;
                // jω/(jω + ω_c): magnitude ω/√(ω² + ω_c²), phase π/2 − atan(ω/ω_c)
                lnMagnitude[k] += s * (Math.log(w) - 0.5 * Math.log(size));
                phase[k] += s * Math.atan2(corner, w);
                if (dMagnitude != null) {
                    dMagnitude[c][k] = -s * corner * corner / size;
                    dPhase[c][k] = s * corner * w / size;
                }
            }
        }
    }
}

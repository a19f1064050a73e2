package org.polebench.reconcile;

import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.units.Decibels;

/**
 * A sweep as the back-solve reads it: ln|H| in nepers and arg H in radians per point, with
 * their standard uncertainties. Residuals are complex logarithms, so a 1 dB error (0.115 Np)
 * weighs as a 6.6° one (0.115 rad) and no phase unwrapping is needed (docs/method.md,
 * "Fitting"); σ of ln|H| in nepers is 0.1151 × σ in dB (ln 10/20).
 */
final class MeasuredResponse {
    private final double[] frequenciesHz;
    private final double[] lnMagnitude;
    private final double[] phaseRad;
    private final double[] sigmaMagnitude;
    private final double[] sigmaPhase;
    private final boolean withPhase;
    private final boolean stated;
    /** Points whose σ the model's own rounding error dominates ({@link #withModelError}). */
    private final int modelLimited;

    /**
     * @param defaultGainDb  σ of the gain where the sweep states none, in dB, positive
     * @param defaultPhaseDeg σ of the phase where the sweep states none, in degrees, positive
     */
    MeasuredResponse(Sweep sweep, double defaultGainDb, double defaultPhaseDeg) {
        int n = sweep.size();
        this.withPhase = sweep.hasPhase();
        this.frequenciesHz = new double[n];
        this.lnMagnitude = new double[n];
        this.phaseRad = new double[n];
        this.sigmaMagnitude = new double[n];
        this.sigmaPhase = new double[n];
        boolean allStated = true;
        for (int i = 0; i < n; i++) {
            SweepPoint point = sweep.points().get(i);
            frequenciesHz[i] = point.frequencyHz();
            lnMagnitude[i] = Decibels.toNepers(point.gainDb());
            double gainSigma = point.gainUncertaintyDb().orElse(defaultGainDb);
            // a stated zero uncertainty would give infinite weight: take the default instead
            sigmaMagnitude[i] = Decibels.toNepers(gainSigma > 0 ? gainSigma : defaultGainDb);
            allStated &= point.gainUncertaintyDb().orElse(0) > 0;
            if (withPhase) {
                phaseRad[i] = Math.toRadians(point.phaseDeg().getAsDouble());
                double phaseSigma = point.phaseUncertaintyDeg().orElse(defaultPhaseDeg);
                sigmaPhase[i] = Math.toRadians(phaseSigma > 0 ? phaseSigma : defaultPhaseDeg);
                allStated &= point.phaseUncertaintyDeg().orElse(0) > 0;
            }
        }
        this.stated = allStated;
        this.modelLimited = 0;
    }

    private MeasuredResponse(MeasuredResponse from, double[] sigmaMagnitude, double[] sigmaPhase, int modelLimited) {
        this.frequenciesHz = from.frequenciesHz;
        this.lnMagnitude = from.lnMagnitude;
        this.phaseRad = from.phaseRad;
        this.withPhase = from.withPhase;
        this.stated = from.stated;
        this.sigmaMagnitude = sigmaMagnitude;
        this.sigmaPhase = sigmaPhase;
        this.modelLimited = modelLimited;
    }

    /**
     * @param relativeError per point, the relative error ε with which the board model can
     *                      compute H there (a relative error ε of H is about ε in ln|H| and in
     *                      arg H, in nepers and radians)
     * @return the same sweep with every σ widened to √(σ² + ε²): the model's error added in
     *         quadrature as an uncertainty of its own (GUM, JCGM 100:2008, 5.1.2), so that a
     *         point the model cannot compute to its measurement's precision weighs as little as
     *         that precision deserves (docs/method.md, "Least squares by QR")
     */
    MeasuredResponse withModelError(double[] relativeError) {
        int n = size();
        double[] magnitude = new double[n];
        double[] phase = new double[n];
        int limited = 0;
        for (int i = 0; i < n; i++) {
            double e = relativeError[i];
            magnitude[i] = Math.hypot(sigmaMagnitude[i], e);
            phase[i] = withPhase ? Math.hypot(sigmaPhase[i], e) : sigmaPhase[i];
            if (e > sigmaMagnitude[i]) {
                limited++;
            }
        }
        return new MeasuredResponse(this, magnitude, phase, limited);
    }

    /** @return how many points the model computes less precisely than they were measured */
    int modelLimited() {
        return modelLimited;
    }

    /** @return whether every point stated its own σ (gain, and phase where measured) */
    boolean stated() {
        return stated;
    }

    int size() {
        return frequenciesHz.length;
    }

    boolean withPhase() {
        return withPhase;
    }

    /** @return residual rows: one per point, two with phase */
    int rows() {
        return withPhase ? 2 * size() : size();
    }

    double[] frequenciesHz() {
        return frequenciesHz.clone();
    }

    double lnMagnitude(int i) {
        return lnMagnitude[i];
    }

    double phaseRad(int i) {
        return phaseRad[i];
    }

    double sigmaMagnitude(int i) {
        return sigmaMagnitude[i];
    }

    double sigmaPhase(int i) {
        return sigmaPhase[i];
    }
}

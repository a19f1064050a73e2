package org.polebench.fit;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.polebench.InputProblem;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.units.Decibels;

/**
 * The points of a sweep that a fit uses, in the units the fit works in: frequency normalised by
 * the reference f_ref (geometric mean of the fitted band, so normalised frequencies straddle 1),
 * gain in nepers, phase in radians, and each point's standard uncertainty in the same units
 * (σ in Np = 0.1151 × σ in dB; σ in rad = σ° × π/180). Arrays are owned and never exposed.
 */
final class PreparedSweep {
    final double referenceHz;
    final double[] frequencyHz;
    final double[] x;
    /** ln x per point. */
    final double[] lnX;
    /**
     * The measured response per point as the linearised estimate takes it: H = |H|·e^{jφ} (real
     * and imaginary parts) with phase, |H|² (in {@code responseRe}) without.
     */
    final double[] responseRe;
    final double[] responseIm;
    final double[] lnGain;
    final double[] phaseRad;
    final double[] sigmaGain;
    final double[] sigmaPhase;
    final int[] sweepIndex;
    final boolean hasPhase;
    final boolean uncertaintiesStated;
    /** The instrument's calibration error common to every point (a flat gain and phase term). */
    final CalibrationTerm calibration;

    private PreparedSweep(double referenceHz, double[] frequencyHz, double[] lnGain, double[] phaseRad,
                          double[] sigmaGain, double[] sigmaPhase, int[] sweepIndex, boolean hasPhase,
                          boolean uncertaintiesStated, CalibrationTerm calibration) {
        this.referenceHz = referenceHz;
        this.frequencyHz = frequencyHz;
        this.lnGain = lnGain;
        this.phaseRad = phaseRad;
        this.sigmaGain = sigmaGain;
        this.sigmaPhase = sigmaPhase;
        this.sweepIndex = sweepIndex;
        this.hasPhase = hasPhase;
        this.uncertaintiesStated = uncertaintiesStated;
        this.calibration = calibration;
        this.x = new double[frequencyHz.length];
        this.lnX = new double[frequencyHz.length];
        this.responseRe = new double[frequencyHz.length];
        this.responseIm = new double[frequencyHz.length];
        for (int k = 0; k < x.length; k++) {
            x[k] = frequencyHz[k] / referenceHz;
            lnX[k] = Math.log(x[k]);
            if (hasPhase) {
                double magnitude = Math.exp(lnGain[k]);
                responseRe[k] = magnitude * Math.cos(phaseRad[k]);
                responseIm[k] = magnitude * Math.sin(phaseRad[k]);
            } else {
                responseRe[k] = Math.exp(2 * lnGain[k]);
            }
        }
    }

    /**
     * Takes the points inside the settings' band.
     *
     * @throws InputProblem when the band holds fewer than three points or a point states a
     *                      non-positive uncertainty
     */
    static PreparedSweep of(Sweep sweep, FitSettings settings) throws InputProblem {
        Path file = sweep.source().sourceFile().orElse(null);
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < sweep.size(); i++) {
            double f = sweep.points().get(i).frequencyHz();
            if (settings.band().isEmpty() || settings.band().get().contains(f)) {
                kept.add(i);
            }
        }
        if (kept.size() < 3) {
            String where = settings.band().map(b -> " inside " + b.lowHz() + " to " + b.highHz() + " Hz").orElse("");
            throw new InputProblem(file, 0, "the sweep has " + kept.size() + " point(s)" + where
                    + "; a fit needs at least three", "widen the band (--band F1:F2) or sweep more points");
        }
        int n = kept.size();
        double[] f = new double[n];
        double[] lnGain = new double[n];
        double[] phase = new double[n];
        double[] sg = new double[n];
        double[] sp = new double[n];
        int[] index = new int[n];
        boolean stated = true;
        for (int k = 0; k < n; k++) {
            SweepPoint point = sweep.points().get(kept.get(k));
            index[k] = kept.get(k);
            f[k] = point.frequencyHz();
            lnGain[k] = Decibels.toNepers(point.gainDb());
            phase[k] = point.phaseDeg().isPresent() ? Math.toRadians(point.phaseDeg().getAsDouble()) : 0;
            double gainU = point.gainUncertaintyDb().orElse(settings.defaultGainUncertaintyDb());
            double phaseU = point.phaseUncertaintyDeg().orElse(settings.defaultPhaseUncertaintyDeg());
            if (!(gainU > 0) || !(phaseU > 0) || !Double.isFinite(gainU) || !Double.isFinite(phaseU)) {
                throw new InputProblem(file, 0, "the point at " + f[k] + " Hz states a standard uncertainty of "
                        + gainU + " dB / " + phaseU + "°; a fit needs positive, finite ones",
                        "give the instrument's real uncertainty or leave it out to use the default");
            }
            stated &= point.gainUncertaintyDb().isPresent()
                    && (!point.hasPhase() || point.phaseUncertaintyDeg().isPresent());
            sg[k] = Decibels.toNepers(gainU);
            sp[k] = Math.toRadians(phaseU);
        }
        double referenceHz = Math.sqrt(f[0] * f[n - 1]);
        return new PreparedSweep(referenceHz, f, lnGain, phase, sg, sp, index, sweep.hasPhase(), stated,
                CalibrationTerm.of(sweep));
    }

    /** The same points less those marked, with the same reference frequency. */
    PreparedSweep without(boolean[] dropped) {
        int n = 0;
        for (boolean d : dropped) {
            n += d ? 0 : 1;
        }
        double[] f = new double[n];
        double[] g = new double[n];
        double[] p = new double[n];
        double[] sg = new double[n];
        double[] sp = new double[n];
        int[] index = new int[n];
        int j = 0;
        for (int k = 0; k < size(); k++) {
            if (!dropped[k]) {
                f[j] = frequencyHz[k];
                g[j] = lnGain[k];
                p[j] = phaseRad[k];
                sg[j] = sigmaGain[k];
                sp[j] = sigmaPhase[k];
                index[j] = sweepIndex[k];
                j++;
            }
        }
        return new PreparedSweep(referenceHz, f, g, p, sg, sp, index, hasPhase, uncertaintiesStated, calibration);
    }

    int size() {
        return frequencyHz.length;
    }

    /** Real residuals per fit: two per point with phase (gain and phase), one without. */
    int residualCount() {
        return hasPhase ? 2 * size() : size();
    }

    double lowestHz() {
        return frequencyHz[0];
    }

    double highestHz() {
        return frequencyHz[size() - 1];
    }
}

package org.polebench.fit;

import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.apache.commons.math3.complex.Complex;

/**
 * What a {@link SweepFitter} may try and what it assumes.
 *
 * @param maxPoles                  most low-band poles tried by the order selection (default 4; the
 *                                  number of low-band capacitors when a stage is known)
 * @param poleCount                 when present, exactly this many low-band poles (no order selection
 *                                  over the pole count)
 * @param dcZeros                   when present, exactly this many zeros at s = 0 (coupling capacitors
 *                                  in the signal path); otherwise every count from 0 to the pole count
 *                                  is tried
 * @param band                      when present, only points inside it are fitted
 * @param startPolesRadPerS         predicted poles in rad/s (left half-plane; a complex pole with its
 *                                  conjugate), used as the starting point of every candidate with that
 *                                  many low-band poles; empty for a start from the data alone
 * @param loss                      robust loss of the outlier screen, or {@link RobustLoss#NONE}
 * @param outlierThreshold          a point whose gain or phase residual exceeds this many standard
 *                                  uncertainties (or robust scales, when larger) is dropped
 * @param defaultGainUncertaintyDb  standard uncertainty of a point's gain when the sweep states none
 * @param defaultPhaseUncertaintyDeg standard uncertainty of a point's phase when the sweep states none
 * @param highBandPole              whether one high-band pole may join the model
 */
public record FitSettings(int maxPoles, OptionalInt poleCount, OptionalInt dcZeros, Optional<FitBand> band,
                          List<Complex> startPolesRadPerS, RobustLoss loss, double outlierThreshold,
                          double defaultGainUncertaintyDb, double defaultPhaseUncertaintyDeg,
                          HighBandPole highBandPole) {

    /** Default most low-band poles: four covers two coupling capacitors, a bypass and one spare. */
    public static final int DEFAULT_MAX_POLES = 4;
    /** Default gain uncertainty per point, dB: a typical audio analyser's flatness (common practice). */
    public static final double DEFAULT_GAIN_UNCERTAINTY_DB = 0.05;
    /** Default phase uncertainty per point, degrees (common practice for a two-channel analyser). */
    public static final double DEFAULT_PHASE_UNCERTAINTY_DEG = 0.5;
    /**
     * Default outlier threshold in standard uncertainties: a normal residual exceeds 4.5 σ with
     * probability 7·10⁻⁶, so a clean 100-point sweep loses a point about once in 700 fits.
     */
    public static final double DEFAULT_OUTLIER_THRESHOLD = 4.5;

    public FitSettings {
        startPolesRadPerS = List.copyOf(startPolesRadPerS);
        if (maxPoles < 0 || maxPoles > 8) {
            throw new IllegalArgumentException("max poles must be 0 to 8, was " + maxPoles);
        }
        if (poleCount.isPresent() && (poleCount.getAsInt() < 0 || poleCount.getAsInt() > 8)) {
            throw new IllegalArgumentException("pole count must be 0 to 8, was " + poleCount.getAsInt());
        }
        if (dcZeros.isPresent() && dcZeros.getAsInt() < 0) {
            throw new IllegalArgumentException("DC zero count must not be negative");
        }
        if (!(outlierThreshold > 1)) {
            throw new IllegalArgumentException("outlier threshold must exceed 1, was " + outlierThreshold);
        }
        if (!(defaultGainUncertaintyDb > 0) || !(defaultPhaseUncertaintyDeg > 0)) {
            throw new IllegalArgumentException("default point uncertainties must be positive");
        }
        for (Complex pole : startPolesRadPerS) {
            if (!(pole.getReal() < 0)) {
                throw new IllegalArgumentException("a starting pole must lie in the left half-plane, was " + pole);
            }
        }
    }

    /** Order selection up to four poles, DC zeros free, Huber screen, 0.05 dB and 0.5° per point. */
    public static FitSettings defaults() {
        return new FitSettings(DEFAULT_MAX_POLES, OptionalInt.empty(), OptionalInt.empty(), Optional.empty(),
                List.of(), RobustLoss.HUBER, DEFAULT_OUTLIER_THRESHOLD, DEFAULT_GAIN_UNCERTAINTY_DB,
                DEFAULT_PHASE_UNCERTAINTY_DEG, HighBandPole.DETECT);
    }

    public FitSettings withMaxPoles(int poles) {
        return new FitSettings(poles, poleCount, dcZeros, band, startPolesRadPerS, loss, outlierThreshold,
                defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    /** Fixes the number of low-band poles (and raises the maximum to it). */
    public FitSettings withPoleCount(int poles) {
        return new FitSettings(Math.max(poles, maxPoles), OptionalInt.of(poles), dcZeros, band, startPolesRadPerS,
                loss, outlierThreshold, defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withDcZeros(int zeros) {
        return new FitSettings(maxPoles, poleCount, OptionalInt.of(zeros), band, startPolesRadPerS, loss,
                outlierThreshold, defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withBand(FitBand fitBand) {
        return new FitSettings(maxPoles, poleCount, dcZeros, Optional.of(fitBand), startPolesRadPerS, loss,
                outlierThreshold, defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withStartPoles(List<Complex> polesRadPerS) {
        return new FitSettings(maxPoles, poleCount, dcZeros, band, polesRadPerS, loss, outlierThreshold,
                defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withLoss(RobustLoss robustLoss) {
        return new FitSettings(maxPoles, poleCount, dcZeros, band, startPolesRadPerS, robustLoss, outlierThreshold,
                defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withOutlierThreshold(double standardUncertainties) {
        return new FitSettings(maxPoles, poleCount, dcZeros, band, startPolesRadPerS, loss, standardUncertainties,
                defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, highBandPole);
    }

    public FitSettings withDefaultUncertainties(double gainDb, double phaseDeg) {
        return new FitSettings(maxPoles, poleCount, dcZeros, band, startPolesRadPerS, loss, outlierThreshold,
                gainDb, phaseDeg, highBandPole);
    }

    public FitSettings withHighBandPole(HighBandPole rule) {
        return new FitSettings(maxPoles, poleCount, dcZeros, band, startPolesRadPerS, loss, outlierThreshold,
                defaultGainUncertaintyDb, defaultPhaseUncertaintyDeg, rule);
    }
}

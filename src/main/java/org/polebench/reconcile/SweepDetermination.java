package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.fit.FitBand;
import org.polebench.fit.FitResult;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootStatus;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Whether the sweep itself determines each quantity a limit holds (issue 11, "Verdicts only from
 * what the sweep shows"; docs/method.md, "The verdict"). The rules, each of which needs a fit
 * that describes the sweep (χ²/ν at most {@link Reconciler#FIT_ADEQUATE_CHI_SQUARE}):
 * <ul>
 * <li><b>Lower corner</b>: the fit quotes it (its model's exact −3 dB corner, or the −3 dB point
 *     read between measured points) and the lowest fitted frequency lies below it, so the −3 dB
 *     point is bracketed by data. A corner the fit extrapolates below the sweep, and a corner
 *     only the back-solved stage model gives, are not decided.</li>
 * <li><b>Midband gain</b>: at least one fitted point lies on the midband plateau, at or above
 *     {@link #MIDBAND_CLEARANCE} times the fit's lower corner and, when the fit has a high-band
 *     pole, at or below a {@code MIDBAND_CLEARANCE}-th of it. A fit that quotes no lower corner
 *     puts it more than a decade below the band (or has none), so every point clears it.</li>
 * <li><b>Upper corner</b>: a fitted high-band pole (status {@link RootStatus#FITTED}) at or below
 *     the highest fitted frequency; one above the last point is the fit's extrapolation.</li>
 * </ul>
 * Stateless.
 */
public final class SweepDetermination {
    /**
     * How far a swept point must lie from a corner to count as midband: a factor of 10 leaves a
     * one-pole corner 10·log10(1 + 1/100) = 0.043 dB below the plateau (closed form of a
     * first-order response), about the size of a bench point's noise.
     */
    public static final double MIDBAND_CLEARANCE = 10;

    /**
     * @param adequate whether the fit describes the sweep
     * @param fromFit  whether the corner is the fit's (else the back-solved stage model's)
     * @param cornerHz the corner, Hz
     * @param fitted   the band the fit used
     * @return empty when the sweep determines the lower corner, else why not
     */
    public Optional<NotDecided> lowerCorner(boolean adequate, boolean fromFit, double cornerHz, FitBand fitted) {
        if (!adequate) {
            return Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP);
        }
        if (!fromFit) {
            return Optional.of(NotDecided.FROM_MODEL_ONLY);
        }
        if (!(fitted.lowHz() < cornerHz)) {
            return Optional.of(NotDecided.OUTSIDE_SWEPT_BAND);
        }
        return Optional.empty();
    }

    /**
     * @param adequate      whether the fit describes the sweep
     * @param lowerCornerHz the fit's lower corner, Hz; empty when it quotes none
     * @param upperCornerHz the fit's high-band pole, Hz; empty when it has none
     * @param fitted        the band the fit used
     * @param sweptHz       the swept frequencies, Hz (those outside {@code fitted} are ignored)
     * @return empty when the sweep determines the midband gain, else why not
     */
    public Optional<NotDecided> midbandGain(boolean adequate, OptionalDouble lowerCornerHz,
                                            OptionalDouble upperCornerHz, FitBand fitted, List<Double> sweptHz) {
        if (!adequate) {
            return Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP);
        }
        double from = lowerCornerHz.isPresent() ? MIDBAND_CLEARANCE * lowerCornerHz.getAsDouble() : 0;
        double to = upperCornerHz.isPresent() ? upperCornerHz.getAsDouble() / MIDBAND_CLEARANCE
                : Double.POSITIVE_INFINITY;
        for (double f : sweptHz) {
            if (fitted.contains(f) && f >= from && f <= to) {
                return Optional.empty();
            }
        }
        return Optional.of(NotDecided.MIDBAND_NOT_REACHED);
    }

    /**
     * @param adequate whether the fit describes the sweep
     * @param pole     the fit's high-band pole; empty when it has none
     * @param fitted   the band the fit used
     * @return empty when the sweep determines the upper corner, else why not
     */
    public Optional<NotDecided> upperCorner(boolean adequate, Optional<FittedRoot> pole, FitBand fitted) {
        if (!adequate) {
            return Optional.of(NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP);
        }
        if (pole.isEmpty() || pole.get().status() != RootStatus.FITTED
                || !(pole.get().magnitudeHz() <= fitted.highHz())) {
            return Optional.of(NotDecided.OUTSIDE_SWEPT_BAND);
        }
        return Optional.empty();
    }

    /** @return the fit's high-band pole ("ph"), if it has one */
    public static Optional<FittedRoot> highBandPole(FitResult fit) {
        for (FittedRoot pole : fit.poles()) {
            if (pole.label().equals("ph")) {
                return Optional.of(pole);
            }
        }
        return Optional.empty();
    }

    /** @return the fit's lower corner, Hz: its model's exact corner, else the data's; empty when it quotes neither */
    public static OptionalDouble fitLowerCornerHz(FitResult fit) {
        if (fit.lowerCornerModelHz().isPresent()) {
            return OptionalDouble.of(fit.lowerCornerModelHz().get().value());
        }
        return fit.lowerCornerDataHz().isPresent() ? OptionalDouble.of(fit.lowerCornerDataHz().get().value())
                : OptionalDouble.empty();
    }

    /** @return the sweep's frequencies, Hz, in its order */
    public static List<Double> frequencies(Sweep sweep) {
        return sweep.points().stream().map(SweepPoint::frequencyHz).toList();
    }
}

package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.fit.Estimate;

/**
 * The stage as designed beside the board as measured (issue 5, item 1).
 *
 * @param predictedMidbandGainDb   20·log10|D| of the nominal stage, dB
 * @param measuredMidbandGainDb    the fit's midband gain, dB, with uncertainty
 * @param sctcLowerCornerHz        the SCTC estimate, Hz
 * @param exactLowerCornerHz       the exact −3 dB corner of the nominal stage, Hz; empty if none
 * @param measuredLowerCornerHz    the fit's lower corner with uncertainty; empty when it quotes none
 * @param cornerPercentile         the fraction of the tolerance spread's corners at or below the
 *                                 corner the verdict uses; empty without one or without a spread
 * @param insideDesignSpread       the percentile lies within the central 95 % (2.5 % to 97.5 %)
 * @param roots                    poles then zeros, each predicted root beside its nearest measured one
 * @param backSolvedMidbandGainDb  the midband gain of the stage's model at the back-solve's MAP, dB
 * @param backSolvedLowerCornerHz  that model's exact lower corner, Hz
 * @param fitAdequate              whether the rational fit describes the sweep (χ²/ν at most
 *                                 {@link Reconciler#FIT_ADEQUATE_CHI_SQUARE}); when not, the
 *                                 verdict shows the back-solved values and decides no limit
 *                                 from them
 */
public record SideBySide(double predictedMidbandGainDb, Estimate measuredMidbandGainDb, double sctcLowerCornerHz,
                         OptionalDouble exactLowerCornerHz, Optional<Estimate> measuredLowerCornerHz,
                         OptionalDouble cornerPercentile, boolean insideDesignSpread, List<RootMatch> roots,
                         Optional<Estimate> backSolvedMidbandGainDb, Optional<Estimate> backSolvedLowerCornerHz,
                         boolean fitAdequate) {
    /** Lower edge of the central 95 % of the design spread. */
    public static final double SPREAD_LOW = 0.025;
    /** Upper edge of the central 95 % of the design spread. */
    public static final double SPREAD_HIGH = 0.975;

    public SideBySide {
        roots = List.copyOf(roots);
    }
}

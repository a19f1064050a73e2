package org.polebench.reconcile;

import java.util.List;
import java.util.OptionalDouble;

/**
 * Whether the most probable hypothesis explains the sweep (docs/method.md, "Does the stage explain the sweep?"), and
 * the evidence either way. The thresholds and how they were set are in {@link AdequacyTest}.
 *
 * @param explained          false when any finding below says the model does not describe the
 *                           sweep; the probabilities are then relative among hypotheses that
 *                           do not explain it
 * @param looksLikeStage     false when the sweep is far from any board of this stage (every
 *                           hypothesis far off, or a midband or corner far outside the
 *                           tolerance spread)
 * @param chiSquared         Σ r² of the best hypothesis at the stated σ (or the defaults)
 * @param degreesOfFreedom   ν = N − k, N the real residuals, k the parameters the data fix
 * @param pValue             P(χ²_ν ≥ χ²) where the points state their σ; otherwise the free-fit
 *                           comparison's p; empty when neither applies
 * @param basis              which of the two {@code pValue} is
 * @param freeFitRatio       (χ²/ν of the stage model) over (χ²/ν of the free rational fit), both
 *                           at the same point weights over the points the fit used
 * @param freeFitPValue      P(F ≥ that ratio) for F(ν_stage, ν_fit)
 * @param structurePValue    the structure test's p: the chance of so large a lag-1
 *                           autocorrelation of the normalised residuals along frequency if they
 *                           were noise
 * @param tolerancePValue    P(χ² ≥ Σz²) of the standardised distances from their tolerance priors
 *                           of the parts the best hypothesis does not free
 * @param partsOutsideTolerance those parts estimated far outside their tolerance, by name
 * @param findings           what failed, in order of weight; empty when explained
 */
public record ModelAdequacy(boolean explained, boolean looksLikeStage, double chiSquared, int degreesOfFreedom,
                            OptionalDouble pValue, PValueBasis basis, OptionalDouble freeFitRatio,
                            OptionalDouble freeFitPValue, double structurePValue, double tolerancePValue,
                            List<String> partsOutsideTolerance, List<Finding> findings) {
    public ModelAdequacy {
        partsOutsideTolerance = List.copyOf(partsOutsideTolerance);
        findings = List.copyOf(findings);
    }

    /** Where {@link #pValue} comes from. */
    public enum PValueBasis {
        /** χ² against the χ² distribution, with the sweep's own point uncertainties. */
        STATED_UNCERTAINTIES,
        /** The stage model against a free rational fit of the same sweep (noise from the data). */
        FREE_FIT,
        /** Neither applies (no stated uncertainties and no free fit). */
        NONE
    }

    /** One piece of evidence that the model does not explain the sweep. */
    public enum Finding {
        /** χ² far above its distribution at the sweep's stated uncertainties. */
        CHI_SQUARED_ABOVE_STATED_NOISE,
        /** The stage model fits far worse than a free rational model of the same sweep. */
        WORSE_THAN_FREE_FIT,
        /** The residuals run in long stretches of one sign along frequency. */
        RESIDUAL_RUNS,
        /** The best hypothesis fits only by moving parts it does not free far out of tolerance. */
        PARTS_OUTSIDE_TOLERANCE,
        /** The misfit's RMS is a hundred point σ or more, whatever a free fit does. */
        WORSE_THAN_STATED_NOISE_BY_FAR,
        /** The stage misses the sweep by orders of magnitude (against the free fit or the point σ). */
        FAR_FROM_EVERY_HYPOTHESIS,
        /** The measured lower corner lies far outside every board of the tolerance spread. */
        CORNER_OUTSIDE_SPREAD,
        /** The measured midband gain lies further from the stage's than any board or probe mistake puts it. */
        GAIN_FAR_FROM_STAGE
    }
}

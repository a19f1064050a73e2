package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.polebench.spread.CornerSpread;
import org.polebench.fit.DroppedPoint;
import org.polebench.fit.Estimate;
import org.polebench.fit.FitResult;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.units.Decibels;

/**
 * Tests whether the most probable hypothesis explains the sweep
 * (docs/method.md, "Does the stage explain the sweep?"), by four checks, each at the level
 * {@value #ALPHA}:
 * <ol>
 * <li>where every point states its σ: χ² of the best hypothesis against the χ² distribution with
 *     ν = N − k, k the effective number of parameters the data fix;</li>
 * <li>the stage model against the free rational fit of the same sweep, both at the same point
 *     weights over the points the fit used: the ratio of their χ²/ν against F(ν_stage, ν_fit).
 *     The two share the noise, so under a right model the ratio scatters less than F says and
 *     the test errs on the side of "explained"; it holds whatever the noise level, because the
 *     free fit measures the noise the stated σ may misstate;</li>
 * <li>residual structure along frequency: the lag-1 autocorrelation of the normalised gain
 *     residuals and, separately, the phase residuals ({@link #structureTest}). A wrong model
 *     leaves long stretches of one sign; noise does not. Structure counts only where it is
 *     material: the systematic part of the misfit (the mean square less the noise read from
 *     successive differences) reaches {@value #MATERIAL_MEAN_SQUARE} of the assumed σ², so that
 *     a model error far below the point σ (a noise-free sweep's round-off, the product of the
 *     low and high bands) is not an alarm. Unlike the free-fit comparison this holds when the
 *     free fit cannot follow the sweep either (an extra bench pole beyond the stage's order).</li>
 * <li>the parts the best hypothesis holds within their tolerances must be found there: the
 *     squared standardised distances of their estimates from their priors' means, summed,
 *     against χ² with one degree per part (conservative: a posterior mean scatters less than
 *     its prior), and no single part beyond {@value #OUTSIDE_TOLERANCE_SIGMAS} σ. A hypothesis
 *     that fits the data only by moving parts it does not free far out of tolerance does not
 *     explain the sweep.</li>
 * </ol>
 * The level {@value #ALPHA} per check was set so that seeded boards made by the synthesizer from
 * the stage itself (several stages, noise levels and faults) raise a false alarm on at most 1 %
 * of boards (AdequacyCalibrationTest); the note of issue 11 gives the measured rates.
 *
 * <p>A sweep the stage does not explain is said not to look like a board of this stage at all
 * when the stage model misses it by {@value #FAR_RATIO} times the free fit's χ²/ν or more (every
 * hypothesis far off), or when its lower corner lies outside the tolerance spread's extremes
 * widened {@value #SPREAD_WIDENING}× (further than a decade slip of one part moves it), or when
 * its fitted midband lies more than {@value #FAR_GAIN_DB} dB from the stage's.
 * Stateless.
 */
public final class AdequacyTest {
    /**
     * A part the best hypothesis holds at its tolerance prior but estimates this many prior σ
     * away is outside its tolerance: a band read as rectangular puts its edge at √3 σ, so 4 σ is
     * more than twice the band's half-width beyond its centre.
     */
    public static final double OUTSIDE_TOLERANCE_SIGMAS = 4;
    /** The level of each check: a false alarm on about 0.1 % of right models per check. */
    public static final double ALPHA = 1e-3;
    /**
     * The systematic mean square, in units of the point σ the ranking assumed, at which residual
     * structure counts: a misfit whose RMS is half that σ or more.
     */
    public static final double MATERIAL_MEAN_SQUARE = 0.25;
    /** Stage χ²/ν over the free fit's from which the stage counts as far worse, whatever the misfit's size. */
    public static final double FAR_WORSE_RATIO = 2;
    /** The stage misses the sweep this many times worse than the free fit: far off. */
    public static final double FAR_RATIO = 100;
    /**
     * χ²/ν at the assumed σ (stated or default) from which no hypothesis is anywhere near the
     * sweep: a misfit RMS of a hundred point σ (5 dB at the default 0.05 dB), far beyond any
     * noise an instrument states or a bench has.
     */
    public static final double FAR_REDUCED_CHI_SQUARE = 1e4;
    /**
     * A measured midband this far from the stage's, dB, is no board of it: beyond a ×10 probe
     * read as ×1 (20 dB, a hypothesis of its own) with 10 dB to spare for the parts' spread.
     */
    public static final double FAR_GAIN_DB = 30;
    /** The spread's extreme corners are widened by this factor before a corner counts as outside. */
    public static final double SPREAD_WIDENING = 10;

    /**
     * @param diagnosis the ranked hypotheses, with the best one's residuals
     * @param fit       the free rational fit of the same sweep
     * @param sweep     the sweep both were made from, in the order the residuals follow
     * @param spread    the stage's tolerance spread of the lower corner (may be empty)
     * @param predictedMidbandGainDb the stage's own midband gain, dB
     */
    public ModelAdequacy assess(Diagnosis diagnosis, FitResult fit, Sweep sweep, CornerSpread spread,
                                double predictedMidbandGainDb) {
        BestResiduals best = diagnosis.residuals();
        int rows = best.rows();
        double k = best.effectiveParameters();
        int nu = (int) Math.max(1, Math.round(rows - k));
        double chiSquared = best.chiSquaredStated();
        List<ModelAdequacy.Finding> findings = new ArrayList<>();

        OptionalDouble statedP = OptionalDouble.empty();
        if (diagnosis.noise().stated()) {
            statedP = OptionalDouble.of(upperTail(chiSquared, nu));
            if (statedP.getAsDouble() < ALPHA) {
                findings.add(ModelAdequacy.Finding.CHI_SQUARED_ABOVE_STATED_NOISE);
            }
        }

        FreeComparison free = compare(best, fit, sweep);
        OptionalDouble ratio = OptionalDouble.empty();
        OptionalDouble freeP = OptionalDouble.empty();
        if (free != null) {
            double stageNu = Math.max(1, free.rows - k);
            double fitNu = Math.max(1, free.rows - fit.parameterNames().size());
            double stageReduced = free.stageChiSquared / stageNu;
            double fitReduced = free.fitChiSquared / fitNu;
            if (fitReduced > 0) {
                ratio = OptionalDouble.of(stageReduced / fitReduced);
                freeP = OptionalDouble.of(1 - new FDistribution(null, stageNu, fitNu).cumulativeProbability(
                        ratio.getAsDouble()));
                // "far worse": a model error below the noise an instrument resolves (a noise-free
                // sweep's band-product error) is significant against a free fit of tiny χ², yet
                // immaterial; so the ratio must be large or the misfit material as well
                boolean far = ratio.getAsDouble() >= FAR_WORSE_RATIO || systematicMeanSquare(best,
                        diagnosis.noise().magnitudeScale(), diagnosis.noise().phaseScale()) >= MATERIAL_MEAN_SQUARE;
                if (freeP.getAsDouble() < ALPHA && far) {
                    findings.add(ModelAdequacy.Finding.WORSE_THAN_FREE_FIT);
                }
            }
        }

        double structureP = structureTest(best);
        boolean material = systematicMeanSquare(best, diagnosis.noise().magnitudeScale(),
                diagnosis.noise().phaseScale()) >= MATERIAL_MEAN_SQUARE;
        if (structureP < ALPHA && material) {
            findings.add(ModelAdequacy.Finding.RESIDUAL_RUNS);
        }

        // the parts the best hypothesis does not free must stay within their tolerances: a
        // hypothesis that fits only by pulling them far out (a gain nuisance stretched to 20 dB,
        // three capacitors moved to make up for a wrong resistor) does not explain the sweep
        List<String> outside = new ArrayList<>();
        double toleranceChiSquared = 0;
        int held = 0;
        Hypothesis top = diagnosis.top();
        for (ParameterEstimate estimate : top.backSolve().parameters()) {
            boolean freed = top.faults().stream().anyMatch(f -> f.estimate().parameter().equals(estimate.parameter()));
            if (freed) {
                continue;
            }
            Prior prior = estimate.parameter().tolerancePrior();
            double z = (estimate.logEstimate() - prior.mean()) / prior.standardDeviation();
            toleranceChiSquared += z * z;
            held++;
            if (Math.abs(z) > OUTSIDE_TOLERANCE_SIGMAS) {
                outside.add(estimate.parameter().kind() == ParameterKind.GAIN ? "the gain calibration"
                        : estimate.parameter().kind() == ParameterKind.BIAS ? estimate.parameter().label() + " bias current"
                        : estimate.parameter().kind() == ParameterKind.CURRENT_GAIN
                        ? estimate.parameter().label() + " β" : estimate.parameter().label());
            }
        }
        double toleranceP = held == 0 ? 1 : upperTail(toleranceChiSquared, held);
        if (toleranceP < ALPHA || !outside.isEmpty()) {
            findings.add(ModelAdequacy.Finding.PARTS_OUTSIDE_TOLERANCE);
        }
        boolean explained = findings.isEmpty();
        // a faulty board is not a stranger: only a sweep the stage does not explain is asked
        // whether it looks like a board of this stage at all
        boolean looksLike = true;
        if (chiSquared / nu >= FAR_REDUCED_CHI_SQUARE) {
            // a misfit RMS of a hundred point σ: no hypothesis is anywhere near the sweep
            if (explained) {
                findings.add(ModelAdequacy.Finding.WORSE_THAN_STATED_NOISE_BY_FAR);
                explained = false;
            }
            findings.add(ModelAdequacy.Finding.FAR_FROM_EVERY_HYPOTHESIS);
            looksLike = false;
        } else if (!explained && ratio.isPresent() && ratio.getAsDouble() >= FAR_RATIO) {
            findings.add(ModelAdequacy.Finding.FAR_FROM_EVERY_HYPOTHESIS);
            looksLike = false;
        }
        if (!explained && outsideSpread(fit, spread)) {
            findings.add(ModelAdequacy.Finding.CORNER_OUTSIDE_SPREAD);
            looksLike = false;
        }
        if (!explained && Math.abs(fit.midbandGainDb().value() - predictedMidbandGainDb) > FAR_GAIN_DB) {
            findings.add(ModelAdequacy.Finding.GAIN_FAR_FROM_STAGE);
            looksLike = false;
        }
        OptionalDouble p = statedP.isPresent() ? statedP : freeP;
        ModelAdequacy.PValueBasis basis = statedP.isPresent() ? ModelAdequacy.PValueBasis.STATED_UNCERTAINTIES
                : freeP.isPresent() ? ModelAdequacy.PValueBasis.FREE_FIT : ModelAdequacy.PValueBasis.NONE;
        return new ModelAdequacy(explained, looksLike, chiSquared, nu, p, basis, ratio, freeP, structureP,
                toleranceP, outside, findings);
    }

    static double upperTail(double chiSquared, int nu) {
        return 1 - new ChiSquaredDistribution(null, nu).cumulativeProbability(chiSquared);
    }

    private static final class FreeComparison {
        final double stageChiSquared;
        final double fitChiSquared;
        final int rows;

        FreeComparison(double stageChiSquared, double fitChiSquared, int rows) {
            this.stageChiSquared = stageChiSquared;
            this.fitChiSquared = fitChiSquared;
            this.rows = rows;
        }
    }

    // both models' residuals over the points the fit used, each divided by the σ the stage's
    // residuals were divided by (the same weights for both)
    private static FreeComparison compare(BestResiduals best, FitResult fit, Sweep sweep) {
        List<SweepPoint> points = sweep.points();
        if (points.size() != best.magnitude().size()) {
            return null;
        }
        boolean[] dropped = new boolean[points.size()];
        for (DroppedPoint point : fit.droppedPoints()) {
            if (point.sweepIndex() >= 0 && point.sweepIndex() < dropped.length) {
                dropped[point.sweepIndex()] = true;
            }
        }
        boolean phase = !best.phase().isEmpty();
        double stage = 0;
        double free = 0;
        int rows = 0;
        for (int i = 0; i < points.size(); i++) {
            SweepPoint point = points.get(i);
            if (dropped[i] || !fit.band().contains(point.frequencyHz())) {
                continue;
            }
            Complex model = fit.model().responseAt(point.frequencyHz());
            double size = model.abs();
            if (!(size > 0) || !Double.isFinite(size)) {
                return null;
            }
            double magnitude = (Decibels.toNepers(point.gainDb()) - Math.log(size)) / best.magnitudeSigmaNepers().get(i);
            free += magnitude * magnitude;
            stage += best.magnitude().get(i) * best.magnitude().get(i);
            rows++;
            if (phase && point.phaseDeg().isPresent()) {
                double angle = Math.IEEEremainder(Math.toRadians(point.phaseDeg().getAsDouble()) - model.getArgument(),
                        2 * Math.PI) / best.phaseSigmaRad().get(i);
                free += angle * angle;
                stage += best.phase().get(i) * best.phase().get(i);
                rows++;
            }
        }
        return rows > fit.parameterNames().size() + 1 ? new FreeComparison(stage, free, rows) : null;
    }

    /**
     * @return the one-sided p of the lag-1 autocorrelation of the normalised residuals along
     *         frequency, gain and phase sequences pooled: ρ̂ = Σ r_k·r_{k+1} / Σ r_k², which for
     *         white noise has mean about 0 and standard deviation 1/√n (Box and Pierce, J. Amer.
     *         Statist. Assoc. 65, 1970, from memory); a smooth misfit gives ρ̂ near 1. The two
     *         sequences' z = ρ̂·√n are pooled as (z₁ + z₂)/√2. 1 when there are too few points
     */
    static double structureTest(BestResiduals best) {
        double zGain = lagOneZ(best.magnitude());
        if (best.phase().isEmpty()) {
            return upperNormal(zGain);
        }
        return upperNormal((zGain + lagOneZ(best.phase())) / Math.sqrt(2));
    }

    private static double upperNormal(double z) {
        return Double.isNaN(z) ? 1 : 1 - new NormalDistribution(null, 0, 1).cumulativeProbability(z);
    }

    private static double lagOneZ(List<Double> residuals) {
        int n = residuals.size();
        if (n < 8) {
            return Double.NaN;
        }
        double sum = 0;
        double lagged = 0;
        for (int k = 0; k < n; k++) {
            double r = residuals.get(k);
            sum += r * r;
            if (k + 1 < n) {
                lagged += r * residuals.get(k + 1);
            }
        }
        return sum > 0 ? lagged / sum * Math.sqrt(n) : Double.NaN;
    }

    /**
     * @return the systematic part of the misfit in units of the σ the ranking assumed (stated or
     *         default, before any scale): the mean square residual less the noise variance read
     *         from successive differences, Σ(r_{k+1} − r_k)²/(2(n − 1)), which a smooth misfit
     *         barely feeds (von Neumann, Ann. Math. Statist. 12(4), 1941, from memory); 0 when
     *         noise explains it all
     */
    static double systematicMeanSquare(BestResiduals best, double magnitudeScale, double phaseScale) {
        double gain = systematic(best.magnitude(), magnitudeScale);
        if (best.phase().isEmpty()) {
            return gain;
        }
        return (gain + systematic(best.phase(), phaseScale)) / 2;
    }

    private static double systematic(List<Double> residuals, double scale) {
        int n = residuals.size();
        if (n < 3) {
            return 0;
        }
        double square = 0;
        double differences = 0;
        for (int k = 0; k < n; k++) {
            double r = residuals.get(k) * scale;
            square += r * r;
            if (k + 1 < n) {
                double d = residuals.get(k + 1) * scale - r;
                differences += d * d;
            }
        }
        return Math.max(0, square / n - differences / (2.0 * (n - 1)));
    }

    private static boolean outsideSpread(FitResult fit, CornerSpread spread) {
        if (spread == null || spread.analysed() == 0) {
            return false;
        }
        Estimate corner = fit.lowerCornerModelHz().isPresent() ? fit.lowerCornerModelHz().get()
                : fit.lowerCornerDataHz().orElse(null);
        if (corner == null) {
            return false;
        }
        OptionalDouble low = spread.percentileHz(0);
        OptionalDouble high = spread.percentileHz(1);
        if (low.isEmpty() || high.isEmpty()) {
            return false;
        }
        return corner.value() < low.getAsDouble() / SPREAD_WIDENING || corner.value() > high.getAsDouble() * SPREAD_WIDENING;
    }
}

package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.polebench.analysis.CornerSpread;
import org.polebench.fit.DroppedPoint;
import org.polebench.fit.Estimate;
import org.polebench.fit.FitResult;
import org.polebench.measure.Sweep;
import org.polebench.measure.SweepPoint;
import org.polebench.units.Decibels;

/**
 * Tests whether the most probable hypothesis explains the sweep (DESIGN.md "Honest diagnosis"),
 * by three checks, each at the level {@value #ALPHA}:
 * <ol>
 * <li>where every point states its σ: χ² of the best hypothesis against the χ² distribution with
 *     ν = N − k, k the effective number of parameters the data fix;</li>
 * <li>the stage model against the free rational fit of the same sweep, both at the same point
 *     weights over the points the fit used: the ratio of their χ²/ν against F(ν_stage, ν_fit).
 *     The two share the noise, so under a right model the ratio scatters less than F says and
 *     the test errs on the side of "explained"; it holds whatever the noise level, because the
 *     free fit measures the noise the stated σ may misstate;</li>
 * <li>residual structure along frequency: a Wald–Wolfowitz runs test on the signs of the gain
 *     residuals and, separately, the phase residuals, their run counts summed under the normal
 *     approximation (Wald and Wolfowitz, Ann. Math. Statist. 11(2), 1940). A wrong model leaves
 *     long runs of one sign; noise does not. Structure alone is counted only where it is
 *     material: the stage model fits at least {@value #MATERIAL_RATIO} times worse than the
 *     free fit (or, with no free fit, χ²/ν at least {@value #MATERIAL_REDUCED_CHI_SQUARE}), so
 *     that a systematic error far below the noise, or one the free fit shares, is not an alarm.</li>
 * </ol>
 * The level {@value #ALPHA} per check was set so that seeded boards made by the synthesizer from
 * the stage itself (several stages, noise levels and faults) raise a false alarm on at most 1 %
 * of boards (AdequacyCalibrationTest); the note of issue 11 gives the measured rates.
 *
 * <p>A sweep the stage does not explain is said not to look like a board of this stage at all
 * when the stage model misses it by {@value #FAR_RATIO} times the free fit's χ²/ν or more (every
 * hypothesis far off), or when its lower corner lies outside the tolerance spread's extremes
 * widened {@value #SPREAD_WIDENING}× (further than a decade slip of one part moves it).
 * Stateless.
 */
public final class AdequacyTest {
    /** The level of each check: a false alarm on about 0.1 % of right models per check. */
    public static final double ALPHA = 1e-3;
    /** Stage χ²/ν over the free fit's at which residual structure counts. */
    public static final double MATERIAL_RATIO = 1.5;
    /** χ²/ν at the stated σ at which residual structure counts when there is no free fit. */
    public static final double MATERIAL_REDUCED_CHI_SQUARE = 2;
    /** The stage misses the sweep this many times worse than the free fit: far off. */
    public static final double FAR_RATIO = 100;
    /** The spread's extreme corners are widened by this factor before a corner counts as outside. */
    public static final double SPREAD_WIDENING = 10;

    /**
     * @param diagnosis the ranked hypotheses, with the best one's residuals
     * @param fit       the free rational fit of the same sweep
     * @param sweep     the sweep both were made from, in the order the residuals follow
     * @param spread    the stage's tolerance spread of the lower corner (may be empty)
     */
    public ModelAdequacy assess(Diagnosis diagnosis, FitResult fit, Sweep sweep, CornerSpread spread) {
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
                if (freeP.getAsDouble() < ALPHA) {
                    findings.add(ModelAdequacy.Finding.WORSE_THAN_FREE_FIT);
                }
            }
        }

        double structureP = runsTest(best);
        boolean material = ratio.isPresent() ? ratio.getAsDouble() >= MATERIAL_RATIO
                : chiSquared / nu >= MATERIAL_REDUCED_CHI_SQUARE;
        if (structureP < ALPHA && material) {
            findings.add(ModelAdequacy.Finding.RESIDUAL_RUNS);
        }

        boolean explained = findings.isEmpty();
        // a faulty board is not a stranger: only a sweep the stage does not explain is asked
        // whether it looks like a board of this stage at all
        boolean looksLike = true;
        if (!explained && ratio.isPresent() && ratio.getAsDouble() >= FAR_RATIO) {
            findings.add(ModelAdequacy.Finding.FAR_FROM_EVERY_HYPOTHESIS);
            looksLike = false;
        }
        if (!explained && outsideSpread(fit, spread)) {
            findings.add(ModelAdequacy.Finding.CORNER_OUTSIDE_SPREAD);
            looksLike = false;
        }
        OptionalDouble p = statedP.isPresent() ? statedP : freeP;
        ModelAdequacy.PValueBasis basis = statedP.isPresent() ? ModelAdequacy.PValueBasis.STATED_UNCERTAINTIES
                : freeP.isPresent() ? ModelAdequacy.PValueBasis.FREE_FIT : ModelAdequacy.PValueBasis.NONE;
        return new ModelAdequacy(explained, looksLike, chiSquared, nu, p, basis, ratio, freeP, structureP,
                findings);
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
     * @return the one-sided p of the runs test (too few runs) over the gain and phase residual
     *         signs; 1 when too few residuals of either sign to test
     */
    static double runsTest(BestResiduals best) {
        double[] gain = runs(best.magnitude());
        double[] phase = best.phase().isEmpty() ? new double[] {0, 0, 0} : runs(best.phase());
        double variance = gain[2] + phase[2];
        if (!(variance > 0)) {
            return 1;
        }
        // continuity correction of ½ run toward the mean
        double z = (gain[0] + phase[0] - (gain[1] + phase[1]) + 0.5) / Math.sqrt(variance);
        return new NormalDistribution(null, 0, 1).cumulativeProbability(z);
    }

    // {runs, expected runs, variance} of one sequence of signs: with n₊ and n₋ of each sign,
    // E = 1 + 2n₊n₋/n and Var = 2n₊n₋(2n₊n₋ − n)/(n²(n − 1)) (Wald and Wolfowitz, 1940)
    private static double[] runs(List<Double> residuals) {
        int plus = 0;
        int minus = 0;
        int runs = 0;
        int previous = 0;
        for (double r : residuals) {
            int sign = r > 0 ? 1 : r < 0 ? -1 : 0;
            if (sign == 0) {
                continue;
            }
            if (sign > 0) {
                plus++;
            } else {
                minus++;
            }
            if (sign != previous) {
                runs++;
                previous = sign;
            }
        }
        double n = plus + minus;
        if (plus == 0 || minus == 0 || n < 2) {
            return new double[] {0, 0, 0};
        }
        double product = 2.0 * plus * minus;
        double expected = 1 + product / n;
        double variance = product * (product - n) / (n * n * (n - 1));
        return new double[] {runs, expected, variance};
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

package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.sweep.Sweep;
import org.polebench.units.Decibels;

/**
 * Fits the measured low-frequency poles and zeros of a sweep (docs/method.md, "The fit").
 *
 * <ol>
 * <li>Keep the points inside the band; normalise frequency by f_ref, the band's geometric mean.</li>
 * <li>For every candidate order (0 to the maximum number of low-band poles; the counts of DC
 *     zeros that the linearised estimate and the low-frequency slope imply, or the one the
 *     settings fix; with and without a high-band pole when the sweep's top
 *     falls away), start from the predicted poles or a Sanathanan–Koerner estimate and refine by
 *     Levenberg–Marquardt on complex-log residuals ({@link CandidateFitter}).</li>
 * <li>Choose by BIC ({@link OrderSelection}).</li>
 * <li>Unless the loss is {@link RobustLoss#NONE}: refit the choice robustly, drop points beyond the
 *     outlier threshold and, if any were dropped, repeat 2–3 on the rest.</li>
 * <li>State uncertainties, corners and warnings ({@link FitStatement}).</li>
 * </ol>
 *
 * Holds only its settings, so one instance may serve any number of threads.
 */
public final class SweepFitter {
    /** More than this share of points standing out means the model is wrong, not the points. */
    private static final double MAX_OUTLIER_SHARE = 0.25;

    private final FitSettings settings;

    public SweepFitter(FitSettings settings) {
        this.settings = settings;
    }

    /**
     * @return the fitted model with uncertainties
     * @throws InputProblem when the band leaves fewer than three points, a point states a
     *                      non-positive uncertainty, or no model at all can be fitted
     */
    public FitResult fit(Sweep sweep) throws InputProblem {
        PreparedSweep data = PreparedSweep.of(sweep, settings);
        List<InputWarning> warnings = new ArrayList<>();
        boolean[] high = highBandOptions(data);
        OrderSelection.Outcome outcome = select(data, high);
        if (outcome.chosen == null) {
            throw unfittable(sweep, data);
        }
        List<DroppedPoint> dropped = new ArrayList<>();
        if (settings.loss() != RobustLoss.NONE) {
            double[] e = new OutlierScreen().standardisedResiduals(data, outcome.chosen, settings.loss(),
                    settings.outlierThreshold());
            boolean[] drop = new boolean[data.size()];
            for (int k = 0; k < e.length; k++) {
                if (e[k] > settings.outlierThreshold()) {
                    drop[k] = true;
                    dropped.add(new DroppedPoint(data.sweepIndex[k], data.frequencyHz[k], e[k]));
                }
            }
            if (dropped.size() > MAX_OUTLIER_SHARE * data.size()) {
                warnings.add(InputWarning.general(dropped.size() + " of " + data.size() + " points stand more than "
                        + settings.outlierThreshold() + " standard uncertainties from the robust fit: the model, not "
                        + "the points, is at fault; all points were kept"));
                dropped.clear();
            } else if (!dropped.isEmpty() && data.size() - dropped.size() >= 3) {
                for (DroppedPoint point : dropped) {
                    warnings.add(InputWarning.general(String.format(java.util.Locale.ROOT, "point %d at %s Hz dropped as an outlier "
                                    + "(%.1f standard uncertainties from the robust fit)",
                            point.sweepIndex() + 1, trim(point.frequencyHz()), point.residualSigmas())));
                }
                data = data.without(drop);
                outcome = select(data, high);
                if (outcome.chosen == null) {
                    throw unfittable(sweep, data);
                }
            } else {
                dropped.clear();
            }
        }
        return new FitStatement().state(data, outcome.chosen, outcome.scores, dropped, warnings);
    }

    private OrderSelection.Outcome select(PreparedSweep data, boolean[] highOptions) {
        CandidateFitter fitter = new CandidateFitter();
        List<RefinedFit> fits = new ArrayList<>();
        List<ModelStructure> tried = new ArrayList<>();
        int lowest = settings.poleCount().orElse(0);
        int highest = settings.poleCount().orElse(settings.maxPoles());
        for (int poles = lowest; poles <= highest; poles++) {
            for (boolean high : highOptions) {
                boolean[] counts = new boolean[poles + 1];
                RationalEstimate unconstrained = null;
                if (settings.dcZeros().isPresent()) {
                    // a fixed DC-zero count still allows fewer poles: a coupling pole far below the band
                    // cancels against its DC zero there, and the data cannot see either
                    counts[Math.min(settings.dcZeros().getAsInt(), poles)] = true;
                } else if (poles > 0) {
                    // the linearised estimate's zeros and the data's low-frequency slope both vote
                    unconstrained = fitter.unconstrainedEstimate(data, poles, high);
                    counts = fitter.dcZeroCounts(data, poles, unconstrained);
                } else {
                    counts[0] = true;
                }
                for (int dc = 0; dc <= poles; dc++) {
                    if (!counts[dc]) {
                        continue;
                    }
                    ModelStructure shape = new ModelStructure(dc, poles - dc, 0, poles, 0, high);
                    if (shape.parameterCount() >= data.residualCount()) {
                        continue;
                    }
                    tried.add(shape);
                    fits.add(fitter.fit(data, poles, dc, high, settings.startPolesRadPerS(), unconstrained));
                }
            }
        }
        return new OrderSelection().choose(fits, tried);
    }

    /** Which high-band options to try: {false}, {true} or both. */
    private boolean[] highBandOptions(PreparedSweep data) {
        switch (settings.highBandPole()) {
            case NEVER:
                return new boolean[]{false};
            case ALWAYS:
                return new boolean[]{true};
            default:
                if (topFallsAway(data)) {
                    return new boolean[]{false, true};
                }
                return new boolean[]{false};
        }
    }

    /**
     * The sweep reaches the upper rolloff when its last two steps both fall and the last point
     * lies below the sweep's highest gain by more than 0.3 dB and five of its standard
     * uncertainties, or when its last point lags the midband phase (0° or 180°, whichever is
     * nearer the phase at the highest gain) by more than 1° and five standard uncertainties. A low
     * band alone levels off towards the top and leads there; it neither falls nor lags.
     */
    private static boolean topFallsAway(PreparedSweep data) {
        int n = data.size();
        if (n < 4) {
            return false;
        }
        int top = 0;
        for (int k = 1; k < n; k++) {
            if (data.lnGain[k] > data.lnGain[top]) {
                top = k;
            }
        }
        double drop = data.lnGain[top] - data.lnGain[n - 1];
        boolean falling = data.lnGain[n - 1] < data.lnGain[n - 2] && data.lnGain[n - 2] < data.lnGain[n - 3];
        if (falling && drop > Math.max(Decibels.toNepers(0.3), 5 * data.sigmaGain[n - 1])) {
            return true;
        }
        if (!data.hasPhase) {
            return false;
        }
        double reference = Math.abs(Math.IEEEremainder(data.phaseRad[top], 2 * Math.PI)) > Math.PI / 2 ? Math.PI : 0;
        double lag = -Math.IEEEremainder(data.phaseRad[n - 1] - reference, 2 * Math.PI);
        return lag > Math.max(Math.toRadians(1), 5 * data.sigmaPhase[n - 1]);
    }

    private static InputProblem unfittable(Sweep sweep, PreparedSweep data) {
        return new InputProblem(sweep.source().sourceFile().orElse(null), 0,
                "no model could be fitted to the " + data.size() + " points of this sweep",
                "check that the gain and phase columns hold the stage's response (not the instrument's noise floor)");
    }

    private static String trim(double hz) {
        return String.format(java.util.Locale.ROOT, "%.6g", hz);
    }
}

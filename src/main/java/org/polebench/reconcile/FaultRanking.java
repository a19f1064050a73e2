package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;
import org.polebench.measure.Sweep;
import org.polebench.units.Decibels;
import org.polebench.units.EngineeringValue;

/**
 * The full back-solve and the single-fault hypotheses (DESIGN.md "Back-solve", PITFALLS.md
 * "Back-solve and evidence").
 *
 * <p>Parameters: φ_i = ln(C_i/C_nom) for every low-band capacitor, ln(I_j/I_nom) for every
 * transistor's bias current, and a flat gain g in nepers, on the stage's own exact model
 * ({@link BoardModel}). Tolerance priors (DESIGN.md "Conventions"): each band read as
 * rectangular in ln value ({@link Prior#fromBand}); the bias ±20 % unless the stage says; the
 * gain ±{@code gain-calibration} dB read as rectangular in dB. A zero-width band gets
 * σ = {@value #ZERO_BAND_SIGMA} (0.1 %), as no part is exact.
 *
 * <p>Hypotheses: "no fault" (all at tolerance), and one per parameter with that one freed:
 * a capacitor σ = ln 10 (DESIGN.md), a bias current σ = ln 3 (a wrong divider resistor or a
 * wrong part class moves a bias by tens of percent up to a few times; beyond ×3 the stage
 * usually leaves its active region, which the sweep would show as a wholly different response),
 * the gain σ = 20 dB (a ×10 probe read as ×1 is exactly 20 dB off), each centred on its
 * tolerance prior's mean. Prior probabilities: "no fault" 0.5, the rest share 0.5 equally.
 *
 * <p>Evidence by Laplace at each MAP θ̂ with H = JᵀWJ + Σp⁻¹:
 * ln Z = −½χ²(θ̂) − ½(θ̂ − μ)ᵀΣp⁻¹(θ̂ − μ) − ½ ln det(Σp·H) (MacKay, Information Theory,
 * Inference, and Learning Algorithms, 2003, ch. 28), combined by log-sum-exp. A decade slip
 * makes the posterior multimodal, so a freed capacitor starts at μ, μ − ln 10 and μ + ln 10
 * (and at the no-fault estimate); each start runs {@value #SCREEN_ITERATIONS} iterations and
 * only the best is run to convergence. Noise: the sweep's point σ where given, else 0.05 dB and
 * 0.5°; then, if the best hypothesis leaves χ²/ν above 1, every σ is scaled by √(χ²/ν) and all
 * hypotheses are solved again from their MAPs, so model mismatch widens the posteriors instead
 * of making the probabilities overconfident. Identifiable: at the reported MAP, the posterior
 * with the tolerance priors is narrower than {@value #IDENTIFIABLE_RATIO} of the prior; a part
 * the sweep cannot see is flagged, never blamed. Immutable.
 */
public final class FaultRanking {
    public static final double DEFAULT_GAIN_SIGMA_DB = 0.05;
    public static final double DEFAULT_PHASE_SIGMA_DEG = 0.5;
    /** Posterior σ over tolerance-prior σ above this: the sweep cannot identify the parameter. */
    public static final double IDENTIFIABLE_RATIO = 0.7;
    public static final double CAPACITOR_FAULT_SIGMA = Math.log(10);
    public static final double BIAS_FAULT_SIGMA = Math.log(3);
    public static final double GAIN_FAULT_SIGMA_DB = 20;
    public static final double NO_FAULT_PRIOR = 0.5;
    static final double ZERO_BAND_SIGMA = 1e-3;
    static final int SCREEN_ITERATIONS = 4;
    static final int MAX_ITERATIONS = 60;
    /** Log-posterior lag after screening beyond which a hypothesis is not run to convergence. */
    static final double SKIP_NATS = 100;

    private final MapSolver screen = new MapSolver(SCREEN_ITERATIONS);
    private final MapSolver solver = new MapSolver(MAX_ITERATIONS);

    /**
     * @param nominalPoints the stage's solved or given operating points
     * @param nominalModel  the stage's nominal low-band model
     * @throws IllegalStateException when the model is undefined even at the priors' means (a
     *                               stage that reduced once cannot do so; a defect)
     */
    public Diagnosis rank(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, Sweep sweep) {
        MeasuredResponse measured = new MeasuredResponse(sweep, DEFAULT_GAIN_SIGMA_DB, DEFAULT_PHASE_SIGMA_DEG);
        BoardModel model = new BoardModel(stage, nominalPoints, nominalModel, measured.frequenciesHz());
        List<ModelParameter> parameters = parameters(stage, nominalPoints, model);
        int p = parameters.size();
        Prior[] tolerance = new Prior[p];
        double[] mean = new double[p];
        for (int j = 0; j < p; j++) {
            tolerance[j] = parameters.get(j).tolerancePrior();
            mean[j] = tolerance[j].mean();
        }
        List<HypothesisKind> kinds = new ArrayList<>();
        List<Prior[]> priorSets = new ArrayList<>();
        kinds.add(HypothesisKind.NONE);
        priorSets.add(tolerance);
        for (int j = 0; j < p; j++) {
            Prior[] freed = tolerance.clone();
            freed[j] = parameters.get(j).faultPrior();
            priorSets.add(freed);
            kinds.add(kindOf(parameters.get(j).kind()));
        }

        boolean[] biasHeld = new boolean[p];
        java.util.Arrays.fill(biasHeld, true);
        int k = model.capacitors().size();
        for (int j = k; j < k + model.transistors().size(); j++) {
            biasHeld[j] = false;
        }
        MapPoint none = solve(new Misfit(model, measured, tolerance, 1), List.of(mean), biasHeld);
        double[] logPrior = new double[priorSets.size()];
        double alternative = (1 - NO_FAULT_PRIOR) / p;
        logPrior[0] = Math.log(NO_FAULT_PRIOR);
        List<MapPoint> points = new ArrayList<>();
        points.add(none);
        List<Misfit> misfits = new ArrayList<>();
        misfits.add(null);
        for (int h = 1; h < priorSets.size(); h++) {
            int j = h - 1;
            logPrior[h] = Math.log(alternative);
            Misfit misfit = new Misfit(model, measured, priorSets.get(h), 1);
            misfits.add(misfit);
            List<double[]> starts = starts(none.theta(), mean, tolerance, j, parameters.get(j));
            boolean freedBias = parameters.get(j).kind() == ParameterKind.BIAS;
            boolean[] free = biasHeld;
            if (freedBias) {
                // screen with only the freed bias among the biases moving
                free = biasHeld.clone();
                free[j] = true;
            }
            points.add(screen(misfit, starts, free));
        }
        double[] lnZ = evidence(points, priorSets);
        double bestScreened = Double.NEGATIVE_INFINITY;
        for (int h = 0; h < lnZ.length; h++) {
            bestScreened = Math.max(bestScreened, logPrior[h] + lnZ[h]);
        }
        for (int h = 1; h < priorSets.size(); h++) {
            // a hypothesis far behind after screening keeps its screened point: its probability is
            // below e^-SKIP_NATS either way, and converging it would not change the ranking
            if (logPrior[h] + lnZ[h] > bestScreened - SKIP_NATS) {
                points.set(h, solve(misfits.get(h), List.of(points.get(h).theta()), biasHeld));
            }
        }
        lnZ = evidence(points, priorSets);
        int best = argMax(lnZ, kinds.size());
        int nu = Math.max(1, measured.rows() - p);
        double scale = Math.sqrt(Math.max(1, points.get(best).dataChiSquared() / nu));
        List<MapPoint> chiAtStated = points;
        if (scale > 1) {
            List<MapPoint> rescaled = new ArrayList<>();
            for (int h = 0; h < priorSets.size(); h++) {
                rescaled.add(points.get(h).withNoiseScale(scale, priorSets.get(h)));
            }
            points = rescaled;
            lnZ = evidence(points, priorSets);
        }
        double[] logPosterior = new double[lnZ.length];
        for (int h = 0; h < lnZ.length; h++) {
            logPosterior[h] = logPrior[h] + lnZ[h];
        }
        double max = Double.NEGATIVE_INFINITY;
        for (double v : logPosterior) {
            max = Math.max(max, v);
        }
        double sum = 0;
        for (double v : logPosterior) {
            sum += Math.exp(v - max);
        }
        List<Hypothesis> hypotheses = new ArrayList<>();
        for (int h = 0; h < lnZ.length; h++) {
            double probability = Math.exp(logPosterior[h] - max) / sum;
            BackSolve backSolve = backSolve(parameters, points.get(h), priorSets.get(h), tolerance,
                    chiAtStated.get(h).dataChiSquared(), measured.rows(), scale);
            hypotheses.add(hypothesis(kinds.get(h), h == 0 ? Optional.empty() : Optional.of(parameters.get(h - 1)),
                    h == 0 ? NO_FAULT_PRIOR : alternative, lnZ[h], probability, backSolve, h - 1));
        }
        hypotheses.sort(Comparator.comparingDouble(Hypothesis::probability).reversed());
        return new Diagnosis(hypotheses, scale, DEFAULT_GAIN_SIGMA_DB, DEFAULT_PHASE_SIGMA_DEG, measured.withPhase());
    }

    /** @return the back-solve's parameters for this stage, in model order */
    static List<ModelParameter> parameters(Stage stage, OperatingPoints points, BoardModel model) {
        List<ModelParameter> result = new ArrayList<>();
        for (int i = 0; i < model.capacitors().size(); i++) {
            Capacitor capacitor = stage.capacitor(model.capacitors().get(i));
            Prior prior = bandPrior(capacitor.tolerance());
            result.add(new ModelParameter(ParameterKind.CAPACITOR, Optional.of(capacitor.name()), model.nominalFarads(i),
                    Optional.of(capacitor.tolerance()), prior, new Prior(prior.mean(), CAPACITOR_FAULT_SIGMA)));
        }
        for (String name : model.transistors()) {
            Transistor transistor = stage.transistor(name);
            Prior prior = bandPrior(transistor.biasTolerance());
            result.add(new ModelParameter(ParameterKind.BIAS, Optional.of(name), points.point(name).currentAmps(),
                    Optional.of(transistor.biasTolerance()), prior, new Prior(prior.mean(), BIAS_FAULT_SIGMA)));
        }
        Prior gainDb = Prior.fromGainBandDb(stage.gainCalibrationDb());
        result.add(new ModelParameter(ParameterKind.GAIN, Optional.empty(), 0, Optional.empty(),
                new Prior(0, Decibels.toNepers(gainDb.standardDeviation())),
                new Prior(0, Decibels.toNepers(GAIN_FAULT_SIGMA_DB))));
        return result;
    }

    private static Prior bandPrior(Tolerance tolerance) {
        if (tolerance.upperFraction() > tolerance.lowerFraction()) {
            return Prior.fromBand(tolerance.lowerFraction(), tolerance.upperFraction());
        }
        return new Prior(tolerance.lnLower(), ZERO_BAND_SIGMA);
    }

    private static HypothesisKind kindOf(ParameterKind kind) {
        switch (kind) {
            case CAPACITOR:
                return HypothesisKind.CAPACITOR;
            case BIAS:
                return HypothesisKind.BIAS;
            default:
                return HypothesisKind.GAIN;
        }
    }

    // From the no-fault MAP, and from the tolerance means with the freed parameter at its mean
    // (and a decade either side for a capacitor): when one part is far off, the no-fault MAP
    // has bent the others to compensate, and the means are the better place to start them.
    // The means start is left out when the no-fault MAP lies within one prior σ of the means in
    // every parameter: the two starts are then the same basin.
    private static List<double[]> starts(double[] noFault, double[] mean, Prior[] tolerance, int j,
                                         ModelParameter parameter) {
        List<double[]> starts = new ArrayList<>();
        starts.add(noFault.clone());
        boolean bent = false;
        for (int i = 0; i < mean.length; i++) {
            bent |= Math.abs(noFault[i] - mean[i]) > tolerance[i].standardDeviation();
        }
        double[] offsets = parameter.kind() == ParameterKind.CAPACITOR
                ? (bent ? new double[] {0, -Math.log(10), Math.log(10)} : new double[] {-Math.log(10), Math.log(10)})
                : (bent ? new double[] {0} : new double[0]);
        for (double offset : offsets) {
            double[] start = mean.clone();
            start[j] = mean[j] + offset;
            starts.add(start);
        }
        return starts;
    }

    // every start with the bias held (no reductions needed), the best one kept
    private MapPoint screen(Misfit misfit, List<double[]> starts, boolean[] free) {
        MapPoint best = null;
        for (double[] start : starts) {
            Optional<MapPoint> point = screen.solve(misfit, start, free, false);
            if (point.isPresent() && (best == null || point.get().objective() < best.objective())) {
                best = point.get();
            }
        }
        if (best == null) {
            throw new IllegalStateException("the stage's model is undefined at every start of the back-solve");
        }
        // the best start's Hessian exact, for the evidence of a hypothesis that stops here
        return screen.at(misfit, best.theta()).orElse(best);
    }

    // bias held first (no reductions while the capacitors move), then everything free: the
    // bias moves little under its priors, so the second phase takes a few iterations
    private MapPoint solve(Misfit misfit, List<double[]> starts, boolean[] biasHeld) {
        MapPoint best = null;
        for (double[] start : starts) {
            double[] from = start;
            if (biasHeld != null) {
                // only a start for the next phase: its Hessian is not wanted
                Optional<MapPoint> held = solver.solve(misfit, start, biasHeld, false);
                if (held.isPresent()) {
                    from = held.get().theta();
                }
            }
            Optional<MapPoint> point = solver.solve(misfit, from);
            if (point.isPresent() && (best == null || point.get().objective() < best.objective())) {
                best = point.get();
            }
        }
        if (best == null) {
            throw new IllegalStateException("the stage's model is undefined at the back-solve's start");
        }
        return best;
    }

    private static double[] evidence(List<MapPoint> points, List<Prior[]> priorSets) {
        double[] lnZ = new double[points.size()];
        for (int h = 0; h < points.size(); h++) {
            MapPoint point = points.get(h);
            double lnSigma = 0;
            for (Prior prior : priorSets.get(h)) {
                lnSigma += Math.log(prior.standardDeviation());
            }
            // ln det(Σp·H) = ln det H + 2·Σ ln σ_j
            lnZ[h] = -0.5 * point.objective() - 0.5 * point.lnDetHessian() - lnSigma;
        }
        return lnZ;
    }

    private static int argMax(double[] values, int count) {
        int best = 0;
        for (int h = 1; h < count; h++) {
            if (values[h] > values[best]) {
                best = h;
            }
        }
        return best;
    }

    private static BackSolve backSolve(List<ModelParameter> parameters, MapPoint point, Prior[] priors,
                                       Prior[] tolerance, double chiSquaredAtStated, int dataRows, double scale) {
        int p = parameters.size();
        // identifiability at this MAP: swap this hypothesis' prior curvature for the tolerance one
        double[][] withTolerance = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                withTolerance[i][j] = point.hessian(i, j);
            }
            withTolerance[i][i] += 1 / sq(tolerance[i].standardDeviation()) - 1 / sq(priors[i].standardDeviation());
        }
        double[][] toleranceCovariance = Cholesky.of(withTolerance).map(Cholesky::inverse).orElse(null);
        List<ParameterEstimate> estimates = new ArrayList<>();
        List<List<Double>> correlation = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            double u = Math.sqrt(point.covariance(i, i));
            boolean identifiable = toleranceCovariance != null
                    && Math.sqrt(toleranceCovariance[i][i]) < IDENTIFIABLE_RATIO * tolerance[i].standardDeviation();
            estimates.add(new ParameterEstimate(parameters.get(i), point.theta(i), u, priors[i].standardDeviation(),
                    identifiable));
            List<Double> row = new ArrayList<>(p);
            for (int j = 0; j < p; j++) {
                row.add(point.covariance(i, j) / Math.sqrt(point.covariance(i, i) * point.covariance(j, j)));
            }
            correlation.add(row);
        }
        return new BackSolve(estimates, correlation, chiSquaredAtStated, dataRows, point.converged());
    }

    private static double sq(double x) {
        return x * x;
    }

    private static Hypothesis hypothesis(HypothesisKind kind, Optional<ModelParameter> freed, double prior,
                                         double logEvidence, double probability, BackSolve backSolve, int index) {
        if (freed.isEmpty()) {
            return new Hypothesis(kind, Optional.empty(), prior, logEvidence, probability, Optional.empty(),
                    OptionalDouble.empty(), false,
                    "no fault: the sweep agrees with the stage within its part tolerances", backSolve);
        }
        ModelParameter parameter = freed.get();
        ParameterEstimate estimate = backSolve.parameters().get(index);
        OptionalDouble nearest = OptionalDouble.empty();
        boolean slip = false;
        String statement;
        if (!estimate.identifiable()) {
            statement = parameter.label() + " cannot be identified from this sweep (its effect lies outside "
                    + "the swept band or is masked by other parts): not blamed";
        } else if (parameter.kind() == ParameterKind.CAPACITOR) {
            Tolerance tolerance = parameter.tolerance().get();
            PreferredSeries series = PreferredSeries.forTolerance(
                    Math.max(Math.abs(tolerance.lowerFraction()), Math.abs(tolerance.upperFraction())));
            double value = estimate.value();
            double near = series.nearest(value);
            nearest = OptionalDouble.of(near);
            double decades = Math.log10(near / parameter.nominal());
            slip = Math.abs(decades - Math.rint(decades)) < 1e-6 && Math.rint(decades) != 0;
            double u = estimate.uncertainty();
            // "likely a part of value X" when the estimate lies in X's own tolerance band, widened by 2u
            double low = near * (1 + tolerance.lowerFraction()) - 2 * u;
            double high = near * (1 + tolerance.upperFraction()) + 2 * u;
            boolean fitsPart = value >= low && value <= high;
            statement = String.format(Locale.ROOT, "%s reads %s ± %s against %s nominal (×%.3g)", parameter.label(),
                    EngineeringValue.format(value, "F", 2), EngineeringValue.format(u, "F", 1),
                    EngineeringValue.format(parameter.nominal(), "F", 2), estimate.factor());
            if (fitsPart && Math.abs(near / parameter.nominal() - 1) > 1e-9) {
                statement += ": likely a " + EngineeringValue.format(near, "F", 2) + " part"
                        + (slip ? ", a decade slip" : " (" + series.name() + " series)");
            } else if (fitsPart) {
                statement += ": within its " + tolerance.describe() + " tolerance";
            } else {
                statement += ": outside its " + tolerance.describe() + " tolerance and no " + series.name()
                        + " value fits (nearest " + EngineeringValue.format(near, "F", 2)
                        + "); an aged, damaged or misfitted part";
            }
        } else if (parameter.kind() == ParameterKind.BIAS) {
            statement = String.format(Locale.ROOT, "%s bias current reads %s ± %s against %s designed (×%.3g): "
                            + "check its bias network and supply", parameter.label(),
                    EngineeringValue.format(estimate.value(), "A", 3), EngineeringValue.format(estimate.uncertainty(), "A", 1),
                    EngineeringValue.format(parameter.nominal(), "A", 3), estimate.factor());
        } else {
            double db = estimate.value();
            double tenfold = Math.abs(Math.abs(db) - 20);
            statement = String.format(Locale.ROOT, "a flat gain error of %+.2f dB ± %.2f dB (×%.3g)", db,
                    estimate.uncertainty(), estimate.factor())
                    + (tenfold < 1 ? ": likely a ×10 probe or attenuator setting mixed up"
                    : ": a probe, attenuator or generator level mistake");
        }
        return new Hypothesis(kind, parameter.part(), prior, logEvidence, probability, Optional.of(estimate), nearest,
                slip, statement, backSolve);
    }
}

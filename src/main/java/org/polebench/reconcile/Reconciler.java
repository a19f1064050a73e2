package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.concurrent.Executor;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.ForkJoinPool;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.analysis.ComplexFrequency;
import org.polebench.bench.Bench;
import org.polebench.bench.MeasuringChain;
import org.polebench.bench.Reference;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.GainReference;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageInput;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.CornerSpread;
import org.polebench.analysis.Prediction;
import org.polebench.spread.StagePrediction;
import org.polebench.fit.Estimate;
import org.polebench.fit.FitResult;
import org.polebench.fit.FitSettings;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootStatus;
import org.polebench.fit.SweepFitter;
import org.polebench.sweep.Sweep;

/**
 * The whole reconcile job for one stage and one sweep (issue 5): fit the sweep starting from
 * the stage's predicted poles, set prediction and measurement side by side, apportion the
 * corner error to first order, rank the fault hypotheses on the stage's exact model, test
 * whether the best one explains the sweep ({@link AdequacyTest}; when it does not, pairs of
 * faults are ranked as well and the test is made again), and decide the limits. The verdict shows the midband gain and the lower corner from the fit
 * (the quantities the fit measures directly, with their uncertainties) when the fit describes
 * the sweep, else from the stage's model at the back-solve's MAP ({@link ModelMeasurement}),
 * and the upper corner from a fitted high-band pole (a one-pole roll-off puts the −3 dB point at
 * the pole). A limit is decided only where the sweep itself determines the quantity
 * ({@link SweepDetermination}, issue 11); a value from the model alone, from a fit that does not
 * describe the sweep, or outside the swept band is shown but leaves its limit not decided.
 * Immutable.
 */
public final class Reconciler {
    private final FaultRanking ranking = new FaultRanking();
    private final AdequacyTest adequacyTest = new AdequacyTest();
    private final CornerApportionment apportionment = new CornerApportionment();
    private final LimitAssessment assessment = new LimitAssessment();
    private final ModelMeasurement measurement = new ModelMeasurement();
    private final SweepDetermination determination = new SweepDetermination();
    private final Executor fitExecutor;
    private final boolean rankingThread;

    /**
     * Fits on the common fork-join pool while the back-solve runs on the calling thread and on a
     * thread of its own for half the single faults (the common pool of a 2-core machine has one
     * worker, which the fit holds).
     */
    public Reconciler() {
        this(ForkJoinPool.commonPool(), true);
    }

    private Reconciler(Executor fitExecutor, boolean rankingThread) {
        this.fitExecutor = fitExecutor;
        this.rankingThread = rankingThread;
    }

    /** @return a reconciler that does everything on the calling thread (for one-core timing) */
    public static Reconciler onOneThread() {
        return new Reconciler(Runnable::run, false);
    }

    /**
     * χ²/ν above which the rational fit is taken not to describe the sweep (its residuals over
     * twice the point σ): then the gain and corner shown come from the back-solved model, and no
     * limit is decided from them (issue 11).
     */
    public static final double FIT_ADEQUATE_CHI_SQUARE = 4;

    /**
     * χ²/ν up to which the fit started from the predicted poles is taken as it is; above it the
     * fit from the linearised estimate is tried too and the one nearer the noise kept. 1.5: a
     * right model's χ²/ν over about 150 degrees of freedom lies within 1 ± 0.35 at 3σ (the χ²
     * distribution's standard deviation √(2/ν); common practice).
     */
    static final double FIT_AT_THE_NOISE = 1.5;

    /**
     * @param lowBandOrder the stage's low-band order
     * @return the most poles reconcile's fit may take: the stage's low-band order, 1 to 8
     */
    public static int fitPoleLimit(int lowBandOrder) {
        return Math.max(1, Math.min(8, lowBandOrder));
    }

    /** @throws InputProblem when the sweep cannot be fitted (too few points, no low band) */
    public ReconcileResult reconcile(StagePrediction predicted, Sweep sweep, DecisionRule rule) throws InputProblem {
        return reconcile(predicted, sweep, rule, Optional.empty());
    }

    /**
     * @param bench how the board was measured (a bench file), or empty: its generator resistance
     *              and channel loads enter the back-solve's network, its couplings the reading,
     *              and the limits are decided on the board's own response with the bench taken out
     * @throws InputProblem when the sweep cannot be fitted, or the stage as the bench sees it
     *                      cannot be solved
     */
    public ReconcileResult reconcile(StagePrediction predicted, Sweep sweep, DecisionRule rule, Optional<Bench> bench)
            throws InputProblem {
        Prediction prediction = predicted.prediction();
        int order = prediction.lowBand().order();
        List<Complex> start = new ArrayList<>();
        for (ComplexFrequency pole : prediction.poles().roots()) {
            if (pole.realRadPerS() < 0) {
                start.add(new Complex(pole.realRadPerS(), pole.imaginaryRadPerS()));
            }
        }
        FitSettings free = FitSettings.defaults().withMaxPoles(fitPoleLimit(order));
        FitSettings settings = start.size() == order ? free.withStartPoles(start) : free;
        // the fit and the back-solve are independent: the fit runs on another thread meanwhile
        CompletableFuture<FitResult> fitting = CompletableFuture.supplyAsync(() -> {
            try {
                FitResult started = new SweepFitter(settings).fit(sweep);
                if (settings == free || started.quality().reducedChiSquare() <= FIT_AT_THE_NOISE) {
                    return started;
                }
                // a board far from its design (a decade-slipped part) can leave the fit started from
                // the predicted poles in a poor local minimum, or at an order too low to follow the
                // sweep to its noise (the demo board: 4 poles, χ²/ν 2.3, residuals of 0.27 dB beside
                // 0.05 dB of noise, where the fit polebench fit runs takes 5 poles at χ²/ν 1.2); the
                // fit from the linearised estimate then may describe the sweep better, and no limit
                // is decided from a fit that does not (issue 11)
                FitResult unstarted = new SweepFitter(free).fit(sweep);
                return unstarted.quality().reducedChiSquare() < started.quality().reducedChiSquare()
                        ? unstarted : started;
            } catch (InputProblem problem) {
                throw new CompletionException(problem);
            }
        }, fitExecutor);
        ExecutorService helper = rankingThread ? Executors.newSingleThreadExecutor(runnable -> {
            Thread thread = new Thread(runnable, "polebench-ranking");
            thread.setDaemon(true);
            return thread;
        }) : null;
        Diagnosis diagnosis;
        FitResult fit;
        ModelAdequacy adequacy;
        try {
            HypothesisSearch search;
            if (bench.isPresent()) {
                Stage seen = sweptStage(bench.get(), predicted.stage());
                OperatingPoints points = new BiasSolver().solve(seen);
                Prediction seenPrediction = new StageAnalysis().predictNetwork(seen,
                        new SmallSignalExpansion().expand(seen, points));
                search = ranking.search(seen, points, seenPrediction.lowBand(), sweep, helper,
                        DeclaredChain.of(bench.get(), predicted.stage()));
            } else {
                search = ranking.search(predicted.stage(), predicted.operatingPoints(), prediction.lowBand(), sweep,
                        helper);
            }
            diagnosis = search.singles();
            fit = join(fitting);
            adequacy = adequacyTest.assess(diagnosis, fit, sweep, predicted.spread(), prediction.midbandGainDb());
            if (!adequacy.explained()) {
                // no single fault explains the sweep: pairs of the most probable ones, then the test again
                diagnosis = search.withPairs();
                adequacy = adequacyTest.assess(diagnosis, fit, sweep, predicted.spread(), prediction.midbandGainDb());
            }
        } finally {
            if (helper != null) {
                helper.shutdown();
            }
        }
        ModelMeasurement.Measured model = measurement.measure(predicted.stage(), predicted.operatingPoints(),
                diagnosis.top().backSolve(), fit.quality().calibration().gainStandardUncertaintyDb());
        boolean adequate = adequate(fit);
        Optional<Estimate> fitCorner = fit.lowerCornerModelHz().isPresent() ? fit.lowerCornerModelHz()
                : fit.lowerCornerDataHz();
        Optional<Estimate> corner;
        String cornerSource;
        boolean chainTakenOut = (bench.isPresent() || Diagnosis.chainTakenOut(diagnosis, adequacy))
                && model.lowerCornerHz().isPresent();
        if (chainTakenOut) {
            // the sweep shows the board through its bench: the limit is the board's own
            corner = model.lowerCornerHz();
            cornerSource = bench.isPresent()
                    ? "the board's own exact −3 dB corner: the back-solved stage model with the declared bench taken "
                    + "out (the fitted corner is the one the bench showed)"
                    : "the board's own exact −3 dB corner: the back-solved stage model with the measuring "
                    + "channel's AC coupling taken out (the fitted corner is the one the bench showed)";
        } else if (adequate && fitCorner.isPresent()) {
            corner = fitCorner;
            cornerSource = fit.lowerCornerModelHz().isPresent() ? "the fitted model's exact −3 dB corner"
                    : "the −3 dB point read between measured points";
        } else {
            corner = model.lowerCornerHz();
            cornerSource = "the back-solved stage model's exact −3 dB corner ("
                    + (adequate ? "the fit quotes no corner" : "the rational fit does not describe the sweep") + ")";
        }
        Estimate gainEstimate = fit.midbandGainDb();
        String gainSource = "the fitted midband gain";
        if (bench.isPresent() && model.midbandGainDb().isPresent()) {
            // a generator resistance or a channel's load moves the midband the bench shows
            gainEstimate = model.midbandGainDb().get();
            gainSource = "the board's own midband gain: the back-solved stage model with the declared bench taken out";
        } else if (!adequate && model.midbandGainDb().isPresent()) {
            gainEstimate = model.midbandGainDb().get();
            gainSource = "the back-solved stage model's midband gain (the rational fit does not describe the sweep)";
        }
        OptionalDouble percentile = OptionalDouble.empty();
        CornerSpread spread = predicted.spread();
        if (corner.isPresent() && spread.analysed() > 0) {
            percentile = spread.fractionAtOrBelow(corner.get().value());
        }
        boolean inside = percentile.isPresent() && percentile.getAsDouble() >= SideBySide.SPREAD_LOW
                && percentile.getAsDouble() <= SideBySide.SPREAD_HIGH;
        SideBySide sideBySide = new SideBySide(prediction.midbandGainDb(), fit.midbandGainDb(),
                prediction.sctcLowerCornerHz(), prediction.exactLowerCornerHz(), fitCorner, percentile, inside,
                matches(prediction, fit), model.midbandGainDb(), model.lowerCornerHz(), adequate);

        Optional<Apportionment> shares = Optional.empty();
        if (model.lowerCornerHz().isPresent() && prediction.exactLowerCornerHz().isPresent()) {
            // the back-solved board's corner change, shared along the path from the design to it:
            // the shares and the back-solve then name the same culprit (issue 14)
            Estimate solved = model.lowerCornerHz().get();
            shares = apportionment.apportion(predicted.stage(), predicted.operatingPoints(), diagnosis.top().backSolve(),
                    solved.standardUncertainty() / solved.value());
        }
        // a limit is decided only from a quantity the sweep itself determines (issue 11); the
        // others are still shown, labelled with their source, and the verdict names them
        // the board's own corner under a bench hypothesis that explains the sweep is the sweep's
        // too: the channel is part of the model that explains it
        boolean cornerFromFit = adequate && (chainTakenOut ? adequacy.explained() : fitCorner.isPresent());
        MeasuredQuantity lower = corner.isEmpty()
                ? MeasuredQuantity.absent(adequate ? NotDecided.OUTSIDE_SWEPT_BAND : NotDecided.FIT_DOES_NOT_DESCRIBE_SWEEP)
                : quantity(corner.get(), cornerSource, determination.lowerCorner(adequate, cornerFromFit,
                        corner.get().value(), fit.band()));
        Optional<FittedRoot> highPole = SweepDetermination.highBandPole(fit);
        OptionalDouble highPoleHz = highPole.isPresent() ? OptionalDouble.of(highPole.get().magnitudeHz())
                : OptionalDouble.empty();
        MeasuredQuantity gain = quantity(gainEstimate, gainSource, determination.midbandGain(adequate,
                SweepDetermination.fitLowerCornerHz(fit), highPoleHz, fit.band(), SweepDetermination.frequencies(sweep)));
        Optional<NotDecided> upperReason = determination.upperCorner(adequate, highPole, fit.band());
        MeasuredQuantity upper;
        if (highPole.isPresent() && highPole.get().status() == RootStatus.FITTED) {
            FittedRoot pole = highPole.get();
            // a one-pole roll-off puts the −3 dB point at the pole
            upper = new MeasuredQuantity(OptionalDouble.of(pole.magnitudeHz()),
                    fit.coverageFactor() * pole.uMagnitudeHz(), fit.coverageFactor(), "the fitted high-band pole",
                    upperReason);
        } else {
            upper = MeasuredQuantity.absent(upperReason.orElseThrow());
        }
        Conformity conformity = assessment.assess(predicted.stage().limits(), lower, gain, upper, rule);
        return new ReconcileResult(predicted, sweep, fit, sideBySide, shares, diagnosis, adequacy, conformity,
                gainSource, cornerSource, bench);
    }

    /**
     * The stage as the bench sees it ({@link MeasuringChain#asMeasured}); with the gain taken as
     * the ratio of the two channels, referred to the input channel's point instead of the EMF.
     */
    static Stage sweptStage(Bench bench, Stage board) {
        MeasuringChain chain = MeasuringChain.forBackSolve(bench);
        Stage seen = chain.asMeasured(board);
        if (bench.referenceFor(board) != Reference.INPUT_CHANNEL) {
            return seen;
        }
        StageInput in = seen.input();
        return seen.withInput(new StageInput(chain.inputPointNode(board), in.sourceOhms(), GainReference.INPUT_NODE,
                in.line()));
    }

    private static boolean adequate(FitResult fit) {
        return fit.quality().reducedChiSquare() <= FIT_ADEQUATE_CHI_SQUARE;
    }

    private static MeasuredQuantity quantity(Estimate estimate, String source, Optional<NotDecided> notDecided) {
        return new MeasuredQuantity(OptionalDouble.of(estimate.value()), estimate.expandedUncertainty(),
                estimate.coverageFactor(), source,
                notDecided);
    }

    private static FitResult join(CompletableFuture<FitResult> fitting) throws InputProblem {
        try {
            return fitting.join();
        } catch (CompletionException failure) {
            if (failure.getCause() instanceof InputProblem) {
                throw (InputProblem) failure.getCause();
            }
            if (failure.getCause() instanceof RuntimeException) {
                throw (RuntimeException) failure.getCause();
            }
            throw failure;
        }
    }

    /**
     * Each predicted root beside a measured root, DC zeros with DC zeros, paired so that the sum
     * of |ln|s_pred| − ln|s_meas|| over the pairs is least (the assignment problem, solved by
     * {@link MinimumCostAssignment}): a greedy nearest-first pairing can set a root beside a far
     * one while a near one stays free. As many roots are paired as the two sides allow; the
     * high-band pole is left out (the low-band prediction has none) and the roots of the longer
     * side that find no partner are listed alone.
     */
    static List<RootMatch> matches(Prediction prediction, FitResult fit) {
        List<RootMatch> result = new ArrayList<>();
        List<FittedRoot> measuredPoles = new ArrayList<>();
        for (FittedRoot pole : fit.poles()) {
            if (!pole.label().equals("ph")) {
                measuredPoles.add(pole);
            }
        }
        match(false, prediction.poles().roots(), measuredPoles, result);
        List<ComplexFrequency> zeros = prediction.zeros().isPresent() ? prediction.zeros().get().roots() : List.of();
        match(true, zeros, fit.zeros(), result);
        return result;
    }

    /**
     * The cost of leaving a root without a partner. One more pair saves twice this, which is more
     * than any ln-distance two positive doubles can have (ln(Double.MAX_VALUE / Double.MIN_VALUE)
     * is about 1454), so the assignment pairs as many roots as it can and only then weighs the
     * distances.
     */
    static final double UNPAIRED = 1e3;
    /** The cost of a pairing that is not allowed (DC against a finite root): above every other choice. */
    private static final double NOT_ALLOWED = 1e6;

    private static void match(boolean zero, List<ComplexFrequency> predicted, List<FittedRoot> measured,
                              List<RootMatch> out) {
        int p = predicted.size();
        int m = measured.size();
        double[][] magnitudes = new double[2][];
        magnitudes[0] = new double[p];
        magnitudes[1] = new double[m];
        for (int i = 0; i < p; i++) {
            magnitudes[0][i] = predicted.get(i).magnitudeRadPerS();
        }
        for (int j = 0; j < m; j++) {
            magnitudes[1][j] = measured.get(j).radPerS().abs();
        }
        int[] partner = pairing(magnitudes[0], magnitudes[1]);
        boolean[] taken = new boolean[m];
        List<RootMatch> matched = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            if (partner[i] >= 0) {
                taken[partner[i]] = true;
                matched.add(new RootMatch(zero, Optional.of(predicted.get(i)), Optional.of(measured.get(partner[i]))));
            } else {
                matched.add(new RootMatch(zero, Optional.of(predicted.get(i)), Optional.empty()));
            }
        }
        for (int j = 0; j < m; j++) {
            if (!taken[j]) {
                matched.add(new RootMatch(zero, Optional.empty(), Optional.of(measured.get(j))));
            }
        }
        matched.sort((a, b) -> Double.compare(magnitude(a), magnitude(b)));
        out.addAll(matched);
    }

    /**
     * The least-cost pairing of two lists of root magnitudes: the square problem of size p + m in
     * which every root may also take a stand-in partner at cost {@link #UNPAIRED}.
     *
     * @param predicted |s| of the predicted roots, rad/s (0 at DC)
     * @param measured  |s| of the measured roots, rad/s (0 at DC)
     * @return for each predicted root the index of its measured partner, or −1 for none
     */
    static int[] pairing(double[] predicted, double[] measured) {
        int p = predicted.length;
        int m = measured.length;
        double[][] cost = new double[p + m][p + m];
        for (int i = 0; i < p + m; i++) {
            for (int j = 0; j < p + m; j++) {
                if (i < p && j < m) {
                    cost[i][j] = distance(predicted[i], measured[j]);
                } else if (i < p || j < m) {
                    cost[i][j] = UNPAIRED;
                }
            }
        }
        int[] column = MinimumCostAssignment.solve(cost);
        int[] partner = new int[p];
        for (int i = 0; i < p; i++) {
            partner[i] = column[i] < m && cost[i][column[i]] < NOT_ALLOWED ? column[i] : -1;
        }
        return partner;
    }

    private static double magnitude(RootMatch match) {
        return match.predicted().isPresent() ? match.predicted().get().magnitudeRadPerS()
                : match.measured().get().radPerS().abs();
    }

    /** |ln a − ln b|; DC meets DC at distance 0, and DC is never set beside a finite root. */
    static double distance(double a, double b) {
        if (a == 0 && b == 0) {
            return 0;
        }
        if (a == 0 || b == 0) {
            return NOT_ALLOWED;
        }
        return Math.abs(Math.log(a / b));
    }
}

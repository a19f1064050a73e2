package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;
import org.polebench.sweep.Sweep;
import org.polebench.units.Decibels;

/**
 * The full back-solve and the fault hypotheses (docs/method.md, "The hypotheses").
 *
 * <p>Parameters, on the stage's own exact model ({@link BoardModel}): φ_i = ln(C_i/C_nom) for
 * every low-band capacitor; ln(I_j/I_nom) for every transistor's bias current; ln(β/β_nom) for
 * every BJT, a nuisance in every hypothesis (device spread moves rπ apart from the bias
 * current); ln(R/R_nom) for every resistor, present only in the hypotheses that free it (a
 * resistor held at its value costs nothing; its ±1 % or ±5 % band would barely move the
 * response); and a flat gain g in nepers. Tolerance priors: each band read as rectangular in ln
 * value ({@link Prior#fromBand}); the bias ±20 % unless the stage says; β from the transistor's
 * {@code beta-tolerance} (±50 % when the stage gives none, the spread of one small-signal type
 * within its gain group: common practice); the gain ±{@code gain-calibration} dB read as
 * rectangular in dB. A zero-width band gets σ = {@value #ZERO_BAND_SIGMA} (0.1 %), as no part is
 * exact.
 *
 * <p>Hypotheses: "no fault" (all at tolerance); one per capacitor, resistor, bias current and
 * the gain with that one freed: a capacitor or a resistor σ = ln 10 (a decade slip is the
 * common misfit), a bias current σ = ln 3 (a wrong divider resistor or a wrong part class moves
 * a bias by tens of percent up to a few times), the gain σ = 20 dB (a ×10 probe read as ×1 is
 * exactly 20 dB off), each centred on its tolerance prior's mean; and, only when asked because
 * no single fault explains the sweep, pairs: the most probable single fault with each of the
 * four parts that, freed beside it, promise the largest further drop of χ² (one Gauss–Newton
 * step from its MAP), and the three most probable single faults with one another. Prior
 * probabilities: "no fault" {@value #NO_FAULT_PRIOR}; the single faults share
 * {@value #SINGLE_FAULTS_PRIOR} equally; the pairs share {@value #DOUBLE_FAULTS_PRIOR} equally
 * over every pair that could be formed (not only those ranked), so that one given pair is far
 * less likely than one given single fault. Probabilities are normalised over the hypotheses
 * ranked.
 *
 * <p>Evidence by Laplace at each MAP θ̂ with H = JᵀWJ + Σp⁻¹:
 * ln Z = −½χ²(θ̂) − ½(θ̂ − μ)ᵀΣp⁻¹(θ̂ − μ) − ½ ln det(Σp·H) (MacKay, Information Theory,
 * Inference, and Learning Algorithms, 2003, ch. 28), combined by log-sum-exp. Noise: the
 * sweep's point σ where every point states one, else {@value #DEFAULT_GAIN_SIGMA_DB} dB and
 * {@value #DEFAULT_PHASE_SIGMA_DEG}°. Then the residuals of the best hypothesis set two
 * variance components when the sweep stated no σ, one for the gain rows and one for the phase
 * rows, s² = max(1, χ²/ν) each with ν = rows − p_eff shared between them (a Birge ratio per
 * component); where the sweep stated its σ, one common ratio. So model mismatch widens the
 * posteriors instead of making the probabilities overconfident, and a phase misfit cannot
 * outweigh the gain data. Identifiable: at the reported MAP, the posterior with the tolerance
 * priors is narrower than {@value #IDENTIFIABLE_RATIO} of the prior (for a resistor, of the
 * prior or of a ±10 % band, whichever is wider: a 1 % part is never pinned to 0.7 % by a
 * sweep, yet a sweep that tells it within 6 % identifies it); a part the sweep cannot see is
 * flagged, never blamed. Immutable.
 */
public final class FaultRanking {
    public static final double DEFAULT_GAIN_SIGMA_DB = 0.05;
    public static final double DEFAULT_PHASE_SIGMA_DEG = 0.5;
    /** Posterior σ over tolerance-prior σ above this: the sweep cannot identify the parameter. */
    public static final double IDENTIFIABLE_RATIO = 0.7;
    /** The σ in ln R of a ±10 % band read as rectangular: the widest reference for a resistor. */
    static final double RESISTOR_REFERENCE_SIGMA = Prior.fromBand(-0.1, 0.1).standardDeviation();
    public static final double CAPACITOR_FAULT_SIGMA = Math.log(10);
    public static final double RESISTOR_FAULT_SIGMA = Math.log(10);
    public static final double BIAS_FAULT_SIGMA = Math.log(3);
    public static final double GAIN_FAULT_SIGMA_DB = 20;
    public static final double NO_FAULT_PRIOR = 0.45;
    /**
     * The measuring-chain hypotheses' share: an AC-coupled output channel takes
     * {@value #AC_CHANNEL_SHARE} of it, a generator resistance the stage leaves out
     * {@value #GENERATOR_SHARE} (where the gain is read against the source EMF), a coupling
     * mismatch between two channels the rest. Taken from "no fault": a bench mistake is a
     * healthy board measured wrongly.
     */
    public static final double BENCH_PRIOR = 0.05;
    static final double AC_CHANNEL_SHARE = 0.6;
    /** The share of a generator output resistance the stage file leaves out (the rest: two couplings). */
    static final double GENERATOR_SHARE = 0.2;
    /** A function generator's output resistance (the common 50 Ω; common practice). */
    public static final double GENERATOR_OHMS = 50;
    /**
     * The prior of an AC coupling's corner: log-normal about 3.3 Hz, σ = ln 3 (a scope's AC
     * coupling sits at a few hertz, about 1 to 10 Hz; common practice, from memory).
     */
    static final double CHANNEL_CORNER_HZ = 3.3;
    static final double CHANNEL_CORNER_SIGMA = Math.log(3);
    /** The channels, in parameter order: the output channel's coupling, then the input channel's. */
    static final List<String> CHANNELS = List.of("output-channel", "input-channel");
    public static final double SINGLE_FAULTS_PRIOR = 0.4;
    public static final double DOUBLE_FAULTS_PRIOR = 0.1;
    /**
     * How many second faults are paired with the most probable single fault when pairs are
     * ranked, plus one: the parts that promise the largest further drop of χ² beside it.
     */
    public static final int PAIRED_SINGLES = 5;
    static final double ZERO_BAND_SIGMA = 1e-3;
    static final int SCREEN_ITERATIONS = 4;
    static final int MAX_ITERATIONS = 60;
    /** Log-posterior lag after screening beyond which a hypothesis is not run to convergence. */
    static final double SKIP_NATS = 100;

    /**
     * @param nominalPoints the stage's solved or given operating points
     * @param nominalModel  the stage's nominal low-band model
     * @return the single-fault ranking
     * @throws IllegalStateException when the model is undefined even at the priors' means (a
     *                               stage that reduced once cannot do so; a defect)
     */
    public Diagnosis rank(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, Sweep sweep) {
        return search(stage, nominalPoints, nominalModel, sweep).singles();
    }

    /** @return a search over this sweep's hypotheses, for one thread: singles first, pairs on request */
    HypothesisSearch search(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, Sweep sweep) {
        return search(stage, nominalPoints, nominalModel, sweep, null);
    }

    /**
     * @param helper runs half the single faults beside the calling thread, on a board model of
     *               its own; null for everything on the calling thread. The ranking is the same
     *               either way up to round-off in the board models' cached high-band factors.
     */
    HypothesisSearch search(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, Sweep sweep,
                            java.util.concurrent.Executor helper) {
        return search(stage, nominalPoints, nominalModel, sweep, helper, DeclaredChain.NONE);
    }

    /**
     * @param stage    the stage as the sweep sees it: the board's own, or with a declared bench's
     *                 generator resistance and channel loads in it
     * @param declared the channel couplings a bench file declares ({@link DeclaredChain#NONE} for none)
     */
    HypothesisSearch search(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, Sweep sweep,
                            java.util.concurrent.Executor helper, DeclaredChain declared) {
        MeasuredResponse stated = new MeasuredResponse(sweep, DEFAULT_GAIN_SIGMA_DB, DEFAULT_PHASE_SIGMA_DEG);
        BoardModel model = new BoardModel(stage, nominalPoints, nominalModel, stated.frequenciesHz());
        MeasuredResponse measured = withModelError(stated, model);
        return new HypothesisSearch(model, measured, parameters(stage, nominalPoints, model, declared),
                () -> new BoardModel(stage, nominalPoints, nominalModel, measured.frequenciesHz()), helper, declared,
                declared.stated() ? null : generatorModel(stage, nominalPoints, measured.frequenciesHz()));
    }

    /**
     * The board model's own rounding error at each point, taken once at the nominal parts (so
     * that every hypothesis weighs the points alike) and added to the points' σ: the low band
     * is a sum D + cᵀ·x whose terms are of the midband gain's size, so a long high-pass cascade
     * far below its corner (−300 dB against the midband) is computed with no correct digit
     * there, while the sweep's own full solve of the network is not
     * (docs/method.md, "Least squares by QR"). ε = {@value #MODEL_ERROR_FACTOR}·u·(cancellation ratio): the factor
     * covers the errors the reduction's k + 1 solves and the port solve carry into the terms.
     */
    private static MeasuredResponse withModelError(MeasuredResponse measured, BoardModel model) {
        double[] ratio = model.cancellation(new double[model.parameterCount()]);
        if (ratio == null) {
            return measured;
        }
        double[] error = new double[ratio.length];
        for (int n = 0; n < ratio.length; n++) {
            error[n] = MODEL_ERROR_FACTOR * Math.ulp(1.0) / 2 * ratio[n];
        }
        return measured.withModelError(error);
    }

    /** Bound on the board model's error over u·(cancellation ratio); see {@link #withModelError}. */
    static final double MODEL_ERROR_FACTOR = 1e3;

    /**
     * @return the board model of the stage with a {@value #GENERATOR_OHMS} Ω generator output
     *         resistance in series with its source; null where the gain is read against the input
     *         node (a source resistance then changes nothing read) or that stage cannot be solved
     */
    private static BoardModel generatorModel(Stage stage, OperatingPoints points, double[] frequenciesHz) {
        if (stage.input().reference() != org.polebench.circuit.GainReference.SOURCE_EMF) {
            return null;
        }
        org.polebench.circuit.StageInput in = stage.input();
        Stage loaded = stage.withInput(
                new org.polebench.circuit.StageInput(in.node(), in.sourceOhms() + GENERATOR_OHMS, in.reference(), in.line()));
        // the low band's state model alone (one port reduction), not a whole prediction
        java.util.Optional<StateModel> low = new org.polebench.analysis.PortReduction().reduce(
                new org.polebench.circuit.SmallSignalExpansion().expand(loaded, points),
                org.polebench.circuit.Band.LOW).stateModel();
        return low.isEmpty() ? null : new BoardModel(loaded, points, low.get(), frequenciesHz);
    }

    /** @return the back-solve's parameters for this stage, in model order, with no bench declared */
    static List<ModelParameter> parameters(Stage stage, OperatingPoints points, BoardModel model) {
        return parameters(stage, points, model, DeclaredChain.NONE);
    }

    /** @return the back-solve's parameters for this stage, in model order */
    static List<ModelParameter> parameters(Stage stage, OperatingPoints points, BoardModel model,
                                           DeclaredChain declared) {
        List<ModelParameter> result = new ArrayList<>();
        for (int i = 0; i < model.capacitors().size(); i++) {
            Capacitor capacitor = stage.capacitor(model.capacitors().get(i));
            Prior prior = bandPrior(capacitor.tolerance());
            result.add(new ModelParameter(ParameterKind.CAPACITOR, Optional.of(capacitor.name()), model.nominalFarads(i),
                    Optional.of(capacitor.tolerance()), prior, new Prior(prior.mean(), CAPACITOR_FAULT_SIGMA)));
        }
        BoardNetwork board = model.board();
        for (String name : board.transistors()) {
            Transistor transistor = stage.transistor(name);
            Prior prior = bandPrior(transistor.biasTolerance());
            result.add(new ModelParameter(ParameterKind.BIAS, Optional.of(name), points.point(name).currentAmps(),
                    Optional.of(transistor.biasTolerance()), prior, new Prior(prior.mean(), BIAS_FAULT_SIGMA)));
        }
        for (String name : board.bjts()) {
            Bjt bjt = stage.bjt(name);
            Prior prior = bandPrior(bjt.betaTolerance());
            // β is a nuisance: no hypothesis frees it, so its "fault" prior is its tolerance prior
            result.add(new ModelParameter(ParameterKind.CURRENT_GAIN, Optional.of(name), bjt.beta(),
                    Optional.of(bjt.betaTolerance()), prior, prior));
        }
        for (String name : board.resistors()) {
            Resistor resistor = stage.resistor(name);
            Prior prior = bandPrior(resistor.tolerance());
            result.add(new ModelParameter(ParameterKind.RESISTOR, Optional.of(name), resistor.ohms(),
                    Optional.of(resistor.tolerance()), prior, new Prior(prior.mean(), RESISTOR_FAULT_SIGMA)));
        }
        Prior gainDb = Prior.fromGainBandDb(stage.gainCalibrationDb());
        result.add(new ModelParameter(ParameterKind.GAIN, Optional.empty(), 0, Optional.empty(),
                new Prior(0, Decibels.toNepers(gainDb.standardDeviation())),
                new Prior(0, Decibels.toNepers(GAIN_FAULT_SIGMA_DB))));
        // the measuring channels' AC couplings, after the board model's own parameters (ChannelCouplings)
        Prior coupling = new Prior(Math.log(CHANNEL_CORNER_HZ), CHANNEL_CORNER_SIGMA);
        for (int c = 0; c < CHANNELS.size(); c++) {
            Prior prior = declared.coupling(c).orElse(coupling);
            result.add(new ModelParameter(ParameterKind.CHANNEL_CORNER, Optional.of(CHANNELS.get(c)), 1, Optional.empty(),
                    prior, prior));
        }
        return result;
    }

    private static Prior bandPrior(Tolerance tolerance) {
        if (tolerance.upperFraction() > tolerance.lowerFraction()) {
            return Prior.fromBand(tolerance.lowerFraction(), tolerance.upperFraction());
        }
        return new Prior(tolerance.lnLower(), ZERO_BAND_SIGMA);
    }
}

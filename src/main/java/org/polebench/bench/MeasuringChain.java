package org.polebench.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.GainReference;
import org.polebench.circuit.NodePair;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageInput;
import org.polebench.circuit.Tolerance;

/**
 * The bench's measuring chain applied to a stage (docs/method.md, "The bench in the model"):
 * each element enters the small-signal model where it physically sits.
 * <ul>
 *   <li>The generator's output resistance Rg is in series ahead of the stage's source
 *       resistance Rs; the stimulus is the generator's open-circuit level (its EMF).</li>
 *   <li>Each channel's R ∥ C is a load from its node to ground, as parts named
 *       {@code bench:output-R}, {@code bench:output-C}, {@code bench:input-R},
 *       {@code bench:input-C}, held at their stated values (no tolerance).</li>
 *   <li>Each AC coupling is a first-order high-pass jω/(jω + ωc) on its channel's reading
 *       ({@link Channel#readingFactor}); it does not load the node.</li>
 * </ul>
 * With {@code reference: generator} the measured ratio is V(out)·HPout over the EMF; with
 * {@code reference: input-channel} it is V(out)·HPout / (V(in)·HPin), where V(in) is the voltage
 * at the input channel's point: the stage's input node, or the generator's terminal (between Rg
 * and Rs; a node {@code bench:generator} of its own when Rs &gt; 0, with Rs as the part
 * {@value #STAGE_SOURCE_PART}). Immutable; safe to share between threads.
 */
public final class MeasuringChain {
    /** The node of the generator's terminal when the input channel sits there ahead of Rs &gt; 0. */
    public static final String GENERATOR_NODE = "bench:generator";
    /** The stage's own source resistance, as a part, when the generator's terminal is a node of its own. */
    public static final String STAGE_SOURCE_PART = "stage:source-resistance";
    /** Prefix of every part the bench adds, so that they are recognised as the bench's. */
    public static final String BENCH_PREFIX = "bench:";

    private final Bench bench;

    private MeasuringChain(Bench bench) {
        this.bench = bench;
    }

    /**
     * @param purpose what needs the corners, for the message: {@code "predict"}
     * @throws InputProblem when a channel's corner is {@code unknown}: only a fit to a sweep can
     *                      estimate it, so a prediction or a synthesized sweep needs its value
     */
    public static MeasuringChain of(Bench bench, String purpose) throws InputProblem {
        List<Channel> channels = new ArrayList<>();
        channels.add(bench.output());
        bench.input().ifPresent(i -> channels.add(i.channel()));
        for (Channel channel : channels) {
            if (channel.cornerUnknown()) {
                throw new InputProblem(bench.sourceFile(), channel.line(), purpose + " needs the AC coupling's"
                        + " corner, and the bench gives it as 'unknown'",
                        "give the corner in Hz from the instrument's data sheet, e.g. 'corner: 3.3 Hz'");
            }
        }
        return new MeasuringChain(bench);
    }

    /**
     * @return the chain for a back-solve, which estimates a corner given as {@code unknown}: the
     *         network part of the chain (Rg, the loads) does not depend on the corners
     */
    public static MeasuringChain forBackSolve(Bench bench) {
        return new MeasuringChain(bench);
    }

    public Bench bench() {
        return bench;
    }

    /**
     * @return the stage as the bench sees it: Rg added in series with the source, the gain taken
     *         against the source EMF, and every channel's R and C as parts from its node to ground
     */
    public Stage asMeasured(Stage stage) {
        return withBench(stage, true);
    }

    /**
     * @return {@link #asMeasured} without the resistances of AC-coupled channels: at DC the coupling
     *         capacitor stands between the node and the channel's resistance, so the bias is solved
     *         on this one (capacitors are open at DC either way)
     */
    public Stage forBias(Stage stage) {
        return withBench(stage, false);
    }

    /** @return the node, in {@link #asMeasured}'s stage, where the input channel reads */
    public String inputPointNode(Stage stage) {
        return splitsSource(stage) ? GENERATOR_NODE : stage.input().node();
    }

    /** @return the output channel's factor on its reading at {@code frequencyHz} (1 when DC-coupled) */
    public Complex outputFactor(double frequencyHz) {
        return bench.output().readingFactor(frequencyHz);
    }

    /** @return the input channel's factor on its reading at {@code frequencyHz} (1 when DC-coupled) */
    public Complex inputFactor(double frequencyHz) {
        return bench.inputChannel().channel().readingFactor(frequencyHz);
    }

    /**
     * The response this bench shows of a board, its bias solved with the bench in place.
     *
     * @throws InputProblem when the stage with the bench cannot be biased, or its low band is singular
     */
    public AsMeasuredResponse response(Stage board) throws InputProblem {
        return response(board, new BiasSolver().solve(forBias(board)));
    }

    /**
     * @param board  the stage as built (faults already in it)
     * @param points its operating points with the bench in place ({@link #forBias}), possibly with
     *               a scaled bias current
     * @throws InputProblem when the low band of the board with the bench is singular
     */
    public AsMeasuredResponse response(Stage board, OperatingPoints points) throws InputProblem {
        Stage measured = asMeasured(board);
        SmallSignalNetwork out = new SmallSignalExpansion().expand(measured, points);
        Optional<SmallSignalNetwork> in = Optional.empty();
        if (bench.referenceFor(board) == Reference.INPUT_CHANNEL) {
            int node = out.nodes().indexOf(inputPointNode(board));
            if (node > 0 && node != out.drivenNode()) {
                in = Optional.of(new SmallSignalNetwork(out.nodes(), out.elements(), out.drivenNode(), node));
            }
        }
        Channel inChannel = bench.referenceFor(board) == Reference.INPUT_CHANNEL ? bench.inputChannel().channel()
                : Channel.IDEAL;
        return new AsMeasuredResponse(new FullResponse(out), in.map(FullResponse::new), lowBand(out, board),
                in.isPresent() ? Optional.of(lowBand(in.get(), board)) : Optional.empty(), bench.output(), inChannel);
    }

    private static StateModel lowBand(SmallSignalNetwork network, Stage board) throws InputProblem {
        Reduction low = new PortReduction().reduce(network, Band.LOW);
        Optional<Reduction.Singular> singular = low.singular();
        if (singular.isPresent()) {
            throw new InputProblem(board.sourceFile(), 0, "with the bench in place the stage's low band is singular: "
                    + singular.get().kind().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' '),
                    "check the stage alone with 'polebench predict', then the bench file's values");
        }
        // a reduction that is not singular has a model (Reduction's Javadoc)
        return low.stateModel().orElseThrow();
    }

    private boolean splitsSource(Stage stage) {
        return bench.input().isPresent() && bench.input().get().at() == ProbePoint.GENERATOR
                && stage.input().sourceOhms() > 0;
    }

    private Stage withBench(Stage stage, boolean acLoads) {
        StageInput input = stage.input();
        List<Part> parts = new ArrayList<>(stage.parts());
        StageInput measuredInput;
        if (splitsSource(stage)) {
            measuredInput = new StageInput(GENERATOR_NODE, bench.generatorOhms(), GainReference.SOURCE_EMF, input.line());
            parts.add(new Resistor(STAGE_SOURCE_PART, new NodePair(GENERATOR_NODE, input.node()), input.sourceOhms(),
                    Tolerance.symmetric(0), input.line()));
        } else {
            measuredInput = new StageInput(input.node(), input.sourceOhms() + bench.generatorOhms(),
                    GainReference.SOURCE_EMF, input.line());
        }
        addLoads(parts, bench.output(), "output", stage.output().node(), stage.ground(), acLoads);
        if (bench.input().isPresent()) {
            addLoads(parts, bench.input().get().channel(), "input", inputPointNode(stage), stage.ground(), acLoads);
        }
        return stage.withInput(measuredInput).withParts(parts);
    }

    private static void addLoads(List<Part> parts, Channel channel, String which, String node, String ground,
                                 boolean acLoads) {
        if (channel.ohms().isPresent() && (acLoads || channel.coupling() == Coupling.DC)) {
            parts.add(new Resistor(BENCH_PREFIX + which + "-R", new NodePair(node, ground),
                    channel.ohms().getAsDouble(), Tolerance.symmetric(0), channel.line()));
        }
        if (channel.farads().isPresent()) {
            double farads = channel.farads().getAsDouble();
            parts.add(new Capacitor(BENCH_PREFIX + which + "-C", new NodePair(node, ground), farads,
                    Tolerance.symmetric(0), Capacitor.defaultBand(farads), channel.line()));
        }
    }
}

package org.polebench.circuit;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.polebench.InputProblem;

/**
 * Solves a stage's DC operating point by modified nodal analysis (MNA: Ho, Ruehli and Brennan,
 * IEEE Trans. Circuits and Systems 22(6), 1975). The DC network: capacitors open; each supply an
 * ideal source to ground; the generator's EMF 0 V behind its source resistance (an ideal 0 V
 * source when that is 0 Ω); the load a resistor to ground.
 *
 * <p>Transistors with {@code bias: auto} (DESIGN.md "Conventions"):
 * <ul>
 *   <li>BJT, forward active: an ideal VBE(on) source from base to emitter (emitter to base for a
 *       PNP) and a collector current β·IB; the Early effect is ignored. This part is linear and is
 *       solved exactly by one LU solve.</li>
 *   <li>MOSFET, saturation: ID = (k/2)·(VGS − Vth)², λ ignored, with the body effect
 *       Vth = Vth0 + γ·(√(2φF + VSB) − √(2φF)) when a body terminal and γ are given (Sedra and
 *       Smith, Microelectronic Circuits, from memory). Solved by Newton's method with backtracking
 *       on the MNA residual; below threshold the law is continued as −(k/2)(VGS − Vth)² so that
 *       Newton has a slope everywhere, and a solution there is reported as cut off.</li>
 * </ul>
 * A transistor with a given current ({@code bias: {ic: ..}} / {@code {id: ..}}) is a pair of
 * current sources: IC and IB = IC/β for a BJT, ID for a MOSFET; its VBE or VGS is then what the
 * network gives.
 *
 * <p>Accepted only in the amplifying region; otherwise an {@link InputProblem} names the
 * transistor, with a hint. Thresholds: a BJT is saturated when VCE &lt; {@value #VCE_SAT_VOLTS} V
 * (VCE(sat) ≈ 0.2 V, common practice) and cut off when the solve needs IB ≤ 0; a MOSFET is in
 * the triode region when VDS &lt; VGS − Vth and cut off when VGS ≤ Vth.
 */
public final class BiasSolver {
    /** VCE(sat): below this a BJT counts as saturated (common practice, 0.2 V for small-signal silicon). */
    public static final double VCE_SAT_VOLTS = 0.2;

    private static final int MAX_NEWTON_STEPS = 200;
    private static final int MAX_HALVINGS = 60;
    // a floor on the Jacobian's MOSFET slope only, so that a start exactly at threshold is not singular
    private static final double SLOPE_FLOOR_SIEMENS = 1e-12;

    /** @return the operating points of every transistor, or a problem naming the one that fails */
    public OperatingPoints solve(Stage stage) throws InputProblem {
        requireDcPaths(stage);
        return solveLaidOut(stage, new NodeIndex(stage));
    }

    private static void requireDcPaths(Stage stage) throws InputProblem {
        Optional<StageTopology.FloatingNode> floating = StageTopology.floatingNode(stage, false);
        if (floating.isPresent()) {
            StageTopology.FloatingNode f = floating.get();
            String given = givenTransistorsAt(stage, f.node());
            throw new InputProblem(stage.sourceFile(), f.line(), (given.isEmpty() ? "" : "the bias of " + given
                    + " cannot be solved: ") + "node '" + f.node() + "' has no DC path to ground"
                    + (given.isEmpty() ? "" : " once the given current is treated as a current source")
                    + " (it connects only to " + String.join(", ", f.touching()) + ")",
                    given.isEmpty() ? f.hint() : "give '" + f.node() + "' a resistor path to ground or a rail,"
                            + " or use 'bias: auto' for " + given);
        }
    }

    /**
     * Runs the structural checks of {@link #solve} once, for many draws of one stage (a Monte
     * Carlo tolerance spread): the draws keep the stage's parts, nodes, supplies, input and
     * output and change only values, so a node with no DC path cannot appear in a draw.
     *
     * @return a solver for draws of {@code stage}
     * @throws InputProblem when the stage has a node with no DC path ({@link #solve}'s first check)
     */
    public Prepared prepare(Stage stage) throws InputProblem {
        requireDcPaths(stage);
        return new Prepared(this, stage, new NodeIndex(stage));
    }

    private OperatingPoints solveLaidOut(Stage stage, NodeIndex nodes) throws InputProblem {
        List<Transistor> transistors = stage.transistors();
        Circuit circuit = new Circuit(stage, transistors, null, nodes);
        double[] x = circuit.solve();
        OperatingPoints points = circuit.points(x);
        for (Transistor transistor : transistors) {
            check(stage, transistor, circuit, x);
        }
        return points;
    }

    /**
     * {@link BiasSolver#solve} for draws of one checked stage: the same solve, region checks and
     * problems, without the structural check and with the node numbering built once. Immutable;
     * one instance serves any thread.
     */
    public static final class Prepared {
        private final BiasSolver solver;
        private final Stage nominal;
        private final NodeIndex nodes;

        private Prepared(BiasSolver solver, Stage nominal, NodeIndex nodes) {
            this.solver = solver;
            this.nominal = nominal;
            this.nodes = nodes;
        }

        /**
         * @param draw the prepared stage with other values: the same parts in the same order, on
         *             the same nodes, with the same supplies, input, output and kinds of bias
         * @return the operating points, as {@link BiasSolver#solve} gives them for {@code draw}
         * @throws InputProblem when a transistor of the draw leaves its amplifying region
         * @throws IllegalArgumentException when the draw is not laid out as the prepared stage
         */
        public OperatingPoints solve(Stage draw) throws InputProblem {
            if (!StageLayout.isDrawOf(draw, nominal)) {
                throw new IllegalArgumentException("stage " + draw.name() + " is not a draw of " + nominal.name());
            }
            return solver.solveLaidOut(draw, nodes);
        }
    }

    /** The DC unknowns' numbering: every node but ground, in {@link Stage#nodes()} order. */
    private static final class NodeIndex {
        private final String ground;
        private final Map<String, Integer> index = new LinkedHashMap<>();

        NodeIndex(Stage stage) {
            this.ground = stage.ground();
            for (String node : stage.nodes()) {
                if (!node.equals(ground)) {
                    index.put(node, index.size());
                }
            }
        }

        int size() {
            return index.size();
        }

        /** @return the nodes but ground, in row order */
        Iterable<String> nodes() {
            return index.keySet();
        }

        /** @return the node's row, −1 for ground */
        int row(String node) {
            return node.equals(ground) ? -1 : index.get(node);
        }
    }

    private static String givenTransistorsAt(Stage stage, String node) {
        List<String> names = new ArrayList<>();
        for (Transistor transistor : stage.transistors()) {
            if (transistor.bias() instanceof Bias.Given && ((Part) transistor).terminalNodes().contains(node)) {
                names.add(transistor.name());
            }
        }
        return String.join(", ", names);
    }

    private void check(Stage stage, Transistor transistor, Circuit circuit, double[] x) throws InputProblem {
        boolean given = transistor.bias() instanceof Bias.Given;
        if (transistor instanceof Bjt) {
            Bjt bjt = (Bjt) transistor;
            int s = bjt.polarity().sign();
            double baseAmps = given ? 0 : circuit.baseCurrent(bjt, x);
            String vbe = bjt.polarity() == Bjt.Polarity.NPN ? "VBE" : "VEB";
            String vce = bjt.polarity() == Bjt.Polarity.NPN ? "VCE" : "VEC";
            if (!given && !(baseAmps > 0)) {
                throw new InputProblem(stage.sourceFile(), bjt.line(), bjt.name() + " is cut off: its "
                        + bjt.polarity().word() + " base–emitter junction would need a base current of "
                        + amps(baseAmps) + " to sit at " + vbe + "(on) = " + volts(bjt.vbeOnVolts()),
                        cutOffHint(stage, bjt, bjt.base(), vbe + "(on)", bjt.vbeOnVolts()));
            }
            double vceVolts = s * (circuit.volts(bjt.collector(), x) - circuit.volts(bjt.emitter(), x));
            if (vceVolts < VCE_SAT_VOLTS) {
                double ic = given ? ((Bias.Given) bjt.bias()).amps() : bjt.beta() * baseAmps;
                throw new InputProblem(stage.sourceFile(), bjt.line(), bjt.name() + " is saturated: " + vce
                        + " would be " + volts(vceVolts) + ", under " + vce + "(sat) = " + volts(VCE_SAT_VOLTS)
                        + ", at IC = " + amps(ic),
                        "the resistors at the collector and emitter (" + resistorsAt(stage, bjt.collector(),
                                bjt.emitter()) + ") drop too much at this current: less bias current (a lower"
                                + " base bias or a larger emitter resistor) or a smaller collector resistor would"
                                + " bring it into the active region");
            }
        } else {
            Mosfet mosfet = (Mosfet) transistor;
            int s = mosfet.channel().sign();
            double vgs = s * (circuit.volts(mosfet.gate(), x) - circuit.volts(mosfet.source(), x));
            double vth = circuit.threshold(mosfet, x);
            String vgsName = s > 0 ? "VGS" : "VSG";
            String vdsName = s > 0 ? "VDS" : "VSD";
            double overdrive;
            double id;
            if (given) {
                id = ((Bias.Given) mosfet.bias()).amps();
                overdrive = Math.sqrt(2 * id / mosfet.kAmpsPerVoltSquared());
            } else {
                overdrive = vgs - vth;
                if (!(overdrive > 0)) {
                    throw new InputProblem(stage.sourceFile(), mosfet.line(), mosfet.name() + " is cut off: "
                            + vgsName + " stays below its threshold of " + volts(vth),
                            cutOffHint(stage, mosfet, mosfet.gate(), "the threshold", vth));
                }
                id = 0.5 * mosfet.kAmpsPerVoltSquared() * overdrive * overdrive;
            }
            double vds = s * (circuit.volts(mosfet.drain(), x) - circuit.volts(mosfet.source(), x));
            if (vds < overdrive) {
                throw new InputProblem(stage.sourceFile(), mosfet.line(), mosfet.name() + " is in the triode"
                        + " region: " + vdsName + " would be " + volts(vds) + ", under " + vgsName + " − Vth = "
                        + volts(overdrive) + ", at ID = " + amps(id),
                        "the resistors at the drain and source (" + resistorsAt(stage, mosfet.drain(),
                                mosfet.source()) + ") drop too much at this current: less bias current (a lower"
                                + " gate bias or a larger source resistor) or a smaller drain resistor would bring"
                                + " it into saturation");
            }
        }
    }

    /** A hint for a cut-off transistor: the control voltage the network applies with it removed. */
    private String cutOffHint(Stage stage, Transistor transistor, String controlNode, String needed,
                              double neededVolts) {
        String held = "";
        try {
            Circuit without = new Circuit(stage, transistor.name());
            double[] x = without.solve();
            int s;
            String common;
            String pair;
            if (transistor instanceof Bjt) {
                s = ((Bjt) transistor).polarity().sign();
                common = ((Bjt) transistor).emitter();
                pair = s > 0 ? "base–emitter" : "emitter–base";
            } else {
                s = ((Mosfet) transistor).channel().sign();
                common = ((Mosfet) transistor).source();
                pair = s > 0 ? "gate–source" : "source–gate";
            }
            double applied = s * (without.volts(controlNode, x) - without.volts(common, x));
            held = "with " + transistor.name() + " off, the network holds its " + pair + " at " + volts(applied)
                    + ", short of " + needed + " (" + volts(neededVolts) + "); ";
        } catch (InputProblem | RuntimeException e) {
            // without the transistor the network may have floating nodes: the hint goes without the number
            held = "";
        }
        return held + "raise the bias at the " + (transistor instanceof Bjt ? "base" : "gate") + " (check "
                + resistorsAt(stage, controlNode) + ")";
    }

    private static String resistorsAt(Stage stage, String... nodes) {
        List<String> names = new ArrayList<>();
        for (Resistor resistor : stage.resistors()) {
            for (String node : nodes) {
                NodePair pair = resistor.between();
                if (pair.a().equals(node) || pair.b().equals(node)) {
                    String other = pair.a().equals(node) ? pair.b() : pair.a();
                    String entry = resistor.name() + " to " + other;
                    if (!names.contains(entry)) {
                        names.add(entry);
                    }
                }
            }
        }
        return names.isEmpty() ? "no resistor connects there" : String.join(", ", names);
    }

    private static String volts(double value) {
        return round(value) + " V";
    }

    private static String amps(double value) {
        return org.polebench.units.EngineeringValue.format(value, "A");
    }

    private static String round(double value) {
        return new BigDecimal(value).round(new MathContext(3)).stripTrailingZeros().toPlainString();
    }

    /**
     * The DC MNA system of one stage: unknowns are the node voltages (ground excluded), then one
     * current per ideal source (supplies, a 0 Ω generator, each auto BJT's VBE(on)).
     */
    private static final class Circuit {
        private final Stage stage;
        private final List<Transistor> transistors;
        private final NodeIndex index;
        private final List<Source> sources = new ArrayList<>();
        private final List<Mosfet> nonlinear = new ArrayList<>();
        private final Map<String, Integer> junctionSource = new LinkedHashMap<>();
        private final double[][] g;
        private final double[] b;
        private final int nodeCount;

        private record Source(String plus, String minus, double volts, String name) {
        }

        /** @param excluded a transistor left out (for a cut-off hint), or null */
        Circuit(Stage stage, String excluded) throws InputProblem {
            this(stage, stage.transistors(), excluded, new NodeIndex(stage));
        }

        /** @param transistors the stage's transistors, {@link Stage#transistors()} */
        Circuit(Stage stage, List<Transistor> transistors, String excluded, NodeIndex index) {
            this.stage = stage;
            this.transistors = transistors;
            this.index = index;
            nodeCount = index.size();
            for (Supply supply : stage.supplies()) {
                sources.add(new Source(supply.node(), stage.ground(), supply.volts(), supply.node()));
            }
            if (stage.input().sourceOhms() == 0) {
                sources.add(new Source(stage.input().node(), stage.ground(), 0, "generator"));
            }
            for (Transistor transistor : transistors) {
                if (transistor.name().equals(excluded)) {
                    continue;
                }
                if (transistor instanceof Bjt && transistor.bias() instanceof Bias.Auto) {
                    Bjt bjt = (Bjt) transistor;
                    junctionSource.put(bjt.name(), sources.size());
                    sources.add(bjt.polarity() == Bjt.Polarity.NPN
                            ? new Source(bjt.base(), bjt.emitter(), bjt.vbeOnVolts(), bjt.name())
                            : new Source(bjt.emitter(), bjt.base(), bjt.vbeOnVolts(), bjt.name()));
                } else if (transistor instanceof Mosfet && transistor.bias() instanceof Bias.Auto) {
                    nonlinear.add((Mosfet) transistor);
                }
            }
            int size = nodeCount + sources.size();
            g = new double[size][size];
            b = new double[size];
            for (Resistor resistor : stage.resistors()) {
                conductance(resistor.between().a(), resistor.between().b(), 1 / resistor.ohms());
            }
            if (stage.input().sourceOhms() > 0) {
                conductance(stage.input().node(), stage.ground(), 1 / stage.input().sourceOhms());
            }
            if (stage.output().loadOhms().isPresent()) {
                conductance(stage.output().node(), stage.ground(), 1 / stage.output().loadOhms().getAsDouble());
            }
            for (int k = 0; k < sources.size(); k++) {
                Source source = sources.get(k);
                int row = nodeCount + k;
                stamp(source.plus(), row, 1);
                stamp(source.minus(), row, -1);
                b[row] = source.volts();
            }
            for (Transistor transistor : transistors) {
                if (transistor.name().equals(excluded)) {
                    continue;
                }
                if (transistor instanceof Bjt) {
                    Bjt bjt = (Bjt) transistor;
                    if (transistor.bias() instanceof Bias.Auto) {
                        // collector current β·IB, with IB the junction source's current
                        int column = nodeCount + junctionSource.get(bjt.name());
                        String from = bjt.polarity() == Bjt.Polarity.NPN ? bjt.collector() : bjt.emitter();
                        String to = bjt.polarity() == Bjt.Polarity.NPN ? bjt.emitter() : bjt.collector();
                        add(from, column, bjt.beta());
                        add(to, column, -bjt.beta());
                    } else {
                        double ic = ((Bias.Given) bjt.bias()).amps();
                        double ib = ic / bjt.beta();
                        if (bjt.polarity() == Bjt.Polarity.NPN) {
                            inject(bjt.base(), bjt.emitter(), ib);
                            inject(bjt.collector(), bjt.emitter(), ic);
                        } else {
                            inject(bjt.emitter(), bjt.base(), ib);
                            inject(bjt.emitter(), bjt.collector(), ic);
                        }
                    }
                } else if (transistor.bias() instanceof Bias.Given) {
                    Mosfet mosfet = (Mosfet) transistor;
                    double id = ((Bias.Given) mosfet.bias()).amps();
                    if (mosfet.channel() == Mosfet.Channel.NMOS) {
                        inject(mosfet.drain(), mosfet.source(), id);
                    } else {
                        inject(mosfet.source(), mosfet.drain(), id);
                    }
                }
            }
        }

        private int row(String node) {
            return index.row(node);
        }

        private void conductance(String a, String bNode, double siemens) {
            int i = row(a);
            int j = row(bNode);
            if (i >= 0) {
                g[i][i] += siemens;
            }
            if (j >= 0) {
                g[j][j] += siemens;
            }
            if (i >= 0 && j >= 0) {
                g[i][j] -= siemens;
                g[j][i] -= siemens;
            }
        }

        /** An ideal source's incidence: its current leaves {@code node} (sign +1) or enters it (−1). */
        private void stamp(String node, int sourceRow, double sign) {
            int i = row(node);
            if (i >= 0) {
                g[i][sourceRow] += sign;
                g[sourceRow][i] += sign;
            }
        }

        private void add(String node, int column, double value) {
            int i = row(node);
            if (i >= 0) {
                g[i][column] += value;
            }
        }

        /** A fixed current {@code amps} taken out of {@code from} and returned into {@code to}. */
        private void inject(String from, String to, double amps) {
            int i = row(from);
            int j = row(to);
            if (i >= 0) {
                b[i] -= amps;
            }
            if (j >= 0) {
                b[j] += amps;
            }
        }

        double volts(String node, double[] x) {
            int i = row(node);
            return i < 0 ? 0 : x[i];
        }

        /** @return IB (magnitude in the device's sense) of an auto BJT from the junction source's current */
        double baseCurrent(Bjt bjt, double[] x) {
            return x[nodeCount + junctionSource.get(bjt.name())];
        }

        /** @return the threshold in the device's own sense at the solved source–body voltage */
        double threshold(Mosfet mosfet, double[] x) {
            return thresholdAt(mosfet, sourceBody(mosfet, x));
        }

        private double sourceBody(Mosfet mosfet, double[] x) {
            if (mosfet.body().isEmpty()) {
                return 0;
            }
            return mosfet.channel().sign() * (volts(mosfet.source(), x) - volts(mosfet.body().get(), x));
        }

        private static double thresholdAt(Mosfet mosfet, double vsb) {
            if (!mosfet.hasBodyEffect()) {
                return mosfet.thresholdMagnitudeVolts();
            }
            double phi = mosfet.surfacePotentialVolts();
            return mosfet.thresholdMagnitudeVolts()
                    + mosfet.gammaRootVolts() * (Math.sqrt(bodyArgument(phi, vsb)) - Math.sqrt(phi));
        }

        /** 2φF + VSB, kept above 1 % of 2φF: a body forward biased past 2φF is outside the model. */
        private static double bodyArgument(double phi, double vsb) {
            return Math.max(phi + vsb, 0.01 * phi);
        }

        double[] solve() throws InputProblem {
            int size = b.length;
            if (nonlinear.isEmpty()) {
                return linearSolve(g, b);
            }
            double[] x = new double[size];
            double[] residual = residual(x);
            double norm = norm(residual);
            for (int step = 0; step < MAX_NEWTON_STEPS; step++) {
                double[] minus = new double[size];
                for (int i = 0; i < size; i++) {
                    minus[i] = -residual[i];
                }
                double[] delta = linearSolve(jacobian(x), minus);
                double full = 0;
                double scale = 1;
                for (int i = 0; i < nodeCount; i++) {
                    full = Math.max(full, Math.abs(delta[i]));
                    scale = Math.max(scale, Math.abs(x[i]));
                }
                // converged when a full Newton step moves no node by more than round-off
                if (full <= 1e-13 * scale) {
                    return x;
                }
                double t = 1;
                boolean decreased = false;
                double[] trial = new double[size];
                for (int halving = 0; halving <= MAX_HALVINGS && !decreased; halving++) {
                    for (int i = 0; i < size; i++) {
                        trial[i] = x[i] + t * delta[i];
                    }
                    double[] trialResidual = residual(trial);
                    double trialNorm = norm(trialResidual);
                    if (trialNorm < norm) {
                        decreased = true;
                        x = trial.clone();
                        residual = trialResidual;
                        norm = trialNorm;
                    }
                    t /= 2;
                }
                if (!decreased) {
                    // no step lowers the residual: at round-off if the Newton step is already tiny
                    if (full <= 1e-9 * scale) {
                        return x;
                    }
                    break;
                }
            }
            throw new InputProblem(stage.sourceFile(), nonlinear.get(0).line(),
                    "the bias of " + String.join(", ", nonlinear.stream().map(Mosfet::name).toList())
                            + " did not converge in " + MAX_NEWTON_STEPS + " Newton steps",
                    "check vth, k and the gate bias; or give the measured current as 'bias: {id: 1m}'");
        }

        private double[] residual(double[] x) {
            int size = b.length;
            double[] r = new double[size];
            for (int i = 0; i < size; i++) {
                double sum = -b[i];
                for (int j = 0; j < size; j++) {
                    sum += g[i][j] * x[j];
                }
                r[i] = sum;
            }
            for (Mosfet mosfet : nonlinear) {
                double current = mosfet.channel().sign() * channelCurrent(mosfet, x);
                addAt(r, mosfet.drain(), current);
                addAt(r, mosfet.source(), -current);
            }
            return r;
        }

        /** @return (k/2)·u·|u| with u = VGS − Vth in the device's sense: the square law, continued below threshold */
        private double channelCurrent(Mosfet mosfet, double[] x) {
            double u = overdrive(mosfet, x);
            return 0.5 * mosfet.kAmpsPerVoltSquared() * u * Math.abs(u);
        }

        private double overdrive(Mosfet mosfet, double[] x) {
            int s = mosfet.channel().sign();
            double vgs = s * (volts(mosfet.gate(), x) - volts(mosfet.source(), x));
            return vgs - threshold(mosfet, x);
        }

        private double[][] jacobian(double[] x) {
            int size = b.length;
            double[][] j = new double[size][];
            for (int i = 0; i < size; i++) {
                j[i] = g[i].clone();
            }
            for (Mosfet mosfet : nonlinear) {
                int s = mosfet.channel().sign();
                double slope = Math.max(mosfet.kAmpsPerVoltSquared() * Math.abs(overdrive(mosfet, x)),
                        SLOPE_FLOOR_SIEMENS);
                double thresholdSlope = 0;
                if (mosfet.hasBodyEffect()) {
                    double vsb = sourceBody(mosfet, x);
                    double argument = mosfet.surfacePotentialVolts() + vsb;
                    thresholdSlope = argument > 0.01 * mosfet.surfacePotentialVolts()
                            ? mosfet.gammaRootVolts() / (2 * Math.sqrt(argument)) : 0;
                }
                // u = s(VG − VS) − Vth(s(VS − VB)); the current s·f(u) flows from drain to source
                double[][] derivative = {
                        {row(mosfet.gate()), s},
                        {row(mosfet.source()), -s * (1 + thresholdSlope)},
                        {mosfet.hasBodyEffect() ? row(mosfet.body().get()) : -1, s * thresholdSlope}};
                for (double[] d : derivative) {
                    int column = (int) d[0];
                    if (column < 0 || d[1] == 0) {
                        continue;
                    }
                    double value = s * slope * d[1];
                    int drain = row(mosfet.drain());
                    int source = row(mosfet.source());
                    if (drain >= 0) {
                        j[drain][column] += value;
                    }
                    if (source >= 0) {
                        j[source][column] -= value;
                    }
                }
            }
            return j;
        }

        private void addAt(double[] r, String node, double value) {
            int i = row(node);
            if (i >= 0) {
                r[i] += value;
            }
        }

        private static double norm(double[] r) {
            double sum = 0;
            for (double v : r) {
                sum += v * v;
            }
            return Math.sqrt(sum);
        }

        private double[] linearSolve(double[][] matrix, double[] rhs) throws InputProblem {
            // an absolute pivot floor far below any conductance a stage holds (1 TΩ is 1e-12 S)
            RealLu lu = new RealLu(matrix, 1e-300);
            if (lu.isNonSingular()) {
                double[] x = lu.solve(rhs);
                if (allFinite(x)) {
                    return x;
                }
            }
            Transistor first = transistors.isEmpty() ? null : transistors.get(0);
            throw new InputProblem(stage.sourceFile(), first == null ? 0 : first.line(),
                    "the DC operating point cannot be solved: the DC network is singular",
                    "look for a node fixed by two ideal sources or one with no DC path to ground");
        }

        private static boolean allFinite(double[] x) {
            for (double v : x) {
                if (!Double.isFinite(v)) {
                    return false;
                }
            }
            return true;
        }

        OperatingPoints points(double[] x) {
            Map<String, Double> nodeVolts = new LinkedHashMap<>();
            nodeVolts.put(stage.ground(), 0.0);
            for (String node : index.nodes()) {
                nodeVolts.put(node, x[index.row(node)]);
            }
            List<OperatingPoint> points = new ArrayList<>();
            for (Transistor transistor : transistors) {
                boolean given = transistor.bias() instanceof Bias.Given;
                if (transistor instanceof Bjt) {
                    Bjt bjt = (Bjt) transistor;
                    int s = bjt.polarity().sign();
                    double ic = given ? ((Bias.Given) bjt.bias()).amps() : bjt.beta() * baseCurrent(bjt, x);
                    Map<String, Double> terminals = new LinkedHashMap<>();
                    terminals.put("c", volts(bjt.collector(), x));
                    terminals.put("b", volts(bjt.base(), x));
                    terminals.put("e", volts(bjt.emitter(), x));
                    points.add(new OperatingPoint.BjtPoint(bjt.name(), Region.FORWARD_ACTIVE, ic, ic / bjt.beta(),
                            s * (terminals.get("c") - terminals.get("e")),
                            s * (terminals.get("b") - terminals.get("e")), given, terminals));
                } else {
                    Mosfet mosfet = (Mosfet) transistor;
                    int s = mosfet.channel().sign();
                    double vth = threshold(mosfet, x);
                    double vgs = s * (volts(mosfet.gate(), x) - volts(mosfet.source(), x));
                    double id = given ? ((Bias.Given) mosfet.bias()).amps()
                            : 0.5 * mosfet.kAmpsPerVoltSquared() * (vgs - vth) * (vgs - vth);
                    Map<String, Double> terminals = new LinkedHashMap<>();
                    terminals.put("d", volts(mosfet.drain(), x));
                    terminals.put("g", volts(mosfet.gate(), x));
                    terminals.put("s", volts(mosfet.source(), x));
                    mosfet.body().ifPresent(body -> terminals.put("b", volts(body, x)));
                    points.add(new OperatingPoint.MosfetPoint(mosfet.name(), Region.SATURATION, id,
                            s * (terminals.get("d") - terminals.get("s")), vgs, sourceBody(mosfet, x), vth, given,
                            terminals));
                }
            }
            return new OperatingPoints(nodeVolts, points);
        }
    }
}

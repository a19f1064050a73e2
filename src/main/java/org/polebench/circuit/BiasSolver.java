package org.polebench.circuit;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.linalg.RealLu;

/**
 * Solves a stage's DC operating point by modified nodal analysis (MNA: Ho, Ruehli and Brennan,
 * IEEE Trans. Circuits and Systems 22(6), 1975). The DC network: capacitors open; each supply an
 * ideal source to ground; the generator's EMF 0 V behind its source resistance (an ideal 0 V
 * source when that is 0 Ω); the load a resistor to ground.
 *
 * <p>Transistors with {@code bias: auto} (docs/method.md, "The small-signal network"):
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
        return solveLaidOut(stage, new Circuit(stage, null));
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
        return new Prepared(stage, new Circuit(stage, null));
    }

    private static OperatingPoints solveLaidOut(Stage stage, Circuit circuit) throws InputProblem {
        double[] values = stage.partValues();
        double[] x = circuit.solve(values);
        for (int t = 0; t < circuit.transistorCount(); t++) {
            Fault fault = circuit.fault(t, values, x);
            if (fault != Fault.NONE) {
                throw problem(stage, t, fault, circuit, values, x);
            }
        }
        return circuit.points(values, x);
    }

    /**
     * {@link BiasSolver#solve} for draws of one checked stage: the same solve, region checks and
     * problems, without the structural check and with the DC network laid out once (rows of
     * every part, sources, unknowns). Immutable; one instance serves any thread.
     */
    public static final class Prepared {
        private final Stage nominal;
        private final Circuit circuit;

        private Prepared(Stage nominal, Circuit circuit) {
            this.nominal = nominal;
            this.circuit = circuit;
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
            return solveLaidOut(draw, circuit);
        }

        /**
         * The bias of one draw given as numbers, for a Monte Carlo spread: the solve and region
         * test of {@link #solve(Stage)} on the prepared stage with {@code partValues}, without
         * building operating points or a problem's text.
         *
         * @param partValues      the draw's values, one per part as {@link Stage#partValues()}
         *                        orders them
         * @param currentAmps     filled with each transistor's IC or ID in amperes (positive), in
         *                        {@link Stage#transistors()} order
         * @param sourceBodyVolts filled with each transistor's VSB in the device's sense, in volts
         *                        (0 for a BJT and for a MOSFET without a body terminal)
         * @return true when every transistor is in its amplifying region; false where
         *         {@link #solve(Stage)} would throw (then the arrays hold nothing of use)
         */
        public boolean solveInRegion(double[] partValues, double[] currentAmps, double[] sourceBodyVolts) {
            if (partValues.length != nominal.parts().size()) {
                throw new IllegalArgumentException(partValues.length + " values for the " + nominal.parts().size()
                        + " parts of " + nominal.name());
            }
            double[] x;
            try {
                x = circuit.solve(partValues);
            } catch (InputProblem notSolvable) {
                return false;
            }
            for (int t = 0; t < circuit.transistorCount(); t++) {
                if (circuit.fault(t, partValues, x) != Fault.NONE) {
                    return false;
                }
                currentAmps[t] = circuit.currentAmps(t, partValues, x);
                sourceBodyVolts[t] = circuit.sourceBody(t, x);
            }
            return true;
        }
    }

    /** Why a solved transistor is not in its amplifying region (see the class comment's thresholds). */
    private enum Fault {
        NONE, CUT_OFF, SATURATED, TRIODE
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
            if (transistor.bias().givenAmps().isPresent() && transistor.terminalNodes().contains(node)) {
                names.add(transistor.name());
            }
        }
        return String.join(", ", names);
    }

    /** The problem {@link #solve} reports for transistor t of {@code stage}, out of its region by {@code fault}. */
    private static InputProblem problem(Stage stage, int t, Fault fault, Circuit circuit, double[] values,
                                        double[] x) {
        return circuit.transistor(t).match(new Transistor.Cases<>() {
            @Override
            public InputProblem bjt(Bjt bjt) {
                return bjtProblem(stage, t, fault, circuit, values, x, bjt);
            }

            @Override
            public InputProblem mosfet(Mosfet mosfet) {
                return mosfetProblem(stage, t, fault, circuit, values, x, mosfet);
            }
        });
    }

    private static InputProblem bjtProblem(Stage stage, int t, Fault fault, Circuit circuit, double[] values,
                                           double[] x, Bjt bjt) {
        String vbe = bjt.polarity() == Bjt.Polarity.NPN ? "VBE" : "VEB";
        String vce = bjt.polarity() == Bjt.Polarity.NPN ? "VCE" : "VEC";
        if (fault == Fault.CUT_OFF) {
            return new InputProblem(stage.sourceFile(), bjt.line(), bjt.name() + " is cut off: its "
                    + bjt.polarity().word() + " base–emitter junction would need a base current of "
                    + amps(circuit.baseCurrent(t, x)) + " to sit at " + vbe + "(on) = " + volts(bjt.vbeOnVolts()),
                    cutOffHint(stage, bjt, bjt.base(), vbe + "(on)", bjt.vbeOnVolts()));
        }
        return new InputProblem(stage.sourceFile(), bjt.line(), bjt.name() + " is saturated: " + vce
                + " would be " + volts(circuit.mainVolts(t, x)) + ", under " + vce + "(sat) = "
                + volts(VCE_SAT_VOLTS) + ", at IC = " + amps(circuit.currentAmps(t, values, x)),
                "the resistors at the collector and emitter (" + resistorsAt(stage, bjt.collector(),
                        bjt.emitter()) + ") drop too much at this current: less bias current (a lower"
                        + " base bias or a larger emitter resistor) or a smaller collector resistor would"
                        + " bring it into the active region");
    }

    private static InputProblem mosfetProblem(Stage stage, int t, Fault fault, Circuit circuit, double[] values,
                                              double[] x, Mosfet mosfet) {
        String vgsName = mosfet.channel().sign() > 0 ? "VGS" : "VSG";
        String vdsName = mosfet.channel().sign() > 0 ? "VDS" : "VSD";
        if (fault == Fault.CUT_OFF) {
            double vth = circuit.threshold(t, x);
            return new InputProblem(stage.sourceFile(), mosfet.line(), mosfet.name() + " is cut off: "
                    + vgsName + " stays below its threshold of " + volts(vth),
                    cutOffHint(stage, mosfet, mosfet.gate(), "the threshold", vth));
        }
        return new InputProblem(stage.sourceFile(), mosfet.line(), mosfet.name() + " is in the triode"
                + " region: " + vdsName + " would be " + volts(circuit.mainVolts(t, x)) + ", under " + vgsName
                + " − Vth = " + volts(circuit.testedOverdrive(t, x)) + ", at ID = "
                + amps(circuit.currentAmps(t, values, x)),
                "the resistors at the drain and source (" + resistorsAt(stage, mosfet.drain(),
                        mosfet.source()) + ") drop too much at this current: less bias current (a lower"
                        + " gate bias or a larger source resistor) or a smaller drain resistor would bring"
                        + " it into saturation");
    }

    /** A hint for a cut-off transistor: the control voltage the network applies with it removed. */
    private static String cutOffHint(Stage stage, Transistor transistor, String controlNode, String needed,
                                     double neededVolts) {
        String held = "";
        try {
            Circuit without = new Circuit(stage, transistor.name());
            double[] x = without.solve(stage.partValues());
            int s = transistor.sign();
            String common = transistor.commonNode();
            String pair = s > 0 ? transistor.controlTerminal() + "–" + transistor.commonTerminal()
                    : transistor.commonTerminal() + "–" + transistor.controlTerminal();
            double applied = s * (without.volts(controlNode, x) - without.volts(common, x));
            held = "with " + transistor.name() + " off, the network holds its " + pair + " at " + volts(applied)
                    + ", short of " + needed + " (" + volts(neededVolts) + "); ";
        } catch (InputProblem | RuntimeException e) {
            // without the transistor the network may have floating nodes: the hint goes without the number
            held = "";
        }
        return held + "raise the bias at the " + transistor.controlTerminal() + " (check "
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
     * The DC MNA system of one stage, laid out once: unknowns are the node voltages (ground
     * excluded), then one current per ideal source (supplies, a 0 Ω generator, each auto BJT's
     * VBE(on)). Every part's terminal rows are found here, so that a solve only stamps the part
     * values ({@link Stage#partValues()}) into the matrix; the values that are never drawn
     * (supplies, VBE(on), source and load resistances, given currents, MOSFET parameters) are the
     * laid-out stage's. Immutable; each solve works in its own arrays.
     */
    private static final class Circuit {
        private final Stage stage;
        private final NodeIndex index;
        private final List<Transistor> transistors;
        private final int nodeCount;
        private final int size;
        /** per part, in part order: the rows of its terminals (−1 for ground), in terminal order */
        private final int[][] partRows;
        private final int[] resistorParts;
        /** per transistor: its part index */
        private final int[] transistorPart;
        /** per transistor: false for the one a cut-off hint leaves out */
        private final boolean[] included;
        /** per transistor: the column of an auto BJT's VBE(on) source current, −1 for the others */
        private final int[] junctionColumn;
        /** transistor indices of the auto-biased MOSFETs, solved by Newton */
        private final int[] nonlinear;
        private final List<Source> sources = new ArrayList<>();
        private final int inputRow;
        private final int outputRow;

        private record Source(int plusRow, int minusRow, double volts) {
        }

        /** @param excluded a transistor left out (for a cut-off hint), or null */
        Circuit(Stage stage, String excluded) {
            this.stage = stage;
            this.index = new NodeIndex(stage);
            this.transistors = stage.transistors();
            nodeCount = index.size();
            List<Part> parts = stage.parts();
            partRows = new int[parts.size()][];
            List<Integer> resistors = new ArrayList<>();
            transistorPart = new int[transistors.size()];
            for (int p = 0, t = 0; p < parts.size(); p++) {
                Part part = parts.get(p);
                List<String> terminals = part.terminalNodes();
                partRows[p] = new int[terminals.size()];
                for (int i = 0; i < terminals.size(); i++) {
                    partRows[p][i] = index.row(terminals.get(i));
                }
                int partIndex = p;
                boolean transistor = part.match(new Part.Cases<Boolean>() {
                    @Override
                    public Boolean resistor(Resistor resistor) {
                        resistors.add(partIndex);   // a conductance between its rows
                        return false;
                    }

                    @Override
                    public Boolean capacitor(Capacitor capacitor) {
                        return false;   // open at DC
                    }

                    @Override
                    public Boolean bjt(Bjt bjt) {
                        return true;
                    }

                    @Override
                    public Boolean mosfet(Mosfet mosfet) {
                        return true;
                    }
                });
                if (transistor) {
                    transistorPart[t++] = p;
                }
            }
            resistorParts = resistors.stream().mapToInt(Integer::intValue).toArray();
            inputRow = index.row(stage.input().node());
            outputRow = index.row(stage.output().node());
            for (Supply supply : stage.supplies()) {
                sources.add(new Source(index.row(supply.node()), -1, supply.volts()));
            }
            if (stage.input().sourceOhms() == 0) {
                sources.add(new Source(inputRow, -1, 0));
            }
            included = new boolean[transistors.size()];
            junctionColumn = new int[transistors.size()];
            List<Integer> mosfets = new ArrayList<>();
            for (int t = 0; t < transistors.size(); t++) {
                Transistor transistor = transistors.get(t);
                included[t] = !transistor.name().equals(excluded);
                junctionColumn[t] = -1;
                if (!included[t] || transistor.bias().givenAmps().isPresent()) {
                    continue;
                }
                int index = t;
                transistor.match(new Transistor.Cases<Void>() {
                    @Override
                    public Void bjt(Bjt bjt) {
                        int[] rows = partRows[transistorPart[index]];
                        junctionColumn[index] = nodeCount + sources.size();
                        // the VBE(on) source from base to emitter (emitter to base for a PNP)
                        sources.add(bjt.polarity() == Bjt.Polarity.NPN
                                ? new Source(rows[1], rows[2], bjt.vbeOnVolts())
                                : new Source(rows[2], rows[1], bjt.vbeOnVolts()));
                        return null;
                    }

                    @Override
                    public Void mosfet(Mosfet mosfet) {
                        mosfets.add(index);   // solved by Newton
                        return null;
                    }
                });
            }
            nonlinear = mosfets.stream().mapToInt(Integer::intValue).toArray();
            size = nodeCount + sources.size();
        }

        int transistorCount() {
            return transistors.size();
        }

        Transistor transistor(int t) {
            return transistors.get(t);
        }

        /** @return the matrix G and right-hand side b of the linear part, from the part values */
        private double[][] stamp(double[] values, double[] b) {
            double[][] g = new double[size][size];
            for (int p : resistorParts) {
                conductance(g, partRows[p][0], partRows[p][1], 1 / values[p]);
            }
            if (stage.input().sourceOhms() > 0) {
                conductance(g, inputRow, -1, 1 / stage.input().sourceOhms());
            }
            if (stage.output().loadOhms().isPresent()) {
                conductance(g, outputRow, -1, 1 / stage.output().loadOhms().getAsDouble());
            }
            for (int k = 0; k < sources.size(); k++) {
                Source source = sources.get(k);
                int row = nodeCount + k;
                incidence(g, source.plusRow(), row, 1);
                incidence(g, source.minusRow(), row, -1);
                b[row] = source.volts();
            }
            for (int t = 0; t < transistors.size(); t++) {
                if (!included[t]) {
                    continue;
                }
                int index = t;
                int[] rows = partRows[transistorPart[t]];
                transistors.get(t).match(new Transistor.Cases<Void>() {
                    @Override
                    public Void bjt(Bjt bjt) {
                        double beta = values[transistorPart[index]];
                        boolean npn = bjt.polarity() == Bjt.Polarity.NPN;
                        OptionalDouble given = bjt.bias().givenAmps();
                        if (given.isEmpty()) {
                            // collector current β·IB, with IB the junction source's current
                            int from = npn ? rows[0] : rows[2];
                            int to = npn ? rows[2] : rows[0];
                            add(g, from, junctionColumn[index], beta);
                            add(g, to, junctionColumn[index], -beta);
                        } else {
                            double ic = given.getAsDouble();
                            double ib = ic / beta;
                            if (npn) {
                                inject(b, rows[1], rows[2], ib);
                                inject(b, rows[0], rows[2], ic);
                            } else {
                                inject(b, rows[2], rows[1], ib);
                                inject(b, rows[2], rows[0], ic);
                            }
                        }
                        return null;
                    }

                    @Override
                    public Void mosfet(Mosfet mosfet) {
                        // an auto MOSFET's square law is stamped by the Newton step, not here
                        OptionalDouble given = mosfet.bias().givenAmps();
                        if (given.isPresent()) {
                            double id = given.getAsDouble();
                            if (mosfet.channel() == Mosfet.Channel.NMOS) {
                                inject(b, rows[0], rows[2], id);
                            } else {
                                inject(b, rows[2], rows[0], id);
                            }
                        }
                        return null;
                    }
                });
            }
            return g;
        }

        private static void conductance(double[][] g, int i, int j, double siemens) {
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

        /** An ideal source's incidence: its current leaves the node of row {@code i} (sign +1) or enters it (−1). */
        private static void incidence(double[][] g, int i, int sourceRow, double sign) {
            if (i >= 0) {
                g[i][sourceRow] += sign;
                g[sourceRow][i] += sign;
            }
        }

        private static void add(double[][] g, int i, int column, double value) {
            if (i >= 0) {
                g[i][column] += value;
            }
        }

        /** A fixed current {@code amps} taken out of row {@code i}'s node and returned into row {@code j}'s. */
        private static void inject(double[] b, int i, int j, double amps) {
            if (i >= 0) {
                b[i] -= amps;
            }
            if (j >= 0) {
                b[j] += amps;
            }
        }

        double volts(String node, double[] x) {
            return volts(index.row(node), x);
        }

        private static double volts(int row, double[] x) {
            return row < 0 ? 0 : x[row];
        }

        /** @return IB (magnitude in the device's sense) of auto BJT t from the junction source's current */
        double baseCurrent(int t, double[] x) {
            return x[junctionColumn[t]];
        }

        /** @return VCE of a BJT or VDS of a MOSFET, in the device's sense */
        double mainVolts(int t, double[] x) {
            int[] rows = partRows[transistorPart[t]];
            return sign(t) * (volts(rows[0], x) - volts(rows[2], x));
        }

        /** @return +1 for NPN and NMOS, −1 for PNP and PMOS */
        private int sign(int t) {
            return transistors.get(t).sign();
        }

        /** @return IC or ID in amperes: given, β·IB, or the square law at the solved VGS */
        double currentAmps(int t, double[] values, double[] x) {
            Transistor transistor = transistors.get(t);
            if (transistor.bias().givenAmps().isPresent()) {
                return transistor.bias().givenAmps().getAsDouble();
            }
            return transistor.match(new Transistor.Cases<Double>() {
                @Override
                public Double bjt(Bjt bjt) {
                    return values[transistorPart[t]] * baseCurrent(t, x);
                }

                @Override
                public Double mosfet(Mosfet mosfet) {
                    double u = overdrive(t, x);
                    return 0.5 * mosfet.kAmpsPerVoltSquared() * u * u;
                }
            });
        }

        /** @return the region test of the class comment for transistor t of a solved circuit */
        Fault fault(int t, double[] values, double[] x) {
            Transistor transistor = transistors.get(t);
            boolean given = transistor.bias().givenAmps().isPresent();
            return transistor.match(new Transistor.Cases<>() {
                @Override
                public Fault bjt(Bjt bjt) {
                    if (!given && !(baseCurrent(t, x) > 0)) {
                        return Fault.CUT_OFF;
                    }
                    return mainVolts(t, x) < VCE_SAT_VOLTS ? Fault.SATURATED : Fault.NONE;
                }

                @Override
                public Fault mosfet(Mosfet mosfet) {
                    double overdrive = testedOverdrive(t, x);
                    if (!given && !(overdrive > 0)) {
                        return Fault.CUT_OFF;
                    }
                    return mainVolts(t, x) < overdrive ? Fault.TRIODE : Fault.NONE;
                }
            });
        }

        /**
         * @return VGS − Vth of MOSFET t as the region test takes it: by the square law from a
         *         given current, else as solved
         */
        double testedOverdrive(int t, double[] x) {
            Mosfet mosfet = (Mosfet) transistors.get(t);
            OptionalDouble given = mosfet.bias().givenAmps();
            if (given.isPresent()) {
                return Math.sqrt(2 * given.getAsDouble() / mosfet.kAmpsPerVoltSquared());
            }
            return overdrive(t, x);
        }

        /** @return the threshold of MOSFET t in the device's own sense at the solved source–body voltage */
        double threshold(int t, double[] x) {
            return thresholdAt((Mosfet) transistors.get(t), sourceBody(t, x));
        }

        /** @return VSB of MOSFET t in the device's sense; 0 for a BJT and without a body terminal */
        double sourceBody(int t, double[] x) {
            return transistors.get(t).match(new Transistor.Cases<Double>() {
                @Override
                public Double bjt(Bjt bjt) {
                    return 0.0;
                }

                @Override
                public Double mosfet(Mosfet mosfet) {
                    if (mosfet.body().isEmpty()) {
                        return 0.0;
                    }
                    int[] rows = partRows[transistorPart[t]];
                    return sign(t) * (volts(rows[2], x) - volts(rows[3], x));
                }
            });
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

        /** @return the unknowns for the part values: node voltages, then source currents */
        double[] solve(double[] values) throws InputProblem {
            double[] b = new double[size];
            double[][] g = stamp(values, b);
            if (nonlinear.length == 0) {
                return linearSolve(g, b);
            }
            double[] x = new double[size];
            double[] residual = residual(g, b, x);
            double norm = norm(residual);
            for (int step = 0; step < MAX_NEWTON_STEPS; step++) {
                double[] minus = new double[size];
                for (int i = 0; i < size; i++) {
                    minus[i] = -residual[i];
                }
                double[] delta = linearSolve(jacobian(g, x), minus);
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
                    double[] trialResidual = residual(g, b, trial);
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
            List<String> names = new ArrayList<>();
            for (int t : nonlinear) {
                names.add(transistors.get(t).name());
            }
            throw new InputProblem(stage.sourceFile(), transistors.get(nonlinear[0]).line(),
                    "the bias of " + String.join(", ", names) + " did not converge in " + MAX_NEWTON_STEPS
                            + " Newton steps",
                    "check vth, k and the gate bias; or give the measured current as 'bias: {id: 1m}'");
        }

        private double[] residual(double[][] g, double[] b, double[] x) {
            double[] r = new double[size];
            for (int i = 0; i < size; i++) {
                double sum = -b[i];
                for (int j = 0; j < size; j++) {
                    sum += g[i][j] * x[j];
                }
                r[i] = sum;
            }
            for (int t : nonlinear) {
                int[] rows = partRows[transistorPart[t]];
                double current = sign(t) * channelCurrent(t, x);
                addAt(r, rows[0], current);
                addAt(r, rows[2], -current);
            }
            return r;
        }

        /** @return (k/2)·u·|u| with u = VGS − Vth in the device's sense: the square law, continued below threshold */
        private double channelCurrent(int t, double[] x) {
            double u = overdrive(t, x);
            return 0.5 * ((Mosfet) transistors.get(t)).kAmpsPerVoltSquared() * u * Math.abs(u);
        }

        /** @return VGS − Vth of MOSFET t in the device's sense */
        double overdrive(int t, double[] x) {
            int[] rows = partRows[transistorPart[t]];
            double vgs = sign(t) * (volts(rows[1], x) - volts(rows[2], x));
            return vgs - threshold(t, x);
        }

        private double[][] jacobian(double[][] g, double[] x) {
            double[][] j = new double[size][];
            for (int i = 0; i < size; i++) {
                j[i] = g[i].clone();
            }
            for (int t : nonlinear) {
                Mosfet mosfet = (Mosfet) transistors.get(t);
                int[] rows = partRows[transistorPart[t]];
                int s = mosfet.channel().sign();
                double slope = Math.max(mosfet.kAmpsPerVoltSquared() * Math.abs(overdrive(t, x)),
                        SLOPE_FLOOR_SIEMENS);
                double thresholdSlope = 0;
                if (mosfet.hasBodyEffect()) {
                    double vsb = sourceBody(t, x);
                    double argument = mosfet.surfacePotentialVolts() + vsb;
                    thresholdSlope = argument > 0.01 * mosfet.surfacePotentialVolts()
                            ? mosfet.gammaRootVolts() / (2 * Math.sqrt(argument)) : 0;
                }
                // u = s(VG − VS) − Vth(s(VS − VB)); the current s·f(u) flows from drain to source
                int[] columns = {rows[1], rows[2], mosfet.hasBodyEffect() ? rows[3] : -1};
                double[] derivatives = {s, -s * (1 + thresholdSlope), s * thresholdSlope};
                for (int d = 0; d < columns.length; d++) {
                    int column = columns[d];
                    if (column < 0 || derivatives[d] == 0) {
                        continue;
                    }
                    double value = s * slope * derivatives[d];
                    if (rows[0] >= 0) {
                        j[rows[0]][column] += value;
                    }
                    if (rows[2] >= 0) {
                        j[rows[2]][column] -= value;
                    }
                }
            }
            return j;
        }

        private static void addAt(double[] r, int row, double value) {
            if (row >= 0) {
                r[row] += value;
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

        OperatingPoints points(double[] values, double[] x) {
            Map<String, Double> nodeVolts = new LinkedHashMap<>();
            nodeVolts.put(stage.ground(), 0.0);
            for (String node : index.nodes()) {
                nodeVolts.put(node, x[index.row(node)]);
            }
            List<OperatingPoint> points = new ArrayList<>();
            for (int t = 0; t < transistors.size(); t++) {
                Transistor transistor = transistors.get(t);
                boolean given = transistor.bias().givenAmps().isPresent();
                double current = currentAmps(t, values, x);
                int index = t;
                points.add(transistor.match(new Transistor.Cases<OperatingPoint>() {
                    @Override
                    public OperatingPoint bjt(Bjt bjt) {
                        int s = bjt.polarity().sign();
                        Map<String, Double> terminals = new LinkedHashMap<>();
                        terminals.put("c", volts(bjt.collector(), x));
                        terminals.put("b", volts(bjt.base(), x));
                        terminals.put("e", volts(bjt.emitter(), x));
                        return new OperatingPoint.BjtPoint(bjt.name(), Region.FORWARD_ACTIVE, current,
                                current / values[transistorPart[index]], s * (terminals.get("c") - terminals.get("e")),
                                s * (terminals.get("b") - terminals.get("e")), given, terminals);
                    }

                    @Override
                    public OperatingPoint mosfet(Mosfet mosfet) {
                        int s = mosfet.channel().sign();
                        double vgs = s * (volts(mosfet.gate(), x) - volts(mosfet.source(), x));
                        Map<String, Double> terminals = new LinkedHashMap<>();
                        terminals.put("d", volts(mosfet.drain(), x));
                        terminals.put("g", volts(mosfet.gate(), x));
                        terminals.put("s", volts(mosfet.source(), x));
                        mosfet.body().ifPresent(body -> terminals.put("b", volts(body, x)));
                        return new OperatingPoint.MosfetPoint(mosfet.name(), Region.SATURATION, current,
                                s * (terminals.get("d") - terminals.get("s")), vgs, sourceBody(index, x),
                                threshold(index, x), given, terminals);
                    }
                }));
            }
            return new OperatingPoints(nodeVolts, points);
        }
    }
}

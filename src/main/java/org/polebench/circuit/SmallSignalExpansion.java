package org.polebench.circuit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.InputProblem;

/**
 * Expands a stage at its operating point into its linear {@link SmallSignalNetwork}
 * (docs/method.md, "The small-signal network"):
 * <ul>
 *   <li>ground and every supply rail become node 0 (AC ground);</li>
 *   <li>resistors become conductances named by their id; the load is {@code load}; for gain
 *       against the source EMF the stimulus drives an internal node {@code source-emf} behind a
 *       {@code source-resistance} conductance into the input node, while for
 *       {@code reference: node} (or a 0 Ω source) the input node itself is driven and the source
 *       resistance drops out;</li>
 *   <li>part capacitors keep their id and band; device capacitances are HIGH band and named
 *       {@code Q1.cpi}, {@code Q1.cmu}, {@code M1.cgs}, {@code M1.cgd};</li>
 *   <li>BJT hybrid-π (NPN and PNP alike): gm = IC/VT ({@code Q1.gm}, collector to emitter,
 *       controlled by the inner base against the emitter), rπ = β/gm ({@code Q1.rpi}),
 *       ro = VA/IC ({@code Q1.ro}, only with an Early voltage), rx ({@code Q1.rx}) from the base
 *       node to an inner base node {@code Q1.b'} when given;</li>
 *   <li>MOSFET (NMOS and PMOS alike): gm = √(2·k·ID) ({@code M1.gm}, drain to source, controlled
 *       by gate against source), gmb = γ·gm/(2·√(2φF + VSB)) ({@code M1.gmb}, controlled by body
 *       against source, only with a body terminal off the source and γ &gt; 0),
 *       ro = 1/(λ·ID) ({@code M1.ro}, only with λ &gt; 0).</li>
 * </ul>
 * VT = kT/q at the stage's temperature ({@link ThermalVoltage}). The hybrid-π and MOSFET
 * small-signal models are those of Sedra and Smith, Microelectronic Circuits (from memory).
 * Elements whose two ends both land on AC ground (a rail decoupling capacitor, a resistor from
 * a rail to ground) have no effect and are left out.
 */
public final class SmallSignalExpansion {
    /** Name of the internal node the stimulus drives when gain is taken against the source EMF. */
    public static final String SOURCE_NODE = "source-emf";

    /** Solves the bias first with {@link BiasSolver}, then expands. */
    public SmallSignalNetwork expand(Stage stage) throws InputProblem {
        return expand(stage, new BiasSolver().solve(stage));
    }

    /**
     * @param points the operating points, possibly with scaled currents
     *               ({@link OperatingPoints#withCurrentScaled}); one per transistor of the stage
     */
    public SmallSignalNetwork expand(Stage stage, OperatingPoints points) {
        return new Layout(stage).network(stage, points);
    }

    /** @return an expansion for draws of {@code stage} that lays the network out once */
    public Prepared prepare(Stage stage) {
        return new Prepared(stage, new Layout(stage));
    }

    /**
     * {@link SmallSignalExpansion#expand(Stage, OperatingPoints)} for draws of one stage (a
     * Monte Carlo tolerance spread), with the node numbering and the element list made once: a
     * draw changes element values, never which elements there are or where they sit. Immutable;
     * one instance serves any thread.
     */
    public static final class Prepared {
        private final Stage nominal;
        private final Layout layout;

        private Prepared(Stage nominal, Layout layout) {
            this.nominal = nominal;
            this.layout = layout;
        }

        /**
         * @param draw   the prepared stage with other values: the same parts in the same order, on
         *               the same nodes, with the same supplies, input, output, bands and rx use
         * @param points the draw's operating points
         * @return the network {@link SmallSignalExpansion#expand(Stage, OperatingPoints)} gives
         * @throws IllegalArgumentException when the draw is not laid out as the prepared stage
         */
        public SmallSignalNetwork expand(Stage draw, OperatingPoints points) {
            if (!StageLayout.isDrawOf(draw, nominal)) {
                throw new IllegalArgumentException("stage " + draw.name() + " is not a draw of " + nominal.name());
            }
            return layout.network(draw, points);
        }

        /**
         * The network of the prepared stage with other part values and currents, as records.
         *
         * @param partValues      one per part, as {@link Stage#partValues()} orders them
         * @param currentAmps     per transistor ({@link Stage#transistors()} order), IC or ID, positive
         * @param sourceBodyVolts per transistor, VSB in the device's sense (read for MOSFETs only)
         */
        public SmallSignalNetwork network(double[] partValues, double[] currentAmps, double[] sourceBodyVolts) {
            return layout.network(nominal, partValues, currentAmps, sourceBodyVolts);
        }

        /**
         * The element values alone, for a kernel that keeps one network's layout and restamps
         * only numbers: the same arithmetic as {@link #network}, without the records.
         *
         * @return per element of {@link #network}, in its order: siemens for a conductance or
         *         transconductance, farads for a capacitance
         */
        public double[] elementValues(double[] partValues, double[] currentAmps, double[] sourceBodyVolts) {
            return layout.values(nominal, partValues, currentAmps, sourceBodyVolts);
        }
    }

    /** What one element of the network is, and so how its value follows from the stage's numbers. */
    private enum Kind {
        SOURCE_RESISTANCE(Form.CONDUCTANCE), LOAD(Form.CONDUCTANCE), RESISTOR(Form.CONDUCTANCE),
        CAPACITOR(Form.CAPACITANCE), BJT_RX(Form.CONDUCTANCE), BJT_RPI(Form.CONDUCTANCE),
        BJT_GM(Form.TRANSCONDUCTANCE), BJT_RO(Form.CONDUCTANCE), BJT_CPI(Form.CAPACITANCE),
        BJT_CMU(Form.CAPACITANCE), MOSFET_GM(Form.TRANSCONDUCTANCE), MOSFET_GMB(Form.TRANSCONDUCTANCE),
        MOSFET_RO(Form.CONDUCTANCE), MOSFET_CGS(Form.CAPACITANCE), MOSFET_CGD(Form.CAPACITANCE);

        final Form form;

        Kind(Form form) {
            this.form = form;
        }
    }

    private enum Form {
        CONDUCTANCE, CAPACITANCE, TRANSCONDUCTANCE
    }

    /**
     * One element's place in the network: its kind, the part and transistor it comes from, its
     * name and nodes (a and b; for a transconductance from, to, control + and control −).
     */
    private static final class Slot {
        final Kind kind;
        final int part;
        final int transistor;
        final String name;
        final int a;
        final int b;
        final int plus;
        final int minus;
        final Band band;

        Slot(Kind kind, int part, int transistor, String name, int a, int b, int plus, int minus, Band band) {
            this.kind = kind;
            this.part = part;
            this.transistor = transistor;
            this.name = name;
            this.a = a;
            this.b = b;
            this.plus = plus;
            this.minus = minus;
            this.band = band;
        }
    }

    /**
     * The network's elements in order, from a stage's layout alone (which parts, nodes, bands,
     * rx, Early voltage, body effect and λ it has). Elements whose two ends both land on AC
     * ground are left out here, once, so every set of values fills the same list.
     */
    private static final class Layout {
        private final Nodes nodes;
        private final int driven;
        private final int output;
        private final List<Slot> slots = new ArrayList<>();

        Layout(Stage stage) {
            nodes = new Nodes(stage);
            int input = nodes.of(stage.input().node());
            if (StageTopology.inputIsDriven(stage)) {
                driven = input;
            } else {
                driven = nodes.sourceNode();
                slots.add(new Slot(Kind.SOURCE_RESISTANCE, -1, -1, "source-resistance", driven, input, 0, 0, null));
            }
            output = nodes.of(stage.output().node());
            if (stage.output().loadOhms().isPresent()) {
                twoTerminal(Kind.LOAD, -1, -1, "load", output, 0, null);
            }
            List<Part> parts = stage.parts();
            int t = 0;
            for (int p = 0; p < parts.size(); p++) {
                Part part = parts.get(p);
                int partIndex = p;
                int transistorIndex = part.asTransistor().isPresent() ? t++ : -1;
                part.match(new Part.Cases<Void>() {
                    @Override
                    public Void resistor(Resistor r) {
                        twoTerminal(Kind.RESISTOR, partIndex, -1, r.name(), nodes.of(r.between().a()),
                                nodes.of(r.between().b()), null);
                        return null;
                    }

                    @Override
                    public Void capacitor(Capacitor c) {
                        twoTerminal(Kind.CAPACITOR, partIndex, -1, c.name(), nodes.of(c.between().a()),
                                nodes.of(c.between().b()), c.band());
                        return null;
                    }

                    @Override
                    public Void bjt(Bjt bjt) {
                        Layout.this.bjt(bjt, partIndex, transistorIndex);
                        return null;
                    }

                    @Override
                    public Void mosfet(Mosfet mosfet) {
                        Layout.this.mosfet(mosfet, partIndex, transistorIndex);
                        return null;
                    }
                });
            }
        }

        private void bjt(Bjt bjt, int p, int t) {
            int c = nodes.of(bjt.collector());
            int base = nodes.of(bjt.base());
            int e = nodes.of(bjt.emitter());
            int inner = base;
            if (bjt.rxOhms() > 0) {
                inner = nodes.innerBase(bjt.name());
                twoTerminal(Kind.BJT_RX, p, t, bjt.name() + ".rx", base, inner, null);
            }
            twoTerminal(Kind.BJT_RPI, p, t, bjt.name() + ".rpi", inner, e, null);
            transconductance(Kind.BJT_GM, p, t, bjt.name() + ".gm", c, e, inner, e);
            if (bjt.earlyVolts().isPresent()) {
                twoTerminal(Kind.BJT_RO, p, t, bjt.name() + ".ro", c, e, null);
            }
            if (bjt.cpiFarads() > 0) {
                twoTerminal(Kind.BJT_CPI, p, t, bjt.name() + ".cpi", inner, e, Band.HIGH);
            }
            if (bjt.cmuFarads() > 0) {
                twoTerminal(Kind.BJT_CMU, p, t, bjt.name() + ".cmu", inner, c, Band.HIGH);
            }
        }

        private void mosfet(Mosfet mosfet, int p, int t) {
            int d = nodes.of(mosfet.drain());
            int g = nodes.of(mosfet.gate());
            int s = nodes.of(mosfet.source());
            transconductance(Kind.MOSFET_GM, p, t, mosfet.name() + ".gm", d, s, g, s);
            if (mosfet.hasBodyEffect()) {
                transconductance(Kind.MOSFET_GMB, p, t, mosfet.name() + ".gmb", d, s, nodes.of(mosfet.body().get()), s);
            }
            if (mosfet.lambdaPerVolt() > 0) {
                twoTerminal(Kind.MOSFET_RO, p, t, mosfet.name() + ".ro", d, s, null);
            }
            if (mosfet.cgsFarads() > 0) {
                twoTerminal(Kind.MOSFET_CGS, p, t, mosfet.name() + ".cgs", g, s, Band.HIGH);
            }
            if (mosfet.cgdFarads() > 0) {
                twoTerminal(Kind.MOSFET_CGD, p, t, mosfet.name() + ".cgd", g, d, Band.HIGH);
            }
        }

        private void twoTerminal(Kind kind, int p, int t, String name, int a, int b, Band band) {
            if (a != b) {
                slots.add(new Slot(kind, p, t, name, a, b, 0, 0, band));
            }
        }

        private void transconductance(Kind kind, int p, int t, String name, int from, int to, int plus, int minus) {
            if (from != to && plus != minus) {
                slots.add(new Slot(kind, p, t, name, from, to, plus, minus, null));
            }
        }

        SmallSignalNetwork network(Stage stage, OperatingPoints points) {
            List<Transistor> transistors = stage.transistors();
            double[] currentAmps = new double[transistors.size()];
            double[] sourceBodyVolts = new double[transistors.size()];
            for (int t = 0; t < currentAmps.length; t++) {
                OperatingPoint point = points.point(transistors.get(t).name());
                currentAmps[t] = point.currentAmps();
                sourceBodyVolts[t] = point.sourceBodyVolts();
            }
            return network(stage, stage.partValues(), currentAmps, sourceBodyVolts);
        }

        SmallSignalNetwork network(Stage stage, double[] partValues, double[] currentAmps, double[] sourceBodyVolts) {
            double[] values = values(stage, partValues, currentAmps, sourceBodyVolts);
            List<NetworkElement> elements = new ArrayList<>(slots.size());
            for (int i = 0; i < values.length; i++) {
                Slot slot = slots.get(i);
                // a switch expression over an enum: javac refuses it when a form is missing
                elements.add(switch (slot.kind.form) {
                    case CONDUCTANCE -> new NetworkElement.Conductance(slot.name, slot.a, slot.b, values[i]);
                    case CAPACITANCE -> new NetworkElement.Capacitance(slot.name, slot.a, slot.b, values[i], slot.band);
                    case TRANSCONDUCTANCE -> new NetworkElement.Transconductance(slot.name, slot.a, slot.b, slot.plus,
                            slot.minus, values[i]);
                });
            }
            return new SmallSignalNetwork(nodes.names(), elements, driven, output);
        }

        /** The numbers of the class comment: conductances, capacitances, gm = IC/VT and the rest. */
        double[] values(Stage stage, double[] partValues, double[] currentAmps, double[] sourceBodyVolts) {
            double vt = ThermalVoltage.volts(stage.temperatureKelvin());
            List<Part> parts = stage.parts();
            double[] values = new double[slots.size()];
            for (int i = 0; i < values.length; i++) {
                Slot slot = slots.get(i);
                Part part = slot.part >= 0 ? parts.get(slot.part) : null;
                double amps = slot.transistor >= 0 ? currentAmps[slot.transistor] : 0;
                values[i] = value(slot.kind, stage, part, part == null ? Double.NaN : partValues[slot.part], amps,
                        slot.transistor >= 0 ? sourceBodyVolts[slot.transistor] : 0, vt);
            }
            return values;
        }

        /**
         * @param drawn the part's value ({@link Stage#partValues()}): ohms, farads or β
         * @param amps  the transistor's IC or ID
         */
        private static double value(Kind kind, Stage stage, Part part, double drawn, double amps, double vsbVolts,
                                    double vt) {
            // a switch expression over an enum: javac refuses it when a kind is missing; each
            // kind comes from one part type (see bjt and mosfet above), so the casts hold
            return switch (kind) {
                case SOURCE_RESISTANCE -> 1 / stage.input().sourceOhms();
                case LOAD -> 1 / stage.output().loadOhms().getAsDouble();
                case RESISTOR -> 1 / drawn;
                case CAPACITOR -> drawn;
                case BJT_RX -> 1 / ((Bjt) part).rxOhms();
                // gπ = gm/β with gm = IC/VT
                case BJT_RPI -> amps / vt / drawn;
                case BJT_GM -> amps / vt;
                case BJT_RO -> amps / ((Bjt) part).earlyVolts().getAsDouble();
                case BJT_CPI -> ((Bjt) part).cpiFarads();
                case BJT_CMU -> ((Bjt) part).cmuFarads();
                case MOSFET_GM -> Math.sqrt(2 * ((Mosfet) part).kAmpsPerVoltSquared() * amps);
                case MOSFET_GMB -> {
                    Mosfet mosfet = (Mosfet) part;
                    double gm = Math.sqrt(2 * mosfet.kAmpsPerVoltSquared() * amps);
                    double argument = Math.max(mosfet.surfacePotentialVolts() + vsbVolts,
                            0.01 * mosfet.surfacePotentialVolts());
                    yield mosfet.gammaRootVolts() * gm / (2 * Math.sqrt(argument));
                }
                case MOSFET_RO -> ((Mosfet) part).lambdaPerVolt() * amps;
                case MOSFET_CGS -> ((Mosfet) part).cgsFarads();
                case MOSFET_CGD -> ((Mosfet) part).cgdFarads();
            };
        }
    }

    /**
     * Node numbering: 0 for ground and rails, then the stage's nodes in order, then the internal
     * ones: {@value #SOURCE_NODE} when the source resistance is in the circuit, then each inner
     * base node in part order. Complete after construction, so one instance serves every draw.
     */
    private static final class Nodes {
        private final Stage stage;
        private final Map<String, Integer> index = new LinkedHashMap<>();
        private final List<String> names = new ArrayList<>();
        private final Map<String, Integer> innerBases = new LinkedHashMap<>();
        private final int sourceNode;
        private final List<String> frozenNames;

        Nodes(Stage stage) {
            this.stage = stage;
            names.add(stage.ground());
            index.put(stage.ground(), 0);
            for (Supply supply : stage.supplies()) {
                index.put(supply.node(), 0);
            }
            for (String node : stage.nodes()) {
                if (!index.containsKey(node)) {
                    index.put(node, names.size());
                    names.add(node);
                }
            }
            sourceNode = StageTopology.inputIsDriven(stage) ? -1 : internal(SOURCE_NODE);
            for (Bjt bjt : stage.bjts()) {
                if (bjt.rxOhms() > 0) {
                    innerBases.put(bjt.name(), internal(bjt.name() + ".b'"));
                }
            }
            frozenNames = List.copyOf(names);
        }

        /** @return the node behind the source resistance that the stimulus drives */
        int sourceNode() {
            return sourceNode;
        }

        /** @return the inner base node of a BJT with rx */
        int innerBase(String bjt) {
            return innerBases.get(bjt);
        }

        int of(String node) {
            Integer i = index.get(node);
            if (i == null) {
                throw new IllegalArgumentException("node " + node + " is not in stage " + stage.name());
            }
            return i;
        }

        /** @return a new internal node; a suffix keeps it apart from a user's node of the same name */
        private int internal(String wanted) {
            String name = wanted;
            while (index.containsKey(name)) {
                name = name + "'";
            }
            index.put(name, names.size());
            names.add(name);
            return index.get(name);
        }

        List<String> names() {
            return frozenNames;
        }
    }
}

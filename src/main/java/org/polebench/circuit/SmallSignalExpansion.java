package org.polebench.circuit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.InputProblem;

/**
 * Expands a stage at its operating point into its linear {@link SmallSignalNetwork}
 * (DESIGN.md "Numerics", "Conventions"):
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
        return expand(new Nodes(stage), stage, points);
    }

    /** @return an expansion for draws of {@code stage} that numbers the nodes once */
    public Prepared prepare(Stage stage) {
        return new Prepared(stage, new Nodes(stage));
    }

    /**
     * {@link SmallSignalExpansion#expand(Stage, OperatingPoints)} for draws of one stage (a
     * Monte Carlo tolerance spread), with the node numbering made once. Immutable; one instance
     * serves any thread.
     */
    public static final class Prepared {
        private final Stage nominal;
        private final Nodes nodes;

        private Prepared(Stage nominal, Nodes nodes) {
            this.nominal = nominal;
            this.nodes = nodes;
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
            return SmallSignalExpansion.expand(nodes, draw, points);
        }
    }

    private static SmallSignalNetwork expand(Nodes nodes, Stage stage, OperatingPoints points) {
        List<NetworkElement> elements = new ArrayList<>();
        double vt = ThermalVoltage.volts(stage.temperatureKelvin());

        int input = nodes.of(stage.input().node());
        int driven;
        if (StageTopology.inputIsDriven(stage)) {
            driven = input;
        } else {
            driven = nodes.sourceNode();
            elements.add(new NetworkElement.Conductance("source-resistance", driven, input,
                    1 / stage.input().sourceOhms()));
        }
        if (stage.output().loadOhms().isPresent()) {
            conductance(elements, "load", nodes.of(stage.output().node()), 0,
                    1 / stage.output().loadOhms().getAsDouble());
        }
        for (Part part : stage.parts()) {
            if (part instanceof Resistor) {
                Resistor r = (Resistor) part;
                conductance(elements, r.name(), nodes.of(r.between().a()), nodes.of(r.between().b()), 1 / r.ohms());
            } else if (part instanceof Capacitor) {
                Capacitor c = (Capacitor) part;
                capacitance(elements, c.name(), nodes.of(c.between().a()), nodes.of(c.between().b()), c.farads(),
                        c.band());
            } else if (part instanceof Bjt) {
                bjt(elements, nodes, (Bjt) part, points.bjt(part.name()), vt);
            } else {
                mosfet(elements, nodes, (Mosfet) part, points.mosfet(part.name()));
            }
        }
        return new SmallSignalNetwork(nodes.names(), elements, driven, nodes.of(stage.output().node()));
    }

    private static void bjt(List<NetworkElement> elements, Nodes nodes, Bjt bjt, OperatingPoint.BjtPoint point,
                            double vt) {
        double ic = point.collectorAmps();
        double gm = ic / vt;
        double gpi = gm / bjt.beta();
        int c = nodes.of(bjt.collector());
        int base = nodes.of(bjt.base());
        int e = nodes.of(bjt.emitter());
        int inner = base;
        if (bjt.rxOhms() > 0) {
            inner = nodes.innerBase(bjt.name());
            conductance(elements, bjt.name() + ".rx", base, inner, 1 / bjt.rxOhms());
        }
        conductance(elements, bjt.name() + ".rpi", inner, e, gpi);
        transconductance(elements, bjt.name() + ".gm", c, e, inner, e, gm);
        if (bjt.earlyVolts().isPresent()) {
            conductance(elements, bjt.name() + ".ro", c, e, ic / bjt.earlyVolts().getAsDouble());
        }
        if (bjt.cpiFarads() > 0) {
            capacitance(elements, bjt.name() + ".cpi", inner, e, bjt.cpiFarads(), Band.HIGH);
        }
        if (bjt.cmuFarads() > 0) {
            capacitance(elements, bjt.name() + ".cmu", inner, c, bjt.cmuFarads(), Band.HIGH);
        }
    }

    private static void mosfet(List<NetworkElement> elements, Nodes nodes, Mosfet mosfet,
                               OperatingPoint.MosfetPoint point) {
        double id = point.drainAmps();
        double gm = Math.sqrt(2 * mosfet.kAmpsPerVoltSquared() * id);
        int d = nodes.of(mosfet.drain());
        int g = nodes.of(mosfet.gate());
        int s = nodes.of(mosfet.source());
        transconductance(elements, mosfet.name() + ".gm", d, s, g, s, gm);
        if (mosfet.hasBodyEffect()) {
            double argument = Math.max(mosfet.surfacePotentialVolts() + point.vsbVolts(),
                    0.01 * mosfet.surfacePotentialVolts());
            double gmb = mosfet.gammaRootVolts() * gm / (2 * Math.sqrt(argument));
            transconductance(elements, mosfet.name() + ".gmb", d, s, nodes.of(mosfet.body().get()), s, gmb);
        }
        if (mosfet.lambdaPerVolt() > 0) {
            conductance(elements, mosfet.name() + ".ro", d, s, mosfet.lambdaPerVolt() * id);
        }
        if (mosfet.cgsFarads() > 0) {
            capacitance(elements, mosfet.name() + ".cgs", g, s, mosfet.cgsFarads(), Band.HIGH);
        }
        if (mosfet.cgdFarads() > 0) {
            capacitance(elements, mosfet.name() + ".cgd", g, d, mosfet.cgdFarads(), Band.HIGH);
        }
    }

    private static void conductance(List<NetworkElement> elements, String name, int a, int b, double siemens) {
        if (a != b) {
            elements.add(new NetworkElement.Conductance(name, a, b, siemens));
        }
    }

    private static void capacitance(List<NetworkElement> elements, String name, int a, int b, double farads,
                                    Band band) {
        if (a != b) {
            elements.add(new NetworkElement.Capacitance(name, a, b, farads, band));
        }
    }

    private static void transconductance(List<NetworkElement> elements, String name, int from, int to,
                                         int plus, int minus, double siemens) {
        if (from != to && plus != minus) {
            elements.add(new NetworkElement.Transconductance(name, from, to, plus, minus, siemens));
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
            for (Part part : stage.parts()) {
                if (part instanceof Bjt && ((Bjt) part).rxOhms() > 0) {
                    innerBases.put(part.name(), internal(part.name() + ".b'"));
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

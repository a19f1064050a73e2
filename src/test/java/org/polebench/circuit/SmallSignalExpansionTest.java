package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

class SmallSignalExpansionTest {
    @TempDir
    Path dir;

    private final SmallSignalExpansion expansion = new SmallSignalExpansion();

    private static Optional<NetworkElement> element(SmallSignalNetwork network, String name) {
        return network.elements().stream().filter(e -> e.name().equals(name)).findFirst();
    }

    private static double siemens(SmallSignalNetwork network, String name) {
        NetworkElement e = element(network, name).orElseThrow();
        return e instanceof NetworkElement.Conductance ? ((NetworkElement.Conductance) e).siemens()
                : ((NetworkElement.Transconductance) e).siemens();
    }

    @Test
    void bjtTransconductanceIsCollectorCurrentOverThermalVoltage() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER.replace("beta: 150,", "beta: 150,"
                + " early-voltage: 80,"));
        OperatingPoints points = new BiasSolver().solve(stage);
        double ic = points.bjt("Q1").collectorAmps();

        SmallSignalNetwork network = expansion.expand(stage, points);

        // hybrid-π: gm = IC/VT, rπ = β/gm, ro = VA/IC (Sedra and Smith, from memory), VT from exact
        // k and q at 300 K; 1e-14 relative: a few roundings
        double vt = 1.380649e-23 * 300 / 1.602176634e-19;
        assertEquals(ic / vt, siemens(network, "Q1.gm"), 1e-14 * ic / vt);
        assertEquals(ic / vt / 150, siemens(network, "Q1.rpi"), 1e-14 * ic / vt / 150);
        assertEquals(ic / 80, siemens(network, "Q1.ro"), 1e-14 * ic / 80);
    }

    @Test
    void scaledBiasCurrentCarriesIntoGmRpiAndRo() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER.replace("beta: 150,", "beta: 150,"
                + " early-voltage: 80,"));
        OperatingPoints points = new BiasSolver().solve(stage);

        SmallSignalNetwork nominal = expansion.expand(stage, points);
        SmallSignalNetwork scaled = expansion.expand(stage, points.withCurrentScaled("Q1", 0.8));

        // gm, 1/rπ and 1/ro are each proportional to IC: exact, up to round-off
        for (String name : List.of("Q1.gm", "Q1.rpi", "Q1.ro")) {
            assertEquals(0.8 * siemens(nominal, name), siemens(scaled, name), 1e-15 * siemens(nominal, name));
        }
    }

    @Test
    void givenCollectorCurrentSetsGm() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER.replace("bias: auto", "bias: {ic: 1.1m}"));

        SmallSignalNetwork network = expansion.expand(stage);

        double vt = ThermalVoltage.volts(300);
        assertEquals(1.1e-3 / vt, siemens(network, "Q1.gm"), 1e-14 * 1.1e-3 / vt);
    }

    @Test
    void commonEmitterMidbandGainMatchesTheTextbookForm() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER);
        double ic = new BiasSolver().solve(stage).bjt("Q1").collectorAmps();

        SmallSignalNetwork network = expansion.expand(stage);
        double gain = MidbandByEjml.gain(network);

        // bypassed common emitter, no ro: Av = −gm(RC∥RL)·Rin/(Rin + Rs), Rin = RB∥rπ (Sedra and
        // Smith, from memory), solved independently by EJML; 1e-12: LU round-off on this 6×6 system
        double gm = ic / ThermalVoltage.volts(300);
        double rpi = 150 / gm;
        double rb = 68e3 * 15e3 / 83e3;
        double rin = rb * rpi / (rb + rpi);
        double rcl = 4.7e3 * 47e3 / (51.7e3);
        double expected = -gm * rcl * rin / (rin + 600);
        assertEquals(expected, gain, 1e-12 * Math.abs(expected));
    }

    @Test
    void baseSpreadingResistanceAndEarlyVoltageEnterTheGainAsTheHybridPiSays() throws InputProblem {
        Stage stage = new StageReader().read(StageFiles.demo("hydrophone-preamp-ce.stage.yaml")).stage();
        double ic = new BiasSolver().solve(stage).bjt("Q1").collectorAmps();

        SmallSignalNetwork network = expansion.expand(stage);
        double gain = MidbandByEjml.gain(network);

        // with rx: vπ = vb·rπ/(rx + rπ), Rin = RB∥(rx + rπ); the collector sees RC∥RL∥ro
        // (hybrid-π, Sedra and Smith, from memory); 1e-12: LU round-off
        double gm = ic / ThermalVoltage.volts(300);
        double rpi = 150 / gm;
        double ro = 80 / ic;
        double rb = 68e3 * 15e3 / 83e3;
        double rin = 1 / (1 / rb + 1 / (100 + rpi));
        double load = 1 / (1 / 4.7e3 + 1 / 47e3 + 1 / ro);
        double expected = -gm * load * rpi / (100 + rpi) * rin / (rin + 600);
        assertEquals(expected, gain, 1e-12 * Math.abs(expected));
        assertTrue(network.nodes().contains("Q1.b'"));
    }

    @Test
    void commonSourceMidbandGainMatchesTheTextbookForm() throws InputProblem {
        Stage stage = new StageReader().read(StageFiles.demo("vibration-buffer-cs.stage.yaml")).stage();
        double id = new BiasSolver().solve(stage).mosfet("M1").drainAmps();

        double gain = MidbandByEjml.gain(expansion.expand(stage));

        // Av = −gm(RD∥RL∥ro)·RG/(RG + Rs), gm = √(2k·ID), ro = 1/(λ·ID) (Sedra and Smith, from memory)
        double gm = Math.sqrt(2 * 2e-3 * id);
        double load = 1 / (1 / 5.6e3 + 1 / 100e3 + 0.01 * id);
        double rg = 1e6 * 330e3 / 1.33e6;
        double expected = -gm * load * rg / (rg + 1e3);
        assertEquals(expected, gain, 1e-12 * Math.abs(expected));
    }

    @Test
    void bodyTransconductanceFollowsTheBodyEffectFormula() throws InputProblem {
        String text = String.join("\n",
                "ground: gnd",
                "supplies: {vdd: 15}",
                "input: {node: in, source-resistance: 1k}",
                "output: {node: out, load: 100k}",
                "parts:",
                "  R1: {resistor: 1M, between: [vdd, g]}",
                "  R2: {resistor: 330k, between: [g, gnd]}",
                "  RD: {resistor: 5.6k, between: [vdd, d]}",
                "  RS: {resistor: 1k, between: [s, gnd]}",
                "  C1: {capacitor: 100n, between: [in, g]}",
                "  C2: {capacitor: 1u, between: [d, out]}",
                "  M1: {nmos: {d: d, g: g, s: s, b: gnd}, vth: 1.5, k: 2m, gamma: 0.4, bias: auto}", "");
        Stage stage = StageFiles.stage(dir, text);
        OperatingPoint.MosfetPoint point = new BiasSolver().solve(stage).mosfet("M1");

        SmallSignalNetwork network = expansion.expand(stage);

        // gmb = γ·gm/(2√(2φF + VSB)) with the default 2φF = 0.6 V (Sedra and Smith, from memory)
        double gm = Math.sqrt(2 * 2e-3 * point.drainAmps());
        double gmb = 0.4 * gm / (2 * Math.sqrt(0.6 + point.vsbVolts()));
        assertEquals(gm, siemens(network, "M1.gm"), 1e-14 * gm);
        assertEquals(gmb, siemens(network, "M1.gmb"), 1e-14 * gmb);
        NetworkElement.Transconductance body = (NetworkElement.Transconductance) element(network, "M1.gmb")
                .orElseThrow();
        assertEquals(0, body.controlPlus());  // body on ground
        assertFalse(element(network, "M1.ro").isPresent());  // no lambda: ro infinite
    }

    @Test
    void suppliesAreAcGroundAndTheSourceResistanceSitsBehindTheInput() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER);

        SmallSignalNetwork network = expansion.expand(stage);

        NetworkElement.Conductance r1 = (NetworkElement.Conductance) element(network, "R1").orElseThrow();
        assertTrue(r1.a() == 0 || r1.b() == 0);  // R1 from vcc: one end on AC ground
        assertEquals(SmallSignalExpansion.SOURCE_NODE, network.nodes().get(network.drivenNode()));
        NetworkElement.Conductance source = (NetworkElement.Conductance) element(network, "source-resistance")
                .orElseThrow();
        assertEquals(1 / 600.0, source.siemens(), 1e-18);
        assertEquals(network.nodes().indexOf("in"), source.b());
        assertEquals("out", network.nodes().get(network.outputNode()));
        assertEquals(1 / 47e3, siemens(network, "load"), 1e-18);
        assertEquals(List.of("C1", "C2", "C3"),
                network.capacitances(Band.LOW).stream().map(NetworkElement::name).toList());
    }

    @Test
    void referenceNodeDrivesTheInputNodeItselfAndDropsTheSourceResistance() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER.replace("source-resistance: 600}",
                "source-resistance: 600, reference: node}"));

        SmallSignalNetwork network = expansion.expand(stage);

        assertEquals("in", network.nodes().get(network.drivenNode()));
        assertFalse(element(network, "source-resistance").isPresent());
        assertFalse(network.nodes().contains(SmallSignalExpansion.SOURCE_NODE));
    }

    @Test
    void deviceCapacitancesAreHighBandAndNamedAfterTheirTransistor() throws InputProblem {
        Stage stage = new StageReader().read(StageFiles.demo("hydrophone-preamp-ce.stage.yaml")).stage();

        SmallSignalNetwork network = expansion.expand(stage);

        List<NetworkElement.Capacitance> high = network.capacitances(Band.HIGH);
        assertEquals(List.of("Q1.cpi", "Q1.cmu"), high.stream().map(NetworkElement::name).toList());
        // Cπ from the inner base b' (behind rx) to the emitter
        assertEquals(network.nodes().indexOf("Q1.b'"), high.get(0).a());
        assertEquals(20e-12, high.get(0).farads(), 1e-24);
    }
}

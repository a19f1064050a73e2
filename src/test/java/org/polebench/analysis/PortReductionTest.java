package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.polebench.analysis.Stages.parallel;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Band;
import org.polebench.circuit.SmallSignalNetwork;

class PortReductionTest {
    // One LU of about ten unknowns with condition below 1e5: round-off stays near 1e-15 relative.
    private static final double ROUND_OFF = 1e-12;

    private static StateModel lowBand(SmallSignalNetwork network) {
        Reduction r = new PortReduction().reduce(network, Band.LOW);
        return assertInstanceOf(Reduction.StateSpace.class, r).model();
    }

    private static double sctcOhms(StateModel model, String capacitor) {
        return 1 / model.admittanceSiemens(model.capacitorNames().indexOf(capacitor),
                model.capacitorNames().indexOf(capacitor));
    }

    private static void assertRelative(double expected, double actual) {
        assertEquals(expected, actual, ROUND_OFF * Math.abs(expected));
    }

    @Test
    void rcHighPassReducesToTheFirstOrderStateModel() {
        double r = 10e3;
        double c = 1e-6;
        StateModel model = lowBand(new NetworkBuilder()
                .capacitor("C1", "src", "out", c).resistor("R1", "out", "gnd", r).build("src", "out"));
        // closed form: C·dv/dt = −v/R − u/R... for v = V(src) − V(out): A = −1/RC, B = 1/RC,
        // C = −1, D = 1, so H(s) = 1 − (1/RC)/(s + 1/RC) = s/(s + 1/RC), the RC high-pass.
        assertRelative(-1 / (r * c), model.a()[0][0]);
        assertRelative(1 / (r * c), model.b()[0]);
        assertRelative(-1, model.c()[0]);
        assertRelative(1, model.directGain());
        assertRelative(1 / r, model.admittanceSiemens(0, 0));
    }

    @Test
    void commonEmitterCapacitorsSeeTheTextbookResistances() {
        Stages.CommonEmitter ce = Stages.typicalCommonEmitter();
        StateModel model = lowBand(ce.network());
        // Sedra and Smith, Microelectronic Circuits, low-frequency response of the CE amplifier
        // (from memory): input coupling RS + RB∥rπ (emitter shorted, so ro does not reach the
        // base), output coupling RC∥ro + RL (vbe = 0 with the input at rest).
        assertRelative(ce.rs() + parallel(ce.rb(), ce.rpi()), sctcOhms(model, "C1"));
        assertRelative(parallel(ce.rc(), ce.ro()) + ce.rl(), sctcOhms(model, "C2"));
        // same source: midband gain −gm·(ro∥RC∥RL)·(RB∥rπ)/(RS + RB∥rπ)
        double rin = parallel(ce.rb(), ce.rpi());
        assertRelative(-ce.gm() * parallel(parallel(ce.ro(), ce.rc()), ce.rl()) * rin / (ce.rs() + rin),
                model.directGain());
    }

    @Test
    void emitterBypassSeesReParallelTheBaseSideResistanceOverBetaPlusOne() {
        Stages.CommonEmitter t = Stages.typicalCommonEmitter();
        Stages.CommonEmitter ce = new Stages.CommonEmitter(t.rs(), t.rb(), t.rpi(), t.gm(), Double.POSITIVE_INFINITY,
                t.rc(), t.rl(), t.re(), t.c1(), t.c2(), t.ce());
        StateModel model = lowBand(ce.network());
        // Sedra and Smith (from memory): RE ∥ (rπ + RS∥RB)/(β + 1), exact when ro is infinite.
        assertRelative(parallel(ce.re(), (ce.rpi() + parallel(ce.rs(), ce.rb())) / (ce.beta() + 1)),
                sctcOhms(model, "CE"));
    }

    @Test
    void commonSourceCapacitorsSeeTheTextbookResistances() {
        double rsig = 10e3;
        double rg = 1e6;
        double gm = 2e-3;
        double rd = 10e3;
        double rl = 20e3;
        double rss = 2e3;
        for (double ro : new double[] {Double.POSITIVE_INFINITY, 50e3}) {
            StateModel model = lowBand(new NetworkBuilder()
                    .resistor("Rsig", "src", "in", rsig).capacitor("C1", "in", "g", 100e-9)
                    .resistor("RG", "g", "gnd", rg).mosfet("M1", "d", "g", "s", gm, ro)
                    .resistor("RD", "d", "gnd", rd).capacitor("C2", "d", "out", 4.7e-6)
                    .resistor("RL", "out", "gnd", rl).resistor("RSS", "s", "gnd", rss)
                    .capacitor("CS", "s", "gnd", 47e-6).build("src", "out"));
            // Sedra and Smith, Microelectronic Circuits, CS amplifier low-frequency response
            // (from memory): gate coupling Rsig + RG (no gate current); drain coupling RD∥ro + RL.
            assertRelative(rsig + rg, sctcOhms(model, "C1"));
            assertRelative(Double.isFinite(ro) ? parallel(rd, ro) + rl : rd + rl, sctcOhms(model, "C2"));
            // same source: midband gain −gm·(RD∥ro∥RL)·RG/(Rsig + RG)
            double load = Double.isFinite(ro) ? parallel(parallel(rd, ro), rl) : parallel(rd, rl);
            assertRelative(-gm * load * rg / (rsig + rg), model.directGain());
            if (!Double.isFinite(ro)) {
                // source bypass RSS ∥ 1/gm, exact when ro is ignored
                assertRelative(parallel(rss, 1 / gm), sctcOhms(model, "CS"));
            }
        }
    }

    @Test
    void commonBaseCapacitorsSeeTheTextbookResistances() {
        double rsig = 50;
        double re = 2.2e3;
        double rb = 10e3;
        double rc = 5.6e3;
        double rl = 10e3;
        double gm = 0.04;
        double rpi = 2.5e3;
        double beta = gm * rpi;
        StateModel model = lowBand(new NetworkBuilder()
                .resistor("Rsig", "src", "in", rsig).capacitor("C1", "in", "e", 10e-6)
                .resistor("RE", "e", "gnd", re).bjt("Q1", "c", "b", "e", gm, rpi, Double.POSITIVE_INFINITY)
                .resistor("RB", "b", "gnd", rb).capacitor("CB", "b", "gnd", 10e-6)
                .resistor("RC", "c", "gnd", rc).capacitor("C2", "c", "out", 1e-6)
                .resistor("RL", "out", "gnd", rl).build("src", "out"));
        double reIn = rpi / (beta + 1);
        // Sedra and Smith, Microelectronic Circuits, CB amplifier (from memory), ro infinite:
        // input coupling Rsig + RE∥rπ/(β+1); base bypass RB ∥ (rπ + (β+1)·(RE∥Rsig));
        // output coupling RC + RL (the collector is an ideal current source).
        assertRelative(rsig + parallel(re, reIn), sctcOhms(model, "C1"));
        assertRelative(parallel(rb, rpi + (beta + 1) * parallel(re, rsig)), sctcOhms(model, "CB"));
        assertRelative(rc + rl, sctcOhms(model, "C2"));
        // same source: midband gain gm·(RC∥RL)·(RE∥re)/(Rsig + RE∥re), non-inverting
        double rin = parallel(re, reIn);
        assertRelative(gm * parallel(rc, rl) * rin / (rsig + rin), model.directGain());
    }

    @Test
    void parallelCouplingCapacitorsAreNamedAsACapacitorLoop() {
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RS", "src", "in", 600).capacitor("C1a", "in", "out", 1e-6)
                .capacitor("C1b", "in", "out", 2.2e-6).resistor("RL", "out", "gnd", 10e3).build("src", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, new PortReduction().reduce(network, Band.LOW));
        // synthetic case: two capacitors across the same node pair are a loop of ports
        assertEquals(SingularCase.CAPACITOR_LOOP, s.kind());
        assertEquals(List.of("C1a", "C1b"), s.parts());
        assertTrue(s.nodes().containsAll(List.of("in", "out")));
    }

    @Test
    void capacitorAcrossTheStimulusIsACapacitorLoopWithTheStimulus() {
        SmallSignalNetwork network = new NetworkBuilder()
                .capacitor("CX", "in", "gnd", 1e-6).capacitor("C1", "in", "out", 1e-6)
                .resistor("RL", "out", "gnd", 10e3).build("in", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, new PortReduction().reduce(network, Band.LOW));
        // synthetic case: the driven node is an ideal source to ground, CX sits across it
        assertEquals(SingularCase.CAPACITOR_LOOP, s.kind());
        assertEquals(List.of(MnaSystem.STIMULUS, "CX"), s.parts());
    }

    @Test
    void nodeReachedOnlyThroughAHighBandCapacitorHasNoDcPath() {
        SmallSignalNetwork network = new NetworkBuilder()
                .capacitor("C1", "src", "out", 1e-6).resistor("RL", "out", "gnd", 10e3)
                .capacitor("CP", "out", "x", 10e-12, Band.HIGH).resistor("RX", "x", "y", 1e3)
                .build("src", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, new PortReduction().reduce(network, Band.LOW));
        // synthetic case: x and y hang on CP, which is open in the low band
        assertEquals(SingularCase.NO_DC_PATH, s.kind());
        assertEquals(List.of("x", "y"), s.nodes());
        assertEquals(List.of("CP", "RX"), s.parts());
    }

    @Test
    void seriesCapacitorsWithoutAResistorBetweenThemGiveAPoleAtZero() {
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RS", "src", "in", 600).capacitor("C1", "in", "m", 1e-6)
                .capacitor("C2", "m", "out", 1e-6).resistor("RL", "out", "gnd", 10e3).build("src", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, new PortReduction().reduce(network, Band.LOW));
        // synthetic case: node m is a cut set of capacitors, so no DC current divides between
        // C1 and C2: Y is singular (rank 1)
        assertEquals(SingularCase.POLE_AT_ZERO, s.kind());
        assertEquals(List.of("C1", "C2"), s.parts());
    }

    @Test
    void couplingCapacitorFedByAnIdealCurrentSourceGivesAPoleAtZero() {
        // common-emitter with ro infinite and no collector resistor: only gm drives C2
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RS", "src", "in", 600).capacitor("C1", "in", "b", 1e-6).resistor("RB", "b", "gnd", 18e3)
                .bjt("Q1", "c", "b", "e", 0.04, 5e3, Double.POSITIVE_INFINITY).resistor("RE", "e", "gnd", 1e3)
                .capacitor("C2", "c", "out", 10e-6).resistor("RL", "out", "gnd", 47e3).build("src", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, new PortReduction().reduce(network, Band.LOW));
        // synthetic case: C2's current is gm·vbe whatever its voltage, so its voltage integrates
        assertEquals(SingularCase.POLE_AT_ZERO, s.kind());
        assertEquals(List.of("C2"), s.parts());
    }
}

package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

class BiasSolverTest {
    // Newton and LU solves reach round-off (~1e-15); 1e-9 relative leaves room for the
    // conditioning of a stage whose resistors span 1 kΩ to 1 MΩ.
    private static final double RELATIVE = 1e-9;

    @TempDir
    Path dir;

    private final BiasSolver solver = new BiasSolver();

    @Test
    void dividerBiasedCommonEmitterMatchesTheTheveninHandAnalysis() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER);

        OperatingPoint.BjtPoint q1 = solver.solve(stage).bjt("Q1");

        // Thevenin base divider, IB = (VTH − VBE)/(RTH + (β+1)RE) (Sedra and Smith, Microelectronic
        // Circuits, BJT biasing, from memory); VBE(on) = 0.65 V (common practice 0.6–0.7 V)
        double vth = 12 * 15e3 / (68e3 + 15e3);
        double rth = 68e3 * 15e3 / (68e3 + 15e3);
        double ib = (vth - 0.65) / (rth + 151 * 1.2e3);
        double ic = 150 * ib;
        double vce = 12 - ic * 4.7e3 - 151 * ib * 1.2e3;
        assertEquals(ic, q1.collectorAmps(), RELATIVE * ic);
        assertEquals(ib, q1.baseAmps(), RELATIVE * ib);
        assertEquals(vce, q1.vceVolts(), RELATIVE * vce);
        assertEquals(0.65, q1.vbeVolts(), 1e-12);
        assertEquals(Region.FORWARD_ACTIVE, q1.region());
        assertEquals(vth - ib * rth, q1.terminalVolts().get("b"), RELATIVE * vth);
    }

    @Test
    void emitterFollowerMatchesTheTheveninHandAnalysis() throws InputProblem {
        String text = String.join("\n",
                "ground: gnd",
                "supplies: {vcc: 9}",
                "input: {node: in, source-resistance: 50}",
                "output: {node: out, load: 10k}",
                "parts:",
                "  R1: {resistor: 47k, between: [vcc, b]}",
                "  R2: {resistor: 47k, between: [b, gnd]}",
                "  RE: {resistor: 2.2k, between: [e, gnd]}",
                "  C1: {capacitor: 1u, between: [in, b]}",
                "  C2: {capacitor: 10u, between: [e, out]}",
                "  Q1: {npn: {c: vcc, b: b, e: e}, beta: 100, vbe-on: 0.7, bias: auto}", "");

        OperatingPoint.BjtPoint q1 = solver.solve(StageFiles.stage(dir, text)).bjt("Q1");

        // same Thevenin closed form with the collector on the rail: VCE = VCC − IE·RE
        double vth = 4.5;
        double rth = 23.5e3;
        double ib = (vth - 0.7) / (rth + 101 * 2.2e3);
        assertEquals(100 * ib, q1.collectorAmps(), RELATIVE * 100 * ib);
        assertEquals(9 - 101 * ib * 2.2e3, q1.vceVolts(), RELATIVE * 9);
    }

    @Test
    void pnpCommonEmitterHasTheMirroredSigns() throws InputProblem {
        String text = String.join("\n",
                "ground: gnd",
                "supplies: {vcc: 12}",
                "input: {node: in, source-resistance: 600}",
                "output: {node: out, load: 47k}",
                "parts:",
                "  R1: {resistor: 15k, between: [vcc, b]}",
                "  R2: {resistor: 68k, between: [b, gnd]}",
                "  RE: {resistor: 1.2k, between: [vcc, e]}",
                "  RC: {resistor: 4.7k, between: [c, gnd]}",
                "  C1: {capacitor: 4.7u, between: [in, b]}",
                "  C2: {capacitor: 10u, between: [c, out]}",
                "  Q1: {pnp: {c: c, b: b, e: e}, beta: 120, bias: auto}", "");

        OperatingPoints points = solver.solve(StageFiles.stage(dir, text));
        OperatingPoint.BjtPoint q1 = points.bjt("Q1");

        // PNP Thevenin form: IB = (VCC − VEB − VTH)/(RTH + (β+1)RE), currents as magnitudes (same source)
        double vth = 12 * 68e3 / (15e3 + 68e3);
        double rth = 15e3 * 68e3 / (15e3 + 68e3);
        double ib = (12 - 0.65 - vth) / (rth + 121 * 1.2e3);
        double ic = 120 * ib;
        assertEquals(ic, q1.collectorAmps(), RELATIVE * ic);
        assertEquals(12 - 121 * ib * 1.2e3 - ic * 4.7e3, q1.vceVolts(), RELATIVE * 12);
        assertEquals(ic * 4.7e3, points.volts("c"), RELATIVE * 12);
        assertEquals(0.65, points.volts("e") - points.volts("b"), 1e-12);
    }

    private static final String COMMON_SOURCE = String.join("\n",
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
            "  C3: {capacitor: 100u, between: [s, gnd]}",
            "  M1: {nmos: {d: d, g: g, s: s}, vth: 1.5, k: 2m, lambda: 0.01, bias: auto}", "");

    @Test
    void commonSourceWithDividerGateMatchesTheQuadraticSolution() throws InputProblem {
        OperatingPoint.MosfetPoint m1 = solver.solve(StageFiles.stage(dir, COMMON_SOURCE)).mosfet("M1");

        // ID = (k/2)u², u = VG − Vth − ID·RS  ⇒  (k·RS/2)u² + u − (VG − Vth) = 0, positive root
        // (square law as in Sedra and Smith, Microelectronic Circuits, from memory; λ ignored in DC)
        double vg = 15 * 330e3 / 1.33e6;
        double kRs = 2e-3 * 1e3;
        double u = (-1 + Math.sqrt(1 + 2 * kRs * (vg - 1.5))) / kRs;
        double id = 1e-3 * u * u;
        assertEquals(id, m1.drainAmps(), RELATIVE * id);
        assertEquals(1.5 + u, m1.vgsVolts(), RELATIVE * 3);
        assertEquals(15 - id * 5.6e3 - id * 1e3, m1.vdsVolts(), RELATIVE * 15);
        assertEquals(Region.SATURATION, m1.region());
    }

    @Test
    void pmosCommonSourceHasTheMirroredSigns() throws InputProblem {
        String text = String.join("\n",
                "ground: gnd",
                "supplies: {vdd: 15}",
                "input: {node: in, source-resistance: 1k}",
                "output: {node: out, load: 100k}",
                "parts:",
                "  R1: {resistor: 330k, between: [vdd, g]}",
                "  R2: {resistor: 1M, between: [g, gnd]}",
                "  RS: {resistor: 1k, between: [vdd, s]}",
                "  RD: {resistor: 5.6k, between: [d, gnd]}",
                "  C1: {capacitor: 100n, between: [in, g]}",
                "  C2: {capacitor: 1u, between: [d, out]}",
                "  M1: {pmos: {d: d, g: g, s: s}, vth: -1.5, k: 2m, bias: auto}", "");

        OperatingPoints points = solver.solve(StageFiles.stage(dir, text));
        OperatingPoint.MosfetPoint m1 = points.mosfet("M1");

        // mirrored: VSG = (VDD − VG) − ID·RS, same quadratic in u = VSG − |Vth| (same source)
        double vsgOpen = 15 - 15 * 1e6 / 1.33e6;
        double kRs = 2e-3 * 1e3;
        double u = (-1 + Math.sqrt(1 + 2 * kRs * (vsgOpen - 1.5))) / kRs;
        double id = 1e-3 * u * u;
        assertEquals(id, m1.drainAmps(), RELATIVE * id);
        assertEquals(id * 5.6e3, points.volts("d"), RELATIVE * 15);
        assertEquals(15 - id * 1e3, points.volts("s"), RELATIVE * 15);
    }

    @Test
    void bodyEffectRaisesTheThresholdAsTheScalarEquationSays() throws InputProblem {
        String text = COMMON_SOURCE.replace("{d: d, g: g, s: s}, vth: 1.5", "{d: d, g: g, s: s, b: gnd}, vth: 1.5,"
                + " gamma: 0.5, surface-potential: 0.7");

        OperatingPoint.MosfetPoint m1 = solver.solve(StageFiles.stage(dir, text)).mosfet("M1");

        // independent: Brent's root finder on f(ID) = ID − (k/2)(VG − ID·RS − Vth(ID·RS))², with
        // Vth(VSB) = Vth0 + γ(√(2φF + VSB) − √(2φF)) (body effect, Sedra and Smith, from memory)
        double vg = 15 * 330e3 / 1.33e6;
        java.util.function.DoubleUnaryOperator vt = vsb -> 1.5 + 0.5 * (Math.sqrt(0.7 + vsb) - Math.sqrt(0.7));
        double id = new BrentSolver(1e-18, 1e-16).solve(200, i -> {
            double u = vg - i * 1e3 - vt.applyAsDouble(i * 1e3);
            return i - 1e-3 * u * u;
        }, 0, 1.5e-3);
        assertEquals(id, m1.drainAmps(), 1e-8 * id);  // Brent's absolute accuracy 1e-16 A on ~1 mA
        assertEquals(id * 1e3, m1.vsbVolts(), 1e-8);
        assertEquals(vt.applyAsDouble(id * 1e3), m1.thresholdVolts(), 1e-8);
        assertTrue(m1.thresholdVolts() > 1.5);
    }

    @Test
    void givenCollectorCurrentIsUsedAsGiven() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER.replace("bias: auto", "bias: {ic: 1.1m}"));

        OperatingPoints points = solver.solve(stage);
        OperatingPoint.BjtPoint q1 = points.bjt("Q1");

        // the given current, unchanged; the node voltages follow from it by Ohm's law
        // 1e-15 relative: "1.1m" is read as 1.1 × 1e-3, one rounding
        assertEquals(1.1e-3, q1.collectorAmps(), 1e-15 * 1.1e-3);
        assertTrue(q1.currentGiven());
        assertEquals(12 - 1.1e-3 * 4.7e3, points.volts("c"), RELATIVE * 12);
        assertEquals(1.1e-3 * (1 + 1.0 / 150) * 1.2e3, points.volts("e"), RELATIVE * 12);
    }

    @Test
    void givenDrainCurrentIsUsedAsGiven() throws InputProblem {
        Stage stage = StageFiles.stage(dir, COMMON_SOURCE.replace("bias: auto", "bias: {id: 0.9m}"));

        OperatingPoints points = solver.solve(stage);

        // 1e-15 relative: "0.9m" is read as 0.9 × 1e-3, one rounding
        assertEquals(0.9e-3, points.mosfet("M1").drainAmps(), 1e-15 * 0.9e-3);
        assertEquals(15 - 0.9e-3 * 5.6e3, points.volts("d"), RELATIVE * 15);
    }

    @Test
    void scalingTheBiasCurrentScalesOnlyThatTransistor() throws InputProblem {
        OperatingPoints points = solver.solve(StageFiles.stage(dir, StageFiles.COMMON_EMITTER));

        OperatingPoints scaled = points.withCurrentScaled("Q1", 1.25);

        assertEquals(1.25 * points.bjt("Q1").collectorAmps(), scaled.bjt("Q1").collectorAmps(), 1e-18);
        assertEquals(points.bjt("Q1").vceVolts(), scaled.bjt("Q1").vceVolts());
    }

    @Test
    void saturatedTransistorIsRefusedByName() {
        // RC = 47k at IC ≈ 1.2 mA would need 55 V across it: saturated
        String text = StageFiles.COMMON_EMITTER.replace("resistor: 4.7k", "resistor: 47k");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertEquals(StageFiles.lineOf(text, "Q1:"), problem.line());
        assertTrue(problem.getMessage().startsWith("Q1 is saturated"), problem.getMessage());
        assertTrue(problem.hint().contains("RC to vcc"), problem.hint());
    }

    @Test
    void cutOffTransistorIsRefusedWithTheBaseVoltageInTheHint() {
        // R2 = 1k: the divider holds the base at 12·1k/69k = 0.17 V, below VBE(on)
        String text = StageFiles.COMMON_EMITTER.replace("resistor: 15k", "resistor: 1k");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertEquals(StageFiles.lineOf(text, "Q1:"), problem.line());
        assertTrue(problem.getMessage().startsWith("Q1 is cut off"), problem.getMessage());
        assertTrue(problem.hint().contains("0.174 V"), problem.hint());
        assertTrue(problem.hint().contains("R2 to gnd"), problem.hint());
    }

    @Test
    void theSecondOfTwoTransistorsIsNamedWhenItSaturates() throws Exception {
        String text = String.join("\n", java.nio.file.Files.readAllLines(
                StageFiles.demo("geophone-two-stage.stage.yaml"))).replace("resistor: 6.8k", "resistor: 68k");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertTrue(problem.getMessage().startsWith("Q2 is saturated"), problem.getMessage());
        assertEquals(StageFiles.lineOf(text, "Q2:"), problem.line());
    }

    @Test
    void mosfetBelowThresholdIsCutOff() {
        String text = COMMON_SOURCE.replace("vth: 1.5", "vth: 4.5");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertTrue(problem.getMessage().startsWith("M1 is cut off"), problem.getMessage());
        // with M1 off the gate sits at 15·330k/1.33M = 3.72 V and the source at 0 V
        assertTrue(problem.hint().contains("3.72 V"), problem.hint());
        assertEquals(StageFiles.lineOf(text, "M1:"), problem.line());
    }

    @Test
    void mosfetWithTooLargeADrainResistorIsInTheTriodeRegion() {
        String text = COMMON_SOURCE.replace("resistor: 5.6k", "resistor: 56k");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertTrue(problem.getMessage().startsWith("M1 is in the triode region"), problem.getMessage());
    }

    @Test
    void givenBiasOnATransistorWhoseEmitterHasNoOtherPathIsRefused() {
        // emitter reached only through Q1's junction and a capacitor: with a given current the
        // junction is a current source, and the emitter voltage is not fixed
        String text = StageFiles.COMMON_EMITTER.replace("  RE: {resistor: 1.2k, between: [e, gnd]}\n", "")
                .replace("bias: auto", "bias: {ic: 1m}");
        InputProblem problem = assertThrows(InputProblem.class, () -> solver.solve(StageFiles.stage(dir, text)));
        assertTrue(problem.getMessage().contains("the bias of Q1 cannot be solved"), problem.getMessage());
        assertTrue(problem.getMessage().contains("node 'e'"), problem.getMessage());
    }
}

package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.polebench.InputProblem;

class BiasPropertiesTest {
    private static Path dir;

    @BeforeContainer
    static void makeDirectory() throws Exception {
        dir = Files.createTempDirectory("bias-properties");
    }

    @AfterContainer
    static void removeDirectory() throws Exception {
        try (var files = Files.list(dir)) {
            for (Path file : (Iterable<Path>) files::iterator) {
                Files.delete(file);
            }
        }
        Files.delete(dir);
    }

    private static String commonEmitter(double r1, double r2, double re, double beta) {
        return String.join("\n",
                "ground: gnd",
                "supplies: {vcc: 15}",
                "input: {node: in, source-resistance: 600}",
                "output: {node: out, load: 47k}",
                "parts:",
                String.format(Locale.ROOT, "  R1: {resistor: %.17g, between: [vcc, b]}", r1),
                String.format(Locale.ROOT, "  R2: {resistor: %.17g, between: [b, gnd]}", r2),
                "  RC: {resistor: 100, between: [vcc, c]}",
                String.format(Locale.ROOT, "  RE: {resistor: %.17g, between: [e, gnd]}", re),
                "  C1: {capacitor: 1u, between: [in, b]}",
                "  C2: {capacitor: 1u, between: [c, out]}",
                String.format(Locale.ROOT, "  Q1: {npn: {c: c, b: b, e: e}, beta: %.17g, bias: auto}", beta), "");
    }

    // Thevenin closed form over random divider stages (Sedra and Smith, from memory); the
    // collector resistor is kept small so that every case stays active. Fixed seed.
    // 1e-9 relative: LU round-off on a 5×5 system with conductances spanning four decades.
    @Property(tries = 200, seed = "20261202")
    void commonEmitterBiasMatchesTheTheveninFormOverRandomStages(
            @ForAll @DoubleRange(min = 10e3, max = 1e6) double r1,
            @ForAll @DoubleRange(min = 5e3, max = 200e3) double r2,
            @ForAll @DoubleRange(min = 100, max = 10e3) double re,
            @ForAll @DoubleRange(min = 20, max = 800) double beta) throws InputProblem {
        double vth = 15 * r2 / (r1 + r2);
        net.jqwik.api.Assume.that(vth > 1.0);
        double rth = r1 * r2 / (r1 + r2);
        double ib = (vth - 0.65) / (rth + (beta + 1) * re);
        net.jqwik.api.Assume.that(15 - (beta + 1) * ib * re - beta * ib * 100 > 0.5);

        Stage stage = StageFiles.stage(dir, commonEmitter(r1, r2, re, beta));
        double ic = new BiasSolver().solve(stage).bjt("Q1").collectorAmps();

        assertEquals(beta * ib, ic, 1e-9 * beta * ib);
    }

    private static String commonSource(double vg, double rs, double k) {
        return String.join("\n",
                "ground: gnd",
                "supplies: {vdd: 20}",
                "input: {node: in, source-resistance: 600}",
                "output: {node: out, load: 47k}",
                "parts:",
                String.format(Locale.ROOT, "  R1: {resistor: %.17g, between: [vdd, g]}", 1e6 * (20 - vg) / vg),
                "  R2: {resistor: 1M, between: [g, gnd]}",
                "  RD: {resistor: 100, between: [vdd, d]}",
                String.format(Locale.ROOT, "  RS: {resistor: %.17g, between: [s, gnd]}", rs),
                "  C1: {capacitor: 1u, between: [in, g]}",
                "  C2: {capacitor: 1u, between: [d, out]}",
                String.format(Locale.ROOT, "  M1: {nmos: {d: d, g: g, s: s}, vth: 1, k: %.17g, bias: auto}", k), "");
    }

    // Newton on the square law against its closed-form positive root, over random stages; fixed seed.
    // 1e-9 relative: Newton stops at a step of 1e-13 of the largest node voltage.
    @Property(tries = 200, seed = "20261203")
    void commonSourceBiasMatchesTheQuadraticRootOverRandomStages(
            @ForAll @DoubleRange(min = 1.5, max = 10) double vg,
            @ForAll @DoubleRange(min = 10, max = 20e3) double rs,
            @ForAll @DoubleRange(min = -4, max = -0.3) double log10K) throws InputProblem {
        double k = Math.pow(10, log10K);
        double u = (-1 + Math.sqrt(1 + 2 * k * rs * (vg - 1))) / (k * rs);
        double id = 0.5 * k * u * u;
        net.jqwik.api.Assume.that(20 - id * (100 + rs) > u + 0.1);

        Stage stage = StageFiles.stage(dir, commonSource(vg, rs, k));
        double solved = new BiasSolver().solve(stage).mosfet("M1").drainAmps();

        assertEquals(id, solved, 1e-9 * id);
    }
}

package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.SweepReader;

/** {@code --bench} on predict, synthesize and fit (issue 13). */
class BenchOptionTest {
    @TempDir
    Path dir;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    /** A 1 µF coupling capacitor into 10 kΩ from a 600 Ω source: a first-order high-pass at 15.01 Hz. */
    private Path couplingStage() throws IOException {
        Path stage = dir.resolve("coupling.stage.yaml");
        Files.writeString(stage, String.join("\n", "name: coupling", "ground: gnd",
                "input: {node: in, source-resistance: 600}", "output: {node: out}", "parts:",
                "  C1: {capacitor: 1u, between: [in, out]}", "  R1: {resistor: 10k, between: [out, gnd]}", ""),
                StandardCharsets.UTF_8);
        return stage;
    }

    private Path acBench() throws IOException {
        Path bench = dir.resolve("scope.bench.yaml");
        Files.writeString(bench, String.join("\n", "output-channel:", "  coupling: ac", "  corner: 3.3 Hz", ""),
                StandardCharsets.UTF_8);
        return bench;
    }

    /** The measured corner of two first-order high-passes at f1 and f2 (algebra on |H1·H2|² = 1/2). */
    private static double twoPoleCornerHz(double f1, double f2) {
        double a = f1 * f1;
        double b = f2 * f2;
        return Math.sqrt(((a + b) + Math.sqrt((a + b) * (a + b) + 4 * a * b)) / 2);
    }

    @Test
    void predictWarnsThatTheAcCouplingMovesTheCornerAndSaysWhatToChange() throws IOException {
        Run run = run("predict", "--samples", "50", couplingStage().toString(), "--bench", acBench().toString());

        assertEquals(0, run.code(), run.err());
        // board alone 1/(2π·10.6 kΩ·1 µF) = 15.0 Hz; with 3.3 Hz the two-pole closed form 15.4 Hz
        double own = 1 / (2 * Math.PI * 10.6e3 * 1e-6);
        String expected = String.format(java.util.Locale.ROOT, "warning: the output channel's AC coupling at 3.3 Hz"
                + " moves the measured corner from %.3g Hz to %.3g Hz: use DC coupling", own,
                twoPoleCornerHz(own, 3.3));
        assertTrue(run.out().contains(expected), run.out());
    }

    @Test
    void predictJsonCarriesBothResponses() throws IOException {
        Run run = run("predict", "--json", "--samples", "50", couplingStage().toString(), "--bench",
                acBench().toString());

        assertEquals(0, run.code(), run.err());
        JsonNode bench = new ObjectMapper().readTree(run.out()).get("bench");
        double own = 1 / (2 * Math.PI * 10.6e3 * 1e-6);
        // the closed forms above; 1e-9 relative: the corner search stops at 1e-12 in ln f
        assertEquals(own, bench.get("board_alone").get("lower_corner_hz").asDouble(), 1e-9 * own);
        double measured = twoPoleCornerHz(own, 3.3);
        assertEquals(measured, bench.get("as_measured").get("lower_corner_hz").asDouble(), 1e-9 * measured);
        assertEquals(1, bench.get("warnings").size());
    }

    @Test
    void predictWithoutBenchPrintsNoBenchBlock() throws IOException {
        Run run = run("predict", "--samples", "50", couplingStage().toString());

        assertEquals(0, run.code(), run.err());
        assertTrue(!run.out().contains("Bench") && !run.out().contains("warning: the output channel"), run.out());
    }

    @Test
    void synthesizeWritesTheSweepAsTheBenchRecordsItAndNamesTheBench() throws IOException, InputProblem {
        Path out = dir.resolve("b.csv");
        Run run = run("synthesize", "--stage", couplingStage().toString(), "--bench", acBench().toString(),
                "--noise", "0dB,0deg", "--from", "1Hz", "--to", "1kHz", "--points", "9", "--out", out.toString());

        assertEquals(0, run.code(), run.err());
        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(out, "canonical").sweep();
        assertTrue(sweep.source().notes().stream().anyMatch(n -> n.startsWith("bench: ") && n.contains("AC at 3.3 Hz")),
                sweep.source().notes().toString());
        double own = 1 / (2 * Math.PI * 10.6e3 * 1e-6);
        double midband = 10e3 / 10.6e3;
        for (SweepPoint point : sweep.points()) {
            double f = point.frequencyHz();
            // two first-order high-passes times the resistive midband 10k/10.6k (closed form);
            // 1e-6 dB: the canonical file's printed digits
            Complex h = highPass(f, own).multiply(highPass(f, 3.3)).multiply(midband);
            assertEquals(20 * Math.log10(h.abs()), point.gainDb(), 1e-6, "at " + f + " Hz");
        }
    }

    @Test
    void fitSaysTheBenchWasDeclared() throws IOException {
        Path out = dir.resolve("b.csv");
        assertEquals(0, run("synthesize", "--stage", couplingStage().toString(), "--bench", acBench().toString(),
                "--out", out.toString()).code());

        Run run = run("fit", out.toString(), "--bench", acBench().toString());

        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("declared") && run.out().contains("as-measured response"), run.out());
    }

    @Test
    void aMisspeltBenchKeyExitsTwoNamingItsLine() throws IOException {
        Path bench = dir.resolve("bad.bench.yaml");
        Files.writeString(bench, "output-channel:\n  coupling: ac\n  coner: 3.3 Hz\n", StandardCharsets.UTF_8);

        Run run = run("predict", "--samples", "50", couplingStage().toString(), "--bench", bench.toString());

        // exit 2 for bad input (docs/user-guide.md, "Commands"); the message names file and line 3
        assertEquals(2, run.code());
        assertTrue(run.err().contains("bad.bench.yaml") && run.err().contains("3"), run.err());
    }

    private static Complex highPass(double f, double fc) {
        return new Complex(f * f, f * fc).divide(f * f + fc * fc);
    }

}

package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepReader;

class SynthesizeCommandTest {
    private static final String STAGE = "sample-measurements/hydrophone-preamp-ce.stage.yaml";

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    @Test
    void writesALabelledSweepThatReadsBackAndKeepsAnExistingFile(@TempDir Path dir) throws IOException, InputProblem {
        Path out = dir.resolve("board.csv");
        String[] run = run("synthesize", "--stage", STAGE, "--fault", "gain=10", "--noise", "0dB,0deg",
                "--from", "100Hz", "--to", "1k", "--points", "11", "--out", out.toString());
        assertEquals("0", run[0], run[2]);
        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(out, "canonical").sweep();
        assertEquals(11, sweep.size());
        // log spacing: the 6th of 11 points from 100 Hz to 1 kHz is √(100·1000) Hz (closed form)
        assertEquals(Math.sqrt(1e5), sweep.points().get(5).frequencyHz(), 1e-9);
        String text = Files.readString(out);
        assertTrue(text.contains("demo data, invented"), text);
        assertTrue(text.contains("flat gain ×10.00 (+20.00 dB)"), text);
        assertTrue(text.contains("seed: 1"), text);
        String[] again = run("synthesize", "--stage", STAGE, "--out", out.toString());
        assertEquals("2", again[0]);
        assertTrue(again[2].contains("--force"), again[2]);
        assertEquals(text, Files.readString(out));
    }

    @Test
    void optionsTheWaveformRecordsDoNotTakeAreRefusedNotIgnored(@TempDir Path dir) {
        Path out = dir.resolve("records");
        String[] noise = run("synthesize", "--stage", "sample-measurements/hydrophone-preamp-ce.stage.yaml",
                "--waveforms", "--noise", "0.1dB,1deg", "--out", out.toString());
        assertEquals("2", noise[0]);
        assertTrue(noise[2].contains("--record-noise"), noise[2]);
        String[] layout = run("synthesize", "--stage", "sample-measurements/hydrophone-preamp-ce.stage.yaml",
                "--waveforms", "--layout", "canonical", "--out", out.toString());
        assertEquals("2", layout[0]);
        assertTrue(!Files.exists(out), "nothing is written when an option is refused");
    }

    @Test
    void forceWritesThroughASymbolicLinkAndRefusesAFolder(@TempDir Path dir) throws IOException {
        // issue 14: --force on a link replaces its target and keeps the link; a folder is never written over
        Path real = Files.writeString(dir.resolve("real.csv"), "old\n");
        Path link = Files.createSymbolicLink(dir.resolve("link.csv"), real);
        String[] run = run("synthesize", "--stage", STAGE, "--points", "11", "--out", link.toString(), "--force");
        assertEquals("0", run[0], run[2]);
        assertTrue(Files.isSymbolicLink(link));
        assertTrue(Files.readString(real).startsWith("# polebench sweep"), Files.readString(real));

        Path folder = Files.createDirectory(dir.resolve("folder"));
        String[] refused = run("synthesize", "--stage", STAGE, "--points", "11", "--out", folder.toString(), "--force");
        assertEquals("2", refused[0], refused[2]);
        assertTrue(refused[2].contains("not a regular file"), refused[2]);
    }

    @Test
    void aCapacitorFaultInMillifaradsIsWarnedAboutFirst(@TempDir Path dir) {
        // issue 14: m is SI milli; the caution goes to the error stream before the result line
        String[] run = run("synthesize", "--stage", STAGE, "--fault", "C1=4.7mF", "--points", "11",
                "--out", dir.resolve("x.csv").toString());
        assertEquals("0", run[0], run[2]);
        assertTrue(run[2].contains("polebench: warning: --fault C1=4.7mF") && run[2].contains("m is milli"), run[2]);
    }

    @Test
    void refusesAFaultOnAPartTheStageLacks(@TempDir Path dir) {
        String[] run = run("synthesize", "--stage", STAGE, "--fault", "C9=4.7u", "--out", dir.resolve("x.csv").toString());
        assertEquals("2", run[0]);
        assertTrue(run[2].contains("C9=4.7u"), run[2]);
        String[] bias = run("synthesize", "--stage", STAGE, "--fault", "bias:R1=0.5", "--out", dir.resolve("y.csv").toString());
        assertEquals("2", bias[0]);
        assertTrue(bias[2].contains("no transistor"), bias[2]);
    }

    @Test
    void aResistorFaultEndToEndWritesASweepWhoseNotesStateIt(@TempDir Path dir) throws IOException, InputProblem {
        // the case: the geophone's 220 Ω emitter resistor RE1a fitted as 22 Ω
        String geophone = "sample-measurements/geophone-two-stage.stage.yaml";
        Path faulty = dir.resolve("re1a.csv");
        Path healthy = dir.resolve("healthy.csv");
        String[] run = run("synthesize", "--stage", geophone, "--fault", "RE1a=22", "--noise", "0dB,0deg",
                "--from", "1kHz", "--to", "2k", "--points", "8", "--out", faulty.toString());
        assertEquals("0", run[0], run[2]);
        assertTrue(run[1].contains("as built (differences from the stage file): RE1a fitted as 22 Ω"), run[1]);
        String text = Files.readString(faulty);
        assertTrue(text.contains("RE1a fitted as 22 Ω"), text);
        assertTrue(text.contains("demo data, invented"), text);
        assertEquals("0", run("synthesize", "--stage", geophone, "--noise", "0dB,0deg", "--from", "1kHz", "--to", "2k",
                "--points", "8", "--out", healthy.toString())[0]);
        // the first stage's unbypassed emitter resistance falls from 220 Ω to 22 Ω: its gain,
        // about RC1∥Rin2 / (re + RE1a), rises by more than 10 dB (common practice, degenerated CE)
        double faultyDb = new SweepReader(ProfileLibrary.bundled()).read(faulty, "canonical").sweep().points().get(0).gainDb();
        double healthyDb = new SweepReader(ProfileLibrary.bundled()).read(healthy, "canonical").sweep().points().get(0)
                .gainDb();
        assertTrue(faultyDb - healthyDb > 10, healthyDb + " dB to " + faultyDb + " dB");

        String[] beta = run("synthesize", "--stage", geophone, "--fault", "beta:Q2=1.7", "--fault", "RE1a=22",
                "--noise", "0dB,0deg", "--from", "1kHz", "--to", "2k", "--points", "8", "--out",
                dir.resolve("beta.csv").toString());
        assertEquals("0", beta[0], beta[2]);
        assertTrue(Files.readString(dir.resolve("beta.csv")).contains(
                "Q2 current gain β ×1.700 of the stage file's; RE1a fitted as 22 Ω"), beta[1]);
    }

    @Test
    void aResistorFaultThatSaturatesTheTransistorIsExitCode2NamingTheFault(@TempDir Path dir) {
        Path out = dir.resolve("x.csv");
        String[] run = run("synthesize", "--stage", STAGE, "--fault", "RE=120", "--out", out.toString());
        assertEquals("2", run[0], run[2]);
        assertTrue(run[2].contains("RE fitted as 120 Ω"), run[2]);
        assertTrue(run[2].contains("saturated"), run[2]);
        assertTrue(run[2].contains("fix:"), run[2]);
        assertTrue(!run[2].contains("Exception") && !run[2].contains("\tat "), run[2]);
        assertTrue(Files.notExists(out));

        String[] misspelt = run("synthesize", "--stage", STAGE, "--fault", "RE1=22", "--out", out.toString());
        assertEquals("2", misspelt[0], misspelt[2]);
        assertTrue(misspelt[2].contains("did you mean R1 or RE?"), misspelt[2]);
    }

    @Test
    void aDrawSeedBuildsTheBoardWithinItsTolerancesRepeatablyAndLabelsIt(@TempDir Path dir) throws Exception {
        // zero noise, one grid: the corners differ only by the parts
        String[] grid = {"--noise", "0dB,0deg", "--from", "1Hz", "--to", "10k", "--points", "161"};
        Path nominal = dir.resolve("nominal.csv");
        Path drawn = dir.resolve("drawn.csv");
        Path again = dir.resolve("again.csv");
        assertEquals("0", run(concat(new String[]{"synthesize", "--stage", STAGE, "--out", nominal.toString()}, grid))[0]);
        String[] first = run(concat(new String[]{"synthesize", "--stage", STAGE, "--draw-seed", "12", "--board", "HP-012",
            "--out", drawn.toString()}, grid));
        assertEquals("0", first[0], first[2]);
        run(concat(new String[]{"synthesize", "--stage", STAGE, "--draw-seed", "12", "--board", "HP-012",
            "--out", again.toString()}, grid));
        // repeatable: the same seed draws the same board
        assertEquals(Files.readString(drawn), Files.readString(again));
        String text = Files.readString(drawn);
        assertTrue(text.contains("board: HP-012"), text);
        assertTrue(text.contains("draw seed: 12"), text);

        org.polebench.sweep.RoughLowerCorner rough = new org.polebench.sweep.RoughLowerCorner();
        double nominalHz = rough.estimate(read(nominal)).cornerHz().getAsDouble();
        double drawnHz = rough.estimate(read(drawn)).cornerHz().getAsDouble();
        // the draw moved the corner (C3 alone spans −20 %/+80 %), and the moved corner lies within
        // the tolerance spread of 4,000 boards of the stage (the Monte Carlo of predict, a separate
        // computation on the port-reduced model): between its 0.1 % and 99.9 % points
        assertTrue(Math.abs(drawnHz / nominalHz - 1) > 0.005, nominalHz + " " + drawnHz);
        org.polebench.spread.CornerSpread spread = new org.polebench.spread.ToleranceSpread(4000, 3)
                .lowerCorner(new org.polebench.circuit.StageReader().read(Path.of(STAGE)).stage());
        assertTrue(drawnHz > spread.percentileHz(0.001).getAsDouble() && drawnHz < spread.percentileHz(0.999).getAsDouble(),
                drawnHz + " against " + spread.percentileHz(0.001) + " to " + spread.percentileHz(0.999));
    }

    private static Sweep read(Path file) throws Exception {
        return new SweepReader(ProfileLibrary.bundled()).read(file, "canonical").sweep();
    }

    private static String[] concat(String[] a, String[] b) {
        String[] out = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }
}

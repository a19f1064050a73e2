package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.polebench.cli.CaptureRuns.read;
import static org.polebench.cli.CaptureRuns.resource;
import static org.polebench.cli.CaptureRuns.run;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.regex.Pattern;
import org.polebench.cli.CaptureRuns.Background;
import org.polebench.cli.CaptureRuns.Result;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.capture.PseudoTerminalPair;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Live scope capture end to end: {@code simulate} plays a generator and a two-channel scope of a
 * {@code serial-scope} profile, {@code capture} fetches both channels' records per frequency over
 * a loopback socket or a socat pseudo-terminal pair, as ASCII numbers or definite-length blocks,
 * and fits them as they arrive. No mocks.
 */
@Timeout(180)
class ScopeCaptureCommandTest {
    @TempDir
    Path dir;

    private static final double TAU_470N = 10_600 * 470e-9;

    /** First-order high-pass RL/(RS+RL)·jωτ/(1+jωτ), τ = (RS+RL)·C, RS 600 Ω, RL 10 kΩ: closed form. */
    private static double highPassDb(double frequencyHz, double tau) {
        double wt = 2 * Math.PI * frequencyHz * tau;
        return 20 * Math.log10(10_000.0 / 10_600 * wt / Math.hypot(1, wt));
    }

    /** Its phase, 90° − atan(ωτ) (a lead): closed form. */
    private static double highPassDeg(double frequencyHz, double tau) {
        return 90 - Math.toDegrees(Math.atan(2 * Math.PI * frequencyHz * tau));
    }

    /** Runs simulate on TCP loopback and a capture against it; @return the capture's outcome. */
    private Result overTcp(String profile, String name, String... simulateOptions) throws Exception {
        String[] args = new String[8 + simulateOptions.length];
        String[] fixed = {"simulate", "--tcp", "127.0.0.1:0", "--once", "--profile", resource(profile), "--stage",
                resource("rc-coupling.stage.yaml")};
        System.arraycopy(fixed, 0, args, 0, fixed.length);
        System.arraycopy(simulateOptions, 0, args, fixed.length, simulateOptions.length);
        Background simulator = new Background(args);
        String port = simulator.awaitOutput(Pattern.compile("listening on 127\\.0\\.0\\.1:(\\d+)"), 30_000);
        Result capture = run("capture", "--tcp", "127.0.0.1:" + port, "--profile", resource(profile),
                "--from", "2Hz", "--to", "20kHz", "--points", "12", "--out", dir.resolve(name).toString());
        assertEquals(0, simulator.join(10_000), simulator.err.toString());
        return capture;
    }

    @Test
    void asciiRecordsOverTcpGiveTheClosedFormHighPass() throws Exception {
        Result capture = overTcp("scope-test-ascii.yaml", "ascii", "--fault", "C1=470n");

        assertEquals(0, capture.code(), capture.err());
        assertTrue(capture.out().contains("point 12/12"), capture.out());
        Sweep sweep = read(dir.resolve("ascii.sweep.csv"));
        assertEquals(12, sweep.size());
        for (SweepPoint p : sweep.points()) {
            // noiseless records of 2000 samples in six-figure ASCII (relative rounding 5e-7):
            // the three-parameter fit is exact up to that rounding, about 1e-5 dB and 1e-4°
            assertEquals(highPassDb(p.frequencyHz(), TAU_470N), p.gainDb(), 1e-4, "at " + p.frequencyHz() + " Hz");
            assertEquals(highPassDeg(p.frequencyHz(), TAU_470N), p.phaseDeg().getAsDouble(), 1e-3,
                    "at " + p.frequencyHz() + " Hz");
            assertTrue(p.gainUncertaintyDb().isPresent() && p.phaseUncertaintyDeg().isPresent(), "uncertainty columns");
        }
        // the transcript holds records, not readings: reading it as a sweep is refused with a hint
        Result inspect = run("inspect", "--profile", resource("scope-test-ascii.yaml"),
                dir.resolve("ascii.transcript.log").toString());
        assertEquals(2, inspect.code(), inspect.err());
        assertTrue(inspect.err().contains("holds scope records"), inspect.err());
    }

    @Test
    void aPortLostMidSweepStopsWithExitCode3AndResumeCompletesIt() throws Exception {
        String profile = resource("scope-test-blocks.yaml");
        String stage = resource("rc-coupling.stage.yaml");
        Path name = dir.resolve("board");
        Result first;
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            Background simulator = new Background("simulate", "--port", pty.instrumentEnd().toString(),
                    "--profile", profile, "--stage", stage, "--misbehave", "close@5");
            simulator.awaitOutput(Pattern.compile("(answering)"), 30_000);
            first = run("capture", "--port", pty.benchEnd().toString(), "--profile", profile, "--from", "2Hz",
                    "--to", "20kHz", "--points", "12", "--out", name.toString());
            assertEquals(0, simulator.join(10_000));
        }
        assertEquals(3, first.code(), first.err());
        assertTrue(first.err().contains("4 of 12 points are in"), first.err());

        Result second;
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            Background simulator = new Background("simulate", "--port", pty.instrumentEnd().toString(),
                    "--profile", profile, "--stage", stage);
            simulator.awaitOutput(Pattern.compile("(answering)"), 30_000);
            second = run("capture", "--port", pty.benchEnd().toString(), "--profile", profile,
                    "--resume", name.toString());
            pty.close();
            assertEquals(0, simulator.join(10_000));
        }
        assertEquals(0, second.code(), second.err());
        assertTrue(second.out().contains("resuming at point 5 of 12"), second.out());
        Sweep sweep = read(dir.resolve("board.sweep.csv"));
        assertEquals(12, sweep.size());
        for (SweepPoint p : sweep.points()) {
            // the designed 1 µF (τ = 10.6 ms), within the int8 blocks' quantisation as above
            assertEquals(highPassDb(p.frequencyHz(), 10_600 * 1e-6), p.gainDb(), 0.02, "at " + p.frequencyHz() + " Hz");
        }
    }

    @Test
    void blockRecordsOverAPseudoTerminalGiveTheHighPassWithinTheirQuantisation() throws Exception {
        String profile = resource("scope-test-blocks.yaml");
        Result capture;
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            Background simulator = new Background("simulate", "--port", pty.instrumentEnd().toString(),
                    "--profile", profile, "--stage", resource("rc-coupling.stage.yaml"), "--fault", "C1=470n");
            simulator.awaitOutput(Pattern.compile("(answering)"), 30_000);
            capture = run("capture", "--port", pty.benchEnd().toString(), "--profile", profile, "--from", "2Hz",
                    "--to", "20kHz", "--points", "12", "--out", dir.resolve("blocks").toString());
            pty.close();   // the simulator ends when its port vanishes
            assertEquals(0, simulator.join(10_000), simulator.err.toString());
        }
        assertEquals(0, capture.code(), capture.err());
        Sweep sweep = read(dir.resolve("blocks.sweep.csv"));
        assertEquals(12, sweep.size());
        for (SweepPoint p : sweep.points()) {
            // signed bytes with the peak near code 102: a step of 1 % of the amplitude, whose
            // rounding error (q/√12 a sample, spread over 2000 samples) moves the fitted amplitude
            // by about 1e-4 relative (0.001 dB) and the phase by about 0.005°; 0.02 dB and 0.1°
            // leave room for the error's not being white
            assertEquals(highPassDb(p.frequencyHz(), TAU_470N), p.gainDb(), 0.02, "at " + p.frequencyHz() + " Hz");
            assertEquals(highPassDeg(p.frequencyHz(), TAU_470N), p.phaseDeg().getAsDouble(), 0.1,
                    "at " + p.frequencyHz() + " Hz");
            assertTrue(p.gainUncertaintyDb().getAsDouble() > 0, "the quantisation shows in the fit's residuals");
        }
    }

    @Test
    void clippedRecordsAreCapturedWithAClippingWarning() throws Exception {
        // 0.2 Vpp is 0.1 V peak at the input; an input limit of 60 mV flattens its tops
        Result capture = overTcp("scope-test-ascii.yaml", "clipped", "--scope-clip", "60mV");

        assertEquals(0, capture.code(), capture.err());
        assertTrue(capture.err().contains("input channel is clipped"), capture.err());
    }

    @Test
    void coarselyQuantisedNoisyRecordsStillFitWithinTheirStatedUncertainty() throws Exception {
        // 6 bits over each channel's range (a step of 3.9 % of the peak) and 0.5 mV of noise
        Result capture = overTcp("scope-test-ascii.yaml", "coarse", "--fault", "C1=470n", "--scope-bits", "6",
                "--scope-noise", "0.5mV", "--seed", "5");

        assertEquals(0, capture.code(), capture.err());
        Sweep sweep = read(dir.resolve("coarse.sweep.csv"));
        assertEquals(12, sweep.size());
        for (SweepPoint p : sweep.points()) {
            double u = p.gainUncertaintyDb().getAsDouble();
            // the stated uncertainty comes from the residuals (noise plus quantisation); the
            // error stays within 4 u (a normal error passes 4 u with probability 6e-5)
            double error = Math.abs(p.gainDb() - highPassDb(p.frequencyHz(), TAU_470N));
            assertTrue(error <= Math.max(4 * u, 1e-6), "at " + p.frequencyHz() + " Hz: error " + error + " dB, u " + u);
            // and u itself is near the Cramér–Rao bound for a sine in white noise, σ_A/A = σ·√(2/N)/A
            // (Händel 2000): at its worst, 2 Hz, the output is 6 mV peak, so 0.5 mV with the steps'
            // q/√12 gives about 0.025 dB; 0.1 dB allows both channels and the bound's looseness
            assertTrue(u < 0.1, "at " + p.frequencyHz() + " Hz: u " + u + " dB");
        }
    }

    @Test
    void aSpoiltBlockHeaderOnEveryTryStopsWithExitCode3AndAClearReason() throws Exception {
        // the test profile repeats a step once: the third point's frequency is sent as commands 3 and 4
        Result capture = overTcp("scope-test-blocks.yaml", "spoilt", "--misbehave", "garbage@3,garbage@4");

        assertEquals(3, capture.code(), capture.err());
        assertTrue(capture.err().contains("is not a record"), capture.err());
        assertTrue(capture.err().contains("2 of 12 points are in"), capture.err());
        assertFalse(capture.err().contains("Exception"), capture.err());
    }

    @Test
    void anAnswerThatNeverComesStopsWithExitCode3AfterTheTimeout() throws Exception {
        Result capture = overTcp("scope-test-blocks.yaml", "silent", "--misbehave", "drop@2,drop@3");

        assertEquals(3, capture.code(), capture.err());
        assertTrue(capture.err().contains("within 2000 ms"), capture.err());
        assertTrue(capture.err().contains("1 of 12 points are in"), capture.err());
        assertFalse(capture.err().contains("Exception"), capture.err());
    }

    @Test
    void theCautionsBeforeARealScopeCaptureNameTheProbes() {
        // the user guide's cautions for scope capture ("Live scope capture"): probe grounds,
        // attenuation, the output's rating; a meter's capture leaves them out
        StringWriter scope = new StringWriter();
        BenchCautions.print(new PrintWriter(scope), 0.2, 5, "Vpp", true);
        assertTrue(scope.toString().contains("ground clips go to the stage's ground only"), scope.toString());
        assertTrue(scope.toString().contains("attenuation"), scope.toString());
        StringWriter meter = new StringWriter();
        BenchCautions.print(new PrintWriter(meter), 0.2, 5, "Vpp", false);
        assertFalse(meter.toString().contains("scope probes"), meter.toString());
    }

    @Test
    void aBlockScopeWithMoreConverterBitsThanItsCodingIsRefused() {
        Result r = run("simulate", "--tcp", "127.0.0.1:0", "--profile", resource("scope-test-blocks.yaml"),
                "--scope-bits", "12");
        assertEquals(2, r.code(), r.err());
        assertTrue(r.err().contains("12 bits"), r.err());
    }

    // the pseudo-terminals are closed early on purpose (the simulator ends when its port vanishes)
    @SuppressWarnings("try")
    @Test
    void aFaultyBoardCapturedAsScopeRecordsIsDiagnosedByReconcile() throws Exception {
        // the demo hydrophone preamp (invented) built with a 47 µF emitter bypass instead of 470 µF
        String stage = Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml").toString();
        String profile = resource("scope-test-blocks.yaml");
        Result capture;
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            Background simulator = new Background("simulate", "--port", pty.instrumentEnd().toString(),
                    "--profile", profile, "--stage", stage, "--fault", "C3=47u", "--scope-noise", "0.5mV",
                    "--seed", "11");
            simulator.awaitOutput(Pattern.compile("(answering)"), 30_000);
            capture = run("capture", "--port", pty.benchEnd().toString(), "--profile", profile, "--from", "2Hz",
                    "--to", "20kHz", "--points", "31", "--amplitude", "20mVpp", "--out",
                    dir.resolve("hp").toString());
            pty.close();
            assertEquals(0, simulator.join(10_000));
        }
        assertEquals(0, capture.code(), capture.err());

        Result reconcile = run("reconcile", "--stage", stage, "--sweep", dir.resolve("hp.sweep.csv").toString(),
                "--json", "--samples", "200");
        assertTrue(reconcile.code() == 0 || reconcile.code() == 1, reconcile.err());
        com.fasterxml.jackson.databind.JsonNode top = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(reconcile.out()).get("hypotheses").get(0);
        // the injected fault (synthetic case with known truth) is the most probable hypothesis
        assertEquals("capacitor", top.get("kind").asText(), reconcile.out());
        assertEquals("C3", top.get("part").asText(), reconcile.out());
        // 47 µF back-solved within 10 %: narrow against the 470 µF designed
        assertEquals(47e-6, top.get("estimated_value").asDouble(), 0.1 * 47e-6, reconcile.out());
    }
}

package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BooleanSupplier;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.AppendedSweep;
import org.polebench.sweepfile.SweepReader;
import org.polebench.synth.Fault;
import org.polebench.synth.InstrumentSimulator;
import org.polebench.synth.Misbehaviour;
import org.polebench.synth.StageBoard;
import org.polebench.synth.SweepNoise;

/**
 * Live capture over a real pseudo-terminal pair (socat), against the instrument simulator
 * playing the closed-form test stage: no mocks between the two ends. Faults are the
 * simulator's own misbehaviours ({@link Misbehaviour}).
 */
@Timeout(180)
class SweepCaptureTest {
    private static final SweepPlan PLAN = new SweepPlan(2, 20_000, 16);
    /** Bench noise of a good two-channel analyser, as the issues quote it: 0.05 dB and 0.5°. */
    private static final double GAIN_SIGMA_DB = 0.05;
    private static final double PHASE_SIGMA_DEG = 0.5;

    @TempDir
    Path dir;

    /** What one capture against the simulator gave. */
    private record Run(CaptureOutcome outcome, List<String> simulatorSent, List<String> events) {
    }

    private InstrumentSimulator simulator(double gainSigmaDb, double phaseSigmaDeg, List<Misbehaviour> faults)
            throws InputProblem {
        return new InstrumentSimulator(CaptureBench.scpiProfile(), StageBoard.of(CaptureBench.rcStage(), ""),
                new SweepNoise(gainSigmaDb, phaseSigmaDeg), 7, faults);
    }

    // the pseudo-terminals are closed early on purpose: the port vanishing is what the run tests
    @SuppressWarnings("try")
    private Run capture(InstrumentSimulator simulator, CaptureRequest request, BooleanSupplier stop) throws Exception {
        SerialProfile profile = CaptureBench.scpiProfile();
        PortSettings settings = new SweepCapture(profile).portSettings("generator");
        List<String> events = new ArrayList<>();
        CaptureListener listener = new CaptureListener() {
            @Override
            public void retrying(double frequencyHz, String reason, int attempt, int allowed) {
                events.add("retry " + attempt + ": " + reason);
            }

            @Override
            public void point(CaptureProgress progress) {
                events.add("point " + progress.pointNumber());
            }
        };
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            SimulatorThread sim = new SimulatorThread(simulator.session(),
                    SerialLine.open(pty.instrumentEnd().toString(), settings));
            // a pseudo-terminal outlives the close of one end, so a port that vanishes is socat
            // going away, as a USB adapter pulled out takes the device with it
            Thread unplug = new Thread(() -> {
                try {
                    if (sim.awaitEnd(120_000) && sim.end() == InstrumentSimulator.End.CLOSED_ON_PURPOSE) {
                        pty.close();
                    }
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }, "unplug");
            unplug.setDaemon(true);
            unplug.start();
            try {
                CaptureOutcome outcome;
                try (SerialLine bench = SerialLine.open(pty.benchEnd().toString(), settings)) {
                    outcome = new SweepCapture(profile).run(request, CaptureBench.oneLine(bench), listener, stop);
                }
                sim.awaitEnd(5_000);
                return new Run(outcome, sim.sent(), events);
            } finally {
                sim.close();
                unplug.interrupt();
            }
        }
    }

    private Run capture(InstrumentSimulator simulator, String name) throws Exception {
        return capture(simulator, CaptureRequest.of(PLAN, dir.resolve(name)), () -> false);
    }

    private static Sweep read(Path file) throws InputProblem {
        return new SweepReader(ProfileLibrary.bundled()).read(file, "canonical").sweep();
    }

    /** Asserts the sweep is the noise-free closed-form high-pass at the planned frequencies. */
    private static void assertClosedForm(Sweep sweep, double farads) {
        assertEquals(PLAN.points(), sweep.size());
        for (int i = 0; i < PLAN.points(); i++) {
            SweepPoint p = sweep.points().get(i);
            // the frequency on file is the one sent, NR3 with 7 digits (IEEE 488.2), exactly
            assertEquals(PLAN.sentHz(i), p.frequencyHz(), 0);
            double[] expected = CaptureBench.highPass(p.frequencyHz(), farads);
            // the simulator answers in NR3 with 7 significant digits: a relative error of 5e-7
            // per amplitude is 4.3e-6 dB each, so 2e-5 dB covers both channels; phases of at
            // most 90° carry 1e-5° of rounding
            assertEquals(expected[0], p.gainDb(), 2e-5, "gain at " + p.frequencyHz() + " Hz");
            assertEquals(expected[1], p.phaseDeg().getAsDouble(), 2e-5, "phase at " + p.frequencyHz() + " Hz");
        }
    }

    @Test
    void noiseFreeCaptureEqualsTheClosedFormHighPass() throws Exception {
        Run run = capture(simulator(0, 0, List.of()), "rc");

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, run.outcome());
        assertEquals(16, done.points());
        Sweep sweep = read(done.sweepFile());
        assertClosedForm(sweep, CaptureBench.FARADS);
        assertTrue(sweep.source().instrument().contains("simulated bench"), sweep.source().instrument());
        // the profile states ±0.1 dB and ±0.5°: standard uncertainties half-width/√3 (GUM 4.3.7)
        assertEquals(0.1 / Math.sqrt(3), sweep.points().get(0).gainUncertaintyDb().getAsDouble(), 1e-15);
        assertEquals(0.5 / Math.sqrt(3), sweep.points().get(0).phaseUncertaintyDeg().getAsDouble(), 1e-15);
        // nothing received is lost: every line the simulator sent is in the transcript, in order
        assertEquals(run.simulatorSent(), CaptureBench.receivedLines(done.transcript()));
    }

    @Test
    void noisyCaptureStaysWithinTheStatedNoiseOfTheModel() throws Exception {
        Run run = capture(simulator(GAIN_SIGMA_DB, PHASE_SIGMA_DEG, List.of()), "noisy");

        Sweep sweep = read(run.outcome().sweepFile());
        double sumSquares = 0;
        for (SweepPoint p : sweep.points()) {
            double[] expected = CaptureBench.highPass(p.frequencyHz(), CaptureBench.FARADS);
            double gainZ = (p.gainDb() - expected[0]) / GAIN_SIGMA_DB;
            double phaseZ = (p.phaseDeg().getAsDouble() - expected[1]) / PHASE_SIGMA_DEG;
            // Gaussian noise: |z| > 5 has probability 6e-7 per draw (fixed seed 7)
            assertTrue(Math.abs(gainZ) < 5 && Math.abs(phaseZ) < 5, "at " + p.frequencyHz() + " Hz: " + gainZ
                    + ", " + phaseZ);
            sumSquares += gainZ * gainZ + phaseZ * phaseZ;
        }
        // and it is noise of the stated size, not none: Σz² over 32 draws is χ² with 32 degrees of
        // freedom, below 10 or above 70 with probability under 1e-4 each
        assertTrue(sumSquares > 10 && sumSquares < 70, "chi-square " + sumSquares);
    }

    @Test
    void aWrongCapacitorShowsItsOwnCorner() throws Exception {
        double fitted = 0.47e-6;
        InstrumentSimulator faulty = new InstrumentSimulator(CaptureBench.scpiProfile(),
                StageBoard.asBuilt(CaptureBench.rcStage(), List.of(new Fault.CapacitorValue("C1", fitted))),
                SweepNoise.NONE, 7, List.of());
        Run run = capture(faulty, "fault");
        assertClosedForm(read(run.outcome().sweepFile()), fitted);
    }

    @Test
    void aTransistorStageWithABypassFaultIsCapturedAsItsStateSpaceModel() throws Exception {
        Stage designed = new StageReader().read(CaptureBench.resource("ce-no-device-caps.stage.yaml")).stage();
        InstrumentSimulator faulty = new InstrumentSimulator(CaptureBench.scpiProfile(),
                StageBoard.asBuilt(designed, List.of(new Fault.CapacitorValue("C3", 47e-6))), SweepNoise.NONE, 7,
                List.of());
        // 10 mV keeps the 43 dB stage's output below the test profile's 7 V full scale
        CaptureRequest request = new CaptureRequest(Optional.of(PLAN), OptionalDouble.of(0.01), dir.resolve("ce"),
                false, Optional.empty());
        Run run = capture(faulty, request, () -> false);

        // the independent reference: the port-reduced state-space model of the stage as built,
        // H = C(jωI − A)⁻¹B + D (docs/method.md, "Port reduction"), where the simulator solves the full
        // complex MNA system
        Stage built = designed.withCapacitance("C3", 47e-6);
        Reduction reduction = new PortReduction().reduce(new SmallSignalExpansion().expand(built), Band.LOW);
        StateModel model = ((Reduction.StateSpace) reduction).model();
        Sweep sweep = read(run.outcome().sweepFile());
        assertEquals(PLAN.points(), sweep.size());
        for (SweepPoint p : sweep.points()) {
            org.apache.commons.math3.complex.Complex h = model.responseAtHz(p.frequencyHz());
            // 7-digit NR3 answers: 2e-5 dB (see assertClosedForm), and a phase of 100° to 999°
            // sent with 7 digits is within ±5e-5°; compared modulo a turn, since the file keeps
            // the midband in (−180°, 180°]
            assertEquals(20 * Math.log10(h.abs()), p.gainDb(), 2e-5, "gain at " + p.frequencyHz() + " Hz");
            double phaseError = PhaseUnwrap.fold(p.phaseDeg().getAsDouble() - Math.toDegrees(h.getArgument()));
            assertEquals(0, phaseError, 6e-5, "phase at " + p.frequencyHz() + " Hz");
        }
    }

    @Test
    void aDroppedAnswerIsWaitedForThenTheStepIsRepeated() throws Exception {
        Run run = capture(simulator(0, 0, List.of(new Misbehaviour(Misbehaviour.Kind.DROP, 3, 0))), "drop");

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, run.outcome());
        assertClosedForm(read(done.sweepFile()), CaptureBench.FARADS);
        assertEquals(1, run.events().stream().filter(e -> e.startsWith("retry")).count(), run.events().toString());
        assertTrue(run.events().get(2).contains("no answer"), run.events().toString());
        assertEquals(run.simulatorSent(), CaptureBench.receivedLines(done.transcript()));
    }

    @Test
    void aGarbledAnswerIsLoggedAndTheStepRepeated() throws Exception {
        Run run = capture(simulator(0, 0, List.of(new Misbehaviour(Misbehaviour.Kind.GARBAGE, 5, 0))), "garbage");

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, run.outcome());
        assertClosedForm(read(done.sweepFile()), CaptureBench.FARADS);
        List<String> received = CaptureBench.receivedLines(done.transcript());
        assertTrue(received.stream().anyMatch(l -> l.startsWith("#?")), "the garbage is in the transcript");
        assertEquals(run.simulatorSent(), received);
        assertTrue(run.events().stream().anyMatch(e -> e.contains("cannot be read")), run.events().toString());
    }

    @Test
    void aStallPastTheTimeoutIsResynchronisedAndTheLateAnswerNotTakenForAReading() throws Exception {
        // the test profile's timeout is 1.5 s: a 4 s stall outlasts it and one resynchronisation
        Run run = capture(simulator(0, 0, List.of(new Misbehaviour(Misbehaviour.Kind.STALL, 4, 4000))), "stall");

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, run.outcome());
        assertClosedForm(read(done.sweepFile()), CaptureBench.FARADS);
        assertEquals(run.simulatorSent(), CaptureBench.receivedLines(done.transcript()));
        assertTrue(Files.readString(done.transcript()).contains("discarded while resynchronising"));
    }

    @Test
    void answersThatNeverComeStopTheCaptureAfterTheRetries() throws Exception {
        // point 3 is tried 1 + 3 times (the test profile's retries); each try is a frequency command
        List<Misbehaviour> drops = List.of(new Misbehaviour(Misbehaviour.Kind.DROP, 3, 0),
                new Misbehaviour(Misbehaviour.Kind.DROP, 4, 0), new Misbehaviour(Misbehaviour.Kind.DROP, 5, 0),
                new Misbehaviour(Misbehaviour.Kind.DROP, 6, 0));
        Run run = capture(simulator(0, 0, drops), "dead");

        CaptureOutcome.Stopped stopped = assertInstanceOf(CaptureOutcome.Stopped.class, run.outcome());
        assertEquals(CaptureOutcome.StopReason.NO_ANSWER, stopped.reason());
        assertEquals(2, stopped.points());
        assertTrue(stopped.message().contains("point 3 of 16") && stopped.message().contains("4 times"),
                stopped.message());
        // the generator is turned off on the way out
        assertTrue(Files.readString(stopped.transcript()).contains("generator > OUTP OFF"));
    }

    @Test
    void thePortClosedMidSweepThenResumedGivesTheUninterruptedSweepPointForPoint() throws Exception {
        Run whole = capture(simulator(GAIN_SIGMA_DB, PHASE_SIGMA_DEG, List.of()), "whole");
        Sweep uninterrupted = read(whole.outcome().sweepFile());

        Run first = capture(simulator(GAIN_SIGMA_DB, PHASE_SIGMA_DEG,
                List.of(new Misbehaviour(Misbehaviour.Kind.CLOSE, 8, 0))), "cut");
        CaptureOutcome.Stopped stopped = assertInstanceOf(CaptureOutcome.Stopped.class, first.outcome());
        assertEquals(CaptureOutcome.StopReason.PORT_LOST, stopped.reason());
        assertEquals(7, stopped.points());
        assertEquals(7, Files.readAllLines(stopped.sweepFile()).stream().filter(l -> l.matches("^\\d.*")).count());

        CaptureRequest resume = new CaptureRequest(Optional.empty(), OptionalDouble.empty(), dir.resolve("cut"), true,
                Optional.empty());
        Run second = capture(simulator(GAIN_SIGMA_DB, PHASE_SIGMA_DEG, List.of()), resume, () -> false);
        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, second.outcome());
        assertEquals(16, done.points());
        assertEquals(List.of("point 8", "point 9", "point 10", "point 11", "point 12", "point 13", "point 14",
                "point 15", "point 16"), second.events());

        // exactly equal, point for point: the noise depends on the frequency only and each
        // point's phase only on the point before
        assertEquals(uninterrupted.points(), read(done.sweepFile()).points());
        List<String> sent = new ArrayList<>(first.simulatorSent());
        sent.addAll(second.simulatorSent());
        assertEquals(sent, CaptureBench.receivedLines(done.transcript()));
    }

    @Test
    void overTcpAClosedConnectionIsAPortLostAtOnce() throws Exception {
        InstrumentSimulator.Session session = simulator(0, 0,
                List.of(new Misbehaviour(Misbehaviour.Kind.CLOSE, 6, 0))).session();
        CaptureOutcome outcome;
        try (java.net.ServerSocket server = new java.net.ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
            Thread serving = new Thread(() -> {
                try (java.net.Socket socket = server.accept();
                     TcpLine line = TcpLine.accepted(socket, PortSettings.LineEnding.LF)) {
                    session.serve(line, () -> false, sent -> { });
                } catch (java.io.IOException e) {
                    // the test's assertions say what went wrong
                }
            }, "tcp simulator");
            serving.setDaemon(true);
            serving.start();
            try (TcpLine bench = TcpLine.connect("127.0.0.1", server.getLocalPort(), PortSettings.LineEnding.LF, 5000)) {
                assertTrue(bench.local());
                outcome = new SweepCapture(CaptureBench.scpiProfile()).run(CaptureRequest.of(PLAN, dir.resolve("tcp")),
                        CaptureBench.oneLine(bench), CaptureListener.silent(), () -> false);
            }
            serving.join(10_000);
        }
        CaptureOutcome.Stopped stopped = assertInstanceOf(CaptureOutcome.Stopped.class, outcome);
        assertEquals(CaptureOutcome.StopReason.PORT_LOST, stopped.reason());
        assertEquals(5, stopped.points());
        assertEquals(5, AppendedSweep.reopen(stopped.sweepFile()).points().size());
    }

    // the simulator is a resource only to be stopped at the end: it serves on its own thread
    @SuppressWarnings("try")
    @Test
    void aStopRequestEndsCleanlyWithTheCompletedPointsOnDiskAndTheGeneratorOff() throws Exception {
        AtomicInteger points = new AtomicInteger();
        CaptureListener counter = new CaptureListener() {
            @Override
            public void point(CaptureProgress progress) {
                points.incrementAndGet();
            }
        };
        SerialProfile profile = CaptureBench.scpiProfile();
        PortSettings settings = new SweepCapture(profile).portSettings("generator");
        CaptureOutcome outcome;
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir);
             SimulatorThread sim = new SimulatorThread(simulator(0, 0, List.of()).session(),
                     SerialLine.open(pty.instrumentEnd().toString(), settings));
             SerialLine bench = SerialLine.open(pty.benchEnd().toString(), settings)) {
            outcome = new SweepCapture(profile).run(CaptureRequest.of(PLAN, dir.resolve("stop")),
                    CaptureBench.oneLine(bench), counter, () -> points.get() >= 5);
        }
        CaptureOutcome.Stopped stopped = assertInstanceOf(CaptureOutcome.Stopped.class, outcome);
        assertEquals(CaptureOutcome.StopReason.INTERRUPTED, stopped.reason());
        assertEquals(5, stopped.points());
        assertEquals(5, AppendedSweep.reopen(stopped.sweepFile()).points().size());
        List<String> transcript = Files.readAllLines(stopped.transcript());
        assertTrue(transcript.stream().anyMatch(l -> l.endsWith("generator > OUTP OFF")));
    }

    @Test
    void aLevelAboveTheProfileMaximumIsRefusedBeforeAnythingIsSent() throws Exception {
        SerialProfile profile = CaptureBench.scpiProfile();
        try (java.net.ServerSocket server = new java.net.ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress());
             TcpLine bench = TcpLine.connect("127.0.0.1", server.getLocalPort(), PortSettings.LineEnding.LF, 5000);
             java.net.Socket far = server.accept()) {
            CaptureRequest tooHigh = new CaptureRequest(Optional.of(PLAN), OptionalDouble.of(1.5), dir.resolve("high"),
                    false, Optional.empty());
            InputProblem problem = assertThrows(InputProblem.class, () -> new SweepCapture(profile).run(tooHigh,
                    CaptureBench.oneLine(bench), CaptureListener.silent(), () -> false));
            assertTrue(problem.getMessage().contains("above the profile's max-amplitude"), problem.getMessage());
            far.setSoTimeout(300);
            assertThrows(java.net.SocketTimeoutException.class, () -> far.getInputStream().read());
            assertTrue(Files.notExists(dir.resolve("high.sweep.csv")) && Files.notExists(dir.resolve("high.transcript.log")));
        }
    }

    @Test
    void anExistingCaptureIsNeverOverwritten() throws Exception {
        Files.writeString(dir.resolve("kept.sweep.csv"), "precious\n");
        SerialProfile profile = CaptureBench.scpiProfile();
        try (java.net.ServerSocket server = new java.net.ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress());
             TcpLine bench = TcpLine.connect("127.0.0.1", server.getLocalPort(), PortSettings.LineEnding.LF, 5000)) {
            InputProblem problem = assertThrows(InputProblem.class, () -> new SweepCapture(profile).run(
                    CaptureRequest.of(PLAN, dir.resolve("kept")), CaptureBench.oneLine(bench), CaptureListener.silent(),
                    () -> false));
            assertTrue(problem.hint().contains("--resume"), problem.hint());
        }
        assertEquals("precious\n", Files.readString(dir.resolve("kept.sweep.csv")));
    }
}

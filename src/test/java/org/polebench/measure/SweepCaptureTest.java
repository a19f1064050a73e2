package org.polebench.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * Live capture over a real pseudo-terminal pair (socat), against the instrument simulator
 * playing the test stage: no mocks between the two ends.
 */
@Timeout(120)
class SweepCaptureTest {
    @TempDir
    Path dir;

    private CaptureOutcome capture(SerialProfile profile, InstrumentSimulator simulator, CaptureRequest request,
                                   List<String> simulatorSent) throws Exception {
        PortSettings settings = new SweepCapture(profile).portSettings("generator");
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            SimulatorThread sim = new SimulatorThread(simulator.session(),
                    SerialLine.open(pty.instrumentEnd().toString(), settings));
            try {
                CaptureOutcome outcome;
                try (SerialLine bench = SerialLine.open(pty.benchEnd().toString(), settings)) {
                    outcome = new SweepCapture(profile).run(request, CaptureBench.oneLine(bench),
                            CaptureListener.silent(), () -> false);
                }
                sim.awaitEnd(5_000);
                simulatorSent.addAll(sim.sent());
                return outcome;
            } finally {
                sim.close();
            }
        }
    }

    @Test
    void noiseFreeCaptureEqualsTheClosedFormHighPass() throws Exception {
        SerialProfile profile = CaptureBench.scpiProfile();
        InstrumentSimulator simulator = new InstrumentSimulator(profile,
                StageBoard.of(CaptureBench.rcStage(), ""), 0, 0, 1, List.of());
        SweepPlan plan = new SweepPlan(2, 20_000, 16);
        List<String> sent = new java.util.ArrayList<>();
        CaptureOutcome outcome = capture(profile, simulator, CaptureRequest.of(plan, dir.resolve("rc")), sent);

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, outcome);
        assertEquals(16, done.points());
        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(done.sweepFile(), "canonical").sweep();
        assertEquals(16, sweep.size());
        for (int i = 0; i < plan.points(); i++) {
            SweepPoint p = sweep.points().get(i);
            // the frequency on file is the one sent, NR3 with 7 digits (IEEE 488.2), exactly
            assertEquals(plan.sentHz(i), p.frequencyHz(), 0);
            double[] expected = CaptureBench.highPass(p.frequencyHz(), CaptureBench.FARADS);
            // the simulator answers in NR3 with 7 significant digits: a relative error of 5e-7 per
            // amplitude is 4.3e-6 dB each, so 2e-5 dB covers both channels; phases of at most 90°
            // carry 1e-5° of rounding
            assertEquals(expected[0], p.gainDb(), 2e-5, "gain at " + p.frequencyHz() + " Hz");
            assertEquals(expected[1], p.phaseDeg().getAsDouble(), 2e-5, "phase at " + p.frequencyHz() + " Hz");
        }
        assertTrue(sweep.source().instrument().contains("simulated generator"), sweep.source().instrument());
        // nothing received is lost: every line the simulator sent is in the transcript, in order
        assertEquals(sent, CaptureBench.receivedLines(done.transcript()));
    }
}

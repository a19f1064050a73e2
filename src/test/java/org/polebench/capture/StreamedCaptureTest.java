package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.SweepReader;
import org.polebench.synth.InstrumentSimulator;
import org.polebench.synth.Misbehaviour;
import org.polebench.synth.StageBoard;
import org.polebench.synth.SweepNoise;

/** Capture from a self-sweeping instrument streaming one line per point, over a pseudo-terminal pair. */
@Timeout(120)
class StreamedCaptureTest {
    private static final SweepPlan PLAN = new SweepPlan(2, 20_000, 14);

    @TempDir
    Path dir;

    /** How the last simulator ended, for failure messages. */
    private Object simulatorEnd;

    private CaptureOutcome capture(List<Misbehaviour> faults, CaptureRequest request) throws Exception {
        SerialProfile profile = CaptureBench.streamingProfile();
        InstrumentSimulator simulator = new InstrumentSimulator(profile, StageBoard.of(CaptureBench.rcStage(), ""),
                SweepNoise.BENCH, 3, faults);
        PortSettings settings = new SweepCapture(profile).portSettings(profile.name());
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir)) {
            SimulatorThread sim = new SimulatorThread(simulator.session(),
                    SerialLine.open(pty.instrumentEnd().toString(), settings));
            try (SerialLine bench = SerialLine.open(pty.benchEnd().toString(), settings)) {
                return new SweepCapture(profile).run(request, Map.of(profile.name(), bench), CaptureListener.silent(),
                        () -> false);
            } finally {
                simulatorEnd = sim.end();
                sim.close();
            }
        }
    }

    private static String transcript(Path file) {
        try {
            return java.nio.file.Files.readString(file);
        } catch (java.io.IOException e) {
            return e.toString();
        }
    }

    private static Sweep read(Path file) throws InputProblem {
        return new SweepReader(ProfileLibrary.bundled()).read(file, "canonical").sweep();
    }

    @Test
    void aStreamedSweepIsTheModelWithinItsNoise() throws Exception {
        CaptureOutcome outcome = capture(List.of(), CaptureRequest.of(PLAN, dir.resolve("s")));
        assertInstanceOf(CaptureOutcome.Completed.class, outcome, outcome::toString);
        Sweep sweep = read(outcome.sweepFile());
        assertEquals(14, sweep.size());
        for (int i = 0; i < PLAN.points(); i++) {
            SweepPoint p = sweep.points().get(i);
            // the instrument reports the frequency it swept: log spacing in NR3, like the plan's
            assertEquals(PLAN.sentHz(i), p.frequencyHz(), 0);
            double[] expected = CaptureBench.highPass(p.frequencyHz(), CaptureBench.FARADS);
            // 0.05 dB and 0.5° Gaussian noise (seed 3): 5σ is exceeded with probability 6e-7 per
            // draw; the streamed text rounds gain to 1e-6 dB and phase to 1e-4°
            assertEquals(expected[0], p.gainDb(), 5 * 0.05 + 1e-6);
            assertEquals(expected[1], p.phaseDeg().getAsDouble(), 5 * 0.5 + 1e-4);
        }
    }

    @Test
    void aStreamCutShortThenResumedAddsNoPointTwice() throws Exception {
        Sweep whole = read(capture(List.of(), CaptureRequest.of(PLAN, dir.resolve("whole"))).sweepFile());

        // the simulator closes its end before the 6th point, and then sends nothing: a timeout
        CaptureOutcome cut = capture(List.of(new Misbehaviour(Misbehaviour.Kind.CLOSE, 6, 0)),
                CaptureRequest.of(PLAN, dir.resolve("cut")));
        CaptureOutcome.Stopped stopped = assertInstanceOf(CaptureOutcome.Stopped.class, cut);
        assertEquals(5, stopped.points(), () -> simulatorEnd + "\n" + transcript(stopped.transcript()));

        CaptureOutcome resumed = capture(List.of(), new CaptureRequest(Optional.empty(), OptionalDouble.empty(),
                dir.resolve("cut"), true, Optional.empty()));
        assertInstanceOf(CaptureOutcome.Completed.class, resumed);
        assertEquals(whole.points(), read(resumed.sweepFile()).points());
    }
}

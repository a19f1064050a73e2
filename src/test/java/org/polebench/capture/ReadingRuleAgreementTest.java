package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.ProfileReader;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.sweepfile.SweepReader;

/**
 * Import and live capture turn the same readings into the same points by one rule (issue 12):
 * an instrument answering a gain ratio of exactly 0 at one frequency and a negative ratio at
 * another is captured over a pseudo-terminal pair, and the capture's own transcript (every
 * answer as it came) is then imported with the same profile. Both must leave out the same two
 * frequencies with a warning naming each, and keep the same points; the capture must complete
 * (before issue 12 a ratio not above 0 was an unreadable answer, repeated and then a stop).
 */
@Timeout(120)
class ReadingRuleAgreementTest {
    private static final SweepPlan PLAN = new SweepPlan(10, 10_000, 10);
    /** Where the scripted instrument answers a ratio of exactly 0 and a negative ratio. */
    private static final int ZERO_AT = 3;
    private static final int NEGATIVE_AT = 6;
    private static final double NEGATIVE_RATIO = -0.25;
    /** Corner of the invented first-order high-pass the instrument answers, in Hz. */
    private static final double CORNER_HZ = 100;

    @TempDir
    Path dir;

    /** @return the ratio the scripted instrument answers at point i of the plan */
    private static double ratio(int i) {
        if (i == ZERO_AT) {
            return 0;
        }
        if (i == NEGATIVE_AT) {
            return NEGATIVE_RATIO;
        }
        double f = PLAN.sentHz(i);
        return f / Math.hypot(f, CORNER_HZ);
    }

    /** @return the phase in degrees it answers at point i: atan(fc/f), first-order high-pass */
    private static double phaseDeg(int i) {
        return Math.toDegrees(Math.atan2(CORNER_HZ, PLAN.sentHz(i)));
    }

    @Test
    void aZeroAndANegativeRatioAreLeftOutAlikeByImportAndCapture() throws Exception {
        SerialProfile profile = (SerialProfile) new ProfileReader().read(CaptureBench.resource("scpi-ratio-test.yaml"));
        CaptureOutcome outcome = capture(profile, CaptureRequest.of(PLAN, dir.resolve("ratio")));

        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, outcome, outcome::toString);
        Sweep captured = new SweepReader(ProfileLibrary.bundled()).read(done.sweepFile(), "canonical").sweep();
        ImportedSweep imported = new SweepReader(ProfileLibrary.bundled())
                .read(done.transcript(), CaptureBench.resource("scpi-ratio-test.yaml").toString());

        // the two frequencies left out, each with a warning naming it (the rule's wording, in
        // capture by frequency and in import by the transcript line of the answer)
        String zeroHz = hz(PLAN.sentHz(ZERO_AT));
        String negativeHz = hz(PLAN.sentHz(NEGATIVE_AT));
        assertEquals(List.of(zeroHz + " Hz left out: gain ratio 0 is no reading (below any noise floor)",
                negativeHz + " Hz left out: gain ratio -0.250000 is negative: a magnitude cannot be"), done.warnings());
        assertEquals(2, done.skipped());
        List<String> importWarnings = new ArrayList<>();
        for (InputWarning warning : imported.warnings()) {
            importWarnings.add(warning.message());
        }
        assertTrue(importWarnings.contains("gain ratio 0 is no reading (below any noise floor); row dropped"),
                importWarnings.toString());
        assertTrue(importWarnings.contains("gain ratio -0.250000 is negative: a magnitude cannot be; row skipped"),
                importWarnings.toString());

        // the same points on both sides, and they are the answers converted by the definition
        // of the decibel, 20·log10(ratio): every planned frequency but the two left out
        assertEquals(PLAN.points() - 2, captured.size());
        assertEquals(captured.size(), imported.sweep().size());
        int k = 0;
        for (int i = 0; i < PLAN.points(); i++) {
            if (i == ZERO_AT || i == NEGATIVE_AT) {
                continue;
            }
            SweepPoint c = captured.points().get(k);
            SweepPoint m = imported.sweep().points().get(k);
            k++;
            // the frequency on file is the NR3 text sent, parsed alike on both sides: exactly
            assertEquals(PLAN.sentHz(i), c.frequencyHz(), 0);
            assertEquals(c.frequencyHz(), m.frequencyHz(), 0);
            // the answers are NR3 with 7 significant digits: a relative error of 5e-7 in the
            // ratio is 4.3e-6 dB, and 1e-5° in a phase below 90°
            double expectedDb = 20 * Math.log10(ratio(i));
            assertEquals(expectedDb, c.gainDb(), 5e-6, "captured gain at " + c.frequencyHz() + " Hz");
            assertEquals(phaseDeg(i), c.phaseDeg().getAsDouble(), 1e-5, "captured phase at " + c.frequencyHz() + " Hz");
            // the canonical file carries enough digits to read back within 1e-9 (its round trip)
            assertEquals(c.gainDb(), m.gainDb(), 1e-9, "imported gain at " + m.frequencyHz() + " Hz");
            assertEquals(c.phaseDeg().getAsDouble(), m.phaseDeg().getAsDouble(), 1e-9,
                    "imported phase at " + m.frequencyHz() + " Hz");
        }
    }

    private static String hz(double value) {
        return value == Math.rint(value) ? String.format(Locale.ROOT, "%.0f", value)
                : String.format(Locale.ROOT, "%.6g", value);
    }

    private CaptureOutcome capture(SerialProfile profile, CaptureRequest request) throws Exception {
        PortSettings settings = new SweepCapture(profile).portSettings("analyser");
        try (PseudoTerminalPair pty = PseudoTerminalPair.open(dir);
             SerialLine instrumentEnd = SerialLine.open(pty.instrumentEnd().toString(), settings)) {
            AtomicBoolean stop = new AtomicBoolean();
            Thread instrument = new Thread(() -> answer(instrumentEnd, stop), "scripted analyser");
            instrument.setDaemon(true);
            instrument.start();
            try (SerialLine bench = SerialLine.open(pty.benchEnd().toString(), settings)) {
                return new SweepCapture(profile).run(request, java.util.Map.of("analyser", bench),
                        CaptureListener.silent(), () -> false);
            } finally {
                stop.set(true);
                instrument.join(5_000);
            }
        }
    }

    /**
     * The scripted analyser: answers its identity, *OPC?, the error queue (always empty) and,
     * for the frequency last set, the ratio and phase of {@link #ratio} and {@link #phaseDeg},
     * in NR3 with 7 significant digits. The answers depend on the frequency only, so a repeated
     * step reads the same.
     */
    private static void answer(SerialLine line, AtomicBoolean stop) {
        int point = -1;
        try {
            while (!stop.get()) {
                Optional<String> received = line.receive(50);
                if (received.isEmpty()) {
                    continue;
                }
                String command = received.get().strip();
                if (command.equals("*IDN?")) {
                    line.send("POLEBENCH,SCRIPTED RATIO ANALYSER (TEST),0,1");
                } else if (command.startsWith("FREQ ")) {
                    point = nearestPoint(Double.parseDouble(command.substring(5)));
                } else if (command.equals("*OPC?")) {
                    line.send("1");
                } else if (command.equals("MEAS:GAIN?")) {
                    line.send(nr3(ratio(point)));
                } else if (command.equals("MEAS:PHAS?")) {
                    line.send(nr3(phaseDeg(point)));
                } else if (command.equals("SYST:ERR?")) {
                    line.send("+0,\"No error\"");
                }
            }
        } catch (IOException e) {
            // the bench end went away: the capture is over
        }
    }

    private static int nearestPoint(double hz) {
        int best = 0;
        for (int i = 1; i < PLAN.points(); i++) {
            if (Math.abs(PLAN.sentHz(i) - hz) < Math.abs(PLAN.sentHz(best) - hz)) {
                best = i;
            }
        }
        return best;
    }

    private static String nr3(double value) {
        return String.format(Locale.ROOT, "%.6E", value);
    }
}

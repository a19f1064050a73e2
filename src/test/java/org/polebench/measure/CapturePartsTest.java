package org.polebench.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

/** The pieces of a live capture that need no line: plan, line splitting, files, misbehaviour text. */
class CapturePartsTest {
    @TempDir
    Path dir;

    @Test
    void aLogPlanHasEqualRatiosAndExactEnds() {
        SweepPlan plan = new SweepPlan(2, 200_000, 61);
        assertEquals(2, plan.frequencyHz(0), 0);
        assertEquals(200_000, plan.frequencyHz(60), 0);
        // five decades over 60 steps: each step is 10^(5/60) (log spacing, by definition)
        double ratio = Math.pow(10, 5.0 / 60);
        for (int i = 1; i < 61; i++) {
            assertEquals(ratio, plan.frequencyHz(i) / plan.frequencyHz(i - 1), 1e-12);
        }
        assertEquals(plan, SweepPlan.parse(plan.describe()));
        assertEquals(2.423055, plan.sentHz(1), 0);   // 2·10^(1/12) = 2.42305532…, sent with 7 digits
    }

    @Test
    void linesAreSplitAcrossReadsAndCrLfIsTakenForLf() {
        LineAssembler lines = new LineAssembler(PortSettings.LineEnding.LF);
        byte[] first = "1.0E+00\r\n2.5".getBytes(StandardCharsets.US_ASCII);
        byte[] second = "E-01\nrest".getBytes(StandardCharsets.US_ASCII);
        lines.accept(first, first.length);
        assertEquals(Optional.of("1.0E+00"), lines.next());
        assertEquals(Optional.empty(), lines.next());
        lines.accept(second, second.length);
        assertEquals(Optional.of("2.5E-01"), lines.next());
        assertEquals("rest", lines.unfinished());
    }

    @Test
    void aBadByteSpoilsOneLineOnly() {
        LineAssembler lines = new LineAssembler(PortSettings.LineEnding.CR);
        byte[] bytes = {'o', 'k', '\r', (byte) 0xff, 'x', '\r', '1', '\r'};
        lines.accept(bytes, bytes.length);
        assertEquals(Optional.of("ok"), lines.next());
        assertEquals(Optional.of("\uFFFDx"), lines.next());   // U+FFFD, the Unicode replacement character
        assertEquals(Optional.of("1"), lines.next());
    }

    @Test
    void transcriptKeepsOneLinePerReceivedLine() {
        assertEquals("a\\x0Db\\\\c\tz", CaptureTranscript.escaped("a\rb\\c\tz"));
    }

    @Test
    void aReopenedSweepReadsBackExactlyAndDropsARowCutShort() throws Exception {
        Path file = dir.resolve("cut.sweep.csv");
        SweepPoint a = new SweepPoint(2.0, -20.123456789012345, OptionalDouble.of(84.2987654321), OptionalDouble.of(0.0577),
                OptionalDouble.of(0.2887));
        SweepPoint b = new SweepPoint(3.17, -16.1, OptionalDouble.of(80.5), OptionalDouble.of(0.0577),
                OptionalDouble.of(0.2887));
        try (AppendedSweep sweep = AppendedSweep.create(file, Provenance.inMemory("test"), true, true, true)) {
            sweep.append(a);
            sweep.append(b);
        }
        Files.writeString(file, "5.02,-12.", java.nio.file.StandardOpenOption.APPEND);
        try (AppendedSweep again = AppendedSweep.reopen(file)) {
            assertEquals(List.of(a, b), again.points());
        }
        assertTrue(Files.readString(file).endsWith("\n"), "the cut row is gone");
        assertThrows(InputProblem.class, () -> AppendedSweep.create(file, Provenance.inMemory("test"), true, true, true));
    }

    @Test
    void theFinalShiftBringsTheMidbandPhaseIntoOneTurnByWholeTurns() throws Exception {
        Path file = dir.resolve("shift.sweep.csv");
        try (AppendedSweep sweep = AppendedSweep.create(file, Provenance.inMemory("test"), true, false, false)) {
            sweep.append(SweepPoint.of(10, 3, -150));
            sweep.append(SweepPoint.of(100, 20, -185));   // the midband, unwrapped past −180°
            sweep.append(SweepPoint.of(1000, 19, -200));
            assertEquals(360, sweep.settlePhaseTurns(), 0);
        }
        try (AppendedSweep shifted = AppendedSweep.reopen(file)) {
            assertEquals(List.of(210.0, 175.0, 160.0),
                    shifted.points().stream().map(p -> p.phaseDeg().getAsDouble()).toList());
        }
    }

    @Test
    void misbehavioursReadFromText() throws InputProblem {
        assertEquals(new Misbehaviour(Misbehaviour.Kind.STALL, 12, 4000), Misbehaviour.parse("stall@12=4s"));
        assertEquals(new Misbehaviour(Misbehaviour.Kind.STALL, 3, 500), Misbehaviour.parse("stall@3=500ms"));
        assertEquals(new Misbehaviour(Misbehaviour.Kind.CLOSE, 20, 0), Misbehaviour.parse("close@20"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("stall@3"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("drop@0"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("drop@2=1s"));
    }
}

package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.polebench.profile.PortSettings;

/** The pieces of a live capture that need no line: the sweep plan, line splitting and the transcript. */
class CapturePartsTest {
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
    void aLineWithoutItsEndingIsCutAtTheLimitAndTheNextLineReads() {
        // a device streaming 200,000 bytes with no line ending (issue 15): memory stops at the limit
        LineAssembler lines = new LineAssembler(PortSettings.LineEnding.LF);
        byte[] noise = new byte[200_000];
        java.util.Arrays.fill(noise, (byte) '7');
        lines.accept(noise, noise.length);
        byte[] rest = "\nok\n".getBytes(StandardCharsets.US_ASCII);
        lines.accept(rest, rest.length);
        String cut = lines.next().orElseThrow();
        long limit = org.polebench.InputLimits.standing().maxLineChars();
        assertEquals(limit + 1, cut.length());          // the first part, and the "…" that marks the cut
        assertEquals('\u2026', cut.charAt(cut.length() - 1));
        assertEquals(Optional.of("ok"), lines.next());
    }

    @Test
    void transcriptKeepsOneLinePerReceivedLine() {
        assertEquals("a\\x0Db\\\\c\tz", CaptureTranscript.escaped("a\rb\\c\tz"));
    }
}

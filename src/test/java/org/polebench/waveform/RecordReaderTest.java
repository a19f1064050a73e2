package org.polebench.waveform;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.WaveformProfile;

class RecordReaderTest {
    @TempDir
    Path folder;

    private static WaveformProfile timeVolts() {
        return ProfileLibrary.bundled().find("scope-time-volts").orElseThrow().asWaveform().orElseThrow();
    }

    @Test
    void readsQuotedCellsCrlfLinesAByteOrderMarkAndALongRecordAcrossBufferBoundaries() throws Exception {
        StringBuilder text = new StringBuilder("\uFEFF# a comment\r\n\"time (s)\",\"ch1 (V)\",\"ch2 (V)\"\r\n");
        int n = 50_000;     // about 1.5 MB: many refills of the reader's 64 KiB buffer
        for (int i = 0; i < n; i++) {
            text.append(String.format(Locale.ROOT, "\"%.9e\",%d,\"%d\"\r\n", i * 1e-6, i, -i));
        }
        Path file = folder.resolve("rec-2.5kHz.csv");
        byte[] bytes = text.toString().getBytes(StandardCharsets.UTF_8);
        Files.write(file, bytes);
        MessageDigest sha = MessageDigest.getInstance("SHA-256");
        WaveformRecord record = new RecordReader(timeVolts()).read(file, sha);
        assertEquals(n, record.length());
        // the samples as written (exact integers) and the interval from the time column
        assertEquals(12_345, record.input(12_345));
        assertEquals(-49_999, record.output(n - 1));
        assertEquals(1e-6, record.intervalSeconds(), 1e-18);
        // "2.5k" before "Hz" in the file name (engineering notation)
        assertEquals(2500, record.statedFrequencyHz().orElseThrow(), 0);
        // the first sample is on line 3; every row has its own line
        assertEquals(3, record.lineOf(0));
        // the digest is of the file's bytes (an independent MessageDigest over them)
        assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes)),
                HexFormat.of().formatHex(sha.digest()));
    }

    @Test
    void samplesOffTheEvenTimeGridAreRefusedNamingTheLine() throws Exception {
        StringBuilder text = new StringBuilder("time,ch1,ch2\n");
        for (int i = 0; i < 100; i++) {
            double t = i == 40 ? 40.6e-6 : i * 1e-6;     // sample 41 is 0.6 intervals late
            text.append(String.format(Locale.ROOT, "%.9e,0,1%n", t));
        }
        Path file = folder.resolve("jitter.csv");
        Files.writeString(file, text);
        InputProblem problem = assertThrows(InputProblem.class, () ->
                new RecordReader(timeVolts()).read(file, MessageDigest.getInstance("SHA-256")));
        assertEquals(42, problem.line(), problem.describe());
        assertTrue(problem.getMessage().startsWith("sample 41 is off the even time grid"), problem.getMessage());
    }

    @Test
    void aCellThatIsNotANumberIsRefusedNamingTheLine() throws Exception {
        Path file = folder.resolve("bad.csv");
        Files.writeString(file, "time,ch1,ch2\n0,1,2\n1e-6,1,2\n2e-6,OVL,2\n");
        InputProblem problem = assertThrows(InputProblem.class, () ->
                new RecordReader(timeVolts()).read(file, MessageDigest.getInstance("SHA-256")));
        assertEquals(4, problem.line());
        assertTrue(problem.getMessage().startsWith("column 2 of this sample row is not a number"), problem.getMessage());
    }
}

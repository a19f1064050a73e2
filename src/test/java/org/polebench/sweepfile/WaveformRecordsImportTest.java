package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/** A folder of scope records read as a sweep through SweepReader, the entry point the commands use. */
class WaveformRecordsImportTest {
    @TempDir
    Path folder;

    /** The synthetic board: a first-order high-pass, H = 2·jf/fc/(1 + jf/fc), fc = 100 Hz. */
    private static double[] response(double f) {
        double x = f / 100;
        double magnitude = 2 * x / Math.sqrt(1 + x * x);
        double phase = Math.PI / 2 - Math.atan(x);
        return new double[] {magnitude, phase};
    }

    /** A record in the shipped scope-interval-semicolon layout: decimal comma, interval and frequency in the header. */
    private void writeSemicolonRecord(String name, double f) throws Exception {
        double interval = 3.3 / (f * 1000);        // 3.3 periods in 1000 samples
        double[] h = response(f);
        StringBuilder text = new StringBuilder();
        text.append(String.format(Locale.ROOT, "interval;%.10g%nfrequency;%.10g%nch1;ch2%n", interval, f).replace('.', ','));
        for (int i = 0; i < 1000; i++) {
            double theta = 2 * Math.PI * f * i * interval;
            String row = String.format(Locale.ROOT, "%.9f;%.9f%n", 0.1 * Math.cos(theta),
                    0.1 * h[0] * Math.cos(theta + h[1]));
            text.append(row.replace('.', ','));
        }
        Files.writeString(folder.resolve(name), text);
    }

    @Test
    void aFolderOfRecordsBecomesASweepAscendingInFrequencyWithEachFitsUncertainty() throws Exception {
        double[] frequencies = {1000, 10, 30, 100, 300, 3000, 20, 50, 200};
        for (int i = 0; i < frequencies.length; i++) {
            writeSemicolonRecord(String.format(Locale.ROOT, "rec%02d.csv", i), frequencies[i]);
        }
        Files.writeString(folder.resolve("broken.csv"), "interval;0,001\nfrequency;5\nch1;ch2\n0,1;oops\n");
        Files.writeString(folder.resolve("notes.txt"), "not a record: the profile's files pattern is *.csv\n");
        ImportedSweep imported = new SweepReader(ProfileLibrary.bundled()).read(List.of(folder), SweepReader.AUTO);
        Sweep sweep = imported.sweep();
        assertEquals("auto", imported.profileName());
        assertTrue(imported.mapping().startsWith("sniffed: records match profile scope-interval-semicolon"),
                imported.mapping());
        assertEquals(9, sweep.size());
        for (SweepPoint point : sweep.points()) {
            double[] h = response(point.frequencyHz());
            // synthetic truth; the samples are written to 1e-9 V, far below these tolerances
            assertEquals(20 * Math.log10(h[0]), point.gainDb(), 1e-6, "gain at " + point.frequencyHz());
            assertEquals(Math.toDegrees(h[1]), point.phaseDeg().getAsDouble(), 1e-5, "phase at " + point.frequencyHz());
            assertTrue(point.gainUncertaintyDb().isPresent() && point.phaseUncertaintyDeg().isPresent());
        }
        assertEquals(10, sweep.lowestHz(), "ascending: the lowest frequency first");
        List<InputWarning> dropped = imported.warnings().stream()
                .filter(w -> w.message().startsWith("record dropped")).toList();
        assertEquals(1, dropped.size(), imported.warnings().toString());
        assertEquals(folder.resolve("broken.csv"), dropped.get(0).file());
        assertEquals(4, dropped.get(0).line(), "the sample row that is not a number");
        assertEquals(64, sweep.source().sha256().length());
        assertEquals(folder, sweep.source().sourceFile().orElseThrow());
    }

    @Test
    void tooFewUsableRecordsIsAProblemNamingTheFolder() throws Exception {
        writeSemicolonRecord("a.csv", 100);
        writeSemicolonRecord("b.csv", 200);
        InputProblem problem = assertThrows(InputProblem.class, () ->
                new SweepReader(ProfileLibrary.bundled()).read(List.of(folder), "scope-interval-semicolon"));
        assertTrue(problem.getMessage().contains("2 record file(s) gave 2 usable point(s)"), problem.getMessage());
        assertEquals(folder, problem.file().orElseThrow());
    }

    @Test
    void aTableProfileNamedForRecordsIsRefusedWithAHint() throws Exception {
        writeSemicolonRecord("a.csv", 100);
        InputProblem problem = assertThrows(InputProblem.class, () ->
                new SweepReader(ProfileLibrary.bundled()).read(List.of(folder), "db-degrees"));
        assertTrue(problem.getMessage().contains("not a set of waveform records"), problem.getMessage());
    }
}

package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.SweepPoint;

/** Each data check of issue 3, on a file with a known fault at a known line. */
class DataChecksTest {
    private static final SweepReader READER = new SweepReader(ProfileLibrary.bundled());
    private static final String HEADER = "Frequency (Hz),Gain (dB),Phase (deg)";

    @TempDir
    Path dir;

    /** Header on line 1; the closed form of DemoSweeps at n log-spaced points on lines 2.. */
    private static StringBuilder good(int n) {
        StringBuilder text = new StringBuilder(HEADER).append('\n');
        for (double f : DemoSweeps.logSpaced(0.5, 20_000, n)) {
            double[] h = DemoSweeps.response(f);
            text.append(f).append(',').append(h[0]).append(',').append(h[1]).append('\n');
        }
        return text;
    }

    private ImportedSweep read(String text) throws InputProblem, IOException {
        Path file = dir.resolve("sweep.csv");
        Files.writeString(file, text);
        return READER.read(file, "db-degrees");
    }

    private static InputWarning warningAt(ImportedSweep imported, int line) {
        return imported.warnings().stream().filter(w -> w.line() == line).findFirst()
                .orElseThrow(() -> new AssertionError("no warning at line " + line + ": " + imported.warnings()));
    }

    private static String withLine(StringBuilder text, int line, String replacement) {
        List<String> lines = new java.util.ArrayList<>(List.of(text.toString().split("\n")));
        lines.set(line - 1, replacement);
        return String.join("\n", lines) + "\n";
    }

    @Test
    void nonNumericCellIsSkippedAndNamed() throws Exception {
        ImportedSweep imported = read(withLine(good(20), 5, "12.5,abc,3"));
        assertEquals(19, imported.sweep().size());
        assertTrue(warningAt(imported, 5).message().contains("'abc' is not a number"));
    }

    @Test
    void nanAndInfinityAreNotReadings() throws Exception {
        String text = withLine(good(20), 5, "12.5,NaN,3");
        text = withLine(new StringBuilder(text), 6, "13.5,-3,Infinity");
        ImportedSweep imported = read(text);
        assertEquals(18, imported.sweep().size());
        assertTrue(warningAt(imported, 5).message().contains("not a reading"));
        assertTrue(warningAt(imported, 6).message().contains("not a reading"));
    }

    @Test
    void thousandsSeparatorIsRefusedNotTruncated() throws Exception {
        // PITFALLS, OpenCSV: locale parsing read "17,739.89" as 17; here the row is refused
        ImportedSweep imported = read(withLine(good(20), 4, "\"17,739.89\",3,4"));
        assertEquals(19, imported.sweep().size());
        assertTrue(warningAt(imported, 4).message().contains("'17,739.89' is not a number"));
    }

    @Test
    void rowWithMoreCellsThanTheHeaderIsRefusedWithItsLine() {
        // issue 14: "12,5" with a decimal comma in a comma file splits into two cells, and the
        // phase would be read from the gain's decimals; the header names three columns
        InputProblem problem = assertThrows(InputProblem.class,
                () -> read(withLine(good(20), 6, "12,5,3,1,-45,2")));
        assertEquals(6, problem.line());
        assertTrue(problem.getMessage().contains("6 cells but the header row (line 1) names 3"), problem.getMessage());
        assertTrue(problem.hint().contains("decimal comma"), problem.hint());
    }

    @Test
    void trailingDelimiterIsNotAnExtraCell() throws Exception {
        // common practice: some instruments end every row with the delimiter; a blank last cell adds nothing
        ImportedSweep imported = read(withLine(good(20), 6, "12.5,3,4,"));
        assertEquals(20, imported.sweep().size());
    }

    @Test
    void emptyRowsAreWarnedAbout() throws Exception {
        ImportedSweep imported = read(withLine(good(20), 7, ",,"));
        assertTrue(warningAt(imported, 7).message().contains("empty row"));
    }

    @Test
    void nonPositiveFrequencyIsDropped() throws Exception {
        ImportedSweep imported = read(withLine(good(20), 3, "-1,3,4"));
        assertEquals(19, imported.sweep().size());
        assertTrue(warningAt(imported, 3).message().contains("not positive"));
    }

    @Test
    void duplicateFrequenciesAreMergedByAveraging() throws Exception {
        StringBuilder text = good(20);
        double f = DemoSweeps.logSpaced(0.5, 20_000, 20)[10];
        text.append(f).append(",19.0,1.0\n");
        ImportedSweep imported = read(text.toString());
        assertEquals(20, imported.sweep().size());
        SweepPoint merged = imported.sweep().points().get(10);
        double[] h = DemoSweeps.response(f);
        // the mean of the two readings, by construction; 1e-12 is round-off
        assertEquals((h[0] + 19.0) / 2, merged.gainDb(), 1e-12);
        assertEquals((h[1] + 1.0) / 2, merged.phaseDeg().getAsDouble(), 1e-12);
        // line 22 comes after larger frequencies, so it is both sorted and merged: two warnings
        assertTrue(imported.warnings().stream().anyMatch(w -> w.line() == 22 && w.message().contains("repeats line 12")),
                imported.warnings().toString());
        assertTrue(imported.warnings().stream().anyMatch(w -> w.line() == 22 && w.message().contains("sorted")));
    }

    @Test
    void outOfOrderRowIsSortedWithAWarning() throws Exception {
        StringBuilder text = good(20);
        text.append("2.0,10,100\n");
        ImportedSweep imported = read(text.toString());
        assertEquals(21, imported.sweep().size());
        assertTrue(warningAt(imported, 22).message().contains("sorted"));
        for (int i = 1; i < imported.sweep().size(); i++) {
            assertTrue(imported.sweep().points().get(i).frequencyHz() > imported.sweep().points().get(i - 1).frequencyHz());
        }
    }

    @Test
    void readingsAtTheNoiseFloorAreDropped() throws Exception {
        // db-degrees ships a noise floor of -100 dB
        ImportedSweep imported = read(withLine(good(20), 2, "0.5,-100,170"));
        assertEquals(19, imported.sweep().size());
        assertTrue(warningAt(imported, 2).message().contains("noise floor"));
    }

    @Test
    void clippedReadingIsDropped() throws Exception {
        ImportedSweep imported = read(withLine(good(20), 9, "30,OVL,1"));
        assertEquals(19, imported.sweep().size());
        assertTrue(warningAt(imported, 9).message().contains("saturated"));
        // an amplitude at the two-channel profile's full scale (7 Vrms) is clipped
        Path file = dir.resolve("amp.csv");
        StringBuilder amp = new StringBuilder("Frequency (Hz),CH1 (Vrms),CH2 (Vrms),Phase CH1-CH2 (deg)\n");
        for (double f : DemoSweeps.logSpaced(0.5, 20_000, 20)) {
            double[] h = DemoSweeps.response(f);
            amp.append(f).append(",0.1,").append(0.1 * Math.pow(10, h[0] / 20)).append(',').append(-h[1]).append('\n');
        }
        amp.append("25000,0.1,7.0,0\n");
        Files.writeString(file, amp);
        ImportedSweep two = READER.read(file, "two-channel-rms");
        assertEquals(20, two.sweep().size());
        assertTrue(warningAt(two, 22).message().contains("clipped"));
        // lag-positive profile: the stored phase is lead positive, the closed form's own sign
        assertEquals(DemoSweeps.response(0.5)[1], two.sweep().points().get(0).phaseDeg().getAsDouble(), 1e-9);
    }

    @Test
    void fewerThanEightPointsIsAnErrorNamingTheLastLine() {
        InputProblem problem = assertThrows(InputProblem.class, () -> read(good(7).toString()));
        assertEquals(8, problem.line());
        assertTrue(problem.getMessage().contains("only 7 usable points"));
    }

    @Test
    void sweepThatStopsAboveTheCornerIsWarnedAbout() throws Exception {
        StringBuilder text = new StringBuilder(HEADER).append('\n');
        for (double f : DemoSweeps.logSpaced(20, 20_000, 20)) {
            double[] h = DemoSweeps.response(f);
            text.append(f).append(',').append(h[0]).append(',').append(h[1]).append('\n');
        }
        ImportedSweep imported = read(text.toString());
        assertTrue(imported.warnings().stream().anyMatch(w -> w.message().contains("does not reach below")),
                imported.warnings().toString());
    }

    @Test
    void sweepThatEndsOnTheSlopeIsWarnedAbout() throws Exception {
        StringBuilder text = new StringBuilder(HEADER).append('\n');
        for (double f : DemoSweeps.logSpaced(0.2, 4, 20)) {
            double[] h = DemoSweeps.response(f);
            text.append(f).append(',').append(h[0]).append(',').append(h[1]).append('\n');
        }
        ImportedSweep imported = read(text.toString());
        assertTrue(imported.warnings().stream().anyMatch(w -> w.message().contains("does not reach above")),
                imported.warnings().toString());
    }

    @Test
    void manyBadRowsAreListedUpToACapAndCounted() throws Exception {
        StringBuilder text = good(20);
        for (int i = 0; i < 100; i++) {
            text.append(String.format(Locale.ROOT, "%d,x,1%n", 30_000 + i));
        }
        ImportedSweep imported = read(text.toString());
        long listed = imported.warnings().stream().filter(w -> w.line() > 0).count();
        assertEquals(WarningTally.LISTED_PER_KIND, listed);
        assertTrue(imported.warnings().stream().anyMatch(w -> w.message().startsWith("100 non-numeric cells in all")));
    }
}

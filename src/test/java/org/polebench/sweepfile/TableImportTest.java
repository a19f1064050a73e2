package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.Sweep;

/** The awkward files users meet: encodings, marks, line ends, quoting, other languages. */
class TableImportTest {
    private static final SweepReader READER = new SweepReader(ProfileLibrary.bundled());

    @TempDir
    Path dir;

    /** Twelve rows of the closed form in DemoSweeps, formatted by the caller's row function. */
    private static List<double[]> rows() {
        List<double[]> rows = new ArrayList<>();
        for (double f : DemoSweeps.logSpaced(0.5, 20_000, 12)) {
            double[] h = DemoSweeps.response(f);
            rows.add(new double[] {f, h[0], h[1]});
        }
        return rows;
    }

    private Path write(String name, String text, Charset charset) throws IOException {
        Path file = dir.resolve(name);
        Files.write(file, text.getBytes(charset));
        return file;
    }

    private static String table(String header, String delimiter, boolean decimalComma, String lineEnd) {
        StringBuilder text = new StringBuilder(header).append(lineEnd);
        for (double[] r : rows()) {
            String row = String.format(Locale.ROOT, "%s%s%s%s%s", Double.toString(r[0]), delimiter, Double.toString(r[1]),
                    delimiter, Double.toString(r[2]));
            text.append(decimalComma ? row.replace('.', ',') : row).append(lineEnd);
        }
        return text.toString();
    }

    /** Exact: each cell holds Double.toString of the closed form, which reads back bit for bit. */
    private static void assertRows(Sweep sweep) {
        List<double[]> rows = rows();
        assertEquals(rows.size(), sweep.size());
        for (int i = 0; i < rows.size(); i++) {
            assertEquals(rows.get(i)[0], sweep.points().get(i).frequencyHz(), 0.0);
            assertEquals(rows.get(i)[1], sweep.points().get(i).gainDb(), 0.0);
            assertEquals(rows.get(i)[2], sweep.points().get(i).phaseDeg().getAsDouble(), 0.0);
        }
    }

    @Test
    void decimalCommaLatin1GermanHeaderReadsWithAutoAndWithItsProfile() throws Exception {
        String text = "Messung 17\nGerät: Demo (erfunden)\n\n"
                + table("Frequenz (Hz);Verstärkung (dB);Phase (°)", ";", true, "\n");
        Path file = write("de.txt", text, StandardCharsets.ISO_8859_1);

        ImportedSweep auto = READER.read(file, "auto");

        assertRows(auto.sweep());
        assertTrue(auto.mapping().contains("decimal comma") && auto.mapping().contains("latin-1"), auto.mapping());
        assertTrue(auto.mapping().contains("'Verstärkung (dB)'"), auto.mapping());
        assertRows(READER.read(file, "semicolon-decimal-comma").sweep());
    }

    @Test
    void byteOrderMarkAndCrlfLineEndsAreHarmless() throws Exception {
        Path file = write("bom.csv", "\uFEFF" + table("Frequency (Hz),Gain (dB),Phase (deg)", ",", false, "\r\n"),
                StandardCharsets.UTF_8);
        ImportedSweep imported = READER.read(file, "db-degrees");
        assertRows(imported.sweep());
        assertTrue(imported.warnings().stream().allMatch(w -> w.line() == 0), imported.warnings().toString());
        assertRows(READER.read(file, "auto").sweep());
    }

    @Test
    void quotedCellsAndTrailingDelimitersRead() throws Exception {
        StringBuilder text = new StringBuilder("\"Frequency (Hz)\",\"Gain (dB)\",\"Phase (deg)\",\n");
        for (double[] r : rows()) {
            text.append('"').append(r[0]).append("\",\"").append(r[1]).append("\",").append(r[2]).append(",,\n");
        }
        Path file = write("quoted.csv", text.toString(), StandardCharsets.UTF_8);
        assertRows(READER.read(file, "db-degrees").sweep());
        assertRows(READER.read(file, "auto").sweep());
    }

    @Test
    void blanksAroundQuotedCellsReadAndAnUnclosedQuoteSkipsOnlyItsRow() throws Exception {
        // The two odd inputs of the OpenCSV change (CellSplitter's class comment): blanks after a
        // closing quote are dropped as before, and a row whose quote is never closed is skipped
        // with its own warning even when a separator ends it.
        StringBuilder text = new StringBuilder("\"Frequency (Hz)\" , \"Gain (dB)\" , \"Phase (deg)\"\n");
        for (double[] r : rows()) {
            text.append('"').append(r[0]).append("\" , \"").append(r[1]).append("\" ,").append(r[2]).append('\n');
        }
        text.append("\"7.5,-1.0,-2.0,\n");
        Path file = write("blanks.csv", text.toString(), StandardCharsets.UTF_8);
        ImportedSweep imported = READER.read(file, "db-degrees");
        assertRows(imported.sweep());
        int broken = rows().size() + 2;
        assertTrue(imported.warnings().stream().anyMatch(w -> w.line() == broken && w.message().contains("never closed")),
                imported.warnings().toString());
        assertRows(READER.read(file, "auto").sweep());
    }

    @Test
    void spanishAndFrenchHeadersAreSniffed() throws Exception {
        assertRows(READER.read(write("es.csv", table("Frecuencia (Hz),Ganancia (dB),Fase (grados)", ",", false, "\n"),
                StandardCharsets.UTF_8), "auto").sweep());
        assertRows(READER.read(write("fr.txt", table("Fréquence (Hz)\tGain (dB)\tPhase (°)", "\t", false, "\n"),
                StandardCharsets.UTF_8), "auto").sweep());
    }

    @Test
    void latin1BytesUnderAUtf8ProfileAreAProblemNamingTheirLine() throws Exception {
        String text = table("Frequency (Hz),Gain (dB),Phase (deg)", ",", false, "\n") + "# Verstärker\n";
        Path file = write("bad.csv", text, StandardCharsets.ISO_8859_1);
        InputProblem problem = assertThrows(InputProblem.class, () -> READER.read(file, "db-degrees"));
        assertEquals(14, problem.line());
        assertTrue(problem.hint().contains("latin-1"));
    }

    @Test
    void ambiguousHeaderListsTheCandidates() throws Exception {
        // "Gain" with positive values only: a ratio or dB? And two phase columns.
        StringBuilder text = new StringBuilder("Freq (Hz),Gain,Phase A,Phase B\n");
        for (double[] r : rows()) {
            text.append(r[0]).append(',').append(Math.pow(10, r[1] / 20)).append(',').append(r[2]).append(',')
                    .append(r[2]).append('\n');
        }
        Path file = write("ambiguous.csv", text.toString(), StandardCharsets.UTF_8);
        InputProblem problem = assertThrows(InputProblem.class, () -> READER.read(file, "auto"));
        assertEquals(1, problem.line());
        assertTrue(problem.getMessage().contains("dB or a linear ratio"), problem.getMessage());
        assertTrue(problem.getMessage().contains("column 3 'Phase A' or column 4 'Phase B'"), problem.getMessage());
    }

    @Test
    void aProfileWhoseColumnsAreNotInTheHeaderNamesWhatItFound() throws Exception {
        Path file = write("other.csv", table("Freq (kHz),Mag,Angle", ",", false, "\n"), StandardCharsets.UTF_8);
        InputProblem problem = assertThrows(InputProblem.class, () -> READER.read(file, "db-degrees"));
        assertEquals(1, problem.line());
        assertTrue(problem.getMessage().contains("'Freq (kHz)', 'Mag', 'Angle'"), problem.getMessage());
    }

    @Test
    void descendingSweepIsReversedWithOneWarning() throws Exception {
        List<double[]> rows = rows();
        StringBuilder text = new StringBuilder("Frequency (Hz),Gain (dB),Phase (deg)\n");
        for (int i = rows.size() - 1; i >= 0; i--) {
            double[] r = rows.get(i);
            text.append(r[0]).append(',').append(r[1]).append(',').append(r[2]).append('\n');
        }
        ImportedSweep imported = READER.read(write("down.csv", text.toString(), StandardCharsets.UTF_8), "db-degrees");
        assertRows(imported.sweep());
        List<InputWarning> lined = imported.warnings().stream().filter(w -> w.line() > 0).toList();
        assertEquals(1, lined.size(), lined.toString());
        assertEquals(2, lined.get(0).line());
        assertTrue(lined.get(0).message().contains("descend"));
    }
}

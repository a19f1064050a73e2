package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import com.opencsv.CSVReader;
import com.opencsv.CSVReaderBuilder;
import com.opencsv.RFC4180ParserBuilder;
import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;

class CapacitorCsvTest {

    // OWASP "CSV Injection": a cell starting with = + - @ tab or CR is prefixed with '
    @Test
    void formulaCellsAreNeutralised() {
        assertEquals("'=1+2", CapacitorCsv.field("=1+2"));
        assertEquals("'+1", CapacitorCsv.field("+1"));
        assertEquals("'-1", CapacitorCsv.field("-1"));
        assertEquals("'@SUM(A1)", CapacitorCsv.field("@SUM(A1)"));
        assertEquals("'\tx", CapacitorCsv.field("\tx"));
        assertEquals("C1", CapacitorCsv.field("C1"));
        // RFC 4180 §2.6–2.7: a field with a comma or quote is quoted, inner quotes doubled
        assertEquals("\"a,b\"", CapacitorCsv.field("a,b"));
        assertEquals("\"say \"\"hi\"\"\"", CapacitorCsv.field("say \"hi\""));
    }

    // a part id such as =HYPERLINK("x"), read back by an independent RFC 4180 parser (OpenCSV),
    // is text starting with a quote mark, so no spreadsheet runs it
    @Test
    void hyperlinkPartIdComesOutInert() throws Exception {
        ObjectNode root = DemoResult.shared();
        ((ObjectNode) root.withArray("capacitors").get(0)).put("id", "=HYPERLINK(\"x\")");
        String text = new CapacitorCsv().of(root);
        assertTrue(text.startsWith("\uFEFF"), "UTF-8 byte-order mark first");
        List<String[]> rows;
        try (CSVReader reader = new CSVReaderBuilder(new StringReader(text.substring(1)))
                .withCSVParser(new RFC4180ParserBuilder().build()).build()) {
            rows = reader.readAll();
        }
        assertEquals("part", rows.get(0)[0]);
        assertEquals("'=HYPERLINK(\"x\")", rows.get(1)[0]);
        // header plus one row per low-band capacitor of the demo stage (five)
        assertEquals(6, rows.size());
        for (String[] row : rows) {
            assertEquals(rows.get(0).length, row.length);
            for (String cell : row) {
                // a cell may begin with a minus only as a number this class wrote
                assertTrue(cell.isEmpty() || "=+-@\t\r".indexOf(cell.charAt(0)) < 0
                        || cell.matches("-[0-9.]+"), cell);
            }
        }
        // RFC 4180 §2.1: CRLF line ends
        assertTrue(text.endsWith("\r\n"));
        assertEquals(rows.size(), text.split("\r\n", -1).length - 1);
    }

    // the numbers are the result's own: C2 of the demo board was synthesized as 220 nF
    @Test
    void rowsCarryTheBackSolvedValues() throws Exception {
        ObjectNode root = DemoResult.shared();
        String[] c2 = new CapacitorCsv().of(root).split("\r\n")[3].split(",");
        assertEquals("C2", c2[0]);
        // the back-solve's own uncertainty is about 1 %; 5 % leaves room for the small spread
        assertEquals(220e-9, Double.parseDouble(c2[7]), 0.05 * 220e-9);
        assertEquals("no", c2[11]);
    }

    // issue 14: the tolerance as numbers and no binary noise. The demo stage gives C1 2.2 µF ±10 %
    // (sample-measurements/geophone-two-stage.stage.yaml): band 1.98 µF to 2.42 µF, −10 % and 10 %,
    // written exactly as those decimals although 2.2e-6 × 0.9 is 1.9800000000000002e-6 in binary
    @Test
    void tolerancesAreNumericColumnsAndValuesCarryNoFloatNoise() throws Exception {
        String text = new CapacitorCsv().of(DemoResult.shared());
        String[] header = text.substring(1).split("\r\n")[0].split(",");
        String[] c1 = text.split("\r\n")[1].split(",");
        assertEquals("tolerance_low_percent", header[3]);
        assertEquals("tolerance_high_percent", header[4]);
        assertEquals("C1", c1[0]);
        assertEquals("±10%", c1[2]);
        assertEquals("-10", c1[3]);
        assertEquals("10", c1[4]);
        assertEquals("0.00000198", c1[5]);
        assertEquals("0.00000242", c1[6]);
        // every number cell at most 12 significant digits (a double's noise sits in its 16th and 17th)
        for (String line : text.substring(1).split("\r\n")) {
            for (String cell : line.split(",")) {
                if (cell.matches("-?[0-9.]+")) {
                    assertTrue(cell.replaceAll("^-?[0.]*", "").replace(".", "").length() <= 12, cell);
                }
            }
        }
        // µ and ± survive as UTF-8: the bytes of ± are C2 B1 (Unicode 15, U+00B1 in UTF-8)
        byte[] bytes = text.getBytes(java.nio.charset.StandardCharsets.UTF_8);
        assertEquals((byte) 0xEF, bytes[0]);
        assertEquals((byte) 0xBB, bytes[1]);
        assertEquals((byte) 0xBF, bytes[2]);
    }

    @Test
    void numbersAreRoundedToTwelveFigures() {
        // 0.1 + 0.2 is 0.30000000000000004 in IEEE 754 binary64 (common knowledge)
        assertEquals("0.3", CapacitorCsv.number(0.1 + 0.2));
        assertEquals("-10", CapacitorCsv.number(100 * (1.9800000000000002e-6 / 2.2e-6 - 1)));
        assertEquals("0", CapacitorCsv.number(0));
        assertEquals("", CapacitorCsv.number(Double.NaN));
    }
}

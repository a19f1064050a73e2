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
        List<String[]> rows;
        try (CSVReader reader = new CSVReaderBuilder(new StringReader(text))
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
                assertTrue(cell.isEmpty() || "=+-@\t\r".indexOf(cell.charAt(0)) < 0, cell);
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
        assertEquals(220e-9, Double.parseDouble(c2[5]), 0.05 * 220e-9);
        assertEquals("no", c2[9]);
    }
}

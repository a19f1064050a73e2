package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.opencsv.CSVReader;
import com.opencsv.CSVReaderBuilder;
import com.opencsv.RFC4180ParserBuilder;
import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;

class LotCsvTest {
    // read back by an independent RFC 4180 parser (OpenCSV): a header and one row per test, the
    // formula-named board inert (OWASP "CSV Injection": a leading ' makes it text)
    @Test
    void oneRowPerTestWithTheFormulaGuardAndTheByteOrderMark() throws Exception {
        String text = new LotCsv().of(DemoLot.findings());
        assertTrue(text.startsWith("\uFEFF"), "UTF-8 byte-order mark first");
        List<String[]> rows;
        try (CSVReader reader = new CSVReaderBuilder(new StringReader(text.substring(1)))
                .withCSVParser(new RFC4180ParserBuilder().build()).build()) {
            rows = reader.readAll();
        }
        assertEquals(DemoLot.BOARDS + 1, rows.size());
        assertEquals("board", rows.get(0)[0]);
        assertEquals("'" + DemoLot.FORMULA_BOARD, rows.get(7)[0]);
        // board 20's row: an input problem, no figures, the problem's text kept
        String[] twenty = rows.get(20);
        assertEquals("input-problem", twenty[5]);
        assertEquals("", twenty[6]);
        assertEquals("line 14: the gain cell is empty", twenty[14]);
        for (String[] row : rows) {
            assertEquals(rows.get(0).length, row.length);
        }
        // RFC 4180 §2.1: CRLF line ends
        assertEquals(rows.size(), text.split("\r\n", -1).length - 1);
    }
}

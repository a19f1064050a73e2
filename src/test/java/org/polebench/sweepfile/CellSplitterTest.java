package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.opencsv.RFC4180Parser;
import com.opencsv.RFC4180ParserBuilder;
import com.opencsv.enums.CSVReaderNullFieldIndicator;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.polebench.profile.Delimiter;

/**
 * The rules {@link CellSplitter} keeps on top of OpenCSV's RFC 4180 parser. Expected cells are
 * written out by hand from RFC 4180 §2.4–2.7 (separators, quoted fields, doubled quotes) and
 * from the class comment's own rules (one line per row, blanks around a quoted cell, runs of blanks).
 */
class CellSplitterTest {
    private static List<String> cells(Delimiter delimiter, String line) {
        CellSplitter splitter = new CellSplitter(delimiter);
        int count = splitter.split(line);
        List<String> out = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            out.add(splitter.text(i));
        }
        return out;
    }

    private static boolean unclosed(Delimiter delimiter, String line) {
        CellSplitter splitter = new CellSplitter(delimiter);
        splitter.split(line);
        return splitter.unclosedQuote();
    }

    @Test
    void quotedCellsMayHoldTheSeparatorAndDoubledQuotes() {
        // RFC 4180 §2.6 and §2.7
        assertEquals(List.of("a,b", "say \"hi\"", "3"), cells(Delimiter.COMMA, "\"a,b\",\"say \"\"hi\"\"\",3"));
        assertEquals(List.of("1,5", "-3,25"), cells(Delimiter.SEMICOLON, "\"1,5\";-3,25"));
    }

    @Test
    void backslashIsOrdinaryText() {
        // OpenCSV's default parser would take \" as an escaped quote (its documented default)
        assertEquals(List.of("C:\\data\\", "2"), cells(Delimiter.COMMA, "\"C:\\data\\\",2"));
    }

    @Test
    void trailingSeparatorLeavesAnEmptyLastCell() {
        assertEquals(List.of("1", "2", ""), cells(Delimiter.COMMA, "1,2,"));
    }

    @Test
    void blanksBeforeAnOpeningQuoteAreAllowed() {
        assertEquals(List.of("1", "2.5"), cells(Delimiter.COMMA, "1, \"2.5\""));
    }

    @Test
    void anUnclosedQuoteIsReportedForItsRow() {
        assertTrue(unclosed(Delimiter.COMMA, "1,\"2"));
        assertTrue(unclosed(Delimiter.COMMA, "\"1,2"));
        assertTrue(unclosed(Delimiter.COMMA, "1, \"2"));
        assertTrue(unclosed(Delimiter.COMMA, "1,\""));
        assertFalse(unclosed(Delimiter.COMMA, "1,\"\"\"\""));    // a closed cell holding one quote
        assertFalse(unclosed(Delimiter.COMMA, "1,\"\"\"2\"\"\""));
        assertFalse(unclosed(Delimiter.COMMA, "1,2"));
    }

    @Test
    void runsOfBlanksSeparateSpaceDelimitedCells() {
        assertEquals(List.of("1", "2", "3"), cells(Delimiter.SPACES, "  1 \t 2\t\t3  "));
        assertEquals(List.of("a b", "", "4"), cells(Delimiter.SPACES, "\"a b\"  \"\"  4"));
        assertEquals(List.of(), cells(Delimiter.SPACES, " \t "));
    }

    @Test
    void quoteFreeRowsSplitAsOpenCsvSplitsThem() throws Exception {
        // Independent library: OpenCSV's own RFC 4180 parser on the same line is the expected
        // answer for the rows CellSplitter cuts itself. Seeded random lines over separators,
        // blanks, digits and letters; 20,000 per delimiter is far more than the few shapes there are.
        Random random = new Random(20240611L);
        String alphabet = ",; \t1.5e-x\\";
        for (Delimiter delimiter : List.of(Delimiter.COMMA, Delimiter.SEMICOLON, Delimiter.TAB)) {
            RFC4180Parser openCsv = new RFC4180ParserBuilder().withSeparator(delimiter.character())
                    .withFieldAsNull(CSVReaderNullFieldIndicator.NEITHER).build();
            for (int k = 0; k < 20_000; k++) {
                StringBuilder line = new StringBuilder();
                for (int i = random.nextInt(12); i > 0; i--) {
                    line.append(alphabet.charAt(random.nextInt(alphabet.length())));
                }
                List<String> expected = new ArrayList<>();
                for (String cell : openCsv.parseLine(line.toString())) {
                    expected.add(cell.strip());
                }
                assertEquals(expected, cells(delimiter, line.toString()), delimiter + " <" + line + ">");
            }
        }
    }

    @Test
    void blanksAfterAClosingQuoteAreDropped() {
        // Odd input kept from before OpenCSV: `"1.5" ,"2.5"` reads 1.5 and 2.5 (and a header
        // `"Gain (dB)" ,` names Gain (dB)); OpenCSV alone reads the first cell as 1.5" and the
        // row would be skipped as not a number.
        assertEquals(List.of("1.5", "2.5"), cells(Delimiter.COMMA, "\"1.5\" ,\"2.5\"\t"));
        assertEquals(List.of("Gain (dB)", "x"), cells(Delimiter.TAB, "\"Gain (dB)\"  \tx"));
        CellSplitter splitter = new CellSplitter(Delimiter.SEMICOLON);
        splitter.split("\"1,5\" ;2");
        assertEquals(1.5, splitter.number(0, true), 0.0);    // exact: 1.5 is a binary fraction
    }

    @Test
    void textAfterAClosingQuoteKeepsTheWholeCell() {
        // Before OpenCSV `"51"1` silently read 51; the cell is now taken as it stands, so
        // StrictNumber refuses it and the row is skipped with the cell named in the warning.
        CellSplitter splitter = new CellSplitter(Delimiter.COMMA);
        assertEquals(4, splitter.split("\"51\"1,\"a\"b,c\",2"));
        assertEquals("\"51\"1", splitter.text(0));
        assertTrue(Double.isNaN(splitter.number(0, false)));
        assertEquals("\"a\"b", splitter.text(1));    // the separator after it still ends the cell
        assertEquals("c\"", splitter.text(2));    // a quote inside an unquoted cell is text (RFC 4180 §2.5 aside)
        assertFalse(splitter.unclosedQuote());
    }

    @Test
    void anUnclosedQuoteIsReportedEvenBeforeATrailingSeparatorOrAfterADoubledQuote() {
        // Odd input kept from before OpenCSV: OpenCSV alone reads `"1.5,2.5,` as two cells, the
        // second empty, and ` "55"",5` as 55 and 5; both rows are broken and are skipped as such.
        assertTrue(unclosed(Delimiter.COMMA, "\"1.5,2.5,"));
        assertTrue(unclosed(Delimiter.COMMA, "\"x\"\""));
        assertTrue(unclosed(Delimiter.COMMA, " \"55\"\",5"));
        assertTrue(unclosed(Delimiter.SEMICOLON, "1;\"2;3;"));
        assertEquals(List.of("1", "2;3;"), cells(Delimiter.SEMICOLON, "1;\"2;3;"));    // the rest is its cell
        assertEquals(List.of("1", "2", "a \"b"), cells(Delimiter.SPACES, "1  2 \"a \"\"b"));
    }

    @Test
    void numbersAreReadWholeByStrictNumber() {
        CellSplitter splitter = new CellSplitter(Delimiter.SEMICOLON);
        splitter.split("1,5; 2,5x");
        assertEquals(1.5, splitter.number(0, true), 0.0);    // exact: 1.5 is a binary fraction
        assertTrue(Double.isNaN(splitter.number(1, true)));    // a trailing letter is not ignored
    }
}

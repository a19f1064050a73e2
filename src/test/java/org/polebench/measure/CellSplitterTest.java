package org.polebench.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The rules {@link CellSplitter} keeps on top of OpenCSV's RFC 4180 parser. Expected cells are
 * written out by hand from RFC 4180 §2.4–2.7 (separators, quoted fields, doubled quotes) and
 * from the class comment's own rules (one line per row, blanks before a quote, runs of blanks).
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
    void numbersAreReadWholeByStrictNumber() {
        CellSplitter splitter = new CellSplitter(Delimiter.SEMICOLON);
        splitter.split("1,5; 2,5x");
        assertEquals(1.5, splitter.number(0, true), 0.0);    // exact: 1.5 is a binary fraction
        assertTrue(Double.isNaN(splitter.number(1, true)));    // a trailing letter is not ignored
    }
}

package org.polebench.measure;

import com.opencsv.RFC4180Parser;
import com.opencsv.RFC4180ParserBuilder;
import com.opencsv.enums.CSVReaderNullFieldIndicator;
import java.io.IOException;
import java.io.UncheckedIOException;

/**
 * Splits one table row into cells with OpenCSV's {@link RFC4180Parser} (RFC 4180: a quoted cell
 * may hold the separator, a doubled quote stands for one). The RFC parser, not OpenCSV's
 * default one, because the default treats backslash as an escape character, and a backslash in
 * a header or a note is ordinary text here.
 *
 * <p>What is ours on top: one physical line is one row (a quoted cell cannot span lines in the
 * formats we read, so {@link RFC4180Parser#parseLine} is called per line and an unclosed quote
 * is reported for its row, keeping line numbers exact); blanks before an opening quote are
 * allowed and the quotes still removed; {@link Delimiter#SPACES} splits on runs of spaces or
 * tabs, which OpenCSV has no separator for: each run outside quotes becomes one space first. Numbers
 * are read by {@link StrictNumber}, never by OpenCSV's locale-based conversion.
 *
 * <p>A cell holding blanks before an opening quote is not split inside its quotes: RFC 4180
 * (§2.5) allows no blanks there, and OpenCSV reads such a cell as unquoted text.
 *
 * <p>One instance per import; reused for every row.
 */
final class CellSplitter {
    private static final char QUOTE = '"';
    private static final String[] NONE = new String[0];

    private final Delimiter delimiter;
    private final RFC4180Parser parser;
    private String[] cells = NONE;
    private int count;
    private boolean unclosedQuote;

    CellSplitter(Delimiter delimiter) {
        this.delimiter = delimiter;
        this.parser = new RFC4180ParserBuilder()
                .withSeparator(delimiter.character())
                .withQuoteChar(QUOTE)
                .withFieldAsNull(CSVReaderNullFieldIndicator.NEITHER)
                .build();
    }

    /** @return the number of cells found in the line */
    int split(String line) {
        unclosedQuote = false;
        boolean quoted = line.indexOf(QUOTE) >= 0;
        String text = line;
        if (delimiter == Delimiter.SPACES) {
            text = singleSpaced(line);
            if (text.isEmpty()) {
                cells = NONE;
                count = 0;
                return 0;
            }
        }
        String[] parsed;
        try {
            parsed = parser.parseLine(text);
        } catch (IOException e) {
            // RFC4180Parser reads a String without I/O; it declares the exception for its interface
            throw new UncheckedIOException(e);
        }
        if (parsed == null) {
            parsed = NONE;
        }
        cells = parsed;
        count = parsed.length;
        if (quoted) {
            unclosedQuote = openedAndNotClosed(text);
            for (int i = 0; i < count; i++) {
                cells[i] = unquoteAfterBlanks(cells[i]);
            }
        }
        return count;
    }

    /**
     * RFC4180Parser hands back an unclosed quoted field as it stands, from its opening quote to
     * the end of the line. A closed one loses at least its outer quotes, so the line's tail then
     * begins inside the field, never right after a separator or at the line's start.
     */
    private boolean openedAndNotClosed(String line) {
        if (count == 0) {
            return false;
        }
        String last = cells[count - 1];
        if (last.isEmpty() || last.charAt(0) != QUOTE || !line.endsWith(last)) {
            return false;
        }
        int at = line.length() - last.length();
        return at == 0 || line.charAt(at - 1) == delimiter.character();
    }

    /** A cell with blanks before its opening quote reaches us unquoted (see the class comment). */
    private String unquoteAfterBlanks(String cell) {
        if (cell.isEmpty() || cell.charAt(0) != ' ') {
            return cell;
        }
        String stripped = cell.strip();
        if (stripped.isEmpty() || stripped.charAt(0) != QUOTE) {
            return cell;
        }
        if (stripped.length() < 2 || stripped.charAt(stripped.length() - 1) != QUOTE) {
            unclosedQuote = true;
            return stripped.substring(1);
        }
        return stripped.substring(1, stripped.length() - 1).replace("\"\"", "\"");
    }

    /**
     * One space for each run of spaces and tabs outside quotes, none at either end, so that
     * OpenCSV's one-character separator sees one space between cells. A doubled quote toggles
     * twice and so leaves the state as it was.
     */
    private static String singleSpaced(String line) {
        StringBuilder out = new StringBuilder(line.length());
        boolean inQuotes = false;
        boolean pendingBlank = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (!inQuotes && (c == ' ' || c == '\t')) {
                pendingBlank = out.length() > 0;
                continue;
            }
            if (pendingBlank) {
                out.append(' ');
                pendingBlank = false;
            }
            if (c == QUOTE) {
                inQuotes = !inQuotes;
            }
            out.append(c);
        }
        return out.toString();
    }

    int count() {
        return count;
    }

    /** @return true when the last row split had a quote that was never closed */
    boolean unclosedQuote() {
        return unclosedQuote;
    }

    /** @return the cell as OpenCSV gave it (quotes removed, blanks kept) */
    String cell(int cell) {
        return cells[cell];
    }

    /** @return the cell's number read by {@link StrictNumber} (NaN when it is none) */
    double number(int cell, boolean decimalComma) {
        return StrictNumber.parse(cells[cell], decimalComma);
    }

    /** @return true when the cell holds nothing but blanks */
    boolean blank(int cell) {
        return cells[cell].isBlank();
    }

    /** @return the cell's text, stripped */
    String text(int cell) {
        return cells[cell].strip();
    }
}

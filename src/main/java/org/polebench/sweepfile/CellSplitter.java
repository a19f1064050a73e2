package org.polebench.sweepfile;

import com.opencsv.RFC4180Parser;
import com.opencsv.RFC4180ParserBuilder;
import com.opencsv.enums.CSVReaderNullFieldIndicator;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Arrays;
import org.polebench.profile.Delimiter;
import org.polebench.units.StrictNumber;

/**
 * Splits one table row into cells. A row holding a quote character is split and unquoted by
 * OpenCSV's {@link RFC4180Parser} (RFC 4180: a quoted cell may hold the separator, a doubled
 * quote stands for one). The RFC parser, not OpenCSV's default one, because the default treats
 * backslash as an escape character, and a backslash in a header or a note is ordinary text here.
 *
 * <p>A row without a quote character is split here, as ranges of the line, without copying:
 * with no quote, RFC 4180 splitting is cutting at every separator, which is what
 * {@link RFC4180Parser} does for such a line (it hands it to {@code StringUtils.splitPreserveAllTokens});
 * {@code CellSplitterTest} checks that both give the same cells. The copy per cell and the array
 * per row that OpenCSV makes took a 13-column million-row import to about 1.4 times its time
 * (ImportBenchmark), and nearly every row of a measured sweep is quote-free numbers.
 *
 * <p>What is ours on top, for rows with quotes ({@link #tidy}, before OpenCSV sees the row): one
 * physical line is one row (a quoted cell cannot span lines in the formats we read, so an unclosed
 * quote is reported for its row, keeping line numbers exact, and the rest of the line is its
 * cell); blanks before an opening quote and after a closing one are dropped, so {@code 1, "2.5" }
 * reads 2.5 (RFC 4180 §2.5 allows no blanks there, and OpenCSV would read such a cell as unquoted
 * text); a cell with text after its closing quote ({@code "51"1}) is taken whole, as it stands,
 * never as 51; {@link Delimiter#SPACES} splits on runs of spaces or tabs, which OpenCSV has no
 * separator for: each run outside quotes becomes one space. Numbers are read by
 * {@link StrictNumber}, never by OpenCSV's locale-based conversion.
 *
 * <p>One instance per import; reused for every row.
 */
final class CellSplitter {
    private static final char QUOTE = '"';

    private final Delimiter delimiter;
    private final RFC4180Parser parser;
    private String line = "";
    /** True when the cells are ranges of {@link #line}; false when OpenCSV gave them as strings. */
    private boolean ranges;
    private int[] starts = new int[16];
    private int[] ends = new int[16];
    private String[] cells = new String[0];
    private int count;
    private boolean unclosedQuote;
    private String unclosedRest;

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
        this.line = line;
        unclosedQuote = false;
        count = 0;
        if (line.indexOf(QUOTE) < 0) {
            ranges = true;
            if (delimiter == Delimiter.SPACES) {
                splitOnBlankRuns(line);
            } else {
                splitOnSeparator(line, delimiter.character());
            }
            return count;
        }
        ranges = false;
        String tidied = tidy(line);
        String[] parsed = tidied.isEmpty() ? new String[0] : parse(tidied);
        if (unclosedQuote) {
            // the tidied line stops at the unclosed cell's opening quote, so OpenCSV's last cell is
            // the empty one after the separator before it, or there is none when the cell is the first
            if (parsed.length == 0) {
                parsed = new String[1];
            }
            parsed[parsed.length - 1] = unclosedRest;
        }
        cells = parsed;
        count = parsed.length;
        return count;
    }

    private String[] parse(String tidied) {
        try {
            String[] parsed = parser.parseLine(tidied);
            return parsed == null ? new String[0] : parsed;
        } catch (IOException e) {
            // RFC4180Parser reads a String without I/O; it declares the exception for its interface
            throw new UncheckedIOException(e);
        }
    }

    /** Every separator ends a cell; a trailing one leaves an empty last cell, as in RFC 4180 §2.4. */
    private void splitOnSeparator(String line, char separator) {
        int start = 0;
        int n = line.length();
        for (int i = 0; i < n; i++) {
            if (line.charAt(i) == separator) {
                add(start, i);
                start = i + 1;
            }
        }
        add(start, n);
    }

    private void splitOnBlankRuns(String line) {
        int n = line.length();
        int i = 0;
        while (true) {
            while (i < n && isBlank(line.charAt(i))) {
                i++;
            }
            if (i >= n) {
                return;
            }
            int start = i;
            while (i < n && !isBlank(line.charAt(i))) {
                i++;
            }
            add(start, i);
        }
    }

    private void add(int start, int end) {
        if (count == starts.length) {
            starts = Arrays.copyOf(starts, count * 2);
            ends = Arrays.copyOf(ends, count * 2);
        }
        starts[count] = start;
        ends[count] = end;
        count++;
    }

    /**
     * The row rewritten for OpenCSV with our rules applied (see the class comment): each cell
     * verbatim, one separator between cells, the blanks around quoted cells gone. Stops at an
     * unclosed quote, setting {@link #unclosedQuote} and {@link #unclosedRest}.
     */
    private String tidy(String line) {
        boolean spaces = delimiter == Delimiter.SPACES;
        char separator = delimiter.character();
        StringBuilder out = new StringBuilder(line.length() + 2);
        int n = line.length();
        int i = 0;
        if (spaces) {
            while (i < n && isBlank(line.charAt(i))) {
                i++;
            }
            if (i == n) {
                return "";
            }
        }
        while (true) {
            int j = i;
            while (j < n && line.charAt(j) == ' ') {
                j++;    // blanks before an opening quote; only spaces, since a tab may be the separator
            }
            if (j < n && line.charAt(j) == QUOTE) {
                int close = closingQuote(line, j);
                if (close < 0) {
                    unclosedQuote = true;
                    unclosedRest = line.substring(j + 1).replace("\"\"", "\"");
                    return out.toString();
                }
                int after = close + 1;
                while (!spaces && after < n && line.charAt(after) != separator && isBlank(line.charAt(after))) {
                    after++;    // blanks after the closing quote
                }
                if (spaces || after == n || line.charAt(after) == separator) {
                    out.append(line, j, close + 1);
                    i = spaces ? close + 1 : after;
                } else {
                    // text after the closing quote: the cell is taken as it stands, quoted again
                    // so that OpenCSV reads it whole and cannot run on past the separator
                    int end = line.indexOf(separator, after);
                    end = end < 0 ? n : end;
                    out.append(QUOTE).append(line.substring(i, end).replace("\"", "\"\"")).append(QUOTE);
                    i = end;
                }
            } else {
                int end = i;
                while (end < n && (spaces ? !isBlank(line.charAt(end)) : line.charAt(end) != separator)) {
                    end++;
                }
                out.append(line, i, end);
                i = end;
            }
            if (spaces) {
                while (i < n && isBlank(line.charAt(i))) {
                    i++;
                }
            }
            if (i >= n) {
                return out.toString();
            }
            out.append(separator);
            if (!spaces) {
                i++;    // past the separator; a trailing one leaves an empty last cell
            }
        }
    }

    /** @return the index of the quote closing the one at {@code open}, or -1 when none does */
    private static int closingQuote(String line, int open) {
        int n = line.length();
        int i = open + 1;
        while (i < n) {
            if (line.charAt(i) == QUOTE) {
                if (i + 1 < n && line.charAt(i + 1) == QUOTE) {
                    i += 2;
                    continue;
                }
                return i;
            }
            i++;
        }
        return -1;
    }

    /** Blanks between cells of a {@link Delimiter#SPACES} row. */
    private static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }

    int count() {
        return count;
    }

    /** @return true when the last row split had a quote that was never closed */
    boolean unclosedQuote() {
        return unclosedQuote;
    }

    /** @return the cell's number read by {@link StrictNumber} (NaN when it is none) */
    double number(int cell, boolean decimalComma) {
        return ranges ? StrictNumber.parse(line, starts[cell], ends[cell], decimalComma)
                : StrictNumber.parse(cells[cell], decimalComma);
    }

    /** @return true when the cell holds nothing but blanks */
    boolean blank(int cell) {
        if (!ranges) {
            return cells[cell].isBlank();
        }
        for (int i = starts[cell]; i < ends[cell]; i++) {
            if (!Character.isWhitespace(line.charAt(i))) {
                return false;
            }
        }
        return true;
    }

    /** @return the cell's text, stripped */
    String text(int cell) {
        return (ranges ? line.substring(starts[cell], ends[cell]) : cells[cell]).strip();
    }
}

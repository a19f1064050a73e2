package org.polebench.sweepfile;

import java.util.Arrays;
import org.polebench.profile.Delimiter;
import org.polebench.units.StrictNumber;

/**
 * Finds the cells of one table row without copying them: each cell is a character range of
 * the line. Quoted cells follow RFC 4180 (a doubled quote stands for one; the range then
 * excludes the outer quotes and {@link #text} undoes the doubling). Backslash is an ordinary
 * character, unlike OpenCSV's default parser (PITFALLS, OpenCSV).
 *
 * <p>Why not OpenCSV: its parser builds a {@code String[]} per row and cannot split on runs
 * of spaces or know a decimal comma; this finds ranges in one pass and lets
 * {@link StrictNumber} read the digits in place. A quoted cell cannot span lines here; an
 * unclosed quote is reported for its row.
 *
 * <p>One instance per import; reused for every row.
 */
final class CellSplitter {
    private final Delimiter delimiter;
    private int[] starts = new int[16];
    private int[] ends = new int[16];
    private int count;
    private boolean unclosedQuote;

    CellSplitter(Delimiter delimiter) {
        this.delimiter = delimiter;
    }

    /** @return the number of cells found in the line */
    int split(String line) {
        count = 0;
        unclosedQuote = false;
        int n = line.length();
        if (delimiter == Delimiter.SPACES) {
            int i = 0;
            while (true) {
                while (i < n && isBlank(line.charAt(i))) {
                    i++;
                }
                if (i >= n) {
                    break;
                }
                if (line.charAt(i) == '"') {
                    i = quoted(line, i);
                } else {
                    int start = i;
                    while (i < n && !isBlank(line.charAt(i))) {
                        i++;
                    }
                    add(start, i);
                }
            }
            return count;
        }
        char separator = delimiter.character();
        int i = 0;
        while (true) {
            int start = i;
            while (i < n && line.charAt(i) == ' ') {
                i++;    // blanks before an opening quote; only spaces, since a tab may be the separator
            }
            if (i < n && line.charAt(i) == '"') {
                i = quoted(line, i);
                while (i < n && line.charAt(i) != separator) {
                    i++;    // text after the closing quote, such as blanks, is ignored
                }
            } else {
                int end = i;
                while (end < n && line.charAt(end) != separator) {
                    end++;
                }
                add(start, end);
                i = end;
            }
            if (i >= n) {
                break;
            }
            i++;    // past the separator; a trailing one leaves an empty last cell
            if (i == n) {
                add(n, n);
                break;
            }
        }
        return count;
    }

    /** Adds the quoted cell starting at the quote; @return the index just past its closing quote */
    private int quoted(String line, int quote) {
        int n = line.length();
        int i = quote + 1;
        while (i < n) {
            if (line.charAt(i) == '"') {
                if (i + 1 < n && line.charAt(i + 1) == '"') {
                    i += 2;
                    continue;
                }
                add(quote + 1, i);
                return i + 1;
            }
            i++;
        }
        unclosedQuote = true;
        add(quote + 1, n);
        return n;
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

    int start(int cell) {
        return starts[cell];
    }

    int end(int cell) {
        return ends[cell];
    }

    /** @return true when the cell holds nothing but blanks */
    boolean blank(String line, int cell) {
        for (int i = starts[cell]; i < ends[cell]; i++) {
            if (!Character.isWhitespace(line.charAt(i))) {
                return false;
            }
        }
        return true;
    }

    /** @return the cell's text, stripped, with doubled quotes undone */
    String text(String line, int cell) {
        return line.substring(starts[cell], ends[cell]).replace("\"\"", "\"").strip();
    }
}

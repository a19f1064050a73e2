package org.polebench.sweepfile;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import org.polebench.InputLimits;
import org.polebench.InputProblem;

/**
 * Reads text a line at a time, as {@link java.io.BufferedReader#readLine()} does (a line ends at
 * LF, CR or CR LF), but refuses a line longer than a stated limit before holding it: a 100 MB
 * line in a serial log would otherwise become one 100-million-character string (issue 15).
 * Counts lines in a long, so that no file is too long to number.
 */
final class BoundedLines {
    private final Reader in;
    private final Path file;
    private final long maxChars;
    private final char[] buffer = new char[1 << 16];
    private final StringBuilder line = new StringBuilder(128);
    private int position;
    private int filled;
    private long lineNo;
    private boolean skipLineFeed;

    /** @param file named in the refusal; null for a live port */
    BoundedLines(Reader in, Path file, long maxChars) {
        this.in = in;
        this.file = file;
        this.maxChars = maxChars;
    }

    /** @return the 1-based number of the line {@link #next()} returned last, 0 before the first */
    long lineNo() {
        return lineNo;
    }

    /**
     * @return the next line without its end, or null at the end of the text
     * @throws InputProblem when the line is longer than the limit
     */
    String next() throws IOException, InputProblem {
        line.setLength(0);
        boolean any = false;
        while (true) {
            if (position == filled) {
                filled = in.read(buffer, 0, buffer.length);
                position = 0;
                if (filled <= 0) {
                    filled = 0;
                    if (!any) {
                        return null;
                    }
                    lineNo++;
                    return line.toString();
                }
            }
            if (skipLineFeed) {
                skipLineFeed = false;
                if (buffer[position] == '\n') {
                    position++;
                    continue;
                }
            }
            any = true;
            int start = position;
            while (position < filled && buffer[position] != '\n' && buffer[position] != '\r') {
                position++;
            }
            if (line.length() + (long) (position - start) > maxChars) {
                throw new InputProblem(file, lineNo + 1, "the line is longer than " + maxChars
                        + " characters, the limit on one line (" + InputLimits.MAX_LINE_CHARS + "); no sweep or log "
                        + "line is that long, so the file is not one",
                        InputLimits.raise(InputLimits.MAX_LINE_CHARS, maxChars, "check that this is the right file"));
            }
            line.append(buffer, start, position - start);
            if (position < filled) {
                skipLineFeed = buffer[position] == '\r';
                position++;
                lineNo++;
                return line.toString();
            }
        }
    }
}

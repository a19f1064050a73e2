package org.polebench.profile;

import java.util.List;

/**
 * The text layout of a table file, before any column has a meaning.
 *
 * @param delimiter       what separates cells
 * @param decimalComma    true when numbers use a comma as the decimal mark ({@code 1,5})
 * @param encoding        character encoding
 * @param preambleLines   lines at the top skipped unread (an instrument's banner)
 * @param commentPrefixes a line starting with one of these is a comment; {@code # key: value}
 *                        comments carry provenance
 * @param header          true when a header row names the columns
 */
public record TableLayout(Delimiter delimiter, boolean decimalComma, TextEncoding encoding, int preambleLines,
                          List<String> commentPrefixes, boolean header) {
    public TableLayout {
        commentPrefixes = List.copyOf(commentPrefixes);
        if (preambleLines < 0) {
            throw new IllegalArgumentException("preamble lines must be >= 0");
        }
        if (decimalComma && delimiter == Delimiter.COMMA) {
            throw new IllegalArgumentException("a comma cannot be both the delimiter and the decimal mark");
        }
    }

    /** @return true when the line starts with a comment prefix */
    public boolean isComment(String line) {
        for (String prefix : commentPrefixes) {
            if (line.startsWith(prefix)) {
                return true;
            }
        }
        return false;
    }
}

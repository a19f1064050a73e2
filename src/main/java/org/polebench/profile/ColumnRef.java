package org.polebench.profile;

import java.util.List;
import java.util.Locale;

/**
 * Which column of a table holds a quantity: by header name (any of several spellings,
 * compared ignoring case and blanks) or by 1-based number.
 *
 * @param names    accepted header spellings; empty when the column is given by number
 * @param number   1-based column number, or 0 when the column is given by name
 * @param optional true when the file may lack this column (the canonical sweep's phase)
 */
public record ColumnRef(List<String> names, int number, boolean optional) {
    public ColumnRef {
        names = List.copyOf(names);
        if (names.isEmpty() == (number == 0)) {
            throw new IllegalArgumentException("a column is given either by name or by number");
        }
        if (number < 0) {
            throw new IllegalArgumentException("column numbers are 1-based");
        }
    }

    public static ColumnRef named(String... names) {
        return new ColumnRef(List.of(names), 0, false);
    }

    public static ColumnRef numbered(int number) {
        return new ColumnRef(List.of(), number, false);
    }

    public ColumnRef asOptional() {
        return new ColumnRef(names, number, true);
    }

    public boolean byNumber() {
        return number > 0;
    }

    /** @return true when a header cell is one of the names, ignoring case and all blanks */
    public boolean matches(String headerCell) {
        String key = normalise(headerCell);
        for (String name : names) {
            if (normalise(name).equals(key)) {
                return true;
            }
        }
        return false;
    }

    /** Lower case with every blank removed, so "Freq (Hz)" matches "freq(hz)". */
    public static String normalise(String text) {
        StringBuilder out = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (!Character.isWhitespace(c) && c != '\uFEFF') {
                out.append(c);
            }
        }
        return out.toString().toLowerCase(Locale.ROOT);
    }

    /** @return "column 3" or "column 'Freq (Hz)'" */
    public String describe() {
        return byNumber() ? "column " + number : "column '" + names.get(0) + "'";
    }
}

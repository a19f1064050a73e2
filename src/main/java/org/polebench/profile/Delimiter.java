package org.polebench.profile;

import java.util.Optional;

/** What separates the cells of a table row. */
public enum Delimiter {
    COMMA("comma", ','),
    SEMICOLON("semicolon", ';'),
    TAB("tab", '\t'),
    /** One or more spaces or tabs; leading and trailing blanks are not cells. */
    SPACES("spaces", ' ');

    private final String word;
    private final char character;

    Delimiter(String word, char character) {
        this.word = word;
        this.character = character;
    }

    public String word() {
        return word;
    }

    /** @return the character written between cells (one space for {@link #SPACES}) */
    public char character() {
        return character;
    }

    public static Optional<Delimiter> parse(String text) {
        return ProfileWords.lookup(values(), Delimiter::word, text);
    }
}

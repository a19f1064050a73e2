package org.polebench.profile;

import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.Optional;

/** The character encoding of a table file. UTF-8 files may start with a byte-order mark. */
public enum TextEncoding {
    UTF_8("utf-8", StandardCharsets.UTF_8),
    /** ISO-8859-1, which instruments with Western European menus often write. */
    LATIN_1("latin-1", StandardCharsets.ISO_8859_1);

    private final String word;
    private final Charset charset;

    TextEncoding(String word, Charset charset) {
        this.word = word;
        this.charset = charset;
    }

    public String word() {
        return word;
    }

    public Charset charset() {
        return charset;
    }

    public static Optional<TextEncoding> parse(String text) {
        String key = text.strip().toLowerCase(Locale.ROOT).replace("_", "-");
        if (key.equals("utf-8") || key.equals("utf8")) {
            return Optional.of(UTF_8);
        }
        if (key.equals("latin-1") || key.equals("latin1") || key.equals("iso-8859-1")) {
            return Optional.of(LATIN_1);
        }
        return Optional.empty();
    }
}

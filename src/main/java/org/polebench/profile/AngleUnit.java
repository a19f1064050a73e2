package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;

/** The unit an instrument writes phase in. */
public enum AngleUnit {
    DEGREES("degrees"),
    RADIANS("radians");

    private final String word;

    AngleUnit(String word) {
        this.word = word;
    }

    public String word() {
        return word;
    }

    /** @param text {@code degrees}/{@code deg} or {@code radians}/{@code rad} */
    public static Optional<AngleUnit> parse(String text) {
        String key = text.strip().toLowerCase(Locale.ROOT);
        if (key.equals("degrees") || key.equals("deg") || key.equals("°")) {
            return Optional.of(DEGREES);
        }
        if (key.equals("radians") || key.equals("rad")) {
            return Optional.of(RADIANS);
        }
        return Optional.empty();
    }
}

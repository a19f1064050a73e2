package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;

/** Looks up the enum constant a profile's word names, ignoring case and surrounding blanks. */
final class ProfileWords {
    private ProfileWords() {
    }

    static <T> Optional<T> lookup(T[] values, Function<T, String> word, String text) {
        String key = text.strip().toLowerCase(Locale.ROOT);
        for (T value : values) {
            if (word.apply(value).toLowerCase(Locale.ROOT).equals(key)) {
                return Optional.of(value);
            }
        }
        return Optional.empty();
    }
}

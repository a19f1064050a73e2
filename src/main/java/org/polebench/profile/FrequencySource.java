package org.polebench.profile;

import java.util.Optional;
import com.google.re2j.Pattern;

/**
 * Where a waveform record's test frequency comes from. A stated frequency (a header line or the
 * file name) lets the fit use the three-parameter sine fit; an estimated one frees the frequency
 * (the four-parameter fit, IEEE Std 1057). A record whose line or name does not match is fitted
 * with the frequency free, with a warning.
 *
 * @param from    the header, the file name, or the data
 * @param pattern a regular expression with the group {@code hz}; empty when estimated
 */
public record FrequencySource(From from, Optional<Pattern> pattern) {
    /** The places a frequency can come from. */
    public enum From {
        HEADER("header"),
        FILE_NAME("file-name"),
        ESTIMATED("estimated");

        private final String word;

        From(String word) {
            this.word = word;
        }

        public String word() {
            return word;
        }

        public static Optional<From> parse(String text) {
            return ProfileWords.lookup(values(), From::word, text);
        }
    }

    public FrequencySource {
        if ((from == From.ESTIMATED) == pattern.isPresent()) {
            throw new IllegalArgumentException("a header or file-name frequency needs a pattern; an estimated one none");
        }
    }

    public static FrequencySource estimated() {
        return new FrequencySource(From.ESTIMATED, Optional.empty());
    }
}

package org.polebench.profile;

import java.util.Optional;
import java.util.OptionalInt;
import com.google.re2j.Pattern;

/**
 * Where a waveform record's sample times come from: exactly one of a time column (seconds, evenly
 * spaced) or a header line whose named group {@code seconds} holds the sample interval.
 *
 * @param timeColumn      1-based column of the sample times in seconds
 * @param intervalPattern a regular expression with the group {@code seconds}
 */
public record SampleClock(OptionalInt timeColumn, Optional<Pattern> intervalPattern) {
    public SampleClock {
        if (timeColumn.isPresent() == intervalPattern.isPresent()) {
            throw new IllegalArgumentException("give either a time column or an interval line, not both or neither");
        }
        if (timeColumn.isPresent() && timeColumn.getAsInt() < 1) {
            throw new IllegalArgumentException("columns are 1-based, was " + timeColumn.getAsInt());
        }
    }

    public static SampleClock column(int number) {
        return new SampleClock(OptionalInt.of(number), Optional.empty());
    }

    public static SampleClock intervalLine(Pattern pattern) {
        return new SampleClock(OptionalInt.empty(), Optional.of(pattern));
    }
}

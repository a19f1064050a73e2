package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.sweep.CalibrationAccuracy;

/**
 * An instrument's stated accuracy, such as ±0.05 dB and ±0.5°. It is carried with every sweep
 * read through the profile as a calibration error common to all its points
 * ({@link CalibrationAccuracy}), not as point noise. A maker's ± figure is read as the half-width
 * of a rectangular distribution, u = a/√3 (GUM, JCGM 100:2008, 4.3.7), unless the profile says
 * {@code distribution: normal}: then it is an expanded uncertainty with k = 2, u = a/2 (GUM
 * 4.3.3, as a calibration certificate states it).
 *
 * @param gainHalfWidthDb   ± figure for gain in dB; empty when not stated
 * @param phaseHalfWidthDeg ± figure for phase in degrees; empty when not stated
 * @param distribution      how the ± figure is read
 */
public record InstrumentAccuracy(OptionalDouble gainHalfWidthDb, OptionalDouble phaseHalfWidthDeg,
                                 Distribution distribution) {
    private static final double SQRT3 = Math.sqrt(3.0);

    /** How a ± figure becomes a standard uncertainty. */
    public enum Distribution {
        /** ±a bounds the error, every value within equally likely: u = a/√3 (GUM 4.3.7). */
        RECTANGULAR("rectangular", SQRT3),
        /** ±a is an expanded uncertainty with k = 2: u = a/2 (GUM 4.3.3). */
        NORMAL("normal", 2);

        private final String word;
        private final double divisor;

        Distribution(String word, double divisor) {
            this.word = word;
            this.divisor = divisor;
        }

        public String word() {
            return word;
        }

        /** @return the divisor that turns a ± figure into a standard uncertainty */
        public double divisor() {
            return divisor;
        }

        public static Optional<Distribution> parse(String text) {
            for (Distribution d : values()) {
                if (d.word.equalsIgnoreCase(text.strip())) {
                    return Optional.of(d);
                }
            }
            return Optional.empty();
        }
    }

    public InstrumentAccuracy {
        if (gainHalfWidthDb.isPresent() && !(gainHalfWidthDb.getAsDouble() >= 0)) {
            throw new IllegalArgumentException("gain accuracy must be non-negative");
        }
        if (phaseHalfWidthDeg.isPresent() && !(phaseHalfWidthDeg.getAsDouble() >= 0)) {
            throw new IllegalArgumentException("phase accuracy must be non-negative");
        }
        if (distribution == null) {
            throw new IllegalArgumentException("an accuracy needs a distribution");
        }
    }

    /** Figures read as rectangular half-widths, the usual reading of a data sheet's ±. */
    public InstrumentAccuracy(OptionalDouble gainHalfWidthDb, OptionalDouble phaseHalfWidthDeg) {
        this(gainHalfWidthDb, phaseHalfWidthDeg, Distribution.RECTANGULAR);
    }

    public static InstrumentAccuracy unstated() {
        return new InstrumentAccuracy(OptionalDouble.empty(), OptionalDouble.empty());
    }

    /** @return true when neither gain nor phase accuracy is stated */
    public boolean isUnstated() {
        return gainHalfWidthDb.isEmpty() && phaseHalfWidthDeg.isEmpty();
    }

    /** @return the standard uncertainty of gain in dB, or empty */
    public OptionalDouble gainStandardUncertaintyDb() {
        return gainHalfWidthDb.isPresent() ? OptionalDouble.of(gainHalfWidthDb.getAsDouble() / distribution.divisor())
                : OptionalDouble.empty();
    }

    /** @return the standard uncertainty of phase in degrees, or empty */
    public OptionalDouble phaseStandardUncertaintyDeg() {
        return phaseHalfWidthDeg.isPresent()
                ? OptionalDouble.of(phaseHalfWidthDeg.getAsDouble() / distribution.divisor())
                : OptionalDouble.empty();
    }

    /**
     * @param profileName the profile that states it, named in the statement
     * @return the accuracy as a sweep's calibration term, or empty when nothing is stated
     */
    public Optional<CalibrationAccuracy> calibration(String profileName) {
        if (isUnstated()) {
            return Optional.empty();
        }
        StringBuilder figures = new StringBuilder();
        if (gainHalfWidthDb.isPresent()) {
            figures.append(String.format(Locale.ROOT, "±%s dB", plain(gainHalfWidthDb.getAsDouble())));
        }
        if (phaseHalfWidthDeg.isPresent()) {
            figures.append(figures.length() == 0 ? "" : ", ")
                    .append(String.format(Locale.ROOT, "±%s°", plain(phaseHalfWidthDeg.getAsDouble())));
        }
        String statement = "profile " + profileName + ": " + figures + ", " + distribution.word();
        return Optional.of(new CalibrationAccuracy(gainStandardUncertaintyDb(), phaseStandardUncertaintyDeg(), statement));
    }

    private static String plain(double value) {
        return java.math.BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }
}

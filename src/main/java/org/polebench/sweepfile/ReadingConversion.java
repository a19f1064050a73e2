package org.polebench.sweepfile;

import java.util.Locale;
import java.util.Optional;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.ReadingLimits;
import org.polebench.profile.ReadingScale;
import org.polebench.units.Decibels;

/**
 * The one rule that turns an instrument's raw readings into a point's frequency in Hz, gain in
 * dB and phase in degrees, or says why a reading is no point. Import ({@link SweepAssembly})
 * and live capture both use it, so that a reading a file would drop is left out of a capture
 * with the same reason, and never stops one: a gain ratio of exactly 0 is below any noise
 * floor, a negative ratio or amplitude is no magnitude, a reading past full scale is clipped,
 * and numbers beyond {@link #MAX_GAIN_DB} or {@link #MAX_PHASE_DEG} are no reading at all.
 *
 * <p>Phase comes back converted to degrees, lead positive, but not unwrapped: import unwraps
 * the sorted sweep, capture each point against the one before.
 *
 * <p>Holds the profile's scale and limits only; one instance serves any thread.
 */
public final class ReadingConversion {
    /**
     * Gains beyond ±1000 dB and phases beyond ±10⁶° (some 2800 turns) are no reading any
     * instrument makes; refusing them also keeps averaging and unwrapping finite.
     */
    static final double MAX_GAIN_DB = 1000;
    static final double MAX_PHASE_DEG = 1e6;

    private final ReadingScale scale;
    private final ReadingLimits limits;

    public ReadingConversion(InstrumentProfile profile) {
        this.scale = profile.scale();
        this.limits = profile.limits();
    }

    /** Why a reading is no point; each reason says what import does with its row. */
    public enum DropReason {
        OUT_OF_RANGE("out-of-range numbers", "row skipped"),
        NON_POSITIVE_FREQUENCY("non-positive frequencies", "row skipped"),
        NEGATIVE_MAGNITUDE("negative magnitudes", "row skipped"),
        NOISE_FLOOR("readings at the noise floor", "row dropped"),
        CLIPPED("clipped readings", "row dropped");

        private final String plural;
        private final String rowFate;

        DropReason(String plural, String rowFate) {
            this.plural = plural;
            this.rowFate = rowFate;
        }

        /** @return a short plural noun for an import's warning summary, such as "clipped readings" */
        public String plural() {
            return plural;
        }

        /** @return what import does with a row dropped for this reason, such as "row skipped" */
        public String rowFate() {
            return rowFate;
        }
    }

    /**
     * A reading left out.
     *
     * @param message what is wrong with the reading, without what becomes of it
     */
    public record Dropped(DropReason reason, String message) {
        /** @return the message as import words it, with what became of the row */
        public String rowMessage() {
            return message + "; " + reason.rowFate();
        }
    }

    /**
     * One converted quantity, or why the reading is no point.
     *
     * @param value   in Hz, dB or degrees as the method says; NaN when dropped
     * @param dropped present when the reading is no point
     */
    public record Reading(double value, Optional<Dropped> dropped) {
        static Reading of(double value) {
            return new Reading(value, Optional.empty());
        }

        static Reading drop(DropReason reason, String message) {
            return new Reading(Double.NaN, Optional.of(new Dropped(reason, message)));
        }
    }

    /** @return the frequency in Hz, or why it is none (beyond any range, or not positive) */
    public Reading frequencyHz(double rawFrequency) {
        double hz = scale.hertz(rawFrequency);
        if (Double.isInfinite(rawFrequency) || Double.isInfinite(hz)) {
            return Reading.drop(DropReason.OUT_OF_RANGE, "frequency " + rawFrequency + " is beyond any instrument's range");
        }
        if (!(hz > 0)) {
            return Reading.drop(DropReason.NON_POSITIVE_FREQUENCY, "frequency " + format(rawFrequency) + " "
                    + scale.frequencyUnit().symbol() + " is not positive");
        }
        return Reading.of(hz);
    }

    /**
     * Converts the gain as the profile's gain form says and checks it against the profile's
     * limits (full scale, amplitude floor, noise floor).
     *
     * @param rawGain   gain in dB or as a ratio (dB and ratio profiles); NaN otherwise
     * @param rawInput  input amplitude (amplitude profiles); NaN otherwise
     * @param rawOutput output amplitude (amplitude profiles); NaN otherwise
     * @return the gain in dB, or why the reading is no point
     */
    public Reading gainDb(double rawGain, double rawInput, double rawOutput) {
        double gain;
        switch (scale.gainForm()) {
            case DB:
                gain = rawGain;
                break;
            case RATIO:
                if (rawGain < 0) {
                    return Reading.drop(DropReason.NEGATIVE_MAGNITUDE, "gain ratio " + format(rawGain)
                            + " is negative: a magnitude cannot be");
                }
                if (rawGain == 0) {
                    return Reading.drop(DropReason.NOISE_FLOOR, "gain ratio 0 is no reading (below any noise floor)");
                }
                gain = Decibels.fromRatio(rawGain);
                break;
            case AMPLITUDES:
                if (Double.isInfinite(rawInput) || Double.isInfinite(rawOutput)) {
                    return Reading.drop(DropReason.OUT_OF_RANGE, "an amplitude is beyond any instrument's range");
                }
                if (limits.fullScale().isPresent() && Math.max(rawInput, rawOutput) >= limits.fullScale().getAsDouble()) {
                    return Reading.drop(DropReason.CLIPPED, "amplitude " + format(Math.max(rawInput, rawOutput)) + " "
                            + scale.amplitudeKind().symbol() + " is at or above full scale ("
                            + format(limits.fullScale().getAsDouble()) + "): the reading is clipped");
                }
                if (!(rawInput > 0) || rawOutput < 0) {
                    return Reading.drop(DropReason.NEGATIVE_MAGNITUDE, "amplitudes must be positive (input "
                            + format(rawInput) + ", output " + format(rawOutput) + ")");
                }
                if (rawOutput == 0 || (limits.amplitudeFloor().isPresent()
                        && Math.min(rawInput, rawOutput) <= limits.amplitudeFloor().getAsDouble())) {
                    return Reading.drop(DropReason.NOISE_FLOOR, "amplitude " + format(Math.min(rawInput, rawOutput))
                            + " " + scale.amplitudeKind().symbol() + " is at or below the noise floor");
                }
                gain = Decibels.fromRatio(rawOutput / rawInput);
                break;
            default:
                throw new IllegalStateException("unknown gain form " + scale.gainForm());
        }
        if (!(Math.abs(gain) <= MAX_GAIN_DB)) {
            return Reading.drop(DropReason.OUT_OF_RANGE, "gain " + format(gain) + " dB is beyond any reading (more than "
                    + format(MAX_GAIN_DB) + " dB)");
        }
        if (limits.noiseFloorDb().isPresent() && gain <= limits.noiseFloorDb().getAsDouble()) {
            return Reading.drop(DropReason.NOISE_FLOOR, "gain " + format(gain) + " dB is at or below the noise floor of "
                    + format(limits.noiseFloorDb().getAsDouble()) + " dB");
        }
        return Reading.of(gain);
    }

    /** @return the phase in degrees, lead positive, not unwrapped; or why it is no reading */
    public Reading phaseDeg(double rawPhase) {
        if (Double.isInfinite(rawPhase)) {
            return Reading.drop(DropReason.OUT_OF_RANGE, "phase " + rawPhase + " is out of range");
        }
        double phase = scale.phaseDeg(rawPhase);
        if (!(Math.abs(phase) <= MAX_PHASE_DEG)) {
            return Reading.drop(DropReason.OUT_OF_RANGE, "phase " + format(rawPhase) + " is beyond any reading ("
                    + "more than " + format(MAX_PHASE_DEG) + "°)");
        }
        return Reading.of(phase);
    }

    /** @return a number as reading messages print it: whole numbers plainly, others to six digits */
    public static String format(double value) {
        if (value == Math.rint(value) && Math.abs(value) < 1e15) {
            return String.format(Locale.ROOT, "%.0f", value);
        }
        return String.format(Locale.ROOT, "%.6g", value);
    }
}

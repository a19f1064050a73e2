package org.polebench.profile;

import java.util.OptionalDouble;

/**
 * How a record's sample values become volts, and the channel's range.
 *
 * @param codes        true when the samples are ADC codes, false when they are volts
 * @param voltsPerCode the scale of one code (1 for volts)
 * @param zeroCode     the code that reads 0 V (0 for volts)
 * @param lowRail      the lowest code the converter gives, when known: samples there are clipped
 * @param highRail     the highest code the converter gives, when known
 * @param rangeVolts   the channel's range as ± volts, when known (for volts; codes take it from
 *                     the rails)
 */
public record SampleCoding(boolean codes, double voltsPerCode, double zeroCode, OptionalDouble lowRail,
                           OptionalDouble highRail, OptionalDouble rangeVolts) {
    public SampleCoding {
        if (!(voltsPerCode > 0) || !Double.isFinite(voltsPerCode) || !Double.isFinite(zeroCode)) {
            throw new IllegalArgumentException("the code scale must be positive and finite");
        }
        if (lowRail.isPresent() != highRail.isPresent()
                || (lowRail.isPresent() && !(lowRail.getAsDouble() < highRail.getAsDouble()))) {
            throw new IllegalArgumentException("rails come as a pair, low below high");
        }
    }

    /** Samples in volts, with an optional ± range. */
    public static SampleCoding volts(OptionalDouble rangeVolts) {
        return new SampleCoding(false, 1, 0, OptionalDouble.empty(), OptionalDouble.empty(), rangeVolts);
    }

    /** @return the sample in volts */
    public double volts(double raw) {
        return (raw - zeroCode) * voltsPerCode;
    }

    /** @return the lowest and highest volts the channel can show, when known: the rails, or ± the range */
    public OptionalDouble lowVolts() {
        if (lowRail.isPresent()) {
            return OptionalDouble.of(volts(lowRail.getAsDouble()));
        }
        return rangeVolts.isPresent() ? OptionalDouble.of(-rangeVolts.getAsDouble()) : OptionalDouble.empty();
    }

    public OptionalDouble highVolts() {
        if (highRail.isPresent()) {
            return OptionalDouble.of(volts(highRail.getAsDouble()));
        }
        return rangeVolts;
    }
}

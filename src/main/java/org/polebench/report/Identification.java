package org.polebench.report;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What a test report must identify beyond the item and the method (ISO/IEC 17025:2017 7.8.2.1
 * and 7.8.3.1 a): who approved it, the conditions the test ran under and the equipment used. Only
 * what the user gave (the test level also as {@code polebench capture} recorded it): every part is
 * empty when not given, and the report then leaves a blank to
 * fill by hand rather than a value polebench made up.
 *
 * @param approvedBy     who approves the report (the person authorizing it, 7.8.2.1 o)
 * @param ambientCelsius the ambient temperature as measured, in °C
 * @param supplyVolts    the stage's supply voltage as measured, in volts
 * @param testLevel      the level of the test signal, given or as a capture recorded it
 * @param instruments    the instruments used, in the order given
 */
public record Identification(Optional<String> approvedBy, OptionalDouble ambientCelsius, OptionalDouble supplyVolts,
                             Optional<TestLevel> testLevel, List<Instrument> instruments) {
    /** Nothing given. */
    public static final Identification NONE = new Identification(Optional.empty(), OptionalDouble.empty(),
            OptionalDouble.empty(), Optional.empty(), List.of());

    public Identification {
        instruments = List.copyOf(instruments);
    }

    /**
     * @return this identification with the given instruments after its own, each instrument
     *         listed once (the same identity and serial number given twice is one instrument; a
     *         later mention adds a serial number or due date the earlier one lacked)
     */
    public Identification withInstruments(List<Instrument> more) {
        List<Instrument> merged = new java.util.ArrayList<>(instruments);
        for (Instrument next : more) {
            int same = -1;
            for (int i = 0; i < merged.size(); i++) {
                Instrument known = merged.get(i);
                if (known.identity().equalsIgnoreCase(next.identity())
                        && (known.serial().isEmpty() || next.serial().isEmpty() || known.serial().equals(next.serial()))) {
                    same = i;
                    break;
                }
            }
            if (same < 0) {
                merged.add(next);
            } else {
                Instrument known = merged.get(same);
                merged.set(same, new Instrument(known.identity(), known.serial().or(next::serial),
                        known.calibrationDue().or(next::calibrationDue)));
            }
        }
        return new Identification(approvedBy, ambientCelsius, supplyVolts, testLevel, merged);
    }

    /** @return this identification with the given test level in place of its own */
    public Identification with(Optional<TestLevel> level) {
        return new Identification(approvedBy, ambientCelsius, supplyVolts, level, instruments);
    }
}

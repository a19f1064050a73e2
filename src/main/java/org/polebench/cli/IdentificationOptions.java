package org.polebench.cli;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.time.format.ResolverStyle;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.polebench.InputProblem;
import org.polebench.capture.SweepCapture;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchInstrument;
import org.polebench.report.Identification;
import org.polebench.report.Instrument;
import org.polebench.report.TestLevel;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import picocli.CommandLine.Option;

/**
 * The options that identify a test for its report beyond the operator and board (a picocli mixin
 * of {@code reconcile} and {@code report}, issue 14): who approves it, the ambient temperature and
 * supply voltage as measured, the test level, and the instruments with their serial numbers and
 * calibration due dates (ISO/IEC 17025:2017 7.8.2.1). Each is checked as it is read; nothing
 * is filled in that the user did not give.
 */
final class IdentificationOptions {
    // a decimal number as EngineeringValue reads it, then the temperature's unit
    private static final Pattern TEMPERATURE =
            Pattern.compile("([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+))\\s*(°C|℃|degC|C|K)");
    /** ISO 8601 calendar date, strict: 2027-02-30 is refused, not moved to March. */
    private static final DateTimeFormatter ISO_DATE =
            DateTimeFormatter.ofPattern("uuuu-MM-dd", Locale.ROOT).withResolverStyle(ResolverStyle.STRICT);
    /** 0 °C in kelvin (SI Brochure, 9th edition, 2.3.1). */
    private static final BigDecimal ZERO_CELSIUS_KELVIN = new BigDecimal("273.15");

    @Option(names = "--approved-by", paramLabel = "NAME", description = "who approves the report, for its page 1 and sign-off")
    String approvedBy;

    @Option(names = "--ambient", paramLabel = "TEMP",
            description = "the ambient temperature as measured, in °C or K, such as 23.5C")
    String ambient;

    @Option(names = "--supply", paramLabel = "VOLTS", description = "the stage's supply voltage as measured: 12.02V")
    String supply;

    @Option(names = "--test-level", paramLabel = "LEVEL",
            description = "the test signal's level in V, with rms, pp or pk when it says which, such as 100mVrms")
    String testLevel;

    @Option(names = "--instrument", paramLabel = "INSTRUMENT",
            description = {"an instrument used, repeated for each: its identity, serial number and calibration due "
                    + "date (YYYY-MM-DD) separated by semicolons; serial and date may be left empty. Example:",
                    "  --instrument \"Generator G1;SN-0042;2027-03-31\""})
    List<String> instruments = new ArrayList<>();

    /** @throws InputProblem naming the option whose value cannot be read, with what to write instead */
    Identification read() throws InputProblem {
        List<Instrument> list = new ArrayList<>();
        for (String text : instruments) {
            list.add(instrument(text));
        }
        return new Identification(text("--approved-by", approvedBy), temperature(ambient), supply(supply),
                level(testLevel, TestLevel.COMMAND_LINE), list);
    }

    private static Optional<String> text(String option, String value) throws InputProblem {
        if (value == null) {
            return Optional.empty();
        }
        if (value.isBlank()) {
            throw new InputProblem(null, 0, option + " is empty", "give a name, or leave the option out");
        }
        return Optional.of(value.strip());
    }

    private static OptionalDouble temperature(String text) throws InputProblem {
        if (text == null) {
            return OptionalDouble.empty();
        }
        Matcher m = TEMPERATURE.matcher(text.strip());
        if (!m.matches()) {
            throw new InputProblem(null, 0, "--ambient '" + text + "' is not a temperature with its unit",
                    "write it in °C or K, such as --ambient 23C or --ambient 23.5C");
        }
        // decimal arithmetic: 296.65K gives 23.5 °C, not the binary noise of a double's subtraction
        BigDecimal number = new BigDecimal(m.group(1));
        double celsius = (m.group(2).equals("K") ? number.subtract(ZERO_CELSIUS_KELVIN) : number).doubleValue();
        // below absolute zero, or beyond anything a bench stands in, is a typing slip
        if (celsius < -ZERO_CELSIUS_KELVIN.doubleValue() || celsius > 1000) {
            throw new InputProblem(null, 0, "--ambient '" + text + "' is not an ambient temperature",
                    "give the temperature measured at the bench, such as --ambient 23C");
        }
        return OptionalDouble.of(celsius);
    }

    private static OptionalDouble supply(String text) throws InputProblem {
        if (text == null) {
            return OptionalDouble.empty();
        }
        EngineeringValue.Written written = voltage("--supply", text, "--supply 12.02V");
        if (!written.unit().equals("V")) {
            throw new InputProblem(null, 0, "--supply '" + text + "' is a supply voltage, not a signal level",
                    "write it in volts without rms, pp or pk, such as --supply 12.02V");
        }
        if (written.value() == 0) {
            throw new InputProblem(null, 0, "--supply '" + text + "' is zero", "give the supply voltage measured");
        }
        return OptionalDouble.of(written.value());
    }

    /**
     * The identification with the instruments the bench file lists and those the sweep's
     * {@code instrument:} line names (a capture's {@code *IDN?} answers) after the ones given
     * as options; nothing that none of them says.
     */
    static Identification withEquipment(Identification given, Optional<Bench> bench, String sweepInstrument) {
        List<Instrument> found = new ArrayList<>();
        if (bench.isPresent()) {
            for (BenchInstrument listed : bench.get().instruments()) {
                found.add(new Instrument(listed.identity(), listed.serial(), listed.calibrationDue()));
            }
        }
        found.addAll(Instrument.ofSweepIdentity(sweepInstrument));
        return given.withInstruments(found);
    }

    /**
     * The identification with, when {@code --test-level} was not given, the generator level that
     * {@code polebench capture} recorded in the sweep's notes; a recorded level that cannot be
     * read is left out rather than guessed.
     */
    static Identification withRecordedLevel(Identification given, List<String> sweepNotes) {
        if (given.testLevel().isPresent()) {
            return given;
        }
        Optional<String> recorded = SweepCapture.recordedLevel(sweepNotes);
        if (recorded.isEmpty()) {
            return given;
        }
        try {
            return given.with(level(recorded.get(), TestLevel.CAPTURE_PLAN));
        } catch (InputProblem unreadable) {
            return given;
        }
    }

    private static Optional<TestLevel> level(String text, String from) throws InputProblem {
        if (text == null) {
            return Optional.empty();
        }
        EngineeringValue.Written written = voltage("--test-level", text, "--test-level 100mVrms");
        if (!(written.value() > 0)) {
            throw new InputProblem(null, 0, "--test-level '" + text + "' is not a positive level",
                    "give the level the generator was set to, such as --test-level 100mVrms");
        }
        Optional<String> measure;
        switch (written.unit()) {
            case "Vrms":
                measure = Optional.of("rms");
                break;
            case "Vpp":
                measure = Optional.of("peak-to-peak");
                break;
            case "Vpk":
                measure = Optional.of("peak");
                break;
            default:
                measure = Optional.empty();
        }
        return Optional.of(new TestLevel(written.value(), measure, from));
    }

    /** A voltage that must say its unit: a bare 12 could be volts or millivolts. */
    private static EngineeringValue.Written voltage(String option, String text, String example) throws InputProblem {
        EngineeringValue.Written written;
        try {
            written = EngineeringValue.read(text.strip(), Quantity.VOLTS);
        } catch (IllegalArgumentException unreadable) {
            throw new InputProblem(null, 0, option + " " + unreadable.getMessage(), "write a voltage, such as " + example);
        }
        if (written.unit().isEmpty()) {
            throw new InputProblem(null, 0, option + " '" + text + "' has no unit", "write the V, such as " + example);
        }
        return written;
    }

    private static Instrument instrument(String text) throws InputProblem {
        String[] parts = text.split(";", -1);
        String fix = "write --instrument \"IDENTITY;SERIAL;YYYY-MM-DD\", leaving serial or date empty when unknown";
        if (parts.length > 3) {
            throw new InputProblem(null, 0, "--instrument '" + text + "' has " + parts.length
                    + " fields; it has at most three (identity, serial, calibration due)", fix);
        }
        if (parts[0].isBlank()) {
            throw new InputProblem(null, 0, "--instrument '" + text + "' names no instrument", fix);
        }
        Optional<String> serial = parts.length > 1 && !parts[1].isBlank() ? Optional.of(parts[1].strip()) : Optional.empty();
        Optional<LocalDate> due = Optional.empty();
        if (parts.length > 2 && !parts[2].isBlank()) {
            try {
                due = Optional.of(LocalDate.parse(parts[2].strip(), ISO_DATE));
            } catch (DateTimeParseException notADate) {
                throw new InputProblem(null, 0, "--instrument '" + text + "': calibration due '" + parts[2].strip()
                        + "' is not a date", "write the date as YYYY-MM-DD (ISO 8601), such as 2027-03-31");
            }
        }
        return new Instrument(parts[0].strip(), serial, due);
    }
}

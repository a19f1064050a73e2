package org.polebench.bench;

import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.circuit.Spelling;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import org.polebench.yaml.YamlNode;
import org.polebench.yaml.YamlReader;

/**
 * Reads a bench file ({@code *.bench.yaml}), or the {@code bench:} section of an instrument
 * profile, into a {@link Bench} (docs/user-guide.md, "The bench file"). Every error names the
 * file and line; an unknown key is refused with the keys its section takes, so that a misspelt
 * key never passes silently. Values are in engineering notation ({@code 50 ohm}, {@code 1M},
 * {@code 15p}, {@code 3.3 Hz}). Stateless; one instance serves any thread.
 */
public final class BenchReader {
    /** The keys of a bench file, at its top level. */
    public static final List<String> TOP_KEYS = List.of("generator", "reference", "output-channel", "input-channel",
            "instruments");
    static final List<String> INSTRUMENT_KEYS = List.of("identity", "serial", "calibration-due");
    static final List<String> GENERATOR_KEYS = List.of("output-resistance");
    static final List<String> OUTPUT_KEYS = List.of("coupling", "corner", "resistance", "capacitance");
    static final List<String> INPUT_KEYS = List.of("at", "coupling", "corner", "resistance", "capacitance");

    /** @return the bench file's contents */
    public Bench read(Path file) throws InputProblem {
        YamlNode root = new YamlReader().read(file);
        if (!(root instanceof YamlNode.Mapping)) {
            throw new InputProblem(file, root.line(), "a bench file is a map of keys, found " + root.kind(),
                    "start with keys such as 'output-channel:' (" + String.join(", ", TOP_KEYS) + ")");
        }
        return read((YamlNode.Mapping) root, file, "the bench file");
    }

    /**
     * @param section the bench keys: a bench file's top level or a profile's {@code bench:} map
     * @param file    named in errors, and kept as the bench's source
     * @param where   the section's name for messages, such as {@code "the bench file"} or {@code "bench"}
     */
    public Bench read(YamlNode.Mapping section, Path file, String where) throws InputProblem {
        Keys keys = new Keys(file);
        keys.check(section, TOP_KEYS, where);
        double generatorOhms = 0;
        Optional<YamlNode> generator = section.get("generator");
        if (generator.isPresent()) {
            YamlNode.Mapping map = keys.map(generator.get(), "generator", "output-resistance: 50 ohm");
            keys.check(map, GENERATOR_KEYS, "generator");
            Optional<YamlNode> ohms = map.get("output-resistance");
            if (ohms.isPresent()) {
                generatorOhms = keys.value(ohms.get(), Quantity.OHMS, "generator.output-resistance", "50 ohm");
                if (generatorOhms < 0) {
                    throw new InputProblem(file, ohms.get().line(),
                            "generator.output-resistance is negative", "give it in ohms, 0 or more, e.g. 50 ohm");
                }
            }
        }
        Optional<Reference> reference = Optional.empty();
        Optional<YamlNode> referenceNode = section.get("reference");
        if (referenceNode.isPresent()) {
            String word = keys.text(referenceNode.get(), "reference");
            if (word.equals("generator")) {
                reference = Optional.of(Reference.GENERATOR);
            } else if (word.equals("input-channel")) {
                reference = Optional.of(Reference.INPUT_CHANNEL);
            } else {
                throw new InputProblem(file, referenceNode.get().line(), "reference '" + word + "' is not one the"
                        + " bench knows." + Spelling.didYouMean(word, List.of("generator", "input-channel")),
                        "write 'generator' (gain over the generator's set level) or 'input-channel'"
                                + " (gain over the input channel)");
            }
        }
        Channel output = Channel.IDEAL;
        Optional<YamlNode.Entry> outputEntry = section.entry("output-channel");
        if (outputEntry.isPresent()) {
            YamlNode.Mapping map = keys.map(outputEntry.get().value(), "output-channel", "coupling: dc");
            keys.check(map, OUTPUT_KEYS, "output-channel");
            output = channel(map, "output-channel", outputEntry.get().line(), keys);
        }
        Optional<InputChannel> input = Optional.empty();
        Optional<YamlNode.Entry> inputEntry = section.entry("input-channel");
        if (inputEntry.isPresent()) {
            YamlNode.Mapping map = keys.map(inputEntry.get().value(), "input-channel", "at: generator");
            keys.check(map, INPUT_KEYS, "input-channel");
            Optional<YamlNode> atNode = map.get("at");
            if (atNode.isEmpty()) {
                throw new InputProblem(file, inputEntry.get().line(), "input-channel has no 'at'",
                        "say where the input channel is connected: 'at: generator' (the generator's terminal)"
                                + " or 'at: stage-input' (the stage's input node)");
            }
            String at = keys.text(atNode.get(), "input-channel.at");
            ProbePoint point;
            if (at.equals("generator")) {
                point = ProbePoint.GENERATOR;
            } else if (at.equals("stage-input")) {
                point = ProbePoint.STAGE_INPUT;
            } else {
                throw new InputProblem(file, atNode.get().line(), "input-channel.at '" + at + "' is not a point the"
                        + " bench knows." + Spelling.didYouMean(at, List.of("generator", "stage-input")),
                        "write 'generator' or 'stage-input'");
            }
            input = Optional.of(new InputChannel(point, channel(map, "input-channel", inputEntry.get().line(), keys)));
        }
        return new Bench(generatorOhms, reference, output, input, file, instruments(section, keys));
    }

    /**
     * The {@code instruments:} list: each an identity, with its serial number and calibration due
     * date when the file gives them; nothing is filled in that the file does not say.
     */
    private static List<BenchInstrument> instruments(YamlNode.Mapping section, Keys keys) throws InputProblem {
        Optional<YamlNode.Entry> entry = section.entry("instruments");
        if (entry.isEmpty()) {
            return List.of();
        }
        String example = "'- identity: Generator G1', with 'serial: SN-0042' and 'calibration-due: 2027-03-31' under it"
                + " when known";
        if (!(entry.get().value() instanceof YamlNode.Sequence)) {
            throw new InputProblem(keys.file, entry.get().line(), "instruments is not a list",
                    "write one item per instrument: " + example);
        }
        List<BenchInstrument> list = new ArrayList<>();
        for (YamlNode item : ((YamlNode.Sequence) entry.get().value()).items()) {
            YamlNode.Mapping map = keys.map(item, "an instruments item", "identity: Generator G1");
            keys.check(map, INSTRUMENT_KEYS, "an instruments item");
            Optional<YamlNode> identity = map.get("identity");
            if (identity.isEmpty() || keys.text(identity.get(), "instruments.identity").isBlank()) {
                throw new InputProblem(keys.file, item.line(), "an instruments item has no identity",
                        "give each instrument its maker and model or asset name: " + example);
            }
            Optional<String> serial = Optional.empty();
            if (map.get("serial").isPresent()) {
                serial = Optional.of(keys.text(map.get("serial").get(), "instruments.serial")).filter(s -> !s.isBlank());
            }
            Optional<LocalDate> due = Optional.empty();
            Optional<YamlNode> dueNode = map.get("calibration-due");
            if (dueNode.isPresent()) {
                String text = keys.text(dueNode.get(), "instruments.calibration-due");
                try {
                    due = Optional.of(LocalDate.parse(text));
                } catch (DateTimeParseException unreadable) {
                    throw new InputProblem(keys.file, dueNode.get().line(), "instruments.calibration-due '" + text
                            + "' is not a date", "write it as YYYY-MM-DD, such as 2027-03-31");
                }
            }
            list.add(new BenchInstrument(keys.text(identity.get(), "instruments.identity").strip(), serial, due));
        }
        return list;
    }

    private static Channel channel(YamlNode.Mapping map, String where, int line, Keys keys) throws InputProblem {
        Coupling coupling = Coupling.DC;
        Optional<YamlNode> couplingNode = map.get("coupling");
        if (couplingNode.isPresent()) {
            String word = keys.text(couplingNode.get(), where + ".coupling");
            if (word.equals("dc")) {
                coupling = Coupling.DC;
            } else if (word.equals("ac")) {
                coupling = Coupling.AC;
            } else {
                throw new InputProblem(keys.file, couplingNode.get().line(), where + ".coupling '" + word
                        + "' is not a coupling.", "write 'dc' or 'ac'");
            }
        }
        OptionalDouble cornerHz = OptionalDouble.empty();
        Optional<YamlNode> cornerNode = map.get("corner");
        if (coupling == Coupling.DC && cornerNode.isPresent()) {
            throw new InputProblem(keys.file, cornerNode.get().line(), where + " has a corner but is DC-coupled",
                    "write 'coupling: ac' if the channel is AC-coupled, or remove the corner");
        }
        if (coupling == Coupling.AC) {
            if (cornerNode.isEmpty()) {
                throw new InputProblem(keys.file, couplingNode.get().line(), where + " is AC-coupled but has no"
                        + " corner", "add its -3 dB frequency, e.g. 'corner: 3.3 Hz' (see the instrument's data"
                        + " sheet), or 'corner: unknown' to have it estimated from the sweep");
            }
            String text = keys.text(cornerNode.get(), where + ".corner");
            if (!text.equals("unknown")) {
                double hz = keys.value(cornerNode.get(), Quantity.HERTZ, where + ".corner", "3.3 Hz");
                cornerHz = OptionalDouble.of(keys.positive(hz, cornerNode.get(), where + ".corner", "3.3 Hz"));
            }
        }
        OptionalDouble ohms = OptionalDouble.empty();
        Optional<YamlNode> ohmsNode = map.get("resistance");
        if (ohmsNode.isPresent()) {
            double value = keys.value(ohmsNode.get(), Quantity.OHMS, where + ".resistance", "1M");
            ohms = OptionalDouble.of(keys.positive(value, ohmsNode.get(), where + ".resistance", "1M"));
        }
        OptionalDouble farads = OptionalDouble.empty();
        Optional<YamlNode> faradsNode = map.get("capacitance");
        if (faradsNode.isPresent()) {
            double value = keys.value(faradsNode.get(), Quantity.FARADS, where + ".capacitance", "15p");
            farads = OptionalDouble.of(keys.positive(value, faradsNode.get(), where + ".capacitance", "15p"));
        }
        return new Channel(coupling, cornerHz, ohms, farads, line);
    }

    /** The checks every key shares, with the file to name. */
    private static final class Keys {
        private final Path file;

        Keys(Path file) {
            this.file = file;
        }

        void check(YamlNode.Mapping map, List<String> allowed, String where) throws InputProblem {
            for (YamlNode.Entry entry : map.entries()) {
                if (!allowed.contains(entry.key())) {
                    throw new InputProblem(file, entry.line(), "unknown key '" + entry.key() + "' in " + where + "."
                            + Spelling.didYouMean(entry.key(), allowed), where + " takes: " + String.join(", ", allowed));
                }
            }
        }

        YamlNode.Mapping map(YamlNode node, String where, String example) throws InputProblem {
            if (!(node instanceof YamlNode.Mapping)) {
                throw new InputProblem(file, node.line(), where + " should be a map of keys, found " + node.kind(),
                        "indent its keys under it, e.g. '" + where + ":' then '  " + example + "'");
            }
            return (YamlNode.Mapping) node;
        }

        String text(YamlNode node, String what) throws InputProblem {
            if (!(node instanceof YamlNode.Scalar) || ((YamlNode.Scalar) node).text().isBlank()) {
                throw new InputProblem(file, node.line(), what + " needs a value, found "
                        + (node instanceof YamlNode.Scalar ? "none" : node.kind()), "give one value after the ':'");
            }
            return ((YamlNode.Scalar) node).text().strip();
        }

        double value(YamlNode node, Quantity quantity, String what, String example) throws InputProblem {
            String text = text(node, what);
            try {
                // a capacitance states its scale: a bare 15 would be 15 F (EngineeringValue.capacitance)
                return quantity == Quantity.FARADS ? EngineeringValue.capacitance(text).value()
                        : EngineeringValue.parse(text, quantity);
            } catch (IllegalArgumentException e) {
                throw new InputProblem(file, node.line(), what + ": " + e.getMessage(),
                        String.format(Locale.ROOT, "write a number in engineering notation, e.g. %s", example)
                                + (quantity == Quantity.FARADS ? ", or with the unit F when farads are meant" : ""));
            }
        }

        double positive(double value, YamlNode node, String what, String example) throws InputProblem {
            if (!(value > 0)) {
                throw new InputProblem(file, node.line(), what + " must be positive",
                        "write a positive value, e.g. " + example);
            }
            return value;
        }
    }
}

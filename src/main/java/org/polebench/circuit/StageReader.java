package org.polebench.circuit;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import org.polebench.yaml.YamlNode;
import org.polebench.yaml.YamlReader;

/**
 * Reads a {@code *.stage.yaml} file (docs/user-guide.md, "Stage files",
 * which lists every key) into a {@link Stage}. Every refusal is an {@link InputProblem} naming
 * the file, the line, the part and what would fix it; implausible but possible values are
 * accepted with an {@link InputWarning} naming the line.
 *
 * <p>Checks beyond the grammar: a node named only once (most often a typo), input, output,
 * ground and rails that no part connects to, a node with no DC path to ground, and low-band
 * capacitors that form a loop (see {@link StageTopology}).
 */
public final class StageReader {
    private final YamlReader yaml = new YamlReader();

    /** @return the stage and the warnings about it, in file order */
    public StageFile read(Path file) throws InputProblem {
        YamlNode root = yaml.read(file);
        return new Reading(file).stageFile(root);
    }

    /**
     * Reads a stage file's text held elsewhere (the ledger keeps the text of every stage it was
     * tested against).
     *
     * @param name what messages call the file
     * @param text the file's text
     * @return the stage and the warnings about it, in file order
     */
    public StageFile read(Path name, String text) throws InputProblem {
        YamlNode root = yaml.read(name, new java.io.StringReader(text));
        return new Reading(name).stageFile(root);
    }

    // ---------------------------------------------------------------------------------------
    // keys

    private static final List<String> TOP_KEYS = List.of("name", "ground", "supplies", "input", "output",
            "limits", "temperature", "gain-calibration", "parts");
    private static final List<String> INPUT_KEYS = List.of("node", "source-resistance", "reference");
    private static final List<String> OUTPUT_KEYS = List.of("node", "load");
    private static final List<String> LIMIT_KEYS = List.of("lower-corner-max", "lower-corner-min",
            "upper-corner-min", "midband-gain");
    private static final List<String> GAIN_LIMIT_KEYS = List.of("min", "max");
    private static final List<String> KINDS = List.of("resistor", "capacitor", "npn", "pnp", "nmos", "pmos");
    private static final List<String> RESISTOR_KEYS = List.of("resistor", "between", "tolerance");
    private static final List<String> CAPACITOR_KEYS = List.of("capacitor", "between", "tolerance", "band");
    private static final List<String> BJT_KEYS = List.of("beta", "beta-tolerance", "vbe-on", "early-voltage",
            "rx", "cpi", "cmu", "bias", "bias-tolerance");
    private static final List<String> MOSFET_KEYS = List.of("vth", "k", "lambda", "gamma", "surface-potential",
            "cgs", "cgd", "bias", "bias-tolerance");
    private static final List<String> BJT_TERMINALS = List.of("c", "b", "e");
    private static final List<String> MOSFET_TERMINALS = List.of("d", "g", "s", "b");

    /** Resistor tolerance when none is given: ±5 %, IEC 60062 letter code J, a common default. */
    static final Tolerance DEFAULT_RESISTOR_TOLERANCE = Tolerance.symmetric(0.05);
    /** Capacitor tolerance when none is given: ±20 %, IEC 60062 letter code M. */
    static final Tolerance DEFAULT_CAPACITOR_TOLERANCE = Tolerance.symmetric(0.20);
    /** β spread when none is given: ±50 %, common practice (data-sheet hFE ranges span 2:1 to 3:1). */
    static final Tolerance DEFAULT_BETA_TOLERANCE = Tolerance.symmetric(0.50);
    /** Bias-current prior when none is given: ±20 % (docs/method.md, "The small-signal network"). */
    static final Tolerance DEFAULT_BIAS_TOLERANCE = Tolerance.symmetric(0.20);

    private static final Pattern NUMBER = Pattern.compile("\\d+(?:\\.\\d*)?|\\.\\d+");
    private static final Pattern SYMMETRIC = Pattern.compile("(?:±|\\+/-|\\+-)?\\s*(" + NUMBER + ")\\s*%");
    private static final Pattern ASYMMETRIC = Pattern.compile(
            "([+-])\\s*(" + NUMBER + ")\\s*%\\s*/\\s*([+-])\\s*(" + NUMBER + ")\\s*%");

    /** One mention of a node, for the named-only-once check. */
    private record NodeUse(String where, int line) {
    }

    /** The state of one read: the file, the warnings so far and where each node is named. */
    private static final class Reading {
        private final Path file;
        private final List<InputWarning> warnings = new ArrayList<>();
        private final Map<String, List<NodeUse>> partUses = new LinkedHashMap<>();

        Reading(Path file) {
            this.file = file;
        }

        StageFile stageFile(YamlNode rootNode) throws InputProblem {
            if (!(rootNode instanceof YamlNode.Mapping)) {
                throw problem(rootNode.line(), "a stage file is a map of keys, but this one is " + rootNode.kind(),
                        "start with keys such as 'name:', 'ground:', 'input:', 'output:' and 'parts:'");
            }
            YamlNode.Mapping root = (YamlNode.Mapping) rootNode;
            checkKeys(root, TOP_KEYS, "the stage file");

            String name = root.get("name").isPresent() ? text(root.get("name").get(), "name") : defaultName();
            YamlNode.Entry groundEntry = required(root, "ground", "the stage file",
                    "add a line such as 'ground: gnd' naming the node your parts use as ground");
            String ground = nodeName(groundEntry.value(), "ground");

            List<Supply> supplies = supplies(root, ground);
            YamlNode.Entry inputEntry = required(root, "input", "the stage file",
                    "add a line such as 'input: {node: in, source-resistance: 600}'");
            YamlNode.Entry outputEntry = required(root, "output", "the stage file",
                    "add a line such as 'output: {node: out, load: 47k}'");
            StageInput input = input(inputEntry);
            StageOutput output = output(outputEntry);
            Limits limits = root.entry("limits").isPresent() ? limits(root.entry("limits").get()) : Limits.none();
            double kelvin = root.get("temperature").isPresent()
                    ? temperature(root.get("temperature").get()) : Stage.DEFAULT_TEMPERATURE_KELVIN;
            double calibrationDb = root.get("gain-calibration").isPresent()
                    ? gainCalibration(root.get("gain-calibration").get()) : Stage.DEFAULT_GAIN_CALIBRATION_DB;
            YamlNode.Entry partsEntry = required(root, "parts", "the stage file",
                    "add 'parts:' with one line per part, such as 'R1: {resistor: 10k, between: [a, b]}'");
            List<Part> parts = parts(partsEntry);

            checkNodes(ground, groundEntry, supplies, input, output);
            Stage stage = new Stage(name, file, ground, supplies, input, output, limits, kelvin, calibrationDb, parts);
            Optional<StageTopology.FloatingNode> floating = StageTopology.floatingNode(stage, true);
            if (floating.isPresent()) {
                StageTopology.FloatingNode f = floating.get();
                throw problem(f.line(), "node '" + f.node() + "' has no DC path to ground: it connects only to "
                        + String.join(", ", f.touching()), f.hint());
            }
            warnings.addAll(StageTopology.checkCapacitorLoops(stage, file));
            return new StageFile(stage, warnings);
        }

        private String defaultName() {
            String fileName = file == null ? "stage" : file.getFileName().toString();
            return fileName.replaceFirst("\\.stage\\.ya?ml$", "").replaceFirst("\\.ya?ml$", "");
        }

        // ---- top-level sections

        private List<Supply> supplies(YamlNode.Mapping root, String ground) throws InputProblem {
            List<Supply> supplies = new ArrayList<>();
            Optional<YamlNode.Entry> entry = root.entry("supplies");
            if (entry.isEmpty()) {
                return supplies;
            }
            YamlNode.Mapping map = mapping(entry.get().value(), "supplies",
                    "write the rails as a map of node to DC voltage, such as 'supplies: {vcc: 9, vee: -9}'");
            for (YamlNode.Entry rail : map.entries()) {
                String node = rail.key().strip();
                if (node.equals(ground)) {
                    throw problem(rail.line(), "supply '" + node + "' is the ground node",
                            "a rail needs its own node name; ground is 0 V by definition");
                }
                double volts = value(rail.value(), Quantity.VOLTS, "supply '" + node + "'", "9 or 9 V");
                if (Math.abs(volts) > 100) {
                    warn(rail.line(), "supply '" + node + "' is " + EngineeringValue.format(volts, "V")
                            + ", more than 100 V; accepted as given");
                }
                supplies.add(new Supply(node, volts, rail.line()));
            }
            return supplies;
        }

        private StageInput input(YamlNode.Entry entry) throws InputProblem {
            YamlNode.Mapping map = mapping(entry.value(), "input",
                    "write it as 'input: {node: in, source-resistance: 600}'");
            checkKeys(map, INPUT_KEYS, "input");
            YamlNode.Entry nodeEntry = required(map, "node", "input",
                    "name the node the generator drives, as in 'input: {node: in, source-resistance: 600}'");
            YamlNode.Entry sourceEntry = required(map, "source-resistance", "input",
                    "give the generator's output resistance, such as 'source-resistance: 50' (0 for an ideal source)");
            String node = nodeName(nodeEntry.value(), "input node");
            double ohms = value(sourceEntry.value(), Quantity.OHMS, "source-resistance", "600 or 50R");
            if (ohms < 0) {
                throw problem(sourceEntry.line(), "source-resistance is negative",
                        "give the generator's output resistance in ohms, 0 or more");
            }
            if (ohms > 1e9) {
                warn(sourceEntry.line(), "source-resistance is over 1 GΩ; accepted as given");
            }
            GainReference reference = GainReference.SOURCE_EMF;
            Optional<YamlNode.Entry> referenceEntry = map.entry("reference");
            if (referenceEntry.isPresent()) {
                String word = text(referenceEntry.get().value(), "reference");
                if (word.equals("node")) {
                    reference = GainReference.INPUT_NODE;
                } else if (!word.equals("emf")) {
                    throw problem(referenceEntry.get().value().line(), "reference '" + word + "' is not known",
                            "write 'reference: node' for gain against the input node, or 'reference: emf'"
                                    + " (the default) for gain against the generator's EMF");
                }
            }
            return new StageInput(node, ohms, reference, entry.line());
        }

        private StageOutput output(YamlNode.Entry entry) throws InputProblem {
            YamlNode.Mapping map = mapping(entry.value(), "output", "write it as 'output: {node: out, load: 47k}'");
            checkKeys(map, OUTPUT_KEYS, "output");
            YamlNode.Entry nodeEntry = required(map, "node", "output",
                    "name the output node, as in 'output: {node: out, load: 47k}'");
            String node = nodeName(nodeEntry.value(), "output node");
            OptionalDouble load = OptionalDouble.empty();
            Optional<YamlNode.Entry> loadEntry = map.entry("load");
            if (loadEntry.isPresent()) {
                double ohms = positive(loadEntry.get().value(), Quantity.OHMS, "output load", "47k");
                plausibleResistance(loadEntry.get().line(), "the output load", ohms);
                load = OptionalDouble.of(ohms);
            }
            return new StageOutput(node, load, entry.line());
        }

        private Limits limits(YamlNode.Entry entry) throws InputProblem {
            YamlNode.Mapping map = mapping(entry.value(), "limits",
                    "write them as a map, such as 'limits: {lower-corner-max: 20 Hz}'");
            checkKeys(map, LIMIT_KEYS, "limits");
            OptionalDouble lowerMax = optionalPositive(map, "lower-corner-max", Quantity.HERTZ, "20 Hz");
            OptionalDouble lowerMin = optionalPositive(map, "lower-corner-min", Quantity.HERTZ, "5 Hz");
            OptionalDouble upperMin = optionalPositive(map, "upper-corner-min", Quantity.HERTZ, "20 kHz");
            OptionalDouble gainMin = OptionalDouble.empty();
            OptionalDouble gainMax = OptionalDouble.empty();
            Optional<YamlNode.Entry> gain = map.entry("midband-gain");
            if (gain.isPresent()) {
                YamlNode.Mapping bounds = mapping(gain.get().value(), "midband-gain",
                        "write it as 'midband-gain: {min: 17 dB, max: 19 dB}'");
                checkKeys(bounds, GAIN_LIMIT_KEYS, "midband-gain");
                if (bounds.entries().isEmpty()) {
                    throw problem(gain.get().line(), "midband-gain gives no bound",
                            "write it as 'midband-gain: {min: 17 dB, max: 19 dB}'");
                }
                if (bounds.get("min").isPresent()) {
                    gainMin = OptionalDouble.of(value(bounds.get("min").get(), Quantity.DECIBELS,
                            "midband-gain min", "17 dB"));
                }
                if (bounds.get("max").isPresent()) {
                    gainMax = OptionalDouble.of(value(bounds.get("max").get(), Quantity.DECIBELS,
                            "midband-gain max", "19 dB"));
                }
                if (gainMin.isPresent() && gainMax.isPresent() && gainMin.getAsDouble() > gainMax.getAsDouble()) {
                    throw problem(gain.get().line(), "midband-gain min is above its max",
                            "swap the two bounds");
                }
            }
            if (lowerMin.isPresent() && lowerMax.isPresent() && lowerMin.getAsDouble() > lowerMax.getAsDouble()) {
                throw problem(map.entry("lower-corner-min").get().line(),
                        "lower-corner-min is above lower-corner-max", "swap the two bounds");
            }
            return new Limits(lowerMax, lowerMin, upperMin, gainMin, gainMax, entry.line());
        }

        private OptionalDouble optionalPositive(YamlNode.Mapping map, String key, Quantity quantity, String example)
                throws InputProblem {
            Optional<YamlNode> node = map.get(key);
            if (node.isEmpty()) {
                return OptionalDouble.empty();
            }
            return OptionalDouble.of(positive(node.get(), quantity, key, example));
        }

        private double temperature(YamlNode node) throws InputProblem {
            String text = text(node, "temperature");
            double kelvin;
            Matcher celsius = Pattern.compile("(.*?)\\s*°C").matcher(text);
            if (celsius.matches()) {
                // ITS-90 / SI: T/K = t/°C + 273.15
                kelvin = parse(celsius.group(1), Quantity.DIMENSIONLESS, node.line(), "temperature",
                        "300 K or 27 °C") + 273.15;
            } else {
                kelvin = parse(text, Quantity.KELVIN, node.line(), "temperature", "300 K or 27 °C");
            }
            if (!(kelvin > 0)) {
                throw problem(node.line(), "temperature must be above absolute zero", "write it as 300 K or 27 °C");
            }
            if (kelvin < 200 || kelvin > 450) {
                warn(node.line(), "temperature " + EngineeringValue.format(kelvin, "K")
                        + " is outside 200 K to 450 K, unusual for a bench; accepted as given");
            }
            return kelvin;
        }

        private double gainCalibration(YamlNode node) throws InputProblem {
            String text = text(node, "gain-calibration").replaceFirst("^(±|\\+/-|\\+-)\\s*", "");
            double db = parse(text, Quantity.DECIBELS, node.line(), "gain-calibration", "1 dB (read as ±1 dB)");
            if (!(db > 0)) {
                throw problem(node.line(), "gain-calibration must be a positive half-width in dB",
                        "write it as '1 dB' (read as ±1 dB)");
            }
            if (db > 20) {
                warn(node.line(), "gain-calibration of ±" + db + " dB is very wide; accepted as given");
            }
            return db;
        }

        // ---- parts

        private List<Part> parts(YamlNode.Entry entry) throws InputProblem {
            YamlNode.Mapping map = mapping(entry.value(), "parts",
                    "list one part per line under 'parts:', such as 'R1: {resistor: 10k, between: [a, b]}'");
            if (map.entries().isEmpty()) {
                throw problem(entry.line(), "the stage has no parts",
                        "list one part per line under 'parts:', such as 'R1: {resistor: 10k, between: [a, b]}'");
            }
            List<Part> parts = new ArrayList<>();
            for (YamlNode.Entry partEntry : map.entries()) {
                parts.add(part(partEntry));
            }
            return parts;
        }

        private Part part(YamlNode.Entry entry) throws InputProblem {
            String id = entry.key().strip();
            if (!(entry.value() instanceof YamlNode.Mapping)) {
                throw problem(entry.line(), id + ": a part is a map, but this is " + entry.value().kind(),
                        "write it as '" + id + ": {resistor: 10k, between: [a, b]}' or similar");
            }
            YamlNode.Mapping map = (YamlNode.Mapping) entry.value();
            List<String> kinds = new ArrayList<>();
            for (String key : map.keys()) {
                if (KINDS.contains(key)) {
                    kinds.add(key);
                }
            }
            if (kinds.isEmpty()) {
                String suggestion = "";
                for (String key : map.keys()) {
                    Optional<String> close = Spelling.closest(key, KINDS);
                    if (close.isPresent()) {
                        suggestion = " '" + key + "' is not a part kind; did you mean '" + close.get() + "'?";
                        break;
                    }
                }
                throw problem(entry.line(), id + " does not say what kind of part it is." + suggestion,
                        "start the part with one of " + String.join(", ", KINDS) + ", such as '" + id
                                + ": {resistor: 10k, between: [a, b]}'");
            }
            if (kinds.size() > 1) {
                throw problem(entry.line(), id + " is given as both " + kinds.get(0) + " and " + kinds.get(1),
                        "a part has one kind; split it into two parts with their own names");
            }
            String kind = kinds.get(0);
            switch (kind) {
                case "resistor":
                    return resistor(id, entry, map);
                case "capacitor":
                    return capacitor(id, entry, map);
                case "npn":
                case "pnp":
                    return bjt(id, entry, map, kind);
                default:
                    return mosfet(id, entry, map, kind);
            }
        }

        private Resistor resistor(String id, YamlNode.Entry entry, YamlNode.Mapping map) throws InputProblem {
            checkPartKeys(id, map, RESISTOR_KEYS, "resistor");
            YamlNode valueNode = map.get("resistor").get();
            double ohms = positive(valueNode, Quantity.OHMS, id + ": resistor", "10k, 4k7 or 100R");
            plausibleResistance(valueNode.line(), id, ohms);
            NodePair between = between(id, entry, map);
            Tolerance tolerance = map.get("tolerance").isPresent()
                    ? tolerance(map.get("tolerance").get(), id + ": tolerance") : DEFAULT_RESISTOR_TOLERANCE;
            return new Resistor(id, between, ohms, tolerance, entry.line());
        }

        private Capacitor capacitor(String id, YamlNode.Entry entry, YamlNode.Mapping map) throws InputProblem {
            checkPartKeys(id, map, CAPACITOR_KEYS, "capacitor");
            YamlNode valueNode = map.get("capacitor").get();
            double farads = positive(valueNode, Quantity.FARADS, id + ": capacitor", "10u, 4u7 or 100n");
            if (farads >= 1) {
                warn(valueNode.line(), id + ": a capacitor of " + EngineeringValue.format(farads, "F")
                        + " (1 F or more) is unusual; check the prefix (u for micro, n for nano); accepted as given");
            } else if (farads < 0.1e-12) {
                warn(valueNode.line(), id + ": a capacitor of " + EngineeringValue.format(farads, "F")
                        + " (under 0.1 pF) is unusual; check the prefix (p for pico); accepted as given");
            }
            NodePair between = between(id, entry, map);
            Tolerance tolerance = map.get("tolerance").isPresent()
                    ? tolerance(map.get("tolerance").get(), id + ": tolerance") : DEFAULT_CAPACITOR_TOLERANCE;
            Band band = Capacitor.defaultBand(farads);
            Optional<YamlNode> bandNode = map.get("band");
            if (bandNode.isPresent()) {
                String word = text(bandNode.get(), id + ": band").toLowerCase(Locale.ROOT);
                if (word.equals("low")) {
                    band = Band.LOW;
                } else if (word.equals("high")) {
                    band = Band.HIGH;
                } else {
                    throw problem(bandNode.get().line(), id + ": band '" + word + "' is not known",
                            "write 'band: low' (a coupling or bypass capacitor) or 'band: high'"
                                    + " (a small capacitor of the upper rolloff)");
                }
            }
            return new Capacitor(id, between, farads, tolerance, band, entry.line());
        }

        private Bjt bjt(String id, YamlNode.Entry entry, YamlNode.Mapping map, String kind) throws InputProblem {
            List<String> allowed = new ArrayList<>(BJT_KEYS);
            allowed.add(0, kind);
            checkPartKeys(id, map, allowed, kind);
            Map<String, String> terminals = terminals(id, map.entry(kind).get(), BJT_TERMINALS, List.of(), kind);
            YamlNode.Entry betaEntry = required(map, "beta", id,
                    "give the current gain, such as 'beta: 200' (and 'beta-tolerance: 50%' for its spread)");
            double beta = positive(betaEntry.value(), Quantity.DIMENSIONLESS, id + ": beta", "200");
            if (beta < 10 || beta > 2000) {
                warn(betaEntry.value().line(), id + ": beta of " + number(beta)
                        + " is outside 10 to 2000, unusual for a small-signal transistor; accepted as given");
            }
            Tolerance betaTolerance = map.get("beta-tolerance").isPresent()
                    ? tolerance(map.get("beta-tolerance").get(), id + ": beta-tolerance") : DEFAULT_BETA_TOLERANCE;
            double vbeOn = Bjt.DEFAULT_VBE_ON_VOLTS;
            if (map.get("vbe-on").isPresent()) {
                YamlNode node = map.get("vbe-on").get();
                vbeOn = positive(node, Quantity.VOLTS, id + ": vbe-on", "0.65 (the magnitude, also for a pnp)");
                if (vbeOn < 0.4 || vbeOn > 0.9) {
                    warn(node.line(), id + ": vbe-on of " + number(vbeOn)
                            + " V is outside 0.4 V to 0.9 V, unusual for a silicon junction; accepted as given");
                }
            }
            OptionalDouble early = OptionalDouble.empty();
            if (map.get("early-voltage").isPresent()) {
                YamlNode node = map.get("early-voltage").get();
                double volts = positive(node, Quantity.VOLTS, id + ": early-voltage", "100");
                if (volts < 5 || volts > 1000) {
                    warn(node.line(), id + ": early-voltage of " + number(volts)
                            + " V is outside 5 V to 1000 V, unusual; accepted as given");
                }
                early = OptionalDouble.of(volts);
            }
            double rx = optionalNonNegative(map, "rx", Quantity.OHMS, id, "100");
            if (rx > 10e3) {
                warn(map.get("rx").get().line(), id + ": rx of " + EngineeringValue.format(rx, "Ω")
                        + " is over 10 kΩ, unusual for a base spreading resistance; accepted as given");
            }
            double cpi = deviceCapacitance(map, "cpi", id);
            double cmu = deviceCapacitance(map, "cmu", id);
            Bias bias = bias(id, map, "ic", "collector current");
            Tolerance biasTolerance = map.get("bias-tolerance").isPresent()
                    ? tolerance(map.get("bias-tolerance").get(), id + ": bias-tolerance") : DEFAULT_BIAS_TOLERANCE;
            return new Bjt(id, kind.equals("npn") ? Bjt.Polarity.NPN : Bjt.Polarity.PNP, terminals.get("c"),
                    terminals.get("b"), terminals.get("e"), beta, betaTolerance, vbeOn, early, rx, cpi, cmu, bias,
                    biasTolerance, entry.line());
        }

        private Mosfet mosfet(String id, YamlNode.Entry entry, YamlNode.Mapping map, String kind)
                throws InputProblem {
            List<String> allowed = new ArrayList<>(MOSFET_KEYS);
            allowed.add(0, kind);
            checkPartKeys(id, map, allowed, kind);
            Map<String, String> terminals = terminals(id, map.entry(kind).get(), List.of("d", "g", "s"),
                    List.of("b"), kind);
            boolean pmos = kind.equals("pmos");
            YamlNode.Entry vthEntry = required(map, "vth", id, pmos
                    ? "give the threshold voltage, written negative for a pmos, such as 'vth: -1.2'"
                    : "give the threshold voltage, such as 'vth: 1.2'");
            double vth = value(vthEntry.value(), Quantity.VOLTS, id + ": vth", pmos ? "-1.2" : "1.2");
            if (pmos && vth > 0) {
                throw problem(vthEntry.value().line(), id + ": a pmos threshold is written negative, but vth is "
                        + number(vth) + " V", "write 'vth: -" + number(vth) + "'");
            }
            if (!pmos && vth < 0) {
                warn(vthEntry.value().line(), id + ": an nmos with vth " + number(vth)
                        + " V is a depletion-mode device; accepted as given");
            }
            if (Math.abs(vth) > 10) {
                warn(vthEntry.value().line(), id + ": |vth| over 10 V is unusual; accepted as given");
            }
            YamlNode.Entry kEntry = required(map, "k", id,
                    "give k of ID = (k/2)(VGS - Vth)^2 in A/V², such as 'k: 4m'");
            double k = positive(kEntry.value(), Quantity.AMPS_PER_VOLT_SQUARED, id + ": k", "4m or 4 mA/V²");
            if (k > 100) {
                warn(kEntry.value().line(), id + ": k over 100 A/V² is unusual; accepted as given");
            }
            double lambda = optionalNonNegative(map, "lambda", Quantity.PER_VOLT, id, "0.01");
            if (lambda > 1) {
                warn(map.get("lambda").get().line(), id + ": lambda over 1 /V is unusual; accepted as given");
            }
            double gamma = optionalNonNegative(map, "gamma", Quantity.ROOT_VOLTS, id, "0.5");
            if (gamma > 0 && terminals.get("b") == null) {
                warn(map.get("gamma").get().line(), id + ": gamma is given but no body terminal 'b'; the body"
                        + " is taken as tied to the source and gamma is not used");
            }
            double surface = Mosfet.DEFAULT_SURFACE_POTENTIAL_VOLTS;
            if (map.get("surface-potential").isPresent()) {
                surface = positive(map.get("surface-potential").get(), Quantity.VOLTS, id + ": surface-potential",
                        "0.6 (2φF)");
            }
            double cgs = deviceCapacitance(map, "cgs", id);
            double cgd = deviceCapacitance(map, "cgd", id);
            Bias bias = bias(id, map, "id", "drain current");
            Tolerance biasTolerance = map.get("bias-tolerance").isPresent()
                    ? tolerance(map.get("bias-tolerance").get(), id + ": bias-tolerance") : DEFAULT_BIAS_TOLERANCE;
            return new Mosfet(id, pmos ? Mosfet.Channel.PMOS : Mosfet.Channel.NMOS, terminals.get("d"),
                    terminals.get("g"), terminals.get("s"), Optional.ofNullable(terminals.get("b")), vth, k, lambda,
                    gamma, surface, cgs, cgd, bias, biasTolerance, entry.line());
        }

        private double deviceCapacitance(YamlNode.Mapping map, String key, String id) throws InputProblem {
            double farads = optionalNonNegative(map, key, Quantity.FARADS, id, "5p");
            if (farads >= 1e-9) {
                warn(map.get(key).get().line(), id + ": " + key + " of " + EngineeringValue.format(farads, "F")
                        + " is 1 nF or more, unusual for a device capacitance; check the prefix (p for pico);"
                        + " accepted as given");
            }
            return farads;
        }

        private double optionalNonNegative(YamlNode.Mapping map, String key, Quantity quantity, String id,
                                           String example) throws InputProblem {
            Optional<YamlNode> node = map.get(key);
            if (node.isEmpty()) {
                return 0;
            }
            double value = value(node.get(), quantity, id + ": " + key, example);
            if (value < 0) {
                throw problem(node.get().line(), id + ": " + key + " is negative", "give a value of 0 or more, such as "
                        + example);
            }
            return value;
        }

        private Bias bias(String id, YamlNode.Mapping map, String currentKey, String currentWord)
                throws InputProblem {
            Optional<YamlNode> node = map.get("bias");
            String hint = "write 'bias: auto' to solve the operating point, or 'bias: {" + currentKey
                    + ": 1.1m}' for a known " + currentWord + " in amperes";
            if (node.isEmpty()) {
                throw problem(map.line(), id + " has no 'bias'", hint);
            }
            if (node.get() instanceof YamlNode.Scalar) {
                String word = ((YamlNode.Scalar) node.get()).text().strip();
                if (word.equals("auto")) {
                    return new Bias.Auto();
                }
                throw problem(node.get().line(), id + ": bias '" + word + "' is not known."
                        + Spelling.didYouMean(word, List.of("auto")), hint);
            }
            if (!(node.get() instanceof YamlNode.Mapping)) {
                throw problem(node.get().line(), id + ": bias is " + node.get().kind(), hint);
            }
            YamlNode.Mapping given = (YamlNode.Mapping) node.get();
            for (YamlNode.Entry e : given.entries()) {
                if (!e.key().equals(currentKey)) {
                    String other = currentKey.equals("ic") ? "id" : "ic";
                    String why = e.key().equals(other)
                            ? " '" + other + "' is for " + (other.equals("ic") ? "BJTs" : "MOSFETs") + "."
                            : Spelling.didYouMean(e.key(), List.of(currentKey));
                    throw problem(e.line(), id + ": unknown bias key '" + e.key() + "'." + why, hint);
                }
            }
            YamlNode.Entry current = required(given, currentKey, id + "'s bias", hint);
            double amps = positive(current.value(), Quantity.AMPS, id + ": " + currentKey, "1.1m (a magnitude)");
            if (amps > 1) {
                warn(current.value().line(), id + ": a bias current over 1 A is unusual; accepted as given");
            }
            return new Bias.Given(amps);
        }

        private Map<String, String> terminals(String id, YamlNode.Entry entry, List<String> required,
                                              List<String> optional, String kind) throws InputProblem {
            List<String> all = new ArrayList<>(required);
            all.addAll(optional);
            String example = kind.endsWith("mos") ? "{d: drain, g: gate, s: source}" : "{c: collector, b: base, e: emitter}";
            YamlNode.Mapping map = mapping(entry.value(), id + ": " + kind, "write its terminals as '" + kind + ": "
                    + example + "'");
            Map<String, String> terminals = new LinkedHashMap<>();
            for (YamlNode.Entry terminal : map.entries()) {
                if (!all.contains(terminal.key())) {
                    throw problem(terminal.line(), id + ": '" + terminal.key() + "' is not a terminal of " + withArticle(kind)
                            + "." + Spelling.didYouMean(terminal.key(), all),
                            withArticle(kind) + " has terminals " + String.join(", ", all) + ", as in '" + kind + ": "
                                    + example + "'");
                }
                String node = nodeName(terminal.value(), id + " terminal " + terminal.key());
                terminals.put(terminal.key(), node);
                use(node, id, terminal.value().line());
            }
            for (String key : required) {
                if (!terminals.containsKey(key)) {
                    throw problem(entry.line(), id + ": the " + kind + " has no '" + key + "' terminal",
                            "give every terminal, as in '" + kind + ": " + example + "'");
                }
            }
            return terminals;
        }

        private NodePair between(String id, YamlNode.Entry entry, YamlNode.Mapping map) throws InputProblem {
            Optional<YamlNode.Entry> betweenEntry = map.entry("between");
            String hint = "give its two nodes, as in 'between: [a, b]'";
            if (betweenEntry.isEmpty()) {
                throw problem(entry.line(), id + " has no 'between'", hint);
            }
            YamlNode value = betweenEntry.get().value();
            if (!(value instanceof YamlNode.Sequence) || ((YamlNode.Sequence) value).items().size() != 2) {
                throw problem(value.line(), id + ": 'between' must list exactly two nodes", hint);
            }
            List<YamlNode> items = ((YamlNode.Sequence) value).items();
            String a = nodeName(items.get(0), id + " terminal");
            String b = nodeName(items.get(1), id + " terminal");
            if (a.equals(b)) {
                throw problem(value.line(), id + ": both ends are on node '" + a + "'",
                        "a part between one node and itself does nothing; check the node names");
            }
            use(a, id, items.get(0).line());
            use(b, id, items.get(1).line());
            return new NodePair(a, b);
        }

        private Tolerance tolerance(YamlNode node, String what) throws InputProblem {
            String text = text(node, what);
            String hint = "write a symmetric tolerance as '5%' or an asymmetric one as '-20%/+80%'";
            Matcher symmetric = SYMMETRIC.matcher(text);
            Matcher asymmetric = ASYMMETRIC.matcher(text);
            double lower;
            double upper;
            if (symmetric.matches()) {
                upper = Double.parseDouble(symmetric.group(1)) / 100;
                lower = -upper;
            } else if (asymmetric.matches()) {
                double first = (asymmetric.group(1).equals("-") ? -1 : 1) * Double.parseDouble(asymmetric.group(2)) / 100;
                double second = (asymmetric.group(3).equals("-") ? -1 : 1) * Double.parseDouble(asymmetric.group(4)) / 100;
                lower = Math.min(first, second);
                upper = Math.max(first, second);
            } else {
                throw problem(node.line(), what + " '" + text + "' is not a tolerance", hint);
            }
            if (!(lower > -1)) {
                throw problem(node.line(), what + " '" + text + "' reaches -100% or below, which would allow zero",
                        "a tolerance below the nominal must be under 100%, such as '-20%/+80%'");
            }
            if (upper > 1) {
                warn(node.line(), what + " '" + text + "' allows more than +100%; accepted as given");
            }
            return new Tolerance(lower, upper);
        }

        // ---- nodes

        private void use(String node, String where, int line) {
            partUses.computeIfAbsent(node, k -> new ArrayList<>()).add(new NodeUse(where, line));
        }

        private void checkNodes(String ground, YamlNode.Entry groundEntry, List<Supply> supplies, StageInput input,
                                StageOutput output) throws InputProblem {
            List<String> partNodes = new ArrayList<>(partUses.keySet());
            requireConnected(ground, "ground node", groundEntry.value().line(), partNodes,
                    "name the node your parts use as ground");
            for (Supply supply : supplies) {
                requireConnected(supply.node(), "supply", supply.line(), partNodes,
                        "use the rail's name in the parts, or remove it from 'supplies'");
            }
            requireConnected(input.node(), "input node", input.line(), partNodes,
                    "name the node the generator drives, one that a part connects to");
            requireConnected(output.node(), "output node", output.line(), partNodes,
                    "name the node whose voltage is the output, one that a part connects to");
            if (input.node().equals(output.node())) {
                throw problem(output.line(), "the output node is the input node '" + input.node() + "'",
                        "name the node whose voltage is the stage's output");
            }
            for (Supply supply : supplies) {
                if (supply.node().equals(input.node()) || supply.node().equals(output.node())) {
                    String which = supply.node().equals(input.node()) ? "input" : "output";
                    throw problem(supply.line(), "the " + which + " node '" + supply.node() + "' is a supply rail",
                            "a rail is AC ground; the " + which + " must be a signal node");
                }
            }
            if (input.node().equals(ground) || output.node().equals(ground)) {
                String which = input.node().equals(ground) ? "input" : "output";
                throw problem(which.equals("input") ? input.line() : output.line(),
                        "the " + which + " node is the ground node", "name a signal node");
            }
            for (Map.Entry<String, List<NodeUse>> entry : partUses.entrySet()) {
                String node = entry.getKey();
                List<NodeUse> uses = entry.getValue();
                int count = uses.size();
                if (node.equals(ground) || node.equals(input.node()) || node.equals(output.node())) {
                    count++;
                }
                for (Supply supply : supplies) {
                    if (supply.node().equals(node)) {
                        count++;
                    }
                }
                if (count == 1) {
                    List<String> others = new ArrayList<>(partNodes);
                    others.remove(node);
                    Optional<String> close = Spelling.closest(node, others);
                    NodeUse only = uses.get(0);
                    throw problem(only.line(), "node '" + node + "' is named only once (by " + only.where()
                            + "), so nothing else connects to it" + close.map(s -> "; is it a typo for '" + s + "'?")
                                    .orElse(""),
                            close.isPresent() ? "correct the node name, or connect '" + node + "' to the rest of the stage"
                                    : "connect '" + node + "' to the rest of the stage, or correct the name");
                }
            }
        }

        private void requireConnected(String node, String what, int line, List<String> partNodes, String hint)
                throws InputProblem {
            if (!partUses.containsKey(node)) {
                throw problem(line, what + " '" + node + "' is not connected to any part."
                        + Spelling.didYouMean(node, partNodes), hint);
            }
        }

        // ---- scalars and values

        private double value(YamlNode node, Quantity quantity, String what, String example) throws InputProblem {
            return parse(text(node, what), quantity, node.line(), what, example);
        }

        private double positive(YamlNode node, Quantity quantity, String what, String example) throws InputProblem {
            double value = value(node, quantity, what, example);
            if (!(value > 0)) {
                throw problem(node.line(), what + " must be positive, but is " + number(value),
                        "give a positive value, such as " + example);
            }
            return value;
        }

        private double parse(String text, Quantity quantity, int line, String what, String example)
                throws InputProblem {
            try {
                if (quantity == Quantity.FARADS) {
                    return capacitance(text, line, what);
                }
                return EngineeringValue.parse(text, quantity);
            } catch (IllegalArgumentException e) {
                if (quantity == Quantity.FARADS) {
                    throw problem(line, what + ": " + e.getMessage(), "write the value with an SI prefix, such as " + example
                            + ", or with the unit F when farads are meant");
                }
                String unit = quantity.symbol().isEmpty() ? "" : " (unit " + quantity.symbol() + " optional)";
                throw problem(line, what + ": " + e.getMessage(), "write a number in engineering notation, such as "
                        + example + unit);
            }
        }

        /** A capacitance must say its scale (EngineeringValue.capacitance); milli is read as written, with a warning. */
        private double capacitance(String text, int line, String what) {
            EngineeringValue.Written written = EngineeringValue.capacitance(text);
            if (written.milli()) {
                warn(line, what + ": '" + text + "' is read as " + EngineeringValue.format(written.value(), "F")
                        + " (m is milli, 1 mF = 1000 µF); if microfarads are meant, write u or µ");
            }
            return written.value();
        }

        private String text(YamlNode node, String what) throws InputProblem {
            if (!(node instanceof YamlNode.Scalar)) {
                throw problem(node.line(), what + " should be a single value, but is " + node.kind(),
                        "write one value after the ':'");
            }
            String text = ((YamlNode.Scalar) node).text().strip();
            if (text.isEmpty()) {
                throw problem(node.line(), what + " has no value", "write a value after the ':'");
            }
            return text;
        }

        private String nodeName(YamlNode node, String what) throws InputProblem {
            return text(node, what);
        }

        private YamlNode.Mapping mapping(YamlNode node, String what, String hint) throws InputProblem {
            if (!(node instanceof YamlNode.Mapping)) {
                throw problem(node.line(), what + " should be a map of keys, but is " + node.kind(), hint);
            }
            return (YamlNode.Mapping) node;
        }

        private YamlNode.Entry required(YamlNode.Mapping map, String key, String where, String hint)
                throws InputProblem {
            Optional<YamlNode.Entry> entry = map.entry(key);
            if (entry.isEmpty()) {
                throw problem(map.line(), where + " has no '" + key + "'", hint);
            }
            return entry.get();
        }

        private void checkKeys(YamlNode.Mapping map, List<String> allowed, String where) throws InputProblem {
            for (YamlNode.Entry entry : map.entries()) {
                if (!allowed.contains(entry.key())) {
                    throw problem(entry.line(), "unknown key '" + entry.key() + "' in " + where + "."
                                    + Spelling.didYouMean(entry.key(), allowed),
                            where + " takes: " + String.join(", ", allowed));
                }
            }
        }

        private void checkPartKeys(String id, YamlNode.Mapping map, List<String> allowed, String kind)
                throws InputProblem {
            for (YamlNode.Entry entry : map.entries()) {
                String key = entry.key();
                if (allowed.contains(key)) {
                    continue;
                }
                String owner = ownerOf(key);
                String message = id + ": unknown key '" + key + "' for " + withArticle(kind) + ".";
                Optional<String> close = Spelling.closest(key, allowed);
                if (close.isPresent()) {
                    message += " Did you mean '" + close.get() + "'?";
                } else if (!owner.isEmpty()) {
                    message += " '" + key + "' belongs to " + owner + ".";
                }
                throw problem(entry.line(), message, withArticle(kind) + " takes: " + String.join(", ", allowed));
            }
        }

        /** @return "an npn", "an nmos", "a pnp", "a resistor": as the words are spoken */
        private static String withArticle(String kind) {
            return (kind.equals("npn") || kind.equals("nmos") ? "an " : "a ") + kind;
        }

        private static String ownerOf(String key) {
            if (KINDS.contains(key)) {
                return "the part kind, and a part has only one";
            }
            if (BJT_KEYS.contains(key) && !MOSFET_KEYS.contains(key)) {
                return "npn and pnp transistors";
            }
            if (MOSFET_KEYS.contains(key) && !BJT_KEYS.contains(key)) {
                return "nmos and pmos transistors";
            }
            if (CAPACITOR_KEYS.contains(key) && !RESISTOR_KEYS.contains(key)) {
                return "capacitors";
            }
            if (RESISTOR_KEYS.contains(key)) {
                return "resistors and capacitors";
            }
            return "";
        }

        private void plausibleResistance(int line, String what, double ohms) {
            if (ohms < 1 || ohms > 1e9) {
                warn(line, what + ": " + EngineeringValue.format(ohms, "Ω") + " is outside 1 Ω to 1 GΩ, unusual"
                        + " for a part; check the prefix (M is mega, m is milli); accepted as given");
            }
        }

        private void warn(int line, String message) {
            warnings.add(new InputWarning(file, line, message));
        }

        private InputProblem problem(int line, String message, String hint) {
            return new InputProblem(file, line, message, hint);
        }

        private static String number(double value) {
            return new java.math.BigDecimal(value).round(new java.math.MathContext(4)).stripTrailingZeros()
                    .toPlainString();
        }
    }
}

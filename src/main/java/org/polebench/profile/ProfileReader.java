package org.polebench.profile;

import java.io.Reader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.function.Function;
import com.google.re2j.Pattern;
import com.google.re2j.PatternSyntaxException;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import org.polebench.units.StrictNumber;
import org.polebench.yaml.YamlNode;
import org.polebench.yaml.YamlReader;

/**
 * Reads an instrument profile ({@code instrument-profiles/*.yaml}, this project's own format,
 * described in docs/user-guide.md, "Instrument profiles"). Unknown keys are refused, so that a misspelt option never
 * silently does nothing; every problem names the file and line.
 */
public final class ProfileReader {
    private static final Set<String> TABLE_KEYS = Set.of("kind", "name", "description", "layout", "columns", "units",
            "accuracy", "limits", "bench");
    private static final Set<String> SCPI_KEYS = Set.of("kind", "name", "description", "instruments", "setup", "step", "finish",
            "settle", "error-query", "retries", "timeout-ms", "amplitude", "max-amplitude", "units", "accuracy",
            "limits", "bench");
    private static final Set<String> STREAM_KEYS = Set.of("kind", "name", "description", "port", "identify", "start",
            "stop", "point", "ignore", "error", "end", "timeout-ms", "amplitude", "max-amplitude", "units",
            "accuracy", "limits", "bench");

    private static final Set<String> SCOPE_KEYS = Set.of("kind", "name", "description", "instruments", "setup",
            "set-frequency", "fetch", "finish", "settle", "retries", "timeout-ms", "amplitude", "max-amplitude", "units",
            "accuracy", "limits", "bench");
    private static final Set<String> WAVEFORM_KEYS = Set.of("kind", "name", "description", "detect", "layout", "time",
            "channels", "samples", "frequency", "accuracy", "bench");

    private final YamlReader yaml = new YamlReader();

    public InstrumentProfile read(Path file) throws InputProblem {
        return fromTree(file, yaml.read(file));
    }

    /** @param file named in errors and kept as the profile's source; the text comes from the reader */
    public InstrumentProfile read(Path file, Reader text) throws InputProblem {
        return fromTree(file, yaml.read(file, text));
    }

    private InstrumentProfile fromTree(Path file, YamlNode root) throws InputProblem {
        Doc doc = new Doc(file);
        YamlNode.Mapping top = doc.mapping(root, "the profile");
        String kind = doc.text(top, "kind");
        switch (kind) {
            case "table":
                doc.onlyKeys(top, TABLE_KEYS);
                return table(doc, top);
            case "serial-scpi":
                doc.onlyKeys(top, SCPI_KEYS);
                return scpi(doc, top);
            case "serial-stream":
                doc.onlyKeys(top, STREAM_KEYS);
                return stream(doc, top);
            case "serial-scope":
                doc.onlyKeys(top, SCOPE_KEYS);
                return scope(doc, top);
            case "waveform":
                doc.onlyKeys(top, WAVEFORM_KEYS);
                return waveform(doc, top);
            default:
                throw new InputProblem(file, top.entry("kind").orElseThrow().line(),
                        "unknown profile kind '" + kind + "'", "use table, serial-scpi, serial-stream, serial-scope or waveform");
        }
    }

    private TableProfile table(Doc doc, YamlNode.Mapping top) throws InputProblem {
        String name = doc.name(top);
        YamlNode.Mapping layoutNode = doc.optionalMapping(top, "layout");
        doc.onlyKeys(layoutNode, Set.of("delimiter", "decimal-mark", "encoding", "preamble-lines", "comment-prefixes",
                "header"));
        Delimiter delimiter = doc.choice(layoutNode, "delimiter", Delimiter::parse, Delimiter.COMMA,
                "comma, semicolon, tab or spaces");
        String mark = doc.textOr(layoutNode, "decimal-mark", "point");
        if (!mark.equals("point") && !mark.equals("comma")) {
            throw doc.problem(layoutNode, "decimal-mark", "decimal-mark '" + mark + "' is neither point nor comma",
                    "write point or comma");
        }
        boolean decimalComma = mark.equals("comma");
        if (decimalComma && delimiter == Delimiter.COMMA) {
            throw doc.problem(layoutNode, "decimal-mark", "a comma cannot be both the delimiter and the decimal mark",
                    "use delimiter: semicolon (usual with a decimal comma) or decimal-mark: point");
        }
        TextEncoding encoding = doc.choice(layoutNode, "encoding", TextEncoding::parse, TextEncoding.UTF_8,
                "utf-8 or latin-1");
        int preamble = doc.integer(layoutNode, "preamble-lines", 0, 0, 10_000);
        List<String> comments = doc.texts(layoutNode, "comment-prefixes", List.of("#"));
        boolean header = doc.bool(layoutNode, "header", true);
        TableLayout layout = new TableLayout(delimiter, decimalComma, encoding, preamble, comments, header);

        ReadingScale scale = units(doc, top, false);
        YamlNode.Mapping columnsNode = doc.requiredMapping(top, "columns");
        doc.onlyKeys(columnsNode, Set.of("frequency", "gain", "input-amplitude", "output-amplitude", "phase",
                "gain-uncertainty", "phase-uncertainty"));
        ColumnRef frequency = doc.column(columnsNode, "frequency").orElseThrow(() ->
                doc.problemAt(columnsNode.line(), "no frequency column", "add 'frequency: <header name or number>'"));
        Optional<ColumnRef> gain = doc.column(columnsNode, "gain");
        Optional<ColumnRef> input = doc.column(columnsNode, "input-amplitude");
        Optional<ColumnRef> output = doc.column(columnsNode, "output-amplitude");
        boolean amplitudes = scale.gainForm() == GainForm.AMPLITUDES;
        if (amplitudes && (gain.isPresent() || input.isEmpty() || output.isEmpty())) {
            throw doc.problemAt(columnsNode.line(), "units say gain: amplitudes, so the columns need input-amplitude "
                    + "and output-amplitude and no gain", "fix the columns or the units");
        }
        if (!amplitudes && (gain.isEmpty() || input.isPresent() || output.isPresent())) {
            throw doc.problemAt(columnsNode.line(), "units say gain: " + scale.gainForm().word()
                    + ", so the columns need one gain column and no amplitudes", "fix the columns or the units");
        }
        Optional<ColumnRef> phase = doc.column(columnsNode, "phase");
        TableColumns columns = new TableColumns(frequency, gain, input, output, phase,
                doc.column(columnsNode, "gain-uncertainty"), doc.column(columnsNode, "phase-uncertainty"));
        if (!header) {
            for (Optional<ColumnRef> c : List.of(Optional.of(frequency), gain, input, output, phase)) {
                if (c.isPresent() && !c.get().byNumber()) {
                    throw doc.problemAt(columnsNode.line(), "layout says header: false, so columns must be numbers",
                            "give each column as its 1-based number");
                }
            }
        }
        return new TableProfile(name, doc.description(top), layout, columns, scale, accuracy(doc, top),
                limits(doc, top), Optional.ofNullable(doc.file), bench(doc, top));
    }

    /** A {@code kind: waveform} profile (docs/user-guide.md, "Scope waveform records"). */
    private WaveformProfile waveform(Doc doc, YamlNode.Mapping top) throws InputProblem {
        String name = doc.name(top);
        YamlNode.Mapping layoutNode = doc.optionalMapping(top, "layout");
        doc.onlyKeys(layoutNode, Set.of("delimiter", "decimal-mark", "header-lines", "comment-prefixes", "files"));
        Delimiter delimiter = doc.choice(layoutNode, "delimiter", Delimiter::parse, Delimiter.COMMA,
                "comma, semicolon, tab or spaces");
        String mark = doc.textOr(layoutNode, "decimal-mark", "point");
        if (!mark.equals("point") && !mark.equals("comma")) {
            throw doc.problem(layoutNode, "decimal-mark", "decimal-mark '" + mark + "' is neither point nor comma",
                    "write point or comma");
        }
        if (mark.equals("comma") && delimiter == Delimiter.COMMA) {
            throw doc.problem(layoutNode, "decimal-mark", "a comma cannot be both the delimiter and the decimal mark",
                    "use delimiter: semicolon (usual with a decimal comma) or decimal-mark: point");
        }
        WaveformLayout layout = new WaveformLayout(delimiter, mark.equals("comma"),
                doc.integer(layoutNode, "header-lines", 0, 0, 10_000), doc.texts(layoutNode, "comment-prefixes",
                List.of("#")), doc.textOr(layoutNode, "files", "*.csv"));

        YamlNode.Mapping timeNode = doc.requiredMapping(top, "time");
        doc.onlyKeys(timeNode, Set.of("column", "interval-line"));
        if (timeNode.get("column").isPresent() == timeNode.get("interval-line").isPresent()) {
            throw doc.problemAt(timeNode.line(), "time needs either a column or an interval-line",
                    "write column: 1 (times in seconds) or interval-line: '<regex with (?<seconds>...)>'");
        }
        SampleClock clock;
        if (timeNode.get("column").isPresent()) {
            clock = SampleClock.column(doc.integer(timeNode, "column", 1, 1, 10_000));
        } else {
            clock = SampleClock.intervalLine(doc.group(timeNode, "interval-line", "seconds"));
        }

        YamlNode.Mapping channelsNode = doc.requiredMapping(top, "channels");
        doc.onlyKeys(channelsNode, Set.of("input", "output"));
        if (channelsNode.get("input").isEmpty() || channelsNode.get("output").isEmpty()) {
            throw doc.problemAt(channelsNode.line(), "channels needs both input and output",
                    "give each as its 1-based column number, such as input: 2, output: 3");
        }
        int input = doc.integer(channelsNode, "input", 2, 1, 10_000);
        int output = doc.integer(channelsNode, "output", 3, 1, 10_000);
        if (input == output || clock.timeColumn().orElse(-1) == input || clock.timeColumn().orElse(-1) == output) {
            throw doc.problemAt(channelsNode.line(), "the time, input and output columns must differ",
                    "give each its own column number");
        }

        SampleCoding coding = samples(doc, doc.optionalMapping(top, "samples"));

        YamlNode.Mapping frequencyNode = doc.optionalMapping(top, "frequency");
        doc.onlyKeys(frequencyNode, Set.of("from", "pattern"));
        FrequencySource.From from = doc.choice(frequencyNode, "from", FrequencySource.From::parse,
                FrequencySource.From.ESTIMATED, "header, file-name or estimated");
        FrequencySource frequency;
        if (from == FrequencySource.From.ESTIMATED) {
            if (frequencyNode.get("pattern").isPresent()) {
                throw doc.problem(frequencyNode, "pattern", "an estimated frequency takes no pattern",
                        "drop the pattern or say from: header or from: file-name");
            }
            frequency = FrequencySource.estimated();
        } else {
            if (frequencyNode.get("pattern").isEmpty()) {
                throw doc.problemAt(frequencyNode.line(), "from: " + from.word() + " needs a pattern",
                        "add pattern: '<regex with (?<hz>...)>', such as '(?<hz>[0-9.]+) ?Hz'");
            }
            frequency = new FrequencySource(from, Optional.of(doc.group(frequencyNode, "pattern", "hz")));
        }
        Optional<Pattern> signature = doc.pattern(top, "detect");
        return new WaveformProfile(name, doc.description(top), layout, clock, new WaveformChannels(input, output),
                coding, frequency, signature, accuracy(doc, top), Optional.ofNullable(doc.file), bench(doc, top));
    }

    private SampleCoding samples(Doc doc, YamlNode.Mapping node) throws InputProblem {
        doc.onlyKeys(node, Set.of("unit", "range", "volts-per-code", "zero-code", "rails"));
        String unit = doc.textOr(node, "unit", "volts");
        if (unit.equals("volts")) {
            for (String key : List.of("volts-per-code", "zero-code", "rails")) {
                if (node.get(key).isPresent()) {
                    throw doc.problem(node, key, key + " applies to unit: codes", "drop it or say unit: codes");
                }
            }
            OptionalDouble range = node.get("range").isPresent()
                    ? OptionalDouble.of(doc.positive(node, "range", doc.engineering(node, "range", Quantity.VOLTS)))
                    : OptionalDouble.empty();
            return SampleCoding.volts(range);
        }
        if (!unit.equals("codes")) {
            throw doc.problem(node, "unit", "unit '" + unit + "' is neither volts nor codes", "write volts or codes");
        }
        if (node.get("range").isPresent()) {
            throw doc.problem(node, "range", "ADC codes take their range from the rails", "give rails: [low, high]");
        }
        if (node.get("volts-per-code").isEmpty()) {
            throw doc.problemAt(node.line(), "unit: codes needs volts-per-code", "add volts-per-code: such as 1.22 mV");
        }
        double scale = doc.positive(node, "volts-per-code", doc.engineering(node, "volts-per-code", Quantity.VOLTS));
        double zero = doc.number(node, "zero-code", 0);
        OptionalDouble low = OptionalDouble.empty();
        OptionalDouble high = OptionalDouble.empty();
        if (node.get("rails").isPresent()) {
            List<String> rails = doc.texts(node, "rails", List.of());
            double lowCode = rails.size() == 2 ? StrictNumber.parse(rails.get(0), false) : Double.NaN;
            double highCode = rails.size() == 2 ? StrictNumber.parse(rails.get(1), false) : Double.NaN;
            if (!(lowCode < highCode) || !Double.isFinite(lowCode) || !Double.isFinite(highCode)) {
                throw doc.problem(node, "rails", "rails must be two codes, the lowest then the highest",
                        "such as rails: [0, 4095] for a 12-bit converter");
            }
            low = OptionalDouble.of(lowCode);
            high = OptionalDouble.of(highCode);
        }
        return new SampleCoding(true, scale, zero, low, high, OptionalDouble.empty());
    }

    private List<LineProtocol.ScpiInstrument> instruments(Doc doc, YamlNode.Mapping top) throws InputProblem {
        YamlNode.Mapping instrumentsNode = doc.requiredMapping(top, "instruments");
        List<LineProtocol.ScpiInstrument> instruments = new ArrayList<>();
        for (YamlNode.Entry entry : instrumentsNode.entries()) {
            YamlNode.Mapping one = doc.mapping(entry.value(), "instrument " + entry.key());
            doc.onlyKeys(one, Set.of("port", "identify"));
            instruments.add(new LineProtocol.ScpiInstrument(entry.key(), port(doc, doc.requiredMapping(one, "port")),
                    doc.textOr(one, "identify", "*IDN?")));
        }
        if (instruments.isEmpty()) {
            throw doc.problemAt(instrumentsNode.line(), "no instruments", "name at least one instrument with its port");
        }
        return instruments;
    }

    private SerialProfile scpi(Doc doc, YamlNode.Mapping top) throws InputProblem {
        String name = doc.name(top);
        List<LineProtocol.ScpiInstrument> instruments = instruments(doc, top);
        String errorQuery = doc.textOr(top, "error-query", "SYST:ERR?");
        List<ScpiCommand> setup = commands(doc, top, "setup", instruments, errorQuery, false);
        List<ScpiCommand> step = commands(doc, top, "step", instruments, errorQuery, true);
        List<ScpiCommand> finish = commands(doc, top, "finish", instruments, errorQuery, false);
        ReadingScale scale = units(doc, top, true);
        boolean readsGain = step.stream().anyMatch(c -> c.role() == CommandRole.READS_GAIN);
        boolean readsIn = step.stream().anyMatch(c -> c.role() == CommandRole.READS_INPUT_AMPLITUDE);
        boolean readsOut = step.stream().anyMatch(c -> c.role() == CommandRole.READS_OUTPUT_AMPLITUDE);
        int stepLine = top.entry("step").orElseThrow().line();
        if (step.stream().noneMatch(c -> c.role() == CommandRole.SETS_FREQUENCY)) {
            // found by the command-line fuzzer: LineProtocol refused it as a broken precondition (exit 70)
            throw doc.problemAt(stepLine, "no step command sets the frequency",
                    "give one step command with the " + ScpiCommand.FREQUENCY + " placeholder, such as 'FREQ "
                            + ScpiCommand.FREQUENCY + "'");
        }
        if (readsGain == (readsIn || readsOut) || readsIn != readsOut) {
            throw doc.problemAt(stepLine, "a step reads either the gain or both amplitudes",
                    "give one reads-gain command, or one reads-input-amplitude and one reads-output-amplitude");
        }
        if ((scale.gainForm() == GainForm.AMPLITUDES) != readsIn) {
            throw doc.problemAt(stepLine, "the step's readings and units.gain (" + scale.gainForm().word() + ") disagree",
                    "use gain: amplitudes with two amplitude readings, dB or ratio with reads-gain");
        }
        YamlNode.Mapping settleNode = doc.optionalMapping(top, "settle");
        doc.onlyKeys(settleNode, Set.of("periods", "min-ms"));
        LineProtocol.Settling settle = new LineProtocol.Settling(doc.integer(settleNode, "periods", 0, 0, 1_000_000),
                doc.integer(settleNode, "min-ms", 0, 0, 600_000));
        double amplitude = doc.volts(top, "amplitude", scale.amplitudeKind(), OptionalDouble.empty());
        double max = doc.volts(top, "max-amplitude", scale.amplitudeKind(), OptionalDouble.of(amplitude));
        if (amplitude > max) {
            throw doc.problem(top, "amplitude", "the amplitude is above max-amplitude", "lower it or raise the maximum");
        }
        LineProtocol protocol = new LineProtocol.ScpiExchange(instruments, setup, step, finish, settle, errorQuery,
                doc.integer(top, "retries", 2, 0, 100), doc.integer(top, "timeout-ms", 2000, 1, 600_000),
                amplitude, max);
        return new SerialProfile(name, doc.description(top), protocol, scale, accuracy(doc, top), limits(doc, top),
                Optional.ofNullable(doc.file), bench(doc, top));
    }

    /**
     * A {@code kind: serial-scope} profile: a generator and a two-channel scope whose records are
     * fetched and fitted per frequency (docs/user-guide.md, "Live scope capture").
     */
    private SerialProfile scope(Doc doc, YamlNode.Mapping top) throws InputProblem {
        String name = doc.name(top);
        List<LineProtocol.ScpiInstrument> instruments = instruments(doc, top);
        List<ScpiCommand> setup = commands(doc, top, "setup", instruments, "SYST:ERR?", false);
        List<ScpiCommand> finish = commands(doc, top, "finish", instruments, "SYST:ERR?", false);
        YamlNode.Mapping setNode = doc.requiredMapping(top, "set-frequency");
        LineProtocol.ScopeQuery set = query(doc, setNode, instruments);
        if (!set.query().contains(ScpiCommand.FREQUENCY)) {
            throw doc.problem(setNode, "send", "the frequency command has no " + ScpiCommand.FREQUENCY,
                    "write it as 'FREQ " + ScpiCommand.FREQUENCY + "'");
        }
        ScpiCommand setFrequency = new ScpiCommand(set.instrument(), set.query(), CommandRole.SETS_FREQUENCY);
        YamlNode.Mapping fetch = doc.requiredMapping(top, "fetch");
        doc.onlyKeys(fetch, Set.of("interval", "input", "output", "input-scale", "output-scale", "format",
                "coding", "samples"));
        LineProtocol.ScopeQuery interval = query(doc, doc.requiredMapping(fetch, "interval"), instruments);
        LineProtocol.ScopeQuery input = query(doc, doc.requiredMapping(fetch, "input"), instruments);
        LineProtocol.ScopeQuery output = query(doc, doc.requiredMapping(fetch, "output"), instruments);
        Optional<LineProtocol.ScopeQuery> inputScale = Optional.empty();
        Optional<LineProtocol.ScopeQuery> outputScale = Optional.empty();
        if (fetch.get("input-scale").isPresent() || fetch.get("output-scale").isPresent()) {
            inputScale = Optional.of(query(doc, doc.requiredMapping(fetch, "input-scale"), instruments));
            outputScale = Optional.of(query(doc, doc.requiredMapping(fetch, "output-scale"), instruments));
        }
        LineProtocol.WaveformFormat format = doc.choice(fetch, "format", text -> {
            for (LineProtocol.WaveformFormat f : LineProtocol.WaveformFormat.values()) {
                if (f.word().equals(text.strip().toLowerCase(java.util.Locale.ROOT))) {
                    return Optional.of(f);
                }
            }
            return Optional.empty();
        }, LineProtocol.WaveformFormat.ASCII, "ascii or block");
        BlockCoding blockCoding = doc.choice(fetch, "coding", BlockCoding::parse, BlockCoding.INT8,
                "int8, int16-big-endian or int16-little-endian");
        if (format == LineProtocol.WaveformFormat.ASCII && fetch.get("coding").isPresent()) {
            throw doc.problem(fetch, "coding", "coding applies to format: block", "drop it or say format: block");
        }
        YamlNode.Mapping samplesNode = doc.optionalMapping(fetch, "samples");
        SampleCoding coding = samples(doc, samplesNode);
        if (format == LineProtocol.WaveformFormat.BLOCK) {
            if (!coding.codes() && inputScale.isEmpty()) {
                throw doc.problem(fetch, "format", "a block holds codes: its samples need unit: codes and "
                        + "volts-per-code, or scale queries", "add samples: {unit: codes, volts-per-code: 10 mV}, or input-scale "
                        + "and output-scale queries");
            }
            if (!coding.codes()) {
                coding = new SampleCoding(true, 1, 0, OptionalDouble.empty(), OptionalDouble.empty(),
                        OptionalDouble.empty());
            }
            if (coding.lowRail().isEmpty()) {
                // a block's codes cannot leave the coding's range: its ends are the rails
                coding = new SampleCoding(true, coding.voltsPerCode(), coding.zeroCode(),
                        OptionalDouble.of(blockCoding.lowestCode()), OptionalDouble.of(blockCoding.highestCode()),
                        OptionalDouble.empty());
            }
        }
        ReadingScale scale = units(doc, top, false);
        YamlNode.Mapping settleNode = doc.optionalMapping(top, "settle");
        doc.onlyKeys(settleNode, Set.of("periods", "min-ms"));
        LineProtocol.Settling settle = new LineProtocol.Settling(doc.integer(settleNode, "periods", 0, 0, 1_000_000),
                doc.integer(settleNode, "min-ms", 0, 0, 600_000));
        double amplitude = doc.volts(top, "amplitude", scale.amplitudeKind(), OptionalDouble.empty());
        double max = doc.volts(top, "max-amplitude", scale.amplitudeKind(), OptionalDouble.of(amplitude));
        if (amplitude > max) {
            throw doc.problem(top, "amplitude", "the amplitude is above max-amplitude", "lower it or raise the maximum");
        }
        LineProtocol protocol = new LineProtocol.ScopeFetch(instruments, setup, setFrequency, interval, input, output,
                inputScale, outputScale, format, blockCoding, coding, finish, settle, doc.integer(top, "retries", 2, 0, 100),
                doc.integer(top, "timeout-ms", 5000, 1, 600_000), amplitude, max);
        return new SerialProfile(name, doc.description(top), protocol, scale, accuracy(doc, top), limits(doc, top),
                Optional.ofNullable(doc.file), bench(doc, top));
    }

    private LineProtocol.ScopeQuery query(Doc doc, YamlNode.Mapping node, List<LineProtocol.ScpiInstrument> instruments)
            throws InputProblem {
        doc.onlyKeys(node, Set.of("to", "send"));
        String to = doc.textOr(node, "to", instruments.get(0).name());
        if (instruments.stream().noneMatch(i -> i.name().equals(to))) {
            throw doc.problem(node, "to", "no instrument named '" + to + "'", "use one named under instruments");
        }
        return new LineProtocol.ScopeQuery(to, doc.text(node, "send"));
    }

    private List<ScpiCommand> commands(Doc doc, YamlNode.Mapping top, String key,
                                       List<LineProtocol.ScpiInstrument> instruments, String errorQuery,
                                       boolean required) throws InputProblem {
        Optional<YamlNode> node = top.get(key);
        if (node.isEmpty()) {
            if (required) {
                throw doc.problemAt(top.line(), "no " + key + " commands", "list them under '" + key + ":'");
            }
            return List.of();
        }
        if (!(node.get() instanceof YamlNode.Sequence)) {
            throw doc.problemAt(node.get().line(), key + " must be a list of commands", "write one '- {to: …, send: …}' per command");
        }
        List<ScpiCommand> commands = new ArrayList<>();
        for (YamlNode item : ((YamlNode.Sequence) node.get()).items()) {
            YamlNode.Mapping command = doc.mapping(item, "a command");
            doc.onlyKeys(command, Set.of("to", "send", "role"));
            String to = doc.textOr(command, "to", instruments.get(0).name());
            if (instruments.stream().noneMatch(i -> i.name().equals(to))) {
                throw doc.problem(command, "to", "no instrument named '" + to + "'", "use one named under instruments");
            }
            String send = doc.text(command, "send");
            Optional<YamlNode.Entry> roleEntry = command.entry("role");
            CommandRole role;
            if (roleEntry.isPresent()) {
                role = doc.choice(command, "role", CommandRole::parse, CommandRole.SETTING, rolesList());
            } else {
                role = impliedRole(send, errorQuery, instruments);
                if (role == null) {
                    throw doc.problemAt(command.line(), "the query '" + send + "' needs a role saying what it reads",
                            "add role: one of " + rolesList());
                }
            }
            try {
                commands.add(new ScpiCommand(to, send, role));
            } catch (IllegalArgumentException e) {
                throw doc.problemAt(command.line(), e.getMessage(), "put the placeholder in the command text");
            }
        }
        return commands;
    }

    private static CommandRole impliedRole(String send, String errorQuery, List<LineProtocol.ScpiInstrument> instruments) {
        String text = send.strip();
        if (text.contains(ScpiCommand.FREQUENCY)) {
            return CommandRole.SETS_FREQUENCY;
        }
        if (text.contains(ScpiCommand.AMPLITUDE)) {
            return CommandRole.SETS_AMPLITUDE;
        }
        if (text.equalsIgnoreCase(errorQuery)) {
            return CommandRole.READS_ERROR_QUEUE;
        }
        if (text.equalsIgnoreCase("*OPC?")) {
            return CommandRole.WAITS_FOR_COMPLETION;
        }
        if (instruments.stream().anyMatch(i -> i.identify().equalsIgnoreCase(text))) {
            return CommandRole.IDENTIFIES;
        }
        return text.endsWith("?") ? null : CommandRole.SETTING;
    }

    private static String rolesList() {
        List<String> words = new ArrayList<>();
        for (CommandRole role : CommandRole.values()) {
            words.add(role.word());
        }
        return String.join(", ", words);
    }

    private SerialProfile stream(Doc doc, YamlNode.Mapping top) throws InputProblem {
        String name = doc.name(top);
        ReadingScale scale = units(doc, top, false);
        Pattern point = doc.pattern(top, "point").orElseThrow(() ->
                doc.problemAt(top.line(), "no point pattern", "add point: a regular expression with named groups"));
        String regex = point.pattern();
        boolean amplitudes = scale.gainForm() == GainForm.AMPLITUDES;
        for (String group : amplitudes ? List.of("frequency", "input", "output") : List.of("frequency", "gain")) {
            if (!regex.contains("(?<" + group + ">")) {
                throw doc.problem(top, "point", "the point pattern has no group named " + group,
                        "write (?<" + group + ">…) around that number");
            }
        }
        List<Pattern> ignore = new ArrayList<>();
        Optional<YamlNode> ignoreNode = top.get("ignore");
        if (ignoreNode.isPresent()) {
            for (String text : doc.texts(top, "ignore", List.of())) {
                ignore.add(doc.compile(text, ignoreNode.get().line()));
            }
        }
        double amplitude = doc.volts(top, "amplitude", scale.amplitudeKind(), OptionalDouble.of(1.0));
        double max = doc.volts(top, "max-amplitude", scale.amplitudeKind(), OptionalDouble.of(amplitude));
        LineProtocol protocol = new LineProtocol.StreamedLines(port(doc, doc.requiredMapping(top, "port")),
                doc.textOr(top, "identify", ""), doc.text(top, "start"), doc.textOr(top, "stop", ""), point, ignore,
                doc.pattern(top, "error"), doc.pattern(top, "end"), doc.integer(top, "timeout-ms", 2000, 1, 600_000),
                amplitude, max);
        return new SerialProfile(name, doc.description(top), protocol, scale, accuracy(doc, top), limits(doc, top),
                Optional.ofNullable(doc.file), bench(doc, top));
    }

    private PortSettings port(Doc doc, YamlNode.Mapping node) throws InputProblem {
        doc.onlyKeys(node, Set.of("baud", "data-bits", "parity", "stop-bits", "line-ending"));
        int baud = doc.integer(node, "baud", 9600, 1, 10_000_000);
        int dataBits = doc.integer(node, "data-bits", 8, 5, 8);
        PortSettings.Parity parity = doc.choice(node, "parity", PortSettings.Parity::parse, PortSettings.Parity.NONE,
                "none, even, odd, mark or space");
        double stopBits = doc.number(node, "stop-bits", 1.0);
        if (stopBits != 1 && stopBits != 1.5 && stopBits != 2) {
            throw doc.problem(node, "stop-bits", "stop-bits must be 1, 1.5 or 2", "write 1, 1.5 or 2");
        }
        PortSettings.LineEnding ending = doc.choice(node, "line-ending", PortSettings.LineEnding::parse,
                PortSettings.LineEnding.LF, "lf, crlf or cr");
        return new PortSettings(baud, dataBits, parity, stopBits, ending);
    }

    private ReadingScale units(Doc doc, YamlNode.Mapping top, boolean gainImpliedByCommands) throws InputProblem {
        YamlNode.Mapping node = doc.optionalMapping(top, "units");
        doc.onlyKeys(node, Set.of("frequency", "gain", "amplitude", "phase", "phase-sign", "phase-wrapped"));
        FrequencyUnit frequency = doc.choice(node, "frequency", FrequencyUnit::parse, FrequencyUnit.HZ, "Hz, kHz or MHz");
        GainForm gain = doc.choice(node, "gain", GainForm::parse, GainForm.DB, "dB, ratio or amplitudes");
        AmplitudeKind amplitude = doc.choice(node, "amplitude", AmplitudeKind::parse, AmplitudeKind.RMS,
                "Vpp, Vrms or Vpk");
        if (gain == GainForm.AMPLITUDES && node.get("amplitude").isEmpty()) {
            throw doc.problemAt(node.line(), "gain: amplitudes needs the amplitude kind",
                    "add amplitude: Vpp, Vrms or Vpk (as the instrument reports both channels)");
        }
        AngleUnit phase = doc.choice(node, "phase", AngleUnit::parse, AngleUnit.DEGREES, "degrees or radians");
        PhaseSign sign = doc.choice(node, "phase-sign", PhaseSign::parse, PhaseSign.LEAD_POSITIVE,
                "lead-positive or lag-positive");
        boolean wrapped = doc.bool(node, "phase-wrapped", true);
        return new ReadingScale(frequency, gain, amplitude, phase, sign, wrapped);
    }

    /** The {@code bench:} section: the bench file's keys (docs/user-guide.md, "The bench file"). */
    private Optional<Bench> bench(Doc doc, YamlNode.Mapping top) throws InputProblem {
        Optional<YamlNode.Entry> entry = top.entry("bench");
        if (entry.isEmpty()) {
            return Optional.empty();
        }
        YamlNode.Mapping node = doc.optionalMapping(top, "bench");
        return Optional.of(new BenchReader().read(node, doc.file, "bench"));
    }

    private InstrumentAccuracy accuracy(Doc doc, YamlNode.Mapping top) throws InputProblem {
        YamlNode.Mapping node = doc.optionalMapping(top, "accuracy");
        doc.onlyKeys(node, Set.of("gain", "phase", "distribution"));
        InstrumentAccuracy.Distribution distribution = doc.choice(node, "distribution",
                InstrumentAccuracy.Distribution::parse, InstrumentAccuracy.Distribution.RECTANGULAR,
                "rectangular (a data sheet's bound) or normal (an expanded uncertainty with k = 2)");
        OptionalDouble gain = OptionalDouble.empty();
        OptionalDouble phase = OptionalDouble.empty();
        if (node.get("gain").isPresent()) {
            gain = OptionalDouble.of(doc.nonNegative(node, "gain", doc.engineering(node, "gain", Quantity.DECIBELS)));
        }
        if (node.get("phase").isPresent()) {
            phase = OptionalDouble.of(doc.nonNegative(node, "phase", doc.degrees(node, "phase")));
        }
        return new InstrumentAccuracy(gain, phase, distribution);
    }

    private ReadingLimits limits(Doc doc, YamlNode.Mapping top) throws InputProblem {
        YamlNode.Mapping node = doc.optionalMapping(top, "limits");
        doc.onlyKeys(node, Set.of("noise-floor", "amplitude-floor", "full-scale", "overload-markers"));
        OptionalDouble floor = node.get("noise-floor").isPresent()
                ? OptionalDouble.of(doc.engineering(node, "noise-floor", Quantity.DECIBELS)) : OptionalDouble.empty();
        OptionalDouble amplitudeFloor = node.get("amplitude-floor").isPresent()
                ? OptionalDouble.of(doc.engineering(node, "amplitude-floor", Quantity.VOLTS)) : OptionalDouble.empty();
        OptionalDouble fullScale = node.get("full-scale").isPresent()
                ? OptionalDouble.of(doc.engineering(node, "full-scale", Quantity.VOLTS)) : OptionalDouble.empty();
        List<String> markers = doc.texts(node, "overload-markers", ReadingLimits.USUAL_OVERLOAD_MARKERS);
        return new ReadingLimits(floor, amplitudeFloor, fullScale, markers);
    }

    /** Reading helpers bound to one file, so every problem names it. */
    private static final class Doc {
        private final Path file;

        Doc(Path file) {
            this.file = file;
        }

        InputProblem problemAt(int line, String message, String hint) {
            return new InputProblem(file, line, message, hint);
        }

        InputProblem problem(YamlNode.Mapping map, String key, String message, String hint) {
            int line = map.entry(key).map(YamlNode.Entry::line).orElse(map.line());
            return new InputProblem(file, line, message, hint);
        }

        YamlNode.Mapping mapping(YamlNode node, String what) throws InputProblem {
            if (!(node instanceof YamlNode.Mapping)) {
                throw problemAt(node.line(), what + " must be a map of keys, not " + node.kind(),
                        "write 'key: value' lines");
            }
            return (YamlNode.Mapping) node;
        }

        YamlNode.Mapping requiredMapping(YamlNode.Mapping map, String key) throws InputProblem {
            YamlNode node = map.get(key).orElseThrow(() ->
                    problemAt(map.line(), "'" + key + "' is missing", "add the '" + key + ":' section"));
            return mapping(node, "'" + key + "'");
        }

        YamlNode.Mapping optionalMapping(YamlNode.Mapping map, String key) throws InputProblem {
            Optional<YamlNode> node = map.get(key);
            return node.isEmpty() ? new YamlNode.Mapping(List.of(), map.line()) : mapping(node.get(), "'" + key + "'");
        }

        void onlyKeys(YamlNode.Mapping map, Set<String> known) throws InputProblem {
            for (YamlNode.Entry entry : map.entries()) {
                if (!known.contains(entry.key())) {
                    throw problemAt(entry.line(), "unknown key '" + entry.key() + "'",
                            "known keys here: " + String.join(", ", known.stream().sorted().toList()));
                }
            }
        }

        String text(YamlNode.Mapping map, String key) throws InputProblem {
            YamlNode node = map.get(key).orElseThrow(() ->
                    problemAt(map.line(), "'" + key + "' is missing", "add '" + key + ": …'"));
            if (!(node instanceof YamlNode.Scalar) || ((YamlNode.Scalar) node).text().isBlank()) {
                throw problem(map, key, "'" + key + "' must be a value, not " + node.kind(), "write '" + key + ": …'");
            }
            return ((YamlNode.Scalar) node).text();
        }

        String textOr(YamlNode.Mapping map, String key, String fallback) throws InputProblem {
            return map.get(key).isPresent() ? text(map, key) : fallback;
        }

        String name(YamlNode.Mapping top) throws InputProblem {
            String name = text(top, "name");
            if (!name.matches("[a-z0-9][a-z0-9.-]*")) {
                throw problem(top, "name", "profile name '" + name + "' should be lower-case words joined by hyphens",
                        "such as semicolon-decimal-comma");
            }
            return name;
        }

        String description(YamlNode.Mapping top) throws InputProblem {
            return text(top, "description").strip();
        }

        List<String> texts(YamlNode.Mapping map, String key, List<String> fallback) throws InputProblem {
            Optional<YamlNode> node = map.get(key);
            if (node.isEmpty()) {
                return fallback;
            }
            if (node.get() instanceof YamlNode.Scalar) {
                return List.of(((YamlNode.Scalar) node.get()).text());
            }
            if (!(node.get() instanceof YamlNode.Sequence)) {
                throw problem(map, key, "'" + key + "' must be a list of values", "write [a, b]");
            }
            List<String> out = new ArrayList<>();
            for (YamlNode item : ((YamlNode.Sequence) node.get()).items()) {
                if (!(item instanceof YamlNode.Scalar)) {
                    throw problemAt(item.line(), "'" + key + "' must hold plain values", "write [a, b]");
                }
                out.add(((YamlNode.Scalar) item).text());
            }
            return out;
        }

        <T> T choice(YamlNode.Mapping map, String key, Function<String, Optional<T>> parse, T fallback, String allowed)
                throws InputProblem {
            if (map.get(key).isEmpty()) {
                return fallback;
            }
            String text = text(map, key);
            return parse.apply(text).orElseThrow(() ->
                    problem(map, key, key + " '" + text + "' is not known", "use " + allowed));
        }

        int integer(YamlNode.Mapping map, String key, int fallback, int min, int max) throws InputProblem {
            if (map.get(key).isEmpty()) {
                return fallback;
            }
            String text = text(map, key).strip();
            try {
                int value = Integer.parseInt(text);
                if (value < min || value > max) {
                    throw problem(map, key, key + " " + value + " is outside " + min + " to " + max,
                            "use a whole number from " + min + " to " + max);
                }
                return value;
            } catch (NumberFormatException e) {
                throw problem(map, key, key + " '" + text + "' is not a whole number", "write digits only");
            }
        }

        double number(YamlNode.Mapping map, String key, double fallback) throws InputProblem {
            if (map.get(key).isEmpty()) {
                return fallback;
            }
            return engineering(map, key, Quantity.DIMENSIONLESS);
        }

        boolean bool(YamlNode.Mapping map, String key, boolean fallback) throws InputProblem {
            if (map.get(key).isEmpty()) {
                return fallback;
            }
            String text = text(map, key).strip();
            if (text.equals("true") || text.equals("false")) {
                return Boolean.parseBoolean(text);
            }
            throw problem(map, key, key + " '" + text + "' is neither true nor false", "write true or false");
        }

        double engineering(YamlNode.Mapping map, String key, Quantity quantity) throws InputProblem {
            String text = text(map, key);
            try {
                return EngineeringValue.parse(text, quantity);
            } catch (IllegalArgumentException e) {
                throw problem(map, key, key + ": " + e.getMessage(), "write a number with an optional SI prefix and unit");
            }
        }

        double nonNegative(YamlNode.Mapping map, String key, double value) throws InputProblem {
            if (value < 0) {
                throw problem(map, key, key + " must not be negative", "write the ± figure as a positive value");
            }
            return value;
        }

        /** Angles in degrees: a number, optionally followed by deg, degrees or °. */
        double degrees(YamlNode.Mapping map, String key) throws InputProblem {
            String text = text(map, key).strip();
            String number = text.replaceFirst("\\s*(degrees|deg|°)$", "");
            double value = StrictNumber.parse(number, false);
            if (!Double.isFinite(value)) {
                throw problem(map, key, key + " '" + text + "' is not an angle in degrees", "write it as 0.5 deg");
            }
            return value;
        }

        /** Volts of the profile's amplitude kind; a unit after the number must be that kind (or V). */
        double volts(YamlNode.Mapping map, String key, AmplitudeKind kind, OptionalDouble fallback) throws InputProblem {
            if (map.get(key).isEmpty()) {
                if (fallback.isPresent()) {
                    return fallback.getAsDouble();
                }
                throw problemAt(map.line(), "'" + key + "' is missing", "add '" + key + ": 1 " + kind.symbol() + "'");
            }
            String text = text(map, key).strip();
            for (AmplitudeKind other : AmplitudeKind.values()) {
                if (other != kind && text.endsWith(other.symbol())) {
                    throw problem(map, key, key + " is given in " + other.symbol() + " but the profile's amplitudes are "
                            + kind.symbol(), "give it in " + kind.symbol());
                }
            }
            double value = engineering(map, key, Quantity.VOLTS);
            if (!(value > 0)) {
                throw problem(map, key, key + " must be positive", "give a level such as 1 " + kind.symbol());
            }
            return value;
        }

        Optional<ColumnRef> column(YamlNode.Mapping map, String key) throws InputProblem {
            Optional<YamlNode> node = map.get(key);
            if (node.isEmpty()) {
                return Optional.empty();
            }
            YamlNode value = node.get();
            boolean optional = false;
            if (value instanceof YamlNode.Mapping) {
                YamlNode.Mapping spec = (YamlNode.Mapping) value;
                onlyKeys(spec, Set.of("name", "number", "optional"));
                optional = bool(spec, "optional", false);
                if (spec.get("number").isPresent() == spec.get("name").isPresent()) {
                    throw problemAt(spec.line(), key + ": give either name or number", "such as {name: [Freq, Frequency]}");
                }
                if (spec.get("number").isPresent()) {
                    return Optional.of(new ColumnRef(List.of(), integer(spec, "number", 1, 1, 10_000), optional));
                }
                return Optional.of(new ColumnRef(texts(spec, "name", List.of()), 0, optional));
            }
            if (value instanceof YamlNode.Sequence) {
                return Optional.of(new ColumnRef(texts(map, key, List.of()), 0, false));
            }
            String text = ((YamlNode.Scalar) value).text().strip();
            if (text.matches("\\d+")) {
                return Optional.of(new ColumnRef(List.of(), integer(map, key, 1, 1, 10_000), false));
            }
            return Optional.of(new ColumnRef(List.of(text), 0, false));
        }

        Optional<Pattern> pattern(YamlNode.Mapping map, String key) throws InputProblem {
            if (map.get(key).isEmpty()) {
                return Optional.empty();
            }
            return Optional.of(compile(text(map, key), map.entry(key).orElseThrow().line()));
        }

        /** A regular expression that must have the named group, which holds the value wanted. */
        Pattern group(YamlNode.Mapping map, String key, String group) throws InputProblem {
            Pattern pattern = pattern(map, key).orElseThrow();
            if (!pattern.pattern().contains("(?<" + group + ">")) {
                throw problem(map, key, key + " has no group named '" + group + "'",
                        "put (?<" + group + ">...) around the number, such as '(?<" + group + ">[0-9.eE+-]+)'");
            }
            return pattern;
        }

        double positive(YamlNode.Mapping map, String key, double value) throws InputProblem {
            if (!(value > 0) || !Double.isFinite(value)) {
                throw problem(map, key, key + " must be positive", "give a positive value");
            }
            return value;
        }

        Pattern compile(String regex, int line) throws InputProblem {
            try {
                return Pattern.compile(regex);
            } catch (PatternSyntaxException e) {
                // RE2 syntax (RE2/J): matching takes time linear in the line whatever the pattern, which a
                // backtracking engine cannot promise (issue 15), at the price of backreferences and lookaround
                throw problemAt(line, "not a regular expression polebench can match: " + e.getDescription(),
                        "check the brackets and escapes (YAML single quotes keep backslashes as they are); "
                                + "backreferences (\\1) and lookaround ((?=, (?!, (?<=) are not supported");
            }
        }
    }
}

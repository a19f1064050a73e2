package org.polebench.sweepfile;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.profile.AmplitudeKind;
import org.polebench.profile.AngleUnit;
import org.polebench.profile.ColumnRef;
import org.polebench.profile.Delimiter;
import org.polebench.profile.FrequencyUnit;
import org.polebench.profile.GainForm;
import org.polebench.profile.InstrumentAccuracy;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.PhaseSign;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.ReadingLimits;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.SerialProfile;
import org.polebench.profile.TableColumns;
import org.polebench.profile.TableLayout;
import org.polebench.profile.TableProfile;
import org.polebench.profile.TextEncoding;
import org.polebench.units.StrictNumber;

/**
 * Works out how to read a sweep file nobody named a profile for ({@code --profile auto}),
 * from its first 64 KiB: the encoding (UTF-8 when the bytes decode as such, else Latin-1),
 * the header row and its delimiter, the decimal mark, and each column's meaning from the
 * header's words, in English and in the usual spellings of a few other languages (Frequenz,
 * fréquence, frecuencia, Verstärkung, ganancia, fase, …). A file polebench wrote itself is
 * read with the canonical profile; a file with no header is matched against the serial
 * profiles. When the words allow more than one reading, the problem lists the candidates.
 */
final class LayoutSniffer {
    private static final int SAMPLE_BYTES = 1 << 16;
    private static final int SAMPLE_ROWS = 40;
    private static final List<String> COMMENTS = List.of("#", "!", "%", "//");

    private static final Set<String> FREQUENCY_WORDS = Set.of("freq", "frequency", "frequencies", "frequenz", "fréquence",
            "frequence", "frecuencia", "frequenza", "frequência", "frequencia", "frequentie", "częstotliwość", "f",
            "hz", "khz", "mhz");
    private static final Set<String> GAIN_WORDS = Set.of("gain", "mag", "magnitude", "verstärkung", "verstaerkung",
            "ganancia", "guadagno", "ganho", "versterking", "betrag", "level", "pegel", "response", "db",
            "ratio", "h", "amplification", "amplificación", "gaindb");
    private static final Set<String> AMPLITUDE_WORDS = Set.of("ampl", "amplitude", "amplitud", "ampiezza", "voltage",
            "spannung", "tension", "tensión", "v", "vrms", "vpp", "vpk", "rms", "pp", "pk", "peak", "u", "vin", "vout",
            "ch1", "ch2", "cha", "chb");
    private static final Set<String> INPUT_WORDS = Set.of("in", "input", "vin", "ch1", "cha", "eingang", "entrée",
            "entree", "entrada", "ingresso", "u1", "v1", "ein");
    private static final Set<String> OUTPUT_WORDS = Set.of("out", "output", "vout", "ch2", "chb", "ausgang", "sortie",
            "salida", "uscita", "u2", "v2", "aus");
    private static final Set<String> PHASE_WORDS = Set.of("phase", "phas", "fase", "phi", "φ", "arg", "angle", "winkel",
            "phasenwinkel", "déphasage", "dephasage", "desfase", "phasedeg", "phaserad");
    private static final Set<String> DEGREE_WORDS = Set.of("deg", "degree", "degrees", "grad", "°", "degré", "degrés",
            "grados", "gradi", "graus");
    private static final Set<String> RADIAN_WORDS = Set.of("rad", "radian", "radians", "radiant", "radianes");
    private static final Set<String> UNCERTAINTY_WORDS = Set.of("unc", "uncertainty", "sigma", "std", "stdev", "σ");
    private static final Set<String> RATIO_WORDS = Set.of("ratio", "linear", "lin", "x", "vv");

    private final ProfileLibrary library;
    private final InputLimits limits;

    LayoutSniffer(ProfileLibrary library, InputLimits limits) {
        this.library = library;
        this.limits = limits;
    }

    /** What the sniffer chose: a profile, and the words that say how it was found. */
    record Choice(InstrumentProfile profile, String preface) {
    }

    private enum Role { FREQUENCY, GAIN, AMPLITUDE, PHASE, OTHER }

    private static final class Column {
        final int number;
        final String header;
        final Set<String> words;
        Role role = Role.OTHER;

        Column(int number, String header) {
            this.number = number;
            this.header = header;
            this.words = words(header);
        }

        boolean any(Set<String> set) {
            for (String word : words) {
                if (set.contains(word)) {
                    return true;
                }
            }
            return false;
        }
    }

    Choice sniff(Path file) throws InputProblem {
        byte[] bytes = sample(file);
        if (bytes.length == 0) {
            throw new InputProblem(file, 0, "the file is empty", "check that the measurement was saved");
        }
        TextEncoding encoding = decodes(bytes) ? TextEncoding.UTF_8 : TextEncoding.LATIN_1;
        List<String> lines = lines(new String(bytes, encoding.charset()));
        if (!lines.isEmpty() && lines.get(0).startsWith("\uFEFF")) {
            lines.set(0, lines.get(0).substring(1));
        }
        Optional<InstrumentProfile> canonical = library.find(SweepWriter.CANONICAL);
        if (canonical.isPresent() && looksCanonical(lines)) {
            return new Choice(canonical.get(), "auto: polebench's canonical sweep; ");
        }
        for (int i = 0; i < Math.min(lines.size(), 200); i++) {
            String line = lines.get(i);
            if (line.isBlank() || isComment(line)) {
                continue;
            }
            for (Delimiter delimiter : List.of(Delimiter.TAB, Delimiter.SEMICOLON, Delimiter.COMMA, Delimiter.SPACES)) {
                List<Column> columns = header(line, delimiter);
                if (columns.size() >= 2 && hasRole(columns, Role.FREQUENCY)
                        && (hasRole(columns, Role.GAIN) || hasRole(columns, Role.AMPLITUDE))) {
                    return fromHeader(file, encoding, lines, i, delimiter, columns);
                }
            }
        }
        return withoutHeader(file, lines);
    }

    private Choice fromHeader(Path file, TextEncoding encoding, List<String> lines, int headerIndex, Delimiter delimiter,
                              List<Column> columns) throws InputProblem {
        int headerLine = headerIndex + 1;
        List<String> rows = new ArrayList<>();
        for (int i = headerIndex + 1; i < lines.size() && rows.size() < SAMPLE_ROWS; i++) {
            if (!lines.get(i).isBlank() && !isComment(lines.get(i))) {
                rows.add(lines.get(i));
            }
        }
        boolean decimalComma = delimiter != Delimiter.COMMA && usesDecimalComma(rows);
        CellSplitter splitter = new CellSplitter(delimiter);
        List<String> ambiguities = new ArrayList<>();

        Column frequency = single(columns, Role.FREQUENCY, "frequency", ambiguities);
        List<Column> gains = of(columns, Role.GAIN);
        Column phase = single(columns, Role.PHASE, "phase", ambiguities);
        Column gain = null;
        Column input = null;
        Column output = null;
        GainForm form;
        AmplitudeKind kind = AmplitudeKind.RMS;
        List<String> assumed = new ArrayList<>();
        if (gains.size() > 1) {
            ambiguities.add("gain could be " + describe(gains));
            form = GainForm.DB;
        } else if (gains.size() == 1) {
            gain = gains.get(0);
            if (gain.any(Set.of("db", "gaindb"))) {
                form = GainForm.DB;
            } else if (gain.any(RATIO_WORDS)) {
                form = GainForm.RATIO;
            } else if (anyNegative(rows, splitter, gain.number - 1, decimalComma)) {
                form = GainForm.DB;
                assumed.add("gain in dB (it has negative values)");
            } else {
                ambiguities.add("column " + gain.number + " '" + gain.header + "' could be gain in dB or a linear ratio");
                form = GainForm.DB;
            }
        } else {
            form = GainForm.AMPLITUDES;
            List<Column> amplitudes = of(columns, Role.AMPLITUDE);
            for (Column c : amplitudes) {
                if (c.any(INPUT_WORDS) && !c.any(OUTPUT_WORDS)) {
                    input = input == null ? c : input;
                } else if (c.any(OUTPUT_WORDS) && !c.any(INPUT_WORDS)) {
                    output = output == null ? c : output;
                }
            }
            if (input == null || output == null) {
                ambiguities.add("the amplitude columns " + describe(amplitudes)
                        + " do not say which is the input and which the output (in/out, ch1/ch2, Vin/Vout)");
            } else {
                Optional<AmplitudeKind> inKind = kindOf(input);
                Optional<AmplitudeKind> outKind = kindOf(output);
                if (inKind.isPresent() && outKind.isPresent() && inKind.get() != outKind.get()) {
                    throw new InputProblem(file, headerLine, "the input is in " + inKind.get().symbol()
                            + " and the output in " + outKind.get().symbol() + "; a gain needs both of one kind",
                            "set both channels to the same measurement (Vpp, Vrms or Vpk)");
                }
                kind = inKind.or(() -> outKind).orElse(AmplitudeKind.RMS);
                if (inKind.isEmpty() && outKind.isEmpty()) {
                    assumed.add("amplitudes taken as Vrms (their kind cancels in the gain)");
                }
            }
        }
        AngleUnit angle = AngleUnit.DEGREES;
        Optional<PhaseSign> sign = Optional.empty();
        if (phase != null) {
            if (phase.any(RADIAN_WORDS)) {
                angle = AngleUnit.RADIANS;
            } else if (!phase.any(DEGREE_WORDS)) {
                double largest = largestMagnitude(rows, splitter, phase.number - 1, decimalComma);
                if (largest > 2 * Math.PI + 1e-6) {
                    assumed.add("phase in degrees (values beyond 2π)");
                } else {
                    ambiguities.add("column " + phase.number + " '" + phase.header + "' could be phase in degrees or radians");
                }
            }
            sign = signOf(phase);
            if (sign.isEmpty()) {
                assumed.add("phase sign lead-positive");
            }
        }
        if (!ambiguities.isEmpty()) {
            List<String> fitting = fittingProfiles(file);
            throw new InputProblem(file, headerLine, "cannot tell how to read this file: " + String.join("; ", ambiguities)
                    + (fitting.isEmpty() ? "" : "; shipped profiles that read it: " + String.join(", ", fitting)),
                    "name a profile with --profile, or write one for this layout (docs/user-guide.md)");
        }
        FrequencyUnit unit = frequency.any(Set.of("khz")) ? FrequencyUnit.KHZ
                : frequency.any(Set.of("mhz")) ? FrequencyUnit.MHZ : FrequencyUnit.HZ;
        if (!frequency.any(Set.of("hz", "khz", "mhz"))) {
            assumed.add("frequency in Hz");
        }
        int preamble = 0;
        for (int i = 0; i < headerIndex; i++) {
            if (!lines.get(i).isBlank() && !isComment(lines.get(i))) {
                preamble = i + 1;
            }
        }
        TableLayout layout = new TableLayout(delimiter, decimalComma, encoding, preamble, COMMENTS, true);
        TableColumns tableColumns = new TableColumns(ColumnRef.numbered(frequency.number),
                Optional.ofNullable(gain).map(c -> ColumnRef.numbered(c.number)),
                Optional.ofNullable(input).map(c -> ColumnRef.numbered(c.number)),
                Optional.ofNullable(output).map(c -> ColumnRef.numbered(c.number)),
                Optional.ofNullable(phase).map(c -> ColumnRef.numbered(c.number)), Optional.empty(), Optional.empty());
        ReadingScale scale = new ReadingScale(unit, form, kind, angle, sign.orElse(PhaseSign.LEAD_POSITIVE), true);
        TableProfile profile = new TableProfile("auto", "sniffed from the header", layout, tableColumns, scale,
                InstrumentAccuracy.unstated(), ReadingLimits.none(), Optional.empty());
        String preface = "auto: " + delimiter.word() + "-delimited, decimal " + (decimalComma ? "comma" : "point") + ", "
                + encoding.word() + ", header at line " + headerLine
                + (assumed.isEmpty() ? "" : " (assumed: " + String.join(", ", assumed) + ")");
        // A sniffed layout knows nothing of the instrument's accuracy; a shipped profile that reads
        // the file the same way does, and reading through it carries that accuracy exactly as
        // naming it would (issue 13: auto used to drop it).
        Optional<TableProfile> same = sameReading(profile, columns, lines);
        if (same.isPresent()) {
            return new Choice(same.get(), preface + ", the layout of profile '" + same.get().name()
                    + "', read with it (its accuracy applies); ");
        }
        return new Choice(profile, preface + "; ");
    }

    /**
     * @return the one shipped table profile that reads this file exactly as the sniffed layout
     *         does (the same delimiter, decimal mark, preamble, comments and header row, the same
     *         column for every quantity, the same units and phase sign), or empty when none or
     *         more than one does
     */
    private Optional<TableProfile> sameReading(TableProfile sniffed, List<Column> header, List<String> lines) {
        List<TableProfile> found = new ArrayList<>();
        for (TableProfile shipped : library.tableProfiles()) {
            TableLayout a = sniffed.layout();
            TableLayout b = shipped.layout();
            if (!b.header() || a.delimiter() != b.delimiter() || a.decimalComma() != b.decimalComma()
                    || a.encoding() != b.encoding() || a.preambleLines() != b.preambleLines()) {
                continue;
            }
            boolean comments = true;
            for (int i = 0; i < lines.size(); i++) {
                if (isComment(lines.get(i)) && !b.isComment(lines.get(i))) {
                    comments = false;
                    break;
                }
            }
            ReadingScale x = sniffed.scale();
            ReadingScale y = shipped.scale();
            boolean phase = sniffed.columns().phase().isPresent();
            boolean units = x.frequencyUnit() == y.frequencyUnit() && x.gainForm() == y.gainForm()
                    && (!phase || x.phaseUnit() == y.phaseUnit() && x.phaseSign() == y.phaseSign()
                    && x.phaseWrapped() == y.phaseWrapped());
            TableColumns c = sniffed.columns();
            TableColumns d = shipped.columns();
            boolean sameColumns = column(c.frequency(), header) == column(d.frequency(), header)
                    && column(c.gain(), header) == column(d.gain(), header)
                    && column(c.inputAmplitude(), header) == column(d.inputAmplitude(), header)
                    && column(c.outputAmplitude(), header) == column(d.outputAmplitude(), header)
                    && column(c.phase(), header) == column(d.phase(), header)
                    && column(d.gainUncertainty(), header) < 0 && column(d.phaseUncertainty(), header) < 0;
            if (comments && units && sameColumns) {
                found.add(shipped);
            }
        }
        return found.size() == 1 ? Optional.of(found.get(0)) : Optional.empty();
    }

    /** @return the 1-based column a reference picks from the header row, or −1 when none */
    private static int column(Optional<ColumnRef> ref, List<Column> header) {
        return ref.isPresent() ? column(ref.get(), header) : -1;
    }

    private static int column(ColumnRef ref, List<Column> header) {
        if (ref.byNumber()) {
            return ref.number() <= header.size() ? ref.number() : -1;
        }
        for (Column c : header) {
            if (ref.matches(c.header)) {
                return c.number;
            }
        }
        return -1;
    }

    private Choice withoutHeader(Path file, List<String> lines) throws InputProblem {
        List<SerialProfile> fitting = new ArrayList<>();
        for (SerialProfile serial : library.serialProfiles()) {
            SerialLogParser parser = new SerialLogParser(serial, file, limits.maxPoints());
            int unreadable = 0;
            for (int i = 0; i < lines.size(); i++) {
                parser.accept(i + 1, lines.get(i));
            }
            try {
                ImportedSweep trial = parser.result("");
                for (var warning : trial.warnings()) {
                    unreadable += warning.message().contains("line skipped") ? 1 : 0;
                }
                if (unreadable < trial.sweep().size()) {
                    fitting.add(serial);
                }
            } catch (InputProblem notThisOne) {
                // too few points under this profile: not a candidate
            }
        }
        if (fitting.size() == 1) {
            return new Choice(fitting.get(0), "auto: a serial log in the protocol of profile '" + fitting.get(0).name() + "'; ");
        }
        List<String> tables = fittingProfiles(file);
        List<String> candidates = new ArrayList<>(tables);
        fitting.forEach(p -> candidates.add(p.name()));
        throw new InputProblem(file, 1, "no header row names a frequency and a gain or amplitude column, so the layout "
                + "cannot be sniffed" + (candidates.isEmpty() ? "" : "; candidates that read it: " + String.join(", ", candidates)),
                "name a profile with --profile (polebench profiles lists them), or add a header row");
    }

    /** @return names of shipped table profiles that read the whole file with no warning about its rows */
    private List<String> fittingProfiles(Path file) {
        List<String> names = new ArrayList<>();
        for (TableProfile profile : library.tableProfiles()) {
            try {
                ImportedSweep trial = new TableSweepParser(file, profile, limits).read(profile.name(), "");
                boolean clean = trial.warnings().stream().allMatch(w -> w.line() == 0);
                if (clean) {
                    names.add(profile.name());
                }
            } catch (InputProblem | UncheckedIOException notThisOne) {
                // does not read this file
            }
        }
        return names;
    }

    private static boolean looksCanonical(List<String> lines) {
        for (String line : lines) {
            if (line.startsWith("# polebench sweep")) {
                return true;
            }
            if (!line.isBlank() && !line.startsWith("#")) {
                return ColumnRef.normalise(line).startsWith("frequency_hz,gain_db");
            }
        }
        return false;
    }

    private static List<Column> header(String line, Delimiter delimiter) {
        CellSplitter splitter = new CellSplitter(delimiter);
        int count = splitter.split(line);
        List<Column> columns = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            Column column = new Column(i + 1, splitter.text(i));
            column.role = roleOf(column);
            columns.add(column);
        }
        return columns;
    }

    private static Role roleOf(Column c) {
        if (c.words.isEmpty() || c.any(UNCERTAINTY_WORDS) || c.words.size() > 1 && c.words.iterator().next().equals("u")) {
            return Role.OTHER;
        }
        if (c.any(PHASE_WORDS) || (c.any(DEGREE_WORDS) || c.any(RADIAN_WORDS)) && !c.any(GAIN_WORDS)) {
            return Role.PHASE;
        }
        if (c.any(FREQUENCY_WORDS)) {
            return Role.FREQUENCY;
        }
        if (c.any(GAIN_WORDS)) {
            return Role.GAIN;
        }
        if (c.any(AMPLITUDE_WORDS) || c.any(INPUT_WORDS) || c.any(OUTPUT_WORDS)) {
            return Role.AMPLITUDE;
        }
        return Role.OTHER;
    }

    /** Splits a header cell into lower-case words; "Freq (kHz)" gives freq, khz; "Phase/°" gives phase, °. */
    private static Set<String> words(String header) {
        String lower = header.toLowerCase(Locale.ROOT).replace("°", " ° ").replace("v/v", " vv ");
        Set<String> out = new java.util.LinkedHashSet<>();
        for (String word : lower.split("[^\\p{L}\\p{N}°φσ]+")) {
            if (!word.isEmpty()) {
                out.add(word);
            }
        }
        return out;
    }

    /**
     * Reads the sign convention from a phase header: "CH1-CH2" or "in-out" is input minus
     * output, so a lag reads positive; "CH2-CH1" or "out-in" is a lead; so are the words lag
     * and lead themselves.
     */
    private static Optional<PhaseSign> signOf(Column c) {
        if (c.any(Set.of("lag", "nacheilend", "retard", "retraso"))) {
            return Optional.of(PhaseSign.LAG_POSITIVE);
        }
        if (c.any(Set.of("lead", "voreilend", "avance", "adelanto"))) {
            return Optional.of(PhaseSign.LEAD_POSITIVE);
        }
        int in = -1;
        int out = -1;
        int i = 0;
        for (String word : c.words) {
            if (in < 0 && INPUT_WORDS.contains(word)) {
                in = i;
            }
            if (out < 0 && OUTPUT_WORDS.contains(word)) {
                out = i;
            }
            i++;
        }
        if (in < 0 || out < 0) {
            return Optional.empty();
        }
        return Optional.of(in < out ? PhaseSign.LAG_POSITIVE : PhaseSign.LEAD_POSITIVE);
    }

    private static Optional<AmplitudeKind> kindOf(Column c) {
        if (c.any(Set.of("vrms", "rms"))) {
            return Optional.of(AmplitudeKind.RMS);
        }
        if (c.any(Set.of("vpp", "pp"))) {
            return Optional.of(AmplitudeKind.PEAK_TO_PEAK);
        }
        if (c.any(Set.of("vpk", "pk", "peak"))) {
            return Optional.of(AmplitudeKind.PEAK);
        }
        return Optional.empty();
    }

    private static boolean hasRole(List<Column> columns, Role role) {
        return columns.stream().anyMatch(c -> c.role == role);
    }

    private static List<Column> of(List<Column> columns, Role role) {
        return columns.stream().filter(c -> c.role == role).toList();
    }

    private static Column single(List<Column> columns, Role role, String what, List<String> ambiguities) {
        List<Column> found = of(columns, role);
        if (found.size() > 1) {
            ambiguities.add(what + " could be " + describe(found));
        }
        return found.isEmpty() ? null : found.get(0);
    }

    private static String describe(List<Column> columns) {
        List<String> parts = new ArrayList<>();
        for (Column c : columns) {
            parts.add("column " + c.number + " '" + c.header + "'");
        }
        return String.join(" or ", parts);
    }

    private static boolean usesDecimalComma(List<String> rows) {
        boolean comma = false;
        for (String row : rows) {
            if (row.matches(".*\\d\\.\\d.*")) {
                return false;
            }
            comma |= row.matches(".*\\d,\\d.*");
        }
        return comma;
    }

    private static boolean anyNegative(List<String> rows, CellSplitter splitter, int column, boolean decimalComma) {
        for (String row : rows) {
            OptionalDouble value = cell(row, splitter, column, decimalComma);
            if (value.isPresent() && value.getAsDouble() < 0) {
                return true;
            }
        }
        return false;
    }

    private static double largestMagnitude(List<String> rows, CellSplitter splitter, int column, boolean decimalComma) {
        double largest = 0;
        for (String row : rows) {
            OptionalDouble value = cell(row, splitter, column, decimalComma);
            if (value.isPresent() && Double.isFinite(value.getAsDouble())) {
                largest = Math.max(largest, Math.abs(value.getAsDouble()));
            }
        }
        return largest;
    }

    private static OptionalDouble cell(String row, CellSplitter splitter, int column, boolean decimalComma) {
        int count = splitter.split(row);
        if (column >= count) {
            return OptionalDouble.empty();
        }
        double value = splitter.number(column, decimalComma);
        return Double.isNaN(value) ? OptionalDouble.empty() : OptionalDouble.of(value);
    }

    private static boolean isComment(String line) {
        for (String prefix : COMMENTS) {
            if (line.startsWith(prefix)) {
                return true;
            }
        }
        return false;
    }

    private static byte[] sample(Path file) throws InputProblem {
        try (InputStream in = Files.newInputStream(file)) {
            return in.readNBytes(SAMPLE_BYTES);
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
    }

    /** @return true when the bytes decode as UTF-8, allowing a sequence cut off at the sample's end */
    private static boolean decodes(byte[] bytes) {
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult result = decoder.decode(ByteBuffer.wrap(bytes), out, false);
        return !result.isError();
    }

    private static List<String> lines(String text) {
        List<String> lines = new ArrayList<>();
        for (String line : text.split("\r\n|\r|\n", -1)) {
            lines.add(line);
        }
        return lines;
    }
}

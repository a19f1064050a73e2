package org.polebench.sweepfile;

import com.opencsv.CSVWriter;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.CodingErrorAction;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import org.polebench.profile.ColumnRef;
import org.polebench.profile.Delimiter;
import org.polebench.profile.GainForm;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.TableColumns;
import org.polebench.profile.TableLayout;
import org.polebench.profile.TableProfile;
import org.polebench.profile.TextEncoding;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Writes a sweep as polebench's canonical sweep CSV, or in the layout of any table profile
 * (so that demo data can come in the shapes users' instruments write). Numbers are written
 * with {@link Double#toString}, the shortest text that reads back as the same double, so the
 * canonical file round-trips exactly.
 *
 * <p>Canonical layout (docs/user-guide.md, "The canonical sweep CSV"): a first line {@code # polebench sweep}, then
 * {@code # key: value} provenance lines ({@code instrument}, {@code date} as ISO-8601,
 * {@code board}, {@code profile}, {@code source}, {@code source-sha256}, {@code stage},
 * {@code note}) and a {@code # units:} line, then the header
 * {@code frequency_hz,gain_db[,phase_deg][,u_gain_db][,u_phase_deg]}; the uncertainty columns
 * are standard uncertainties and appear when every point has one.
 *
 * <p>Files are written to a temporary file beside the target and then moved into place, so a
 * failed write never leaves half a file, and an existing file is replaced only when asked.
 */
public final class SweepWriter {
    /** The canonical profile's name, as shipped in {@code instrument-profiles/canonical.yaml}. */
    public static final String CANONICAL = "canonical";
    static final String MARKER = "polebench sweep";
    private static final String UNITS = "frequency_hz in Hz; gain_db = 20 log10 |Vout/Vin| in dB; phase_deg in degrees, "
            + "output leading input positive; u_gain_db and u_phase_deg are standard uncertainties (k = 1)";

    private final double inputAmplitude;

    /**
     * A writer that puts 1 V (of the layout's amplitude kind) on the input of amplitude layouts,
     * or less when the layout has a full scale: then the highest output is kept at half of it.
     */
    public SweepWriter() {
        this(1.0);
    }

    /** @param inputAmplitude the input level written in two-amplitude layouts, in the layout's amplitude unit */
    public SweepWriter(double inputAmplitude) {
        if (!(inputAmplitude > 0) || !Double.isFinite(inputAmplitude)) {
            throw new IllegalArgumentException("input amplitude must be positive, was " + inputAmplitude);
        }
        this.inputAmplitude = inputAmplitude;
    }

    /**
     * Writes the canonical sweep CSV.
     *
     * @param overwrite replace an existing file; when false an existing file is left as it is
     * @throws InputProblem when the target exists and overwrite is false
     * @throws IOException  when the file cannot be written
     */
    public void writeCanonical(Sweep sweep, Path target, boolean overwrite) throws InputProblem, IOException {
        write(target, overwrite, TextEncoding.UTF_8, out -> canonical(sweep, out));
    }

    /**
     * Writes the sweep in a table profile's layout, to be read back with that profile. A phase
     * the layout has no column for is left out.
     *
     * @throws IllegalArgumentException when the layout needs a phase the sweep lacks
     */
    public void write(Sweep sweep, Path target, TableProfile layout, boolean overwrite) throws InputProblem, IOException {
        requireFits(sweep, layout);
        write(target, overwrite, layout.layout().encoding(), out -> table(sweep, layout, out));
    }

    /** Writes the canonical layout to a writer (the caller closes it). */
    public void canonical(Sweep sweep, Writer out) throws IOException {
        boolean phase = sweep.hasPhase();
        boolean uGain = sweep.points().stream().allMatch(p -> p.gainUncertaintyDb().isPresent());
        boolean uPhase = phase && sweep.points().stream().allMatch(p -> p.phaseUncertaintyDeg().isPresent());
        canonicalHeader(sweep.source(), phase, uGain, uPhase, out);
        StringBuilder row = new StringBuilder(96);
        for (SweepPoint p : sweep.points()) {
            row.setLength(0);
            canonicalRow(p, phase, uGain, uPhase, row);
            out.append(row).append('\n');
        }
    }

    /**
     * Writes the canonical file's comment lines and column header, for a file that is then
     * filled row by row ({@link AppendedSweep}).
     */
    static void canonicalHeader(Provenance source, boolean phase, boolean uGain, boolean uPhase, Writer out)
            throws IOException {
        out.write("# " + MARKER + "\n");
        provenance(source, "# ", out);
        out.write("# units: " + UNITS + "\n");
        out.write("frequency_hz,gain_db" + (phase ? ",phase_deg" : "") + (uGain ? ",u_gain_db" : "")
                + (uPhase ? ",u_phase_deg" : "") + "\n");
    }

    /** Appends one canonical row without its line ending; the columns must exist in the point. */
    static void canonicalRow(SweepPoint p, boolean phase, boolean uGain, boolean uPhase, StringBuilder row) {
        row.append(p.frequencyHz()).append(',').append(p.gainDb());
        if (phase) {
            row.append(',').append(p.phaseDeg().getAsDouble());
        }
        if (uGain) {
            row.append(',').append(p.gainUncertaintyDb().getAsDouble());
        }
        if (uPhase) {
            row.append(',').append(p.phaseUncertaintyDeg().getAsDouble());
        }
    }

    /** Writes a table profile's layout to a writer (the caller closes it). */
    public void table(Sweep sweep, TableProfile profile, Writer out) throws IOException {
        requireFits(sweep, profile);
        TableLayout layout = profile.layout();
        ReadingScale scale = profile.scale();
        TableColumns c = profile.columns();
        for (int i = 1; i <= layout.preambleLines(); i++) {
            out.write(i == 1 ? "polebench export in the layout of profile " + profile.name()
                    : "(preamble line " + i + " of " + layout.preambleLines() + ")");
            out.write('\n');
        }
        if (!layout.commentPrefixes().isEmpty()) {
            provenance(sweep.source(), layout.commentPrefixes().get(0) + " ", out);
        }
        boolean phase = c.phase().isPresent() && sweep.hasPhase();
        List<Slot> slots = new ArrayList<>();
        slots.add(new Slot(c.frequency(), "frequency", Field.FREQUENCY));
        c.gain().ifPresent(r -> slots.add(new Slot(r, "gain", Field.GAIN)));
        c.inputAmplitude().ifPresent(r -> slots.add(new Slot(r, "input", Field.INPUT)));
        c.outputAmplitude().ifPresent(r -> slots.add(new Slot(r, "output", Field.OUTPUT)));
        if (phase) {
            slots.add(new Slot(c.phase().get(), "phase", Field.PHASE));
            c.phaseUncertainty().ifPresent(r -> slots.add(new Slot(r, "u_phase", Field.U_PHASE)));
        }
        c.gainUncertainty().ifPresent(r -> slots.add(new Slot(r, "u_gain", Field.U_GAIN)));
        Slot[] positions = place(slots);
        CSVWriter rows = rowWriter(layout, out);
        if (layout.header()) {
            String[] header = new String[positions.length];
            for (int i = 0; i < positions.length; i++) {
                header[i] = positions[i] == null ? "" : positions[i].title();
            }
            writeRow(header, rows);
        }
        double level = inputAmplitude;
        if (profile.limits().fullScale().isPresent()) {
            double highestGainDb = sweep.points().stream().mapToDouble(SweepPoint::gainDb).max().orElse(0);
            level = Math.min(level, 0.5 * profile.limits().fullScale().getAsDouble() / Math.pow(10, highestGainDb / 20));
        }
        String[] cells = new String[positions.length];
        for (SweepPoint p : sweep.points()) {
            double ratio = Math.pow(10, p.gainDb() / 20);
            for (int i = 0; i < positions.length; i++) {
                cells[i] = positions[i] == null ? "" : cell(positions[i].field, p, ratio, level, scale, layout);
            }
            writeRow(cells, rows);
        }
        rows.flush();
    }

    private static String cell(Field field, SweepPoint p, double ratio, double level, ReadingScale scale,
                               TableLayout layout) {
        double value;
        switch (field) {
            case FREQUENCY:
                value = scale.rawFrequency(p.frequencyHz());
                break;
            case GAIN:
                value = scale.gainForm() == GainForm.RATIO ? ratio : p.gainDb();
                break;
            case INPUT:
                value = level;
                break;
            case OUTPUT:
                value = level * ratio;
                break;
            case PHASE:
                value = scale.rawPhase(p.phaseDeg().getAsDouble());
                break;
            case U_GAIN:
                if (p.gainUncertaintyDb().isEmpty()) {
                    return "";
                }
                value = p.gainUncertaintyDb().getAsDouble();
                break;
            case U_PHASE:
                if (p.phaseUncertaintyDeg().isEmpty()) {
                    return "";
                }
                value = p.phaseUncertaintyDeg().getAsDouble();
                break;
            default:
                throw new IllegalStateException("unknown field " + field);
        }
        String text = Double.toString(value);
        return layout.decimalComma() ? text.replace('.', ',') : text;
    }

    private enum Field { FREQUENCY, GAIN, INPUT, OUTPUT, PHASE, U_GAIN, U_PHASE }

    /** A column to write: where the profile wants it and what it holds. */
    private static final class Slot {
        final ColumnRef ref;
        final String fallbackTitle;
        final Field field;

        Slot(ColumnRef ref, String fallbackTitle, Field field) {
            this.ref = ref;
            this.fallbackTitle = fallbackTitle;
            this.field = field;
        }

        String title() {
            return ref.byNumber() ? fallbackTitle : ref.names().get(0);
        }
    }

    /** Numbered columns go where their number says; named ones fill the free places in order. */
    private static Slot[] place(List<Slot> slots) {
        int width = slots.size();
        for (Slot slot : slots) {
            width = Math.max(width, slot.ref.number());
        }
        Slot[] positions = new Slot[width];
        for (Slot slot : slots) {
            if (slot.ref.byNumber()) {
                positions[slot.ref.number() - 1] = slot;
            }
        }
        int next = 0;
        for (Slot slot : slots) {
            if (!slot.ref.byNumber()) {
                while (positions[next] != null) {
                    next++;
                }
                positions[next] = slot;
            }
        }
        int used = positions.length;
        while (used > 0 && positions[used - 1] == null) {
            used--;
        }
        return Arrays.copyOf(positions, used);
    }

    /**
     * Rows go through OpenCSV's {@link CSVWriter}: RFC 4180 quoting (a cell holding the delimiter,
     * a quote or a line break is quoted, inner quotes doubled), only where needed, so plain
     * numbers are written bare. The caller closes {@code out}; the table is flushed at its end.
     */
    private static CSVWriter rowWriter(TableLayout layout, Writer out) {
        return new RowWriter(out, layout.delimiter());
    }

    private static void writeRow(String[] cells, CSVWriter rows) throws IOException {
        rows.writeNext(cells, false);
    }

    /**
     * Space-delimited rows also quote an empty cell and a cell holding a tab: the reader takes a
     * run of blanks as one separator, so such a cell would otherwise vanish or split.
     */
    private static final class RowWriter extends CSVWriter {
        private final boolean spaces;

        RowWriter(Writer out, Delimiter delimiter) {
            super(out, delimiter.character(), DEFAULT_QUOTE_CHARACTER, DEFAULT_ESCAPE_CHARACTER, "\n");
            this.spaces = delimiter == Delimiter.SPACES;
        }

        @Override
        protected boolean stringContainsSpecialCharacters(String cell) {
            return super.stringContainsSpecialCharacters(cell)
                    || spaces && (cell.isEmpty() || cell.indexOf('\t') >= 0);
        }
    }

    private static void provenance(Provenance source, String prefix, Writer out) throws IOException {
        if (!source.instrument().isEmpty()) {
            out.write(prefix + "instrument: " + oneLine(source.instrument()) + "\n");
        }
        Optional<java.time.Instant> captured = source.captured();
        if (captured.isPresent()) {
            out.write(prefix + "date: " + captured.get() + "\n");
        }
        if (source.board().isPresent()) {
            out.write(prefix + "board: " + oneLine(source.board().get()) + "\n");
        }
        if (!source.profile().isEmpty()) {
            out.write(prefix + "profile: " + oneLine(source.profile()) + "\n");
        }
        if (source.sourceFile().isPresent()) {
            out.write(prefix + "source: " + oneLine(source.sourceFile().get().toString()) + "\n");
        }
        if (!source.sha256().isEmpty()) {
            out.write(prefix + "source-sha256: " + source.sha256() + "\n");
        }
        for (String note : source.notes()) {
            if (note.startsWith("stage: ")) {
                out.write(prefix + oneLine(note) + "\n");
            } else {
                out.write(prefix + "note: " + oneLine(note) + "\n");
            }
        }
    }

    private static String oneLine(String text) {
        return text.replace('\r', ' ').replace('\n', ' ');
    }

    private static void requireFits(Sweep sweep, TableProfile profile) {
        Optional<ColumnRef> phase = profile.columns().phase();
        if (phase.isPresent() && !phase.get().optional() && !sweep.hasPhase()) {
            throw new IllegalArgumentException("layout " + profile.name() + " needs a phase, and the sweep has none");
        }
    }

    /** Something that writes a file's text. */
    private interface Body {
        void writeTo(Writer out) throws IOException;
    }

    private static void write(Path target, boolean overwrite, TextEncoding encoding, Body body)
            throws InputProblem, IOException {
        OutputFile.write(target, overwrite, stream -> {
            Writer out = new BufferedWriter(new OutputStreamWriter(stream,
                    encoding.charset().newEncoder().onUnmappableCharacter(CodingErrorAction.REPLACE)
                            .onMalformedInput(CodingErrorAction.REPLACE)), 1 << 16);
            body.writeTo(out);
            out.flush();
        });
    }
}

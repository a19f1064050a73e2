package org.polebench.sweepfile;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.profile.ColumnRef;
import org.polebench.profile.Delimiter;
import org.polebench.profile.TableColumns;
import org.polebench.profile.TableLayout;
import org.polebench.profile.TableProfile;
import org.polebench.profile.TextEncoding;
import org.polebench.sweep.Sweep;
import org.polebench.units.StrictNumber;

/**
 * Reads a delimited text table into a sweep with a {@link TableProfile}. Streams the file a
 * line at a time (memory does not grow with the file, only with the points kept), hashes its
 * bytes as it goes, and reports every problem with its line.
 *
 * <p>One instance per import.
 */
final class TableSweepParser {
    private final Path file;
    private final TableProfile profile;
    private final TableLayout layout;
    private final CellSplitter splitter;
    private final WarningTally tally;
    private final ProvenanceNotes notes = new ProvenanceNotes();
    private final InputLimits limits;

    private int frequencyColumn = -1;
    private int gainColumn = -1;
    private int inputColumn = -1;
    private int outputColumn = -1;
    private int phaseColumn = -1;
    private int gainUncertaintyColumn = -1;
    private int phaseUncertaintyColumn = -1;
    private final List<String> mapping = new ArrayList<>();
    private SweepAssembly assembly;
    private boolean rowRejected;
    /** cells the header row names (0 when the columns are numbered), and its line */
    private int headerCells;
    private long headerLine;

    TableSweepParser(Path file, TableProfile profile, InputLimits limits) {
        this.file = file;
        this.limits = limits;
        this.profile = profile;
        this.layout = profile.layout();
        this.splitter = new CellSplitter(layout.delimiter());
        this.tally = new WarningTally(file);
    }

    /**
     * @param profileLabel   the name reported in the result ("auto" when sniffed)
     * @param mappingPreface what was found before the columns (the sniffer's words), or empty
     */
    ImportedSweep read(String profileLabel, String mappingPreface) throws InputProblem {
        MessageDigest sha256;
        try {
            sha256 = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
        long lineNo = 0;
        try (InputStream raw = Files.newInputStream(file);
             DigestInputStream hashed = new DigestInputStream(raw, sha256)) {
            CharsetDecoder decoder = layout.encoding().charset().newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
            BoundedLines reader = new BoundedLines(new InputStreamReader(hashed, decoder), file, limits.maxLineChars());
            if (!layout.header()) {
                resolveNumbered();
            }
            String line;
            while ((line = reader.next()) != null) {
                lineNo = reader.lineNo();
                if (lineNo == 1) {
                    line = withoutByteOrderMark(line);
                }
                take(lineNo, line);
            }
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (CharacterCodingException e) {
            long bad = firstUndecodableLine();
            throw new InputProblem(file, bad, "bytes that are not " + layout.encoding().word() + " text",
                    layout.encoding() == TextEncoding.UTF_8
                            ? "if the file is Latin-1 (ISO-8859-1), use a profile with 'encoding: latin-1'; "
                              + "or save the file as UTF-8"
                            : "save the file as " + layout.encoding().word());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
        if (assembly == null) {
            throw new InputProblem(file, Math.max(lineNo, 0), lineNo == 0 ? "the file is empty"
                    : "no header row found (every line is preamble, comment or blank)",
                    "check the profile's preamble-lines and comment prefixes");
        }
        String sha = HexFormat.of().formatHex(sha256.digest());
        Sweep sweep = assembly.finish(notes.provenance(file, sha, profile.name()), lineNo);
        String described = mappingPreface + String.join("; ", mapping) + "; " + profile.scale().describe();
        return new ImportedSweep(sweep, profileLabel, described, tally.warnings());
    }

    private String withoutByteOrderMark(String line) {
        if (line.startsWith("\uFEFF")) {
            return line.substring(1);
        }
        if (line.startsWith("\u00EF\u00BB\u00BF")) {
            tally.add("encoding notes", 1, "the file starts with a UTF-8 byte-order mark but the profile says "
                    + layout.encoding().word() + "; the mark is skipped, but other text may read wrongly");
            return line.substring(3);
        }
        return line;
    }

    private void take(long lineNo, String line) throws InputProblem {
        if (lineNo <= layout.preambleLines()) {
            if (!line.isBlank()) {
                notes.note("preamble: " + line.strip());
            }
            return;
        }
        if (layout.isComment(line)) {
            String prefix = layout.commentPrefixes().stream().filter(line::startsWith).findFirst().orElse("");
            notes.accept(lineNo, line.substring(prefix.length()), tally);
            return;
        }
        if (assembly == null) {
            if (line.isBlank()) {
                return;
            }
            resolveHeader(lineNo, line);
            return;
        }
        if (line.isBlank()) {
            tally.add("empty rows", lineNo, "empty row; skipped");
            return;
        }
        readRow(lineNo, line);
    }

    private void resolveNumbered() {
        TableColumns columns = profile.columns();
        frequencyColumn = numbered(columns.frequency(), "frequency");
        gainColumn = columns.gain().map(c -> numbered(c, "gain")).orElse(-1);
        inputColumn = columns.inputAmplitude().map(c -> numbered(c, "input amplitude")).orElse(-1);
        outputColumn = columns.outputAmplitude().map(c -> numbered(c, "output amplitude")).orElse(-1);
        phaseColumn = columns.phase().map(c -> numbered(c, "phase")).orElse(-1);
        gainUncertaintyColumn = columns.gainUncertainty().map(c -> numbered(c, "gain uncertainty")).orElse(-1);
        phaseUncertaintyColumn = columns.phaseUncertainty().map(c -> numbered(c, "phase uncertainty")).orElse(-1);
        assembly = new SweepAssembly(file, profile, phaseColumn >= 0, tally, limits.maxPoints());
    }

    private int numbered(ColumnRef column, String what) {
        mapping.add(what + " = column " + column.number());
        return column.number() - 1;
    }

    private void resolveHeader(long lineNo, String line) throws InputProblem {
        int count = splitter.split(line);
        headerLine = lineNo;
        headerCells = filledCells(count);
        List<String> header = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            header.add(splitter.text(i));
        }
        TableColumns columns = profile.columns();
        frequencyColumn = resolve(columns.frequency(), header, lineNo, "frequency");
        gainColumn = resolve(columns.gain(), header, lineNo, "gain");
        inputColumn = resolve(columns.inputAmplitude(), header, lineNo, "input amplitude");
        outputColumn = resolve(columns.outputAmplitude(), header, lineNo, "output amplitude");
        phaseColumn = resolve(columns.phase(), header, lineNo, "phase");
        gainUncertaintyColumn = resolve(columns.gainUncertainty(), header, lineNo, "gain uncertainty");
        phaseUncertaintyColumn = resolve(columns.phaseUncertainty(), header, lineNo, "phase uncertainty");
        if (phaseColumn < 0) {
            phaseUncertaintyColumn = -1;
        }
        assembly = new SweepAssembly(file, profile, phaseColumn >= 0, tally, limits.maxPoints());
    }

    private int resolve(Optional<ColumnRef> column, List<String> header, long lineNo, String what) throws InputProblem {
        return column.isPresent() ? resolve(column.get(), header, lineNo, what) : -1;
    }

    private int resolve(ColumnRef column, List<String> header, long lineNo, String what) throws InputProblem {
        if (column.byNumber()) {
            int index = column.number() - 1;
            String name = index < header.size() ? " '" + header.get(index) + "'" : "";
            mapping.add(what + " = column " + column.number() + name);
            return index;
        }
        for (int i = 0; i < header.size(); i++) {
            if (column.matches(header.get(i))) {
                mapping.add(what + " = column " + (i + 1) + " '" + header.get(i) + "'");
                return i;
            }
        }
        if (column.optional()) {
            return -1;
        }
        throw new InputProblem(file, lineNo, "profile '" + profile.name() + "' looks for a " + what + " column named "
                + quoteAll(column.names()) + ", but the header row has " + quoteAll(header),
                "choose the profile that matches this file (polebench profiles), try --profile auto, "
                        + "or write a profile naming these columns");
    }

    private static String quoteAll(List<String> names) {
        List<String> quoted = new ArrayList<>();
        for (String name : names) {
            quoted.add("'" + printable(name) + "'");
        }
        return quoted.isEmpty() ? "no cells" : String.join(", ", quoted);
    }

    private void readRow(long lineNo, String line) throws InputProblem {
        int count = splitter.split(line);
        if (splitter.unclosedQuote()) {
            tally.add("unclosed quotes", lineNo, "a quote opened in this row is never closed; row skipped");
            return;
        }
        int filled = filledCells(count);
        if (filled == 0) {
            tally.add("empty rows", lineNo, "empty row (delimiters only); skipped");
            return;
        }
        if (headerCells > 0 && filled > headerCells) {
            throw moreCellsThanHeader(lineNo, filled);
        }
        double frequency = reading(line, lineNo, frequencyColumn, "frequency", false);
        if (Double.isNaN(frequency)) {
            return;
        }
        double gain = Double.NaN;
        double input = Double.NaN;
        double output = Double.NaN;
        if (gainColumn >= 0) {
            gain = reading(line, lineNo, gainColumn, "gain", true);
            if (Double.isNaN(gain)) {
                return;
            }
        } else {
            input = reading(line, lineNo, inputColumn, "input amplitude", true);
            if (Double.isNaN(input)) {
                return;
            }
            output = reading(line, lineNo, outputColumn, "output amplitude", true);
            if (Double.isNaN(output)) {
                return;
            }
        }
        double phase = Double.NaN;
        if (phaseColumn >= 0) {
            phase = reading(line, lineNo, phaseColumn, "phase", true);
            if (Double.isNaN(phase)) {
                return;
            }
        }
        rowRejected = false;
        double uGain = uncertainty(line, lineNo, gainUncertaintyColumn, "gain uncertainty");
        double uPhase = uncertainty(line, lineNo, phaseUncertaintyColumn, "phase uncertainty");
        if (rowRejected) {
            return;
        }
        assembly.offer(lineNo, frequency, gain, input, output, phase, uGain, uPhase);
    }

    /**
     * @return the cells up to the last one that is not blank: a trailing delimiter, as some
     *         instruments write, adds no cell
     */
    private int filledCells(int count) {
        int filled = count;
        while (filled > 0 && splitter.blank(filled - 1)) {
            filled--;
        }
        return filled;
    }

    /**
     * A row with more cells than the header cannot be matched to the named columns: every cell
     * after the split would be read one column to the right (a decimal comma in a comma-separated
     * file does exactly this), so the file is refused rather than read shifted.
     */
    private InputProblem moreCellsThanHeader(long lineNo, int filled) {
        String hint = layout.delimiter() == Delimiter.COMMA && !layout.decimalComma()
                ? "if the numbers use a decimal comma, read the file with a profile whose delimiter is not a comma "
                  + "and whose decimal-mark is comma, or save it with decimal points; otherwise remove the extra cells"
                : "remove the extra cells, or give the header row a name for every column";
        return new InputProblem(file, lineNo, "the row has " + filled + " cells but the header row (line " + headerLine
                + ") names " + headerCells + "; its readings would be taken from the wrong columns", hint);
    }

    /** @return the cell's number (±Infinity when too large), or NaN after warning why there is none */
    private double reading(String line, long lineNo, int column, String what, boolean mayOverload) {
        if (column >= splitter.count()) {
            tally.add("rows with missing cells", lineNo, "the row has " + splitter.count() + " cell"
                    + (splitter.count() == 1 ? "" : "s") + "; the " + what + " (column " + (column + 1)
                    + ") is missing; row skipped");
            return Double.NaN;
        }
        if (splitter.blank(column)) {
            tally.add("rows with missing cells", lineNo, "the " + what + " cell (column " + (column + 1)
                    + ") is empty; row skipped");
            return Double.NaN;
        }
        double value = splitter.number(column, layout.decimalComma());
        if (Double.isNaN(value)) {
            String text = splitter.text(column);
            if (mayOverload && profile.limits().isOverloadMarker(text)) {
                tally.add("clipped readings", lineNo, "the " + what + " reads '" + text
                        + "': the instrument was saturated; row dropped");
            } else if (looksNonFinite(text)) {
                tally.add("non-numeric cells", lineNo, "the " + what + " (column " + (column + 1) + ") is '"
                        + printable(text) + "', which is not a reading; row skipped");
            } else {
                tally.add("non-numeric cells", lineNo, "the " + what + " (column " + (column + 1) + ") '"
                        + printable(text) + "' is not a number" + decimalHint(text) + "; row skipped");
            }
        }
        return value;
    }

    /**
     * @return NaN when the cell is absent or blank (use the profile's default), else the value;
     *         a cell that is not a number is warned about and sets {@link #rowRejected}
     */
    private double uncertainty(String line, long lineNo, int column, String what) {
        if (column < 0 || column >= splitter.count() || splitter.blank(column)) {
            return Double.NaN;
        }
        double value = splitter.number(column, layout.decimalComma());
        if (Double.isNaN(value)) {
            tally.add("non-numeric cells", lineNo, "the " + what + " (column " + (column + 1) + ") '"
                    + printable(splitter.text(column)) + "' is not a number; row skipped");
            rowRejected = true;
        }
        return value;
    }

    private String decimalHint(String text) {
        if (!layout.decimalComma() && text.matches("[+-]?\\d+,\\d+")) {
            return " (a decimal comma? this profile expects a point)";
        }
        if (layout.decimalComma() && text.matches("[+-]?\\d*\\.\\d+")) {
            return " (a decimal point? this profile expects a comma)";
        }
        return "";
    }

    private static boolean looksNonFinite(String text) {
        String key = text.toLowerCase(Locale.ROOT);
        return key.contains("nan") || key.contains("inf");
    }

    /** @return the text cut to 32 characters with control characters shown as '?', fit for a message */
    static String printable(String text) {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < text.length() && out.length() < 32; i++) {
            char c = text.charAt(i);
            out.append(Character.isISOControl(c) || Character.isSurrogate(c) ? '?' : c);
        }
        return text.length() > 32 ? out + "…" : out.toString();
    }

    /** @return the 1-based line of the first byte sequence the profile's encoding cannot decode */
    private long firstUndecodableLine() {
        try (InputStream in = Files.newInputStream(file)) {
            CharsetDecoder decoder = layout.encoding().charset().newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
            ByteBuffer bytes = ByteBuffer.allocate(1 << 16);
            CharBuffer chars = CharBuffer.allocate(1 << 16);
            long line = 1;
            boolean end = false;
            while (!end) {
                int read = in.read(bytes.array(), bytes.position(), bytes.remaining());
                if (read < 0) {
                    end = true;
                } else {
                    bytes.position(bytes.position() + read);
                }
                bytes.flip();
                CoderResult result = decoder.decode(bytes, chars, end);
                chars.flip();
                while (chars.hasRemaining()) {
                    if (chars.get() == '\n') {
                        line++;
                    }
                }
                chars.clear();
                if (result.isError()) {
                    return line;
                }
                bytes.compact();
            }
            return line;
        } catch (IOException e) {
            return 0;
        }
    }
}

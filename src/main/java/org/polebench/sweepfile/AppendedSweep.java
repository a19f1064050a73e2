package org.polebench.sweepfile;

import java.io.BufferedWriter;
import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.SweepPoint;

/**
 * A canonical sweep file ({@link SweepWriter}) filled one point at a time during a capture:
 * the comment lines and header go out first, then each point's row is written and flushed
 * as soon as it is measured, so a capture that stops keeps every completed point on disk.
 * Reopening such a file reads its points back exactly (rows are written with
 * {@link Double#toString}) and cuts off a last row left without its line ending.
 *
 * <p>Not thread-safe; one per capture.
 */
public final class AppendedSweep implements Closeable {
    private final Path file;
    private final List<String> comments;
    private final String header;
    private final boolean phase;
    private final boolean uGain;
    private final boolean uPhase;
    private final List<SweepPoint> points;
    private final OutputStream out;
    private final StringBuilder row = new StringBuilder(96);

    private AppendedSweep(Path file, List<String> comments, String header, List<SweepPoint> points,
                          OutputStream out) {
        this.file = file;
        this.comments = List.copyOf(comments);
        this.header = header;
        this.phase = header.contains(",phase_deg");
        this.uGain = header.contains(",u_gain_db");
        this.uPhase = header.contains(",u_phase_deg");
        this.points = new ArrayList<>(points);
        this.out = out;
    }

    /**
     * Starts a new file.
     *
     * @throws InputProblem when the file exists already (it is left as it is)
     */
    public static AppendedSweep create(Path file, Provenance source, boolean phase, boolean uGain, boolean uPhase)
            throws InputProblem, IOException {
        StringWriter text = new StringWriter();
        SweepWriter.canonicalHeader(source, phase, uGain, uPhase && phase, text);
        Path parent = file.toAbsolutePath().getParent();
        Files.createDirectories(parent);
        OutputStream stream;
        try {
            stream = Files.newOutputStream(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        } catch (java.nio.file.FileAlreadyExistsException e) {
            throw new InputProblem(file, 0, "the sweep file exists and is left as it is",
                    "continue it with --resume, or choose another --out name");
        }
        stream.write(text.toString().getBytes(StandardCharsets.UTF_8));
        stream.flush();
        List<String> lines = text.toString().lines().toList();
        return new AppendedSweep(file, lines.subList(0, lines.size() - 1), lines.get(lines.size() - 1), List.of(),
                stream);
    }

    /**
     * Opens a file written by an earlier capture to add points to it.
     *
     * @throws InputProblem when the file is missing or is not a capture's canonical sweep
     */
    public static AppendedSweep reopen(Path file) throws InputProblem, IOException {
        if (!Files.isRegularFile(file)) {
            throw new InputProblem(file, 0, "there is no sweep file to resume",
                    "give the --out name of the interrupted capture (NAME for NAME.sweep.csv)");
        }
        String text = Files.readString(file, StandardCharsets.UTF_8);
        int end = text.lastIndexOf('\n') + 1;
        if (end < text.length()) {
            // a row cut short when the capture stopped: it was never a completed point
            try (FileChannel channel = FileChannel.open(file, StandardOpenOption.WRITE)) {
                channel.truncate(text.getBytes(StandardCharsets.UTF_8).length
                        - text.substring(end).getBytes(StandardCharsets.UTF_8).length);
            }
            text = text.substring(0, end);
        }
        List<String> comments = new ArrayList<>();
        String header = null;
        List<SweepPoint> points = new ArrayList<>();
        long lineNo = 0;
        for (String line : text.lines().toList()) {
            lineNo++;
            if (header == null) {
                if (line.startsWith("#")) {
                    comments.add(line);
                    continue;
                }
                header = line.strip();
                if (!header.startsWith("frequency_hz,gain_db")) {
                    throw new InputProblem(file, lineNo, "this is not a sweep file written by polebench capture",
                            "resume only a capture's own NAME.sweep.csv");
                }
                continue;
            }
            if (line.isBlank()) {
                continue;
            }
            points.add(parseRow(file, lineNo, line, header));
        }
        if (comments.isEmpty() || !comments.get(0).equals("# " + SweepWriter.MARKER) || header == null) {
            throw new InputProblem(file, 1, "this is not a sweep file written by polebench capture",
                    "resume only a capture's own NAME.sweep.csv");
        }
        OutputStream stream = Files.newOutputStream(file, StandardOpenOption.APPEND);
        return new AppendedSweep(file, comments, header, points, stream);
    }

    private static SweepPoint parseRow(Path file, long lineNo, String line, String header) throws InputProblem {
        String[] cells = line.strip().split(",", -1);
        String[] names = header.split(",");
        if (cells.length != names.length) {
            throw new InputProblem(file, lineNo, "row has " + cells.length + " cells, the header " + names.length,
                    "the file was changed after the capture; restore it or start a new capture");
        }
        double[] values = new double[cells.length];
        for (int i = 0; i < cells.length; i++) {
            try {
                values[i] = Double.parseDouble(cells[i]);
            } catch (NumberFormatException e) {
                throw new InputProblem(file, lineNo, "cell '" + cells[i] + "' is not a number",
                        "the file was changed after the capture; restore it or start a new capture");
            }
        }
        OptionalDouble phase = OptionalDouble.empty();
        OptionalDouble uGain = OptionalDouble.empty();
        OptionalDouble uPhase = OptionalDouble.empty();
        for (int i = 2; i < names.length; i++) {
            switch (names[i]) {
                case "phase_deg":
                    phase = OptionalDouble.of(values[i]);
                    break;
                case "u_gain_db":
                    uGain = OptionalDouble.of(values[i]);
                    break;
                case "u_phase_deg":
                    uPhase = OptionalDouble.of(values[i]);
                    break;
                default:
                    throw new InputProblem(file, lineNo, "unknown column " + names[i], "resume only a capture's own file");
            }
        }
        try {
            return new SweepPoint(values[0], values[1], phase, uGain, uPhase);
        } catch (IllegalArgumentException e) {
            throw new InputProblem(file, lineNo, e.getMessage(), "the file was changed after the capture");
        }
    }

    public Path file() {
        return file;
    }

    /** @return the points on file, in the order measured */
    public List<SweepPoint> points() {
        return List.copyOf(points);
    }

    public Optional<SweepPoint> last() {
        return points.isEmpty() ? Optional.empty() : Optional.of(points.get(points.size() - 1));
    }

    public boolean hasPhase() {
        return phase;
    }

    public boolean hasGainUncertainty() {
        return uGain;
    }

    public boolean hasPhaseUncertainty() {
        return uPhase;
    }

    /** @return the value of the first {@code # key: value} comment with this key */
    public Optional<String> comment(String key) {
        String prefix = "# " + key + ":";
        for (String line : comments) {
            if (line.startsWith(prefix)) {
                return Optional.of(line.substring(prefix.length()).strip());
            }
        }
        return Optional.empty();
    }

    /** @return the values of the {@code # note: …} comments, in order */
    public List<String> notes() {
        List<String> notes = new ArrayList<>();
        for (String line : comments) {
            if (line.startsWith("# note:")) {
                notes.add(line.substring("# note:".length()).strip());
            }
        }
        return notes;
    }

    /** Writes one point's row and hands it to the operating system at once. */
    public void append(SweepPoint point) throws IOException {
        row.setLength(0);
        SweepWriter.canonicalRow(point, phase, uGain, uPhase, row);
        row.append('\n');
        out.write(row.toString().getBytes(StandardCharsets.US_ASCII));
        out.flush();
        points.add(point);
    }

    /**
     * Shifts every phase by the whole turns that bring the highest-gain point (the midband)
     * into (−180°, 180°], the convention the importer keeps (see {@link SweepAssembly}), and
     * rewrites the file in place atomically when a shift is needed. A capture unwraps each
     * point against the one before, so only this final shift depends on the whole sweep.
     *
     * @return the shift in degrees, a multiple of 360 (0 when nothing was rewritten)
     */
    public double settlePhaseTurns() throws IOException {
        if (!phase || points.isEmpty()) {
            return 0;
        }
        int best = 0;
        for (int i = 1; i < points.size(); i++) {
            if (points.get(i).gainDb() > points.get(best).gainDb()) {
                best = i;
            }
        }
        double reference = points.get(best).phaseDeg().getAsDouble();
        double shift = PhaseUnwrap.fold(reference) - reference;
        shift = 360.0 * Math.rint(shift / 360.0);
        if (shift == 0) {
            return 0;
        }
        out.flush();
        List<SweepPoint> shifted = new ArrayList<>(points.size());
        for (SweepPoint p : points) {
            shifted.add(new SweepPoint(p.frequencyHz(), p.gainDb(), OptionalDouble.of(p.phaseDeg().getAsDouble() + shift),
                    p.gainUncertaintyDb(), p.phaseUncertaintyDeg()));
        }
        try {
            OutputFile.write(file, true, stream -> {
                Writer writer = new BufferedWriter(new OutputStreamWriter(stream, StandardCharsets.UTF_8));
                for (String line : comments) {
                    writer.write(line);
                    writer.write('\n');
                }
                writer.write(header);
                writer.write('\n');
                StringBuilder text = new StringBuilder(96);
                for (SweepPoint p : shifted) {
                    text.setLength(0);
                    SweepWriter.canonicalRow(p, phase, uGain, uPhase, text);
                    writer.append(text).append('\n');
                }
                writer.flush();
            });
        } catch (InputProblem e) {
            // the file is the capture's own, made by create(): a regular file it may replace
            throw new IllegalStateException("the capture's own file cannot be rewritten: " + e.describe(), e);
        }
        points.clear();
        points.addAll(shifted);
        return shift;
    }

    /** Hands everything written to the disk itself, as far as the operating system allows. */
    public void force() throws IOException {
        out.flush();
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.WRITE)) {
            channel.force(true);
        }
    }

    @Override
    public void close() throws IOException {
        out.close();
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "%s (%d points)", file, points.size());
    }
}

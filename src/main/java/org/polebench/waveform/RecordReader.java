package org.polebench.waveform;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import org.polebench.InputProblem;
import org.polebench.profile.Delimiter;
import org.polebench.profile.FrequencySource;
import org.polebench.profile.SampleCoding;
import org.polebench.profile.WaveformLayout;
import org.polebench.profile.WaveformProfile;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import org.polebench.units.StrictNumber;

/**
 * Reads one waveform record file through a waveform profile: the header lines (searched for the
 * sample interval and the stated frequency; comment and blank lines are searched too and do not
 * count as header lines), then one sample row per line, of which only the
 * time, input and output cells are parsed. Samples go into growing arrays, so memory is that of
 * one record. Sample times from a time column must be evenly spaced (the fits assume it).
 */
final class RecordReader {
    /** A time column may stray this far, in sample intervals, from the even grid (scope timestamps are rounded). */
    static final double TIME_JITTER_INTERVALS = 0.25;
    /** A record line longer than this is not a sample row (a binary file read by mistake). */
    static final int MAX_LINE_BYTES = 1 << 20;

    private final WaveformProfile profile;

    RecordReader(WaveformProfile profile) {
        this.profile = profile;
    }

    /**
     * @param sha256 fed every byte of the file
     * @throws InputProblem naming the file and line when the record does not read
     */
    WaveformRecord read(Path file, MessageDigest sha256) throws InputProblem {
        WaveformLayout layout = profile.layout();
        SampleCoding coding = profile.coding();
        int timeColumn = profile.clock().timeColumn().orElse(0);
        int inColumn = profile.channels().input();
        int outColumn = profile.channels().output();
        int widest = Math.max(profile.channels().widest(), timeColumn);
        char delimiter = layout.delimiter().character();
        boolean spaces = layout.delimiter() == Delimiter.SPACES;
        List<String> headerText = new ArrayList<>();
        double[] times = new double[timeColumn > 0 ? 4096 : 0];
        double[] in = new double[4096];
        double[] out = new double[4096];
        int count = 0;
        int firstLine = 0;
        boolean contiguous = true;
        int lastLine = 0;
        int headerSeen = 0;
        double[] cells = new double[widest + 1];
        byte[][] prefixes = new byte[layout.commentPrefixes().size()][];
        for (int k = 0; k < prefixes.length; k++) {
            prefixes[k] = layout.commentPrefixes().get(k).getBytes(StandardCharsets.UTF_8);
        }
        byte delimiterByte = (byte) delimiter;
        Bytes view = new Bytes();
        try (InputStream raw = Files.newInputStream(file);
             java.security.DigestInputStream hashed = new java.security.DigestInputStream(raw, sha256)) {
            // lines are cut from the bytes in place (sample rows are ASCII): no decoding and no
            // String per row, which is most of the time of a 100,000-row record
            byte[] buffer = new byte[1 << 16];
            int filled = 0;
            int lineStart = 0;
            int lineNo = 0;
            boolean eof = false;
            while (true) {
                int newline = -1;
                for (int i = lineStart; i < filled; i++) {
                    if (buffer[i] == '\n') {
                        newline = i;
                        break;
                    }
                }
                if (newline < 0 && !eof) {
                    // keep the partial line, refill behind it (growing the buffer for a long line)
                    int partial = filled - lineStart;
                    if (partial == buffer.length) {
                        if (buffer.length >= MAX_LINE_BYTES) {
                            throw new InputProblem(file, lineNo + 1, "a line is longer than " + MAX_LINE_BYTES
                                    + " bytes", "check that this is a waveform record with one sample a line");
                        }
                        buffer = Arrays.copyOf(buffer, buffer.length * 2);
                    } else if (lineStart > 0) {
                        System.arraycopy(buffer, lineStart, buffer, 0, partial);
                    }
                    filled = partial;
                    lineStart = 0;
                    int read = hashed.read(buffer, filled, buffer.length - filled);
                    if (read < 0) {
                        eof = true;
                    } else {
                        filled += read;
                    }
                    continue;
                }
                int lineEnd = newline >= 0 ? newline : filled;
                if (newline < 0 && lineStart == filled) {
                    break;
                }
                lineNo++;
                int from = lineStart;
                int to = lineEnd > from && buffer[lineEnd - 1] == '\r' ? lineEnd - 1 : lineEnd;
                lineStart = newline >= 0 ? newline + 1 : filled;
                if (lineNo == 1 && to - from >= 3 && (buffer[from] & 0xff) == 0xEF && (buffer[from + 1] & 0xff) == 0xBB
                        && (buffer[from + 2] & 0xff) == 0xBF) {
                    from += 3;
                }
                if (blank(buffer, from, to) || commented(buffer, from, to, prefixes)) {
                    if (count == 0 && headerText.size() < 1000) {
                        headerText.add(new String(buffer, from, to - from, StandardCharsets.UTF_8));
                    }
                    continue;
                }
                if (headerSeen < layout.headerLines()) {
                    headerSeen++;
                    headerText.add(new String(buffer, from, to - from, StandardCharsets.UTF_8));
                    continue;
                }
                view.bytes = buffer;
                cut(file, lineNo, view, from, to, delimiterByte, spaces, layout.decimalComma(), cells, widest);
                if (!Double.isFinite(cells[inColumn] + cells[outColumn] + (timeColumn > 0 ? cells[timeColumn] : 0))) {
                    int column = !Double.isFinite(cells[inColumn]) ? inColumn
                            : !Double.isFinite(cells[outColumn]) ? outColumn : timeColumn;
                    throw new InputProblem(file, lineNo, "column " + column + " of this sample row is not a number",
                            "check the profile's header-lines, delimiter and decimal-mark against the record");
                }
                if (count == in.length) {
                    int grown = count * 2;
                    in = Arrays.copyOf(in, grown);
                    out = Arrays.copyOf(out, grown);
                    if (timeColumn > 0) {
                        times = Arrays.copyOf(times, grown);
                    }
                }
                if (timeColumn > 0) {
                    times[count] = cells[timeColumn];
                }
                in[count] = coding.volts(cells[inColumn]);
                out[count] = coding.volts(cells[outColumn]);
                if (count == 0) {
                    firstLine = lineNo;
                } else if (lineNo != lastLine + 1) {
                    contiguous = false;
                }
                lastLine = lineNo;
                count++;
            }
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
        if (count < 2) {
            throw new InputProblem(file, 0, "the record holds " + count + " sample rows",
                    "check the profile's header-lines and delimiter against the file");
        }
        double start;
        double interval;
        if (timeColumn > 0) {
            start = times[0];
            interval = (times[count - 1] - times[0]) / (count - 1);
            if (!(interval > 0) || !Double.isFinite(interval)) {
                throw new InputProblem(file, firstLine, "the time column does not increase",
                        "check that column " + timeColumn + " holds the sample times in seconds");
            }
            for (int i = 0; i < count; i++) {
                if (Math.abs(times[i] - (start + i * interval)) > TIME_JITTER_INTERVALS * interval) {
                    throw new InputProblem(file, contiguous ? firstLine + i : 0, "sample " + (i + 1)
                            + " is off the even time grid (" + times[i] + " s); the sine fits need evenly spaced samples",
                            "save the record without gaps or segments");
                }
            }
        } else {
            start = 0;
            interval = headerNumber(file, headerText, profile.clock().intervalPattern().orElseThrow(), "seconds",
                    Quantity.SECONDS).orElseThrow(() -> new InputProblem(file, 0,
                    "no header line gives the sample interval",
                    "the profile looks for " + profile.clock().intervalPattern().orElseThrow().pattern()));
            if (!(interval > 0) || !Double.isFinite(interval)) {
                throw new InputProblem(file, 0, "the sample interval " + interval + " s is not positive",
                        "check the record's header");
            }
        }
        return new WaveformRecord(file, start, interval, in, out, count, statedFrequency(file, headerText),
                contiguous ? firstLine : 0);
    }

    private OptionalDouble statedFrequency(Path file, List<String> headerText) throws InputProblem {
        FrequencySource source = profile.frequency();
        switch (source.from()) {
            case HEADER:
                return headerNumber(file, headerText, source.pattern().orElseThrow(), "hz", Quantity.HERTZ);
            case FILE_NAME:
                return number(file, source.pattern().orElseThrow().matcher(file.getFileName().toString()), "hz",
                        Quantity.HERTZ);
            case ESTIMATED:
            default:
                return OptionalDouble.empty();
        }
    }

    private OptionalDouble headerNumber(Path file, List<String> lines, Pattern pattern, String group, Quantity quantity)
            throws InputProblem {
        for (String line : lines) {
            OptionalDouble value = number(file, pattern.matcher(line), group, quantity);
            if (value.isPresent()) {
                return value;
            }
        }
        return OptionalDouble.empty();
    }

    private OptionalDouble number(Path file, Matcher matcher, String group, Quantity quantity) throws InputProblem {
        if (!matcher.find()) {
            return OptionalDouble.empty();
        }
        String text = matcher.group(group).strip();
        if (profile.layout().decimalComma()) {
            text = text.replace(',', '.');
        }
        try {
            return OptionalDouble.of(EngineeringValue.parse(text, quantity));
        } catch (IllegalArgumentException e) {
            throw new InputProblem(file, 0, "'" + text + "' (group " + group + " of " + matcher.pattern().pattern()
                    + ") is not a number: " + e.getMessage(), "check the profile's pattern against the record");
        }
    }

    private static boolean blank(byte[] b, int from, int to) {
        for (int i = from; i < to; i++) {
            if (b[i] != ' ' && b[i] != '\t') {
                return false;
            }
        }
        return true;
    }

    private static boolean commented(byte[] b, int from, int to, byte[][] prefixes) {
        for (byte[] prefix : prefixes) {
            if (to - from >= prefix.length && Arrays.equals(b, from, from + prefix.length, prefix, 0, prefix.length)) {
                return true;
            }
        }
        return false;
    }

    /** A byte array seen as the characters of its Latin-1 reading, for the number parser (rows are ASCII). */
    private static final class Bytes implements CharSequence {
        byte[] bytes;

        @Override
        public int length() {
            return bytes.length;
        }

        @Override
        public char charAt(int index) {
            return (char) (bytes[index] & 0xff);
        }

        @Override
        public CharSequence subSequence(int start, int end) {
            return new String(bytes, start, end - start, StandardCharsets.ISO_8859_1);
        }

        @Override
        public String toString() {
            return new String(bytes, StandardCharsets.ISO_8859_1);
        }
    }

    /**
     * Cuts one sample row and parses its cells up to {@code widest} (1-based) into {@code cells};
     * cells beyond are not looked at. Double quotes around a cell are dropped.
     */
    private static void cut(Path file, int lineNo, Bytes line, int start, int end, byte delimiter, boolean spaces,
                            boolean decimalComma, double[] cells, int widest) throws InputProblem {
        byte[] b = line.bytes;
        int length = end;
        int column = 0;
        int i = start;
        while (column < widest) {
            if (spaces) {
                while (i < length && (b[i] == ' ' || b[i] == '\t')) {
                    i++;
                }
            }
            if (i > length || (spaces && i == length)) {
                break;
            }
            int from = i;
            while (i < length && (spaces ? b[i] != ' ' && b[i] != '\t' : b[i] != delimiter)) {
                i++;
            }
            int to = i;
            column++;
            while (from < to && b[from] == ' ') {
                from++;
            }
            while (to > from && b[to - 1] == ' ') {
                to--;
            }
            if (to - from >= 2 && b[from] == '"' && b[to - 1] == '"') {
                from++;
                to--;
            }
            double value = StrictNumber.parse(line, from, to, decimalComma);
            cells[column] = value;
            if (!Double.isFinite(value)) {
                // only the cells the profile names need be numbers
                cells[column] = Double.NaN;
            }
            i++;    // past the delimiter
        }
        if (column < widest) {
            throw new InputProblem(file, lineNo, "the row has " + column + " cells; the profile reads up to column "
                    + widest, "check the profile's delimiter and columns against the record");
        }
    }
}

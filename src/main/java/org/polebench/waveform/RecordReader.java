package org.polebench.waveform;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
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
        try (InputStream raw = Files.newInputStream(file);
             java.security.DigestInputStream hashed = new java.security.DigestInputStream(raw, sha256)) {
            CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);
            BufferedReader reader = new BufferedReader(new InputStreamReader(hashed, decoder), 1 << 16);
            String line;
            int lineNo = 0;
            while ((line = reader.readLine()) != null) {
                lineNo++;
                if (lineNo == 1 && line.startsWith("\uFEFF")) {
                    line = line.substring(1);
                }
                if (line.isBlank() || commented(line, layout.commentPrefixes())) {
                    if (count == 0 && headerText.size() < 1000) {
                        headerText.add(line);
                    }
                    continue;
                }
                if (headerSeen < layout.headerLines()) {
                    headerSeen++;
                    headerText.add(line);
                    continue;
                }
                cut(file, lineNo, line, delimiter, spaces, layout.decimalComma(), cells, widest);
                for (int column : new int[] {timeColumn, inColumn, outColumn}) {
                    if (column > 0 && !Double.isFinite(cells[column])) {
                        throw new InputProblem(file, lineNo, "column " + column + " of this sample row is not a number",
                                "check the profile's header-lines, delimiter and decimal-mark against the record");
                    }
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

    private static boolean commented(String line, List<String> prefixes) {
        for (String prefix : prefixes) {
            if (line.startsWith(prefix)) {
                return true;
            }
        }
        return false;
    }

    /**
     * Cuts one sample row and parses its cells up to {@code widest} (1-based) into {@code cells};
     * cells beyond are not looked at. Double quotes around a cell are dropped.
     */
    private static void cut(Path file, int lineNo, String line, char delimiter, boolean spaces, boolean decimalComma,
                            double[] cells, int widest) throws InputProblem {
        int length = line.length();
        int column = 0;
        int i = 0;
        while (column < widest) {
            if (spaces) {
                while (i < length && (line.charAt(i) == ' ' || line.charAt(i) == '\t')) {
                    i++;
                }
            }
            if (i > length || (spaces && i == length)) {
                break;
            }
            int from = i;
            while (i < length && (spaces ? line.charAt(i) != ' ' && line.charAt(i) != '\t' : line.charAt(i) != delimiter)) {
                i++;
            }
            int to = i;
            column++;
            while (from < to && line.charAt(from) == ' ') {
                from++;
            }
            while (to > from && line.charAt(to - 1) == ' ') {
                to--;
            }
            if (to - from >= 2 && line.charAt(from) == '"' && line.charAt(to - 1) == '"') {
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

package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;

/**
 * Seeded random mutations of every valid sample (deleted cells, swapped delimiters, random
 * bytes, truncation, huge numbers, NaN, Inf, stray quotes) never escape as an uncaught
 * exception: each read either gives a sweep or an {@link InputProblem} naming the file and a
 * line (line 0 only for an empty file, which has no line).
 */
class ImportFuzzTest {
    private static final SweepReader READER = new SweepReader(ProfileLibrary.bundled());
    private static final List<String> NAMES = new ArrayList<>();
    private static final List<byte[]> SAMPLES = new ArrayList<>();
    private static final List<String> PROFILES = new ArrayList<>();

    static {
        try {
            for (Map.Entry<String, byte[]> sample : DemoImportSamples.render().entrySet()) {
                NAMES.add(sample.getKey());
                SAMPLES.add(sample.getValue());
                PROFILES.add(sample.getKey().substring(0, sample.getKey().lastIndexOf('.')));
            }
        } catch (IOException e) {
            throw new ExceptionInInitializerError(e);
        }
    }

    @Property(tries = 10_000, seed = "20310402")
    void mutatedFilesGiveASweepOrAProblemNamingALine(@ForAll long seed, @ForAll @IntRange(min = 0, max = 9) int which)
            throws IOException {
        int index = which % SAMPLES.size();
        Random random = new Random(seed);
        byte[] bytes = mutate(SAMPLES.get(index), random);
        Path file = Files.createTempFile("fuzz-", "-" + NAMES.get(index));
        try {
            Files.write(file, bytes);
            for (String profile : List.of(PROFILES.get(index), SweepReader.AUTO)) {
                try {
                    ImportedSweep imported = READER.read(file, profile);
                    assertTrue(imported.sweep().size() >= SweepAssembly.MIN_POINTS);
                } catch (InputProblem problem) {
                    assertEquals(file, problem.file().orElseThrow(), problem.describe());
                    assertTrue(problem.line() >= 1 || bytes.length == 0, problem.describe());
                    assertTrue(problem.line() <= lineCount(bytes), problem.describe());
                }
            }
        } finally {
            Files.deleteIfExists(file);
        }
    }

    private static int lineCount(byte[] bytes) {
        int lines = 1;
        for (byte b : bytes) {
            lines += b == '\n' ? 1 : 0;
        }
        return lines;
    }

    /** One to four mutations of the kinds issue 3 lists. */
    static byte[] mutate(byte[] original, Random random) {
        byte[] bytes = original.clone();
        int count = 1 + random.nextInt(4);
        for (int m = 0; m < count; m++) {
            switch (random.nextInt(8)) {
                case 0:
                    bytes = deleteCell(bytes, random);
                    break;
                case 1:
                    bytes = swapDelimiters(bytes, random);
                    break;
                case 2:
                    for (int k = 0, n = 1 + random.nextInt(8); k < n && bytes.length > 0; k++) {
                        bytes[random.nextInt(bytes.length)] = (byte) random.nextInt(256);
                    }
                    break;
                case 3:
                    bytes = java.util.Arrays.copyOf(bytes, random.nextInt(bytes.length + 1));
                    break;
                default:
                    bytes = replaceNumber(bytes, random, List.of("1e999", "-1e999", "NaN", "Inf", "-Infinity",
                            "1e308", "4.9e-324", "\"", "", "0", "-0", "1.5.5", "9.9E37").get(random.nextInt(13)));
            }
        }
        return bytes;
    }

    private static byte[] deleteCell(byte[] bytes, Random random) {
        String text = new String(bytes, StandardCharsets.ISO_8859_1);
        int at = randomOf(text, random, ",;\t ");
        if (at < 0) {
            return bytes;
        }
        int end = at + 1;
        while (end < text.length() && ",;\t \n".indexOf(text.charAt(end)) < 0) {
            end++;
        }
        return (text.substring(0, at) + text.substring(end)).getBytes(StandardCharsets.ISO_8859_1);
    }

    private static byte[] swapDelimiters(byte[] bytes, Random random) {
        char[] from = {',', ';', '\t', ' '};
        char a = from[random.nextInt(4)];
        char b = from[random.nextInt(4)];
        String text = new String(bytes, StandardCharsets.ISO_8859_1);
        return text.replace(a, b).getBytes(StandardCharsets.ISO_8859_1);
    }

    private static byte[] replaceNumber(byte[] bytes, Random random, String replacement) {
        String text = new String(bytes, StandardCharsets.ISO_8859_1);
        int at = randomOf(text, random, "0123456789");
        if (at < 0) {
            return bytes;
        }
        int start = at;
        while (start > 0 && "0123456789.-+eE".indexOf(text.charAt(start - 1)) >= 0) {
            start--;
        }
        int end = at;
        while (end < text.length() && "0123456789.-+eE".indexOf(text.charAt(end)) >= 0) {
            end++;
        }
        return (text.substring(0, start) + replacement + text.substring(end)).getBytes(StandardCharsets.ISO_8859_1);
    }

    private static int randomOf(String text, Random random, String characters) {
        for (int tries = 0; tries < 50 && !text.isEmpty(); tries++) {
            int at = random.nextInt(text.length());
            if (characters.indexOf(text.charAt(at)) >= 0) {
                return at;
            }
        }
        return -1;
    }
}

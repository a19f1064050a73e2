package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweepfile.SweepReader;
import org.polebench.yaml.YamlReader;

/**
 * Inputs past a stated limit are refused with exit 2 and a message naming the limit and the
 * system property that raises it, before memory runs out (issue 15). The limits are lowered
 * here so that small files reach them; the defaults are the same code with larger numbers.
 */
class StatedLimitsTest {
    @TempDir
    Path dir;

    private String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int exit = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new String[] {Integer.toString(exit), out.toString(), err.toString()};
    }

    @Test
    void tooManySamplesAndPointsAreRefusedNamingTheLimit() {
        // the two values: both far past the default limits (InputLimits.DEFAULTS)
        String[] samples = run("predict", "--samples", "99999999",
                Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml").toString());
        assertEquals("2", samples[0], samples[2]);
        assertTrue(samples[2].contains("polebench.max-samples") && samples[2].contains("99999999"), samples[2]);

        String[] points = run("synthesize", "--stage", Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml")
                .toString(), "--points", "100000000", "--out", dir.resolve("s.csv").toString());
        assertEquals("2", points[0], points[2]);
        assertTrue(points[2].contains("polebench.max-points"), points[2]);
        assertTrue(Files.notExists(dir.resolve("s.csv")));
    }

    private Path table(int rows) throws Exception {
        List<String> lines = new ArrayList<>();
        lines.add("frequency_hz,gain_db,phase_deg");
        for (int i = 0; i < rows; i++) {
            lines.add(String.format(Locale.ROOT, "%d,%.3f,%.2f", 10 + i, -1.0 / (1 + i), 10.0 / (1 + i)));
        }
        return Files.write(dir.resolve("rows.csv"), lines);
    }

    @Test
    void aSweepPastEachLimitIsRefusedNamingIt() throws Exception {
        Path file = table(40);
        ProfileLibrary profiles = ProfileLibrary.bundled();
        // 40 rows kept against a limit of 20 points
        InputProblem points = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class, () -> new SweepReader(
                profiles, new InputLimits(20, 1 << 20, 1 << 30, 1 << 20, 1000)).read(file, "canonical"));
        assertTrue(points.getMessage().contains(InputLimits.MAX_POINTS), points.getMessage());
        assertEquals(22, points.line());   // the header is line 1, so the 21st point is on line 22 (counted)

        // the header line alone has 30 characters, past a limit of 20
        InputProblem line = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class, () -> new SweepReader(
                profiles, new InputLimits(1000, 20, 1 << 30, 1 << 20, 1000)).read(file, "canonical"));
        assertTrue(line.getMessage().contains(InputLimits.MAX_LINE_CHARS), line.getMessage());
        assertEquals(1, line.line());

        InputProblem size = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class, () -> new SweepReader(
                profiles, new InputLimits(1000, 1 << 20, 100, 1 << 20, 1000)).read(file, "auto"));
        assertTrue(size.getMessage().contains(InputLimits.MAX_FILE_BYTES)
                && size.getMessage().contains(Long.toString(Files.size(file))), size.getMessage());
    }

    @Test
    void aLongLineInASerialLogIsRefusedWithItsLineNumber() throws Exception {
        Path log = dir.resolve("long.log");
        Files.writeString(log, "> ID?\n< " + "x".repeat(5000) + "\n");
        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class, () -> new SweepReader(
                ProfileLibrary.bundled(), new InputLimits(1000, 4096, 1 << 30, 1 << 20, 1000))
                .read(log, "streaming-sweeper"));
        assertEquals(2, problem.line());
        assertTrue(problem.hint().contains("-D" + InputLimits.MAX_LINE_CHARS + "="), problem.hint());
    }

    @Test
    void aYamlFilePastItsLimitIsRefusedBeforeItIsRead() throws Exception {
        Path stage = Files.writeString(dir.resolve("big.stage.yaml"), "name: " + "x".repeat(2000) + "\n");
        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                () -> new YamlReader(1024, 1 << 16).read(stage));
        assertTrue(problem.getMessage().contains(InputLimits.MAX_YAML_BYTES), problem.getMessage());
    }

    @Test
    void aLongYamlValueIsRefusedBeforeItIsParsed() throws Exception {
        // the value is on line 2 (counted in the text below)
        Path stage = Files.writeString(dir.resolve("long.stage.yaml"), "# a stage\nname: " + "x".repeat(2000) + "\n");
        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                () -> new YamlReader(1 << 20, 1000).read(stage));
        assertEquals(2, problem.line());
        assertTrue(problem.getMessage().contains(InputLimits.MAX_LINE_CHARS), problem.getMessage());
    }

    @Test
    void aLimitSetToNonsenseIsAUsageError() throws Exception {
        java.util.Properties properties = new java.util.Properties();
        properties.setProperty(InputLimits.MAX_POINTS, "lots");
        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                () -> InputLimits.from(properties));
        assertTrue(problem.getMessage().contains("-D" + InputLimits.MAX_POINTS + "=lots"), problem.getMessage());
        // a set property replaces the default, others keep theirs
        properties.setProperty(InputLimits.MAX_POINTS, "40_000_000");
        assertEquals(40_000_000L, InputLimits.from(properties).maxPoints());
        assertEquals(InputLimits.DEFAULTS.maxSamples(), InputLimits.from(properties).maxSamples());
    }
}

package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class InspectCommandTest {
    private static final String SAMPLE = "sample-measurements/imports/khz-radians.txt";

    @TempDir
    Path dir;

    private static String[] run(int expectedCode, String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        assertEquals(expectedCode, code, out + "\n" + err);
        return new String[] {out.toString(), err.toString()};
    }

    @Test
    void printsPointsBandMappingMidbandAndCorner() {
        String out = run(0, "inspect", SAMPLE)[0];
        assertTrue(out.contains("points:    41 (gain and phase)"), out);
        assertTrue(out.contains("band:      500 mHz to 20 kHz"), out);
        assertTrue(out.contains("'Freq (kHz)'"), out);
        assertTrue(out.contains("warnings:  none"), out);
    }

    @Test
    void warningsComeBeforeTheFiguresReadFromTheData() throws Exception {
        // issue 14: the warnings are printed before the band, midband and corner, not after them
        StringBuilder text = new StringBuilder("Frequency (Hz),Gain (dB),Phase (deg)\n");
        for (double f : new double[] {1, 2, 5, 10, 20, 50, 100, 200, 500, 1000}) {
            text.append(f).append(",20,0\n");
        }
        text.append("abc,20,0\n");
        Path file = dir.resolve("warned.csv");
        Files.writeString(file, text);
        String out = run(0, "inspect", file.toString(), "--profile", "db-degrees")[0];
        int warning = out.indexOf("warnings:  2");  // the bad row and the flat sweep (no corner)
        assertTrue(warning > 0, out);
        assertTrue(warning < out.indexOf("band:") && warning < out.indexOf("midband:"), out);
    }

    @Test
    void jsonHasSnakeCaseKeysAndTheSameFigures() throws Exception {
        JsonNode json = new ObjectMapper().readTree(run(0, "inspect", SAMPLE, "--profile", "khz-radians", "--json")[0]);
        assertEquals(41, json.get("points").asInt());
        assertEquals("khz-radians", json.get("profile").asText());
        // the demo's midband is K = 10, 20 dB (DemoSweeps), printed to 0.001 dB; the top decile's
        // median sits within 0.01 dB of it since the high-band pole is at 80 kHz
        assertEquals(20.0, json.get("midband_gain_db").asDouble(), 0.01);
        assertTrue(json.get("lower_corner_hz").asDouble() > 2 && json.get("lower_corner_hz").asDouble() < 4.5);
        assertTrue(json.get("warnings").isArray());
    }

    @Test
    void exportWritesTheCanonicalSweepAndRefusesToOverwriteWithoutForce() throws Exception {
        Path target = dir.resolve("out.csv");
        run(0, "inspect", SAMPLE, "--export", target.toString());
        assertTrue(Files.readString(target).startsWith("# polebench sweep"));
        Files.writeString(target, "mine\n");
        String err = run(ExitCodes.BAD_INPUT, "inspect", SAMPLE, "--export", target.toString())[1];
        assertTrue(err.contains("--force"), err);
        assertEquals("mine\n", Files.readString(target));
        run(0, "inspect", SAMPLE, "--export", target.toString(), "--force");
        assertTrue(Files.readString(target).startsWith("# polebench sweep"));
    }

    @Test
    void badInputExitsTwoWithFileAndLine() throws Exception {
        Path file = dir.resolve("short.csv");
        Files.writeString(file, "Frequency (Hz),Gain (dB)\n1,2\n2,3\n");
        String err = run(ExitCodes.BAD_INPUT, "inspect", file.toString(), "--profile", "db-degrees")[1];
        assertTrue(err.contains("short.csv:1:"), err);
        err = run(ExitCodes.BAD_INPUT, "inspect", file.toString(), "--profile", "no-such")[1];
        assertTrue(err.contains("no profile named 'no-such'"), err);
    }

    @Test
    void profilesListsEveryShippedProfile() {
        String out = run(0, "profiles")[0];
        for (String name : new String[] {"db-degrees", "linear-ratio", "two-channel-rms", "semicolon-decimal-comma",
                "khz-radians", "magnitude-only", "scpi-generator-meter", "streaming-sweeper", "canonical"}) {
            assertTrue(out.contains(name), name + " missing from\n" + out);
        }
    }
}

package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class FitCommandTest {
    // sample-measurements/imports/db-degrees.csv is written by the test-scope DemoImportSamples from
    // a closed-form two-pole high-pass with poles at 0.8 Hz and 3 Hz and 20 dB midband gain
    private static final String SAMPLE = "sample-measurements/imports/db-degrees.csv";

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    @Test
    void jsonHasTheIssueKeysAndRecoversTheClosedFormPoles() throws IOException {
        String[] run = run("fit", SAMPLE, "--json");
        assertEquals("0", run[0], run[2]);
        JsonNode root = new ObjectMapper().readTree(run[1]);
        for (String key : new String[] {"midband_gain_db", "poles_hz", "zeros_hz", "lower_corner_hz", "order",
                "residual_rms_db", "residual_rms_deg", "warnings"}) {
            assertTrue(root.has(key), key);
        }
        // the sample prints 4 to 5 significant digits, so 1e-3 relative covers its rounding
        assertEquals(20.0, root.get("midband_gain_db").asDouble(), 0.01);
        double slowest = Double.POSITIVE_INFINITY;
        for (JsonNode pole : root.get("poles_hz")) {
            slowest = Math.min(slowest, Math.abs(pole.get("re").asDouble()));
        }
        assertEquals(0.8, slowest, 0.8e-3);
    }

    @Test
    void aPlotIsWrittenAndNeverOverwrittenWithoutForce(@TempDir Path folder) throws IOException {
        Path plot = folder.resolve("bode.svg");
        assertEquals("0", run("fit", SAMPLE, "--plot", plot.toString())[0]);
        assertTrue(Files.readString(plot).contains("<svg"));
        Files.writeString(plot, "keep me");
        String[] again = run("fit", SAMPLE, "--plot", plot.toString());
        assertEquals("" + ExitCodes.BAD_INPUT, again[0]);
        assertEquals("keep me", Files.readString(plot));
        assertEquals("0", run("fit", SAMPLE, "--plot", plot.toString(), "--force")[0]);
    }

    @Test
    void aMalformedBandIsBadInput() {
        assertEquals("" + ExitCodes.BAD_INPUT, run("fit", SAMPLE, "--band", "20kHz:1Hz")[0]);
        assertEquals("" + ExitCodes.BAD_INPUT, run("fit", SAMPLE, "--band", "abc")[0]);
    }
}

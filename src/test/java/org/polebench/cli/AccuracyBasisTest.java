package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * Issue 13: a file read with {@code --profile auto} carries the same instrument accuracy, and so
 * the same uncertainties, as the same file read with the profile whose layout it is; and the
 * output says which basis the calibration term has.
 */
class AccuracyBasisTest {
    private static JsonNode fit(String... args) throws IOException {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        return new ObjectMapper().readTree(out.toString());
    }

    // the shipped table samples, each written by the test-scope DemoImportSamples in its profile's layout
    @ParameterizedTest
    @ValueSource(strings = {"db-degrees.csv", "linear-ratio.csv", "two-channel-rms.csv", "khz-radians.txt",
            "semicolon-decimal-comma.txt"})
    void autoGivesTheNamedProfilesUncertainties(String sample) throws IOException {
        String file = "sample-measurements/imports/" + sample;
        String profile = sample.substring(0, sample.lastIndexOf('.'));
        JsonNode named = fit("fit", file, "--profile", profile, "--json");
        JsonNode auto = fit("fit", file, "--profile", "auto", "--json");
        // the same reading through the same profile: identical numbers, bit for bit
        assertEquals(named.get("midband_gain_u_db").asDouble(), auto.get("midband_gain_u_db").asDouble(), 0.0);
        assertEquals(named.get("lower_corner_hz").get("u").asDouble(), auto.get("lower_corner_hz").get("u").asDouble(),
                0.0);
        assertEquals("profile", auto.get("calibration").get("basis").asText());
        assertTrue(auto.get("calibration").get("statement").asText().contains("profile " + profile),
                auto.get("calibration").toString());
    }

    @Test
    void theMidbandsUncertaintyIsNeverBelowTheProfilesAccuracy() throws IOException {
        // db-degrees states ±0.05 dB, read as rectangular: u = 0.05/√3 dB (GUM 4.3.7); a flat gain
        // error moves the midband one for one, so its u is at least that (1e-12: round-off)
        JsonNode named = fit("fit", "sample-measurements/imports/db-degrees.csv", "--json");
        assertTrue(named.get("midband_gain_u_db").asDouble() >= 0.05 / Math.sqrt(3) * (1 - 1e-12), named.toString());
        assertEquals(0.05 / Math.sqrt(3), named.get("calibration").get("u_gain_db").asDouble(), 1e-15);
        assertEquals(0.5 / Math.sqrt(3), named.get("calibration").get("u_phase_deg").asDouble(), 1e-15);
    }

    @Test
    void theCanonicalFileWithoutUncertaintiesTakesTheDefault() throws IOException {
        JsonNode json = fit("fit", "sample-measurements/imports/canonical.csv", "--json");
        assertEquals("default", json.get("calibration").get("basis").asText());
        // the stated default, ±0.1 dB and ±1° read as rectangular (docs/method.md, "Uncertainty (GUM, JCGM 100:2008)")
        assertEquals(0.1 / Math.sqrt(3), json.get("calibration").get("u_gain_db").asDouble(), 1e-15);
        assertEquals(1 / Math.sqrt(3), json.get("calibration").get("u_phase_deg").asDouble(), 1e-15);
    }
}

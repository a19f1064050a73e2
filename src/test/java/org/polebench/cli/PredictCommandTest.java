package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
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

class PredictCommandTest {

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void jsonCarriesEveryKeyTheIssueNamesAndTheIdentityHolds() throws IOException {
        Run run = run("predict", "--json", "--samples", "200",
                "sample-measurements/hydrophone-preamp-ce.stage.yaml");
        assertEquals(0, run.code(), run.err());
        JsonNode root = new ObjectMapper().readTree(run.out());
        for (String key : new String[] {"midband_gain_db", "sctc_lower_corner_hz", "exact_lower_corner_hz",
                "capacitors", "poles_hz", "zeros_hz", "tolerance_spread", "operating_points"}) {
            assertTrue(root.has(key), key);
        }
        // exact identity Σ 1/τ_i = −Σ Re p_i (docs/method.md, "Exact identities"), in Hz: Σ 1/(2π τ_i) = −Σ Re(p_i)/2π
        double sumInverseTau = 0;
        for (JsonNode capacitor : root.get("capacitors")) {
            sumInverseTau += 1 / capacitor.get("sctc_time_constant_s").asDouble();
        }
        double sumPoles = 0;
        for (JsonNode pole : root.get("poles_hz")) {
            sumPoles += pole.get("re").asDouble();
        }
        assertEquals(sumInverseTau / (2 * Math.PI), -sumPoles, 1e-9 * sumInverseTau);
        // the SCTC corner is Σ 1/τ_i / 2π by definition of the estimate
        assertEquals(sumInverseTau / (2 * Math.PI), root.get("sctc_lower_corner_hz").asDouble(), 1e-9 * sumInverseTau);
        JsonNode spread = root.get("tolerance_spread");
        assertTrue(spread.get("p05_hz").asDouble() <= spread.get("p50_hz").asDouble());
        assertTrue(spread.get("p50_hz").asDouble() <= spread.get("p95_hz").asDouble());
    }

    @Test
    void coupledTwoStageDemoHasOneZeroAtDcPerCouplingCapacitor() throws IOException {
        // three series coupling capacitors (C1, C2, C3) each block DC: H(s) ~ s³ near s = 0,
        // while the two emitter bypasses give zeros at finite frequency (common practice)
        Run run = run("predict", "--json", "--samples", "50", "sample-measurements/geophone-two-stage.stage.yaml");
        assertEquals(0, run.code(), run.err());
        int atDc = 0;
        for (JsonNode zero : new ObjectMapper().readTree(run.out()).get("zeros_hz")) {
            if (zero.get("re").asDouble() == 0 && zero.get("im").asDouble() == 0) {
                atDc++;
            }
        }
        assertEquals(3, atDc);
    }

    @Test
    void withNoStageItRunsTheBundledDemo() {
        Run run = run("predict", "--samples", "50");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("demo"), run.out());
        assertTrue(run.out().contains("SCTC estimate"));
    }

    @Test
    void stageWarningsComeBeforeTheResults(@TempDir Path folder) throws IOException {
        // issue 14: a doubtful value is read before the figures it feeds; 4.7mF is SI milli and warned about
        Path stage = folder.resolve("milli.stage.yaml");
        Files.writeString(stage, Files.readString(Path.of("sample-measurements/hydrophone-preamp-ce.stage.yaml"))
                .replace("{capacitor: 4.7u, between: [in, b],", "{capacitor: 4.7mF, between: [in, b],"));
        Run run = run("predict", "--samples", "50", stage.toString());
        assertEquals(0, run.code(), run.err());
        int warning = run.out().indexOf("m is milli");
        assertTrue(warning > 0, run.out());
        assertTrue(warning < run.out().indexOf("Operating points") && warning < run.out().indexOf("Lower corner"), run.out());
    }

    @Test
    void aBrokenStageExitsTwoWithFileAndLineAndNoStackTrace(@TempDir Path folder) throws IOException {
        Path stage = folder.resolve("broken.stage.yaml");
        Files.writeString(stage, "name: x\nground: gnd\ninput: {node: in, source-resistance: 600}\n"
                + "output: {node: out}\nparts:\n  R1: {resistr: 10k, between: [in, out]}\n");
        Run run = run("predict", stage.toString());
        assertEquals(ExitCodes.BAD_INPUT, run.code());
        assertTrue(run.err().contains("broken.stage.yaml:6"), run.err());
        assertFalse(run.err().contains("at org."), run.err());
    }

    @Test
    void aMissingFileExitsTwo() {
        Run run = run("predict", "no-such.stage.yaml");
        assertEquals(ExitCodes.BAD_INPUT, run.code());
        assertTrue(run.err().contains("no-such.stage.yaml"), run.err());
    }

    @Test
    void helpAndVersionWork() {
        Run help = run("--help");
        assertEquals(0, help.code());
        assertTrue(help.out().contains("predict"));
        assertTrue(help.out().contains("Exit codes"));
        assertEquals(0, run("predict", "--help").code());
        Run version = run("--version");
        assertEquals(0, version.code());
        assertTrue(version.out().startsWith("polebench "));
    }

    @Test
    void anUnknownOptionIsAUsageErrorWithCodeTwo() {
        assertEquals(ExitCodes.BAD_INPUT, run("predict", "--no-such-option").code());
    }
}

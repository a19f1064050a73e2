package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 14: the identification a test report needs (ISO/IEC 17025:2017 7.8.2.1) goes from the
 * options into result.json's {@code run} and onto the report's page 1 and section 1; what is not
 * given stays blank; a value that cannot be read is refused with exit code 2 naming its option.
 * Runs on the bundled demo (invented demo data), whose verdict fails (exit 1).
 */
class IdentificationOptionsTest {
    private static final String BLANK = "<span class=\"blank short\"></span>";

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    /** @return the HTML of the table cell with this id */
    private static String cell(String html, String id) {
        Matcher m = Pattern.compile("<td id=\"" + id + "\">(.*?)</td>", Pattern.DOTALL).matcher(html);
        assertTrue(m.find(), "no cell " + id);
        return m.group(1);
    }

    @Test
    void optionsGoIntoTheResultAndOntoTheReportAndSurviveAReRender(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("a");
        String[] first = run("reconcile", "--samples", "100", "--operator", "A. Tester", "--approved-by", "B. Checker",
                "--ambient", "296.65K", "--supply", "12.02V", "--test-level", "100mVrms",
                "--instrument", "Generator G1;SN-0042;2027-03-31", "--instrument", "Meter M2;;",
                "--report", out.toString());
        assertEquals("1", first[0], first[2]);
        JsonNode run = new ObjectMapper().readTree(out.resolve("result.json").toFile()).path("run");
        assertEquals("B. Checker", run.path("approved_by").asText());
        // 296.65 K − 273.15 K = 23.5 °C (SI Brochure, 9th edition, 2.3.1), exact in decimal
        assertEquals(23.5, run.path("ambient_celsius").asDouble(), 0.0);
        assertEquals(12.02, run.path("supply_volts").asDouble(), 0.0);
        // 100 mV is 0.1 V; the one rounding of a decimal reading into a double, 1e-15 relative
        assertEquals(0.1, run.path("test_level_volts").asDouble(), 1e-16);
        assertEquals("rms", run.path("test_level_measure").asText());
        assertEquals(2, run.path("instruments").size());
        assertEquals("Generator G1", run.path("instruments").get(0).path("identity").asText());
        assertEquals("SN-0042", run.path("instruments").get(0).path("serial").asText());
        assertEquals("2027-03-31", run.path("instruments").get(0).path("calibration_due").asText());
        assertTrue(run.path("instruments").get(1).path("serial").isNull());
        assertTrue(run.path("instruments").get(1).path("calibration_due").isNull());

        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains("approved by B. Checker"), "page 1's Who row");
        assertEquals("ambient 23.5 °C; supply 12.02 V; test level 100 mV rms", cell(html, "conditions"));
        assertEquals("B. Checker", cell(html, "approved-by"));
        assertEquals("23.5 °C", cell(html, "ambient"));
        assertEquals("12.02 V", cell(html, "supply"));
        assertEquals("100 mV rms", cell(html, "test-level"));
        String used = cell(html, "instruments-used");
        assertTrue(used.startsWith("Generator G1, serial SN-0042, calibration due 2027-03-31<br>"), used);
        // the second instrument's serial and date were not given: blanks, not made up
        assertTrue(used.endsWith("Meter M2, serial " + BLANK + ", calibration due " + BLANK), used);
        assertTrue(html.contains("<th>Approved by</th><td>B. Checker</td>"), "sign-off");

        // polebench report re-renders the same identification from the file, and an option given
        // to it replaces what the file holds
        Path again = dir.resolve("b");
        String[] report = run("report", out.resolve("result.json").toString(), "--out", again.toString(),
                "--approved-by", "C. Lead");
        assertEquals("0", report[0], report[2]);
        String reissued = Files.readString(again.resolve("report.html"));
        assertEquals("C. Lead", cell(reissued, "approved-by"));
        assertEquals("ambient 23.5 °C; supply 12.02 V; test level 100 mV rms", cell(reissued, "conditions"));
        assertEquals(used, cell(reissued, "instruments-used"));
    }

    @Test
    void whatIsNotGivenStaysBlank(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("a");
        String[] first = run("reconcile", "--samples", "100", "--supply", "5V", "--report", out.toString());
        assertEquals("1", first[0], first[2]);
        JsonNode run = new ObjectMapper().readTree(out.resolve("result.json").toFile()).path("run");
        assertTrue(run.path("approved_by").isNull());
        assertTrue(run.path("ambient_celsius").isNull());
        assertTrue(run.path("test_level_volts").isNull());
        assertEquals(0, run.path("instruments").size());
        String html = Files.readString(out.resolve("report.html"));
        assertEquals("ambient " + BLANK + "; supply 5 V; test level " + BLANK, cell(html, "conditions"));
        assertEquals(BLANK, cell(html, "approved-by"));
        assertEquals(BLANK, cell(html, "ambient"));
        assertEquals(BLANK, cell(html, "test-level"));
        assertEquals(BLANK, cell(html, "instruments-used"));
        assertTrue(html.contains("<th>Approved by</th><td></td>"), "sign-off left to sign by hand");
    }

    // a sweep polebench capture wrote records its generator level in its plan note (CaptureSession
    // writes "capture plan: … amplitude=<volts> <kind>"): the report's test level when none is given
    @Test
    void theTestLevelComesFromACapturedSweepUnlessGiven(@TempDir Path dir) throws Exception {
        Path demo = BundledSamples.locate(ReconcileCommand.DEMO_SWEEP);
        String text = Files.readString(demo);
        int units = text.indexOf("# units:");
        Path captured = Files.writeString(dir.resolve("captured.sweep.csv"), text.substring(0, units)
                + "# note: capture plan: from_hz=0.5 to_hz=2000.0 points=61 log-spaced amplitude=0.2 Vpp\n"
                + text.substring(units));
        String stage = BundledSamples.locate(BundledSamples.DEMO_STAGE).toString();
        String[] recorded = run("reconcile", "--stage", stage, "--sweep", captured.toString(), "--samples", "100",
                "--json");
        assertEquals("1", recorded[0], recorded[2]);
        JsonNode run = new ObjectMapper().readTree(recorded[1]).path("run");
        assertEquals(0.2, run.path("test_level_volts").asDouble(), 0.0);
        assertEquals("peak-to-peak", run.path("test_level_measure").asText());
        assertEquals("capture plan", run.path("test_level_from").asText());

        Path out = dir.resolve("a");
        String[] given = run("reconcile", "--stage", stage, "--sweep", captured.toString(), "--samples", "100",
                "--test-level", "50mV", "--report", out.toString());
        assertEquals("1", given[0], given[2]);
        JsonNode run2 = new ObjectMapper().readTree(out.resolve("result.json").toFile()).path("run");
        assertEquals(0.05, run2.path("test_level_volts").asDouble(), 0.0);
        assertTrue(run2.path("test_level_measure").isNull());
        assertEquals("command line", run2.path("test_level_from").asText());
        assertEquals("50 mV", cell(Files.readString(out.resolve("report.html")), "test-level"));
    }

    @Test
    void anUnreadableValueIsRefusedNamingItsOption(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("a");
        // 30 February is no date (ISO 8601 calendar), and is not moved to March
        String[] date = run("reconcile", "--samples", "100", "--instrument", "Scope S3;77;2027-02-30",
                "--report", out.toString());
        assertEquals("2", date[0]);
        assertTrue(date[2].startsWith("polebench: "), date[2]);
        assertTrue(date[2].contains("--instrument") && date[2].contains("2027-02-30"), date[2]);
        assertTrue(date[2].contains("fix: ") && date[2].contains("YYYY-MM-DD"), date[2]);
        assertFalse(Files.exists(out), "nothing written");

        String[] dayFirst = run("reconcile", "--instrument", "Scope S3;77;31/03/2027");
        assertEquals("2", dayFirst[0]);
        assertTrue(dayFirst[2].contains("--instrument"), dayFirst[2]);
        String[] noUnit = run("reconcile", "--ambient", "23");
        assertEquals("2", noUnit[0]);
        assertTrue(noUnit[2].contains("--ambient"), noUnit[2]);
        String[] level = run("reconcile", "--supply", "12Vrms");
        assertEquals("2", level[0]);
        assertTrue(level[2].contains("--supply"), level[2]);
        String[] bare = run("reconcile", "--test-level", "0.1");
        assertEquals("2", bare[0]);
        assertTrue(bare[2].contains("--test-level"), bare[2]);
        String[] report = run("report", dir.resolve("missing.json").toString(), "--out", dir.resolve("b").toString(),
                "--instrument", "Scope;;2027-3-1");
        assertEquals("2", report[0]);
        assertTrue(report[2].contains("--instrument"), report[2]);
    }

    @Test
    void theBenchFileAndTheSweepsInstrumentLineNameTheEquipmentToo(@TempDir Path dir) throws Exception {
        // the demo sweep (invented demo data) as if captured from two instruments whose *IDN?
        // answers have the four fields of IEEE Std 488.2-1992, 10.14; the meter's serial field is
        // 0, which that clause reserves for "not available"
        Path demo = BundledSamples.locate(ReconcileCommand.DEMO_SWEEP);
        String text = Files.readString(demo).replace("# instrument: polebench board synthesizer (no instrument)",
                "# instrument: gen: Korvel Labs,FG-7,SN77,1.02; meter: Volta,DMM-2,0,3.1");
        Path captured = Files.writeString(dir.resolve("captured.sweep.csv"), text);
        Path bench = Files.writeString(dir.resolve("lab.bench.yaml"), String.join("\n",
                "# invented bench of the demo: instruments only, an ideal chain",
                "instruments:",
                "  - identity: Korvel Labs FG-7",
                "    calibration-due: 2027-05-31",
                "  - identity: Probe rack P4",
                "    serial: PR-9",
                ""));
        Path out = dir.resolve("a");
        String[] result = run("reconcile", "--stage", BundledSamples.locate(BundledSamples.DEMO_STAGE).toString(),
                "--sweep", captured.toString(), "--bench", bench.toString(), "--samples", "100",
                "--instrument", "Scope S3;77;2027-02-28", "--report", out.toString());
        assertEquals("1", result[0], result[2]);
        JsonNode instruments = new ObjectMapper().readTree(out.resolve("result.json").toFile()).path("run")
                .path("instruments");
        // options first, then the bench file, then the sweep; the generator the bench file lists
        // and the sweep names is one instrument, with the bench file's date and the sweep's serial
        assertEquals(4, instruments.size(), instruments.toString());
        assertEquals("Scope S3", instruments.get(0).path("identity").asText());
        assertEquals("Korvel Labs FG-7", instruments.get(1).path("identity").asText());
        assertEquals("SN77", instruments.get(1).path("serial").asText());
        assertEquals("2027-05-31", instruments.get(1).path("calibration_due").asText());
        assertEquals("Probe rack P4", instruments.get(2).path("identity").asText());
        assertEquals("PR-9", instruments.get(2).path("serial").asText());
        assertTrue(instruments.get(2).path("calibration_due").isNull(), "not given, not made up");
        assertEquals("Volta DMM-2", instruments.get(3).path("identity").asText());
        assertTrue(instruments.get(3).path("serial").isNull(), "serial field 0: not available");
        String used = cell(Files.readString(out.resolve("report.html")), "instruments-used");
        assertTrue(used.contains("Korvel Labs FG-7, serial SN77, calibration due 2027-05-31"), used);
    }

    @Test
    void aBenchFileInstrumentWithoutIdentityOrWithABadDateIsRefusedWithItsLine(@TempDir Path dir) throws Exception {
        Path noIdentity = Files.writeString(dir.resolve("a.bench.yaml"), "instruments:\n  - serial: 12\n");
        String[] first = run("reconcile", "--stage", BundledSamples.locate(BundledSamples.DEMO_STAGE).toString(),
                "--sweep", BundledSamples.locate(ReconcileCommand.DEMO_SWEEP).toString(), "--bench", noIdentity.toString());
        assertEquals("2", first[0]);
        assertTrue(first[2].contains("a.bench.yaml:2:") && first[2].contains("identity"),
                first[2]);
        Path badDate = Files.writeString(dir.resolve("b.bench.yaml"),
                "instruments:\n  - identity: Meter\n    calibration-due: 31.05.2027\n");
        String[] second = run("reconcile", "--stage", BundledSamples.locate(BundledSamples.DEMO_STAGE).toString(),
                "--sweep", BundledSamples.locate(ReconcileCommand.DEMO_SWEEP).toString(), "--bench", badDate.toString());
        assertEquals("2", second[0]);
        assertTrue(second[2].contains("b.bench.yaml:3:") && second[2].contains("YYYY-MM-DD"), second[2]);
    }
}

package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Instant;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;
import org.polebench.spread.StageAnalysis;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

class ReportHtmlTest {
    private static final ReportStamp STAMP = new ReportStamp("PB-20260314-0A1B2C3D", Instant.parse("2026-03-14T09:30:00Z"));

    private static Document parse(JsonNode root) {
        return Jsoup.parse(new ReportHtml().render(root, "ab".repeat(32), STAMP));
    }

    // ISO/IEC 17025:2017 7.8.2.1 items a report must carry, read back with a real HTML parser
    @Test
    void reportHoldsEveryRequiredItem() throws Exception {
        JsonNode root = DemoResult.shared();
        Document page = parse(root);
        assertTrue(page.title().contains("Test report"));
        assertEquals(STAMP.reportId(), page.getElementById("report-id").text());
        // the id on every printed page: in the table header group a browser repeats per page
        assertTrue(page.select("table.sheet > thead").text().contains(STAMP.reportId()));
        assertTrue(page.select("table.sheet > tfoot").text().contains(STAMP.reportId()));
        assertTrue(page.getElementById("end-of-report").text().contains(STAMP.reportId()));
        assertEquals("2026-03-14T09:30:00Z", page.getElementById("date-of-issue").text());
        assertNotNull(page.getElementById("date-of-test"));
        assertTrue(page.getElementById("item").text().contains("Ostrova geophone front end GF-2 rev C"));
        // the demo sweep's own header names board GF2-0417
        assertTrue(page.getElementById("board").text().contains("GF2-0417"));
        assertEquals("A. Tester", page.getElementById("operator").text());
        assertTrue(page.getElementById("instrument").text().contains("board synthesizer"));
        String method = page.getElementById("method").text();
        for (String step : new String[]{"SCTC", "Exact analysis", "Fit", "Back-solve", "Hypotheses", "Adequacy",
            "Decision rule", "ILAC-G8"}) {
            assertTrue(method.contains(step), step);
        }
        // one back-solve row per low-band capacitor of the stage file: C1, CE1, C2, CE2, C3
        assertEquals(5, page.select("#capacitors tbody tr").size());
        assertEquals(root.path("hypotheses").size(), page.select("#hypotheses tbody tr").size());
        assertEquals(2, page.select("#side-by-side tbody tr").size());
        // the stage file's limits: lower corner ≤ 35 Hz and midband gain 53…58 dB, two checks
        Elements checks = page.select("#verdict tbody tr");
        assertEquals(2, checks.size());
        assertTrue(checks.get(0).text().contains("≤ 35 Hz"));
        assertTrue(checks.get(1).text().contains("53 to 58 dB"));
        // synthesized with C2 as 220 nF, the board's corner is far above 35 Hz: the verdict fails
        assertEquals("FAIL", page.getElementById("verdict-overall").text());
        for (String chart : new String[]{"chart-bode", "chart-shares", "chart-capacitors"}) {
            assertEquals(1, page.getElementById(chart).select("svg").size(), chart);
        }
        // traceability: digests computed here with the JDK's own SHA-256 of the same files
        assertEquals(sha256(DemoResult.STAGE), page.getElementById("stage-sha256").text());
        assertEquals(sha256(DemoResult.SWEEP), page.getElementById("sweep-sha256").text());
        assertFalse(page.getElementById("polebench-version").text().isBlank());
        assertFalse(page.getElementById("profile").text().isBlank());
        int warnings = root.path("measured").path("warnings").size() + root.path("import_warnings").size()
                + root.path("predicted").path("warnings").size() + root.path("report_warnings").size();
        // one list item per warning of the result; the demo fit once dropped its six lowest points
        // as "outliers" (a wrong 1-pole model, chi-square/nu 32 000); since the fitter tries the
        // DC-zero count the low-frequency slope implies it fits within the noise and may warn of
        // nothing, which the page states in one item of its own (ReportHtml's "none" line)
        assertEquals(Math.max(warnings, 1), page.select("#warnings li").size());
        assertTrue(page.select("#cautions li").size() >= 5);
        assertTrue(page.getElementById("scope-statement").text().contains("relate only to the item"));
    }

    // self-contained: no script, nothing fetched from anywhere
    @Test
    void pageNeedsNoScriptAndNoNetwork() {
        Document page = parse(DemoResult.shared());
        assertEquals(0, page.select("script").size());
        assertEquals(0, page.select("link, img[src], iframe, object, embed").size());
        assertEquals(1, page.select("head > style").size());
        for (Element any : page.getAllElements()) {
            for (var attribute : any.attributes()) {
                if (attribute.getKey().startsWith("on")) {
                    throw new AssertionError("event handler attribute " + attribute.getKey());
                }
            }
        }
        // only the SVG namespace names a URL, and a namespace is never fetched
        for (Element any : page.getAllElements()) {
            for (var attribute : any.attributes()) {
                if (!attribute.getKey().startsWith("xmlns")) {
                    assertFalse(attribute.getValue().contains("://"), attribute.toString());
                }
            }
        }
    }

    // a part id, an operator and a note that look like markup must come out as text
    @Test
    void userStringsAreEscaped() {
        ObjectNode root = DemoResult.shared();
        String part = "=HYPERLINK(\"x\")<b>bold</b>";
        ((ObjectNode) root.withArray("capacitors").get(0)).put("id", part);
        ((ObjectNode) root.path("run")).put("operator", "<script>alert(1)</script>");
        root.withArray("/sweep/notes").add("note with <img src=x onerror=alert(1)> & more");
        Document page = parse(root);
        assertEquals(part, page.select("#capacitors tbody tr").get(0).child(0).text());
        assertEquals(0, page.select("#capacitors b:contains(bold)").size());
        assertEquals("<script>alert(1)</script>", page.getElementById("operator").text());
        assertEquals(0, page.select("script").size());
        assertEquals(0, page.select("img").size());
        assertTrue(page.getElementById("data").text().contains("<img src=x onerror=alert(1)> & more"));
    }

    // identical input and stamp: identical bytes; another stamp changes only the id and date
    @Test
    void sameInputGivesTheSameBytesApartFromIdAndDate() throws Exception {
        ObjectNode first = DemoResult.run(Optional.of("A. Tester"));
        ObjectNode second = DemoResult.run(Optional.of("A. Tester"));
        ResultJson json = new ResultJson();
        assertEquals(json.text(first), json.text(second));
        String a = new ReportHtml().render(first, "00", STAMP);
        String b = new ReportHtml().render(second, "00", STAMP);
        assertEquals(a, b);
        ReportStamp later = ReportStamp.issue(json.text(first), Instant.parse("2026-04-01T12:00:00Z"));
        assertNotEquals(STAMP.reportId(), later.reportId());
        String c = new ReportHtml().render(second, "00", later);
        assertEquals(a, c.replace(later.reportId(), STAMP.reportId()).replace(later.issuedText(), STAMP.issuedText()));
    }

    // issue 11: whether the stage explains the sweep is said first, in the summary, above the
    // hypotheses. The demo board was synthesized from the demo stage itself with one capacitor
    // decade-slipped (the sweep's notes say so), a fault the hypotheses cover: the stage explains it
    @Test
    void diagnosisComesFirstAboveTheHypotheses() {
        JsonNode root = DemoResult.shared();
        JsonNode diagnosis = root.path("diagnosis");
        assertTrue(diagnosis.path("explained").asBoolean(), diagnosis.toString());
        Document page = parse(root);
        Element block = page.getElementById("diagnosis");
        assertEquals("summary", block.parent().id());
        assertEquals("yes", page.getElementById("diagnosis-explained").text());
        assertNull(page.getElementById("diagnosis-stranger"));
        assertEquals(diagnosis.path("statement").asText(), page.getElementById("diagnosis-statement").text());
        // jsoup lists elements in document order: the diagnosis above the most-likely line, the
        // evidence table and the hypotheses
        List<Element> order = page.getAllElements();
        assertTrue(order.indexOf(block) < order.indexOf(page.getElementById("most-likely")));
        assertTrue(order.indexOf(block) < order.indexOf(page.getElementById("adequacy")));
        assertTrue(order.indexOf(page.getElementById("adequacy")) < order.indexOf(page.getElementById("hypotheses")));
        // the most likely as the JSON words it, with the probability of the hypothesis it names
        JsonNode top = root.path("hypotheses").get(0);
        String line = page.getElementById("most-likely").text();
        assertTrue(line.contains(root.path("most_likely").asText()), line);
        assertTrue(line.contains(String.format(Locale.ROOT, "(posterior probability %.1f %%)",
                100 * top.path("probability").asDouble())), line);
        assertNull(page.getElementById("probabilities-relative"));
        assertTrue(page.select("#hypotheses thead th").eachText().contains("Posterior"));
        // a stage the sweep is explained by needs no pairs (FaultRanking ranks them only otherwise)
        assertFalse(root.path("pairs_ranked").asBoolean());
        assertTrue(page.select("h3:contains(Ranked single-fault hypotheses)").size() == 1);
        // the four checks of the adequacy test (AdequacyTest's Javadoc), one row each
        assertEquals(4, page.select("#adequacy tbody tr").size());
    }

    // issue 11's hand case "a sweep reconciled against the wrong stage file": the demo board of
    // the two-stage geophone front end against the one-stage hydrophone demo stage (both invented).
    // By construction no hypothesis of that stage explains it: the report says so first, labels
    // the probabilities as relative, names no hypothesis as the fault and passes nothing
    @Test
    void aSweepTheStageDoesNotExplainIsSaidSoAndItsProbabilitiesAreRelative() throws Exception {
        ObjectNode root = DemoResult.reconcile(Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml"),
                DemoResult.demoSweep(), DemoResult.SWEEP);
        JsonNode diagnosis = root.path("diagnosis");
        assertFalse(diagnosis.path("explained").asBoolean(), diagnosis.toString());
        assertTrue(root.path("probabilities_relative").asBoolean());
        Document page = parse(root);
        assertEquals("NO", page.getElementById("diagnosis-explained").text());
        boolean stranger = !diagnosis.path("looks_like_stage").asBoolean();
        assertEquals(stranger, page.getElementById("diagnosis-stranger") != null);
        if (stranger) {
            assertEquals("this sweep does not look like a board of this stage",
                    page.getElementById("diagnosis-stranger").text());
        }
        assertEquals(diagnosis.path("statement").asText(), page.getElementById("diagnosis-statement").text());
        List<Element> order = page.getAllElements();
        Element relative = page.getElementById("probabilities-relative");
        assertNotNull(relative);
        assertTrue(order.indexOf(page.getElementById("diagnosis")) < order.indexOf(relative));
        assertTrue(order.indexOf(relative) < order.indexOf(page.getElementById("hypotheses")));
        assertTrue(page.select("#hypotheses thead th").eachText().contains("Posterior, RELATIVE"));
        // the most-likely line is the JSON's plain statement that nothing explains the sweep, and
        // gives no probability, since none of the hypotheses is named
        String line = page.getElementById("most-likely").text();
        assertTrue(line.contains(root.path("most_likely").asText()), line);
        assertTrue(root.path("most_likely").asText().startsWith("no hypothesis explains the sweep"));
        assertFalse(line.contains("posterior probability"), line);
        assertNotEquals("PASS", page.getElementById("verdict-overall").text());
        // pairs are ranked when no single fault explains the sweep (issue 11 §4); each double's row
        // names both of its faults, as its faults array does
        assertTrue(root.path("pairs_ranked").asBoolean());
        assertEquals(1, page.select("h3:contains(Ranked single- and double-fault hypotheses)").size());
        Elements rows = page.select("#hypotheses tbody tr");
        int doubles = 0;
        for (int i = 0; i < rows.size(); i++) {
            JsonNode y = root.path("hypotheses").get(i);
            if (!y.path("kind").asText().equals("double")) {
                continue;
            }
            doubles++;
            assertEquals(2, y.path("faults").size());
            for (JsonNode fault : y.path("faults")) {
                String part = fault.path("part").asText("flat gain error");
                assertTrue(rows.get(i).child(1).text().contains(part), rows.get(i).text());
                assertTrue(rows.get(i).child(4).text().contains(part), rows.get(i).text());
            }
        }
        assertTrue(doubles > 0);
    }

    // issue 11 §2: a hypothesis the tool marks as not identifiable is never named as the most
    // likely, so the summary gives it no probability either (the JSON's most_likely says none can
    // be named). The demo result, edited so that its top hypothesis is not identifiable
    @Test
    void aTopHypothesisThatIsNotIdentifiableGetsNoProbabilityInTheSummary() {
        ObjectNode root = DemoResult.shared();
        ((ObjectNode) root.path("hypotheses").get(0)).put("identifiable", false);
        root.put("most_likely", "none can be named: the most probable, \"C2\", is not identifiable from this sweep");
        Document page = parse(root);
        String line = page.getElementById("most-likely").text();
        assertTrue(line.contains("none can be named"), line);
        assertFalse(line.contains("posterior probability"), line);
    }

    // a resistor fault the hypotheses cover: the hydrophone demo stage (invented) built with its
    // 1.2 kΩ emitter resistor fitted as 680 Ω, synthesized with the stage's own model (seed 3,
    // bench noise 0.05 dB / 0.5°), so the truth is RE. The back-solve shows the freed resistor
    // and each transistor's β beside the bias currents
    @Test
    void theFreedResistorAndTheCurrentGainAppearInTheBackSolve() throws Exception {
        Path stageFile = Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml");
        Stage stage = new StageReader().read(stageFile).stage();
        double corner = new StageAnalysis().analyse(new StageReader().read(stageFile)).prediction()
                .exactLowerCornerHz().getAsDouble();
        Sweep sweep = new BoardSynthesizer().synthesize(stage, List.of(new Fault.ResistorValue("RE", 680)),
                SweepNoise.BENCH, BoardSynthesizer.logSpaced(corner / 30, corner * 300, 61), true, 3);
        ObjectNode root = DemoResult.reconcile(stageFile, sweep, Path.of("synthesized-re-680.csv"));
        JsonNode top = root.path("hypotheses").get(0);
        assertEquals("resistor", top.path("kind").asText(), top.toString());
        assertEquals("RE", top.path("part").asText());
        Document page = parse(root);
        Elements resistors = page.select("#resistors tbody tr");
        assertEquals(root.path("resistors").size(), resistors.size());
        assertEquals("RE", resistors.get(0).child(0).text());
        // R/R_nom of the JSON's own values, to the three decimals the table prints
        JsonNode re = root.path("resistors").get(0);
        assertEquals(String.format(Locale.ROOT, "%.3f", re.path("estimated_ohms").asDouble()
                / re.path("nominal_ohms").asDouble()), resistors.get(0).child(3).text());
        // the nearest preferred value of a resistor is in ohms
        assertTrue(page.select("#hypotheses tbody tr").get(0).child(6).text().endsWith("Ω"));
        // one β row per bipolar transistor: the hydrophone stage has Q1 only
        assertEquals(root.path("nuisance").path("current_gain").size(),
                page.select("#nuisance tbody tr:contains(current gain β)").size());
        assertEquals(1, root.path("nuisance").path("current_gain").size());
    }

    private static String sha256(Path file) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    }
}

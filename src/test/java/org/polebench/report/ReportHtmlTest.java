package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Instant;
import java.util.HexFormat;
import java.util.Optional;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;

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
        for (String step : new String[]{"SCTC", "Exact analysis", "Fit", "Back-solve", "Decision rule", "ILAC-G8"}) {
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

    private static String sha256(Path file) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    }
}

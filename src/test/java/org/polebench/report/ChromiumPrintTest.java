package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.TimeUnit;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prints report.html to PDF in headless Chromium (as ChromiumRenderTest finds it; .ci/run
 * installs it) and reads each page's text with Apache PDFBox, an independent reader (issue 14):
 * every page carries "Page n of N" from the report's own paged-media CSS, and page 1 carries
 * the verdict with the failed check, the diagnosis statement and who, what and when. Skips,
 * saying why, where Chromium is missing or cannot start.
 */
class ChromiumPrintTest {
    @Test
    void everyPrintedPageSaysPageNOfNAndPageOneCarriesTheVerdict(@TempDir Path dir) throws Exception {
        Optional<Path> chromium = HeadlessChromium.find();
        assumeTrue(chromium.isPresent(), "chromium is not installed (apt-get install chromium); print test skipped");
        Path out = dir.resolve("report");
        // the identification filled in (issue 14): page 1 at its longest still carries it all
        ObjectNode root = DemoResult.shared();
        new ResultJson().identify(root, new Identification(Optional.of("B. Checker"), OptionalDouble.of(23.5),
                OptionalDouble.of(12.02), Optional.of(new TestLevel(0.1, Optional.of("rms"), TestLevel.COMMAND_LINE)),
                List.of(new Instrument("Generator G1", Optional.of("SN-0042"), Optional.of(LocalDate.of(2027, 3, 31))),
                        new Instrument("Meter M2", Optional.empty(), Optional.empty()))));
        new TestReportWriter().write(root, out, false, false, Instant.parse("2026-03-14T09:30:00Z"));
        Path pdf = dir.resolve("report.pdf");
        Path profile = Files.createDirectory(dir.resolve("chromium-profile"));
        Process process = new ProcessBuilder(List.of(chromium.get().toString(), "--headless", "--no-sandbox",
                "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + profile, "--no-pdf-header-footer", "--print-to-pdf=" + pdf,
                out.resolve("report.html").toUri().toString()))
                .redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile()).start();
        boolean done = process.waitFor(120, TimeUnit.SECONDS);
        if (!done) {
            process.destroyForcibly();
        }
        assumeTrue(done && process.exitValue() == 0 && Files.isRegularFile(pdf),
                "chromium could not run here (" + (done ? "exit " + process.exitValue() : "timed out") + ")");
        try (PDDocument document = Loader.loadPDF(pdf.toFile())) {
            int pages = document.getNumberOfPages();
            // the demo report holds three charts and a dozen tables: several pages
            assertTrue(pages >= 3, "pages " + pages);
            for (int n = 1; n <= pages; n++) {
                String text = pageText(document, n);
                assertTrue(text.contains("Page " + n + " of " + pages), "page " + n + ": " + text.substring(0,
                        Math.min(300, text.length())));
            }
            String first = pageText(document, 1).replaceAll("\\s+", " ");
            // the demo board (its sweep's notes: C2 fitted as 220 nF) fails its "at most 35 Hz" corner
            assertTrue(first.contains("Verdict: FAIL"), first);
            assertTrue(first.contains("lower corner"), first);
            assertTrue(first.contains("≤ 35 Hz"), first);
            assertTrue(first.contains("Does the stage explain the sweep?"), first);
            String statement = DemoResult.shared().path("diagnosis").path("statement").asText();
            assertTrue(first.contains(statement.substring(0, 40)), first);
            assertTrue(first.contains("A. Tester"), first);
            assertTrue(first.contains("GF2-0417"), first);
            assertTrue(first.contains("issued 2026-03-14T09:30:00Z"), first);
            assertTrue(first.contains("approved by B. Checker"), first);
            assertTrue(first.contains("ambient 23.5 °C; supply 12.02 V; test level 100 mV rms"), first);
            assertTrue(first.contains("Generator G1, serial SN-0042, calibration due 2027-03-31"), first);
        }
    }

    private static String pageText(PDDocument document, int page) throws java.io.IOException {
        PDFTextStripper stripper = new PDFTextStripper();
        stripper.setStartPage(page);
        stripper.setEndPage(page);
        return stripper.getText(document);
    }
}

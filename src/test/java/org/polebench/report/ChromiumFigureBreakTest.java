package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.apache.pdfbox.text.TextPosition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Prints the demo report to PDF in headless Chromium (as ChromiumPrintTest does) and reads where
 * the text on each page ends with Apache PDFBox (issue 14: no half-empty pages before a figure).
 * A figure is kept whole, so it moves to the next page when it does not fit; the report's print
 * CSS caps each figure's height so that it fits in half a page, and lets long tables break
 * between rows. Skips, saying why, where Chromium is missing or cannot start.
 */
class ChromiumFigureBreakTest {
    /** Text below this fraction of the page height is the running foot and page number, not body. */
    private static final double BODY_BOTTOM = 0.9;

    @Test
    void noPageBeforeAFigureIsHalfEmpty(@TempDir Path dir) throws Exception {
        Optional<Path> chromium = HeadlessChromium.find();
        assumeTrue(chromium.isPresent(), "chromium is not installed (apt-get install chromium); print test skipped");
        Path out = dir.resolve("report");
        new TestReportWriter().write(DemoResult.shared(), out, false, false, Instant.parse("2026-03-14T09:30:00Z"));
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
            int figures = 0;
            for (int n = 2; n <= document.getNumberOfPages(); n++) {
                Page page = read(document, n);
                if (!page.text().contains("Figure ")) {
                    continue;
                }
                figures++;
                Page before = read(document, n - 1);
                double height = document.getPage(n - 2).getMediaBox().getHeight();
                // the body text of the page before reaches past the middle of the page: it is not
                // half empty (y grows downwards in PDFBox's adjusted coordinates)
                assertTrue(before.lowestBodyY() > height / 2, "page " + (n - 1) + " ends at y = " + before.lowestBodyY()
                        + " of " + height + " before the figure on page " + n);
            }
            // the demo report holds three figures; at least one starts a page after the first
            assertTrue(figures >= 1, "no figure caption found after page 1");
        }
    }

    /** A page's text and the lowest point its body text reaches. */
    private record Page(String text, double lowestBodyY) {
    }

    private static Page read(PDDocument document, int page) throws IOException {
        double height = document.getPage(page - 1).getMediaBox().getHeight();
        double[] lowest = {0};
        PDFTextStripper stripper = new PDFTextStripper() {
            @Override
            protected void writeString(String text, List<TextPosition> positions) throws IOException {
                for (TextPosition p : positions) {
                    if (p.getYDirAdj() < BODY_BOTTOM * height) {
                        lowest[0] = Math.max(lowest[0], p.getYDirAdj());
                    }
                }
                super.writeString(text, positions);
            }
        };
        stripper.setStartPage(page);
        stripper.setEndPage(page);
        String text = stripper.getText(document);
        return new Page(text, lowest[0]);
    }
}

package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Renders report.html in headless Chromium (Debian's package, which .ci/run installs) and checks
 * the screenshot has the page's content. Skips, saying why, where Chromium is missing or cannot
 * start.
 */
class ChromiumRenderTest {
    private static final int WIDTH = 1240;
    private static final int HEIGHT = 1754;

    @Test
    void reportRendersWithContent(@TempDir Path dir) throws Exception {
        Optional<Path> chromium = HeadlessChromium.find();
        assumeTrue(chromium.isPresent(), "chromium is not installed (apt-get install chromium); render test skipped");
        Path out = dir.resolve("report");
        new TestReportWriter().write(DemoResult.shared(), out, false, false, Instant.parse("2026-03-14T09:30:00Z"));
        Path png = dir.resolve("page.png");
        Path profile = Files.createDirectory(dir.resolve("chromium-profile"));
        Process process = new ProcessBuilder(List.of(chromium.get().toString(), "--headless", "--no-sandbox",
                "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + profile, "--screenshot=" + png,
                "--window-size=" + WIDTH + "," + HEIGHT, out.resolve("report.html").toUri().toString()))
                .redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile()).start();
        boolean done = process.waitFor(120, TimeUnit.SECONDS);
        if (!done) {
            process.destroyForcibly();
        }
        assumeTrue(done && process.exitValue() == 0 && Files.isRegularFile(png),
                "chromium could not run here (" + (done ? "exit " + process.exitValue() : "timed out") + "): "
                        + tail(dir.resolve("chromium.log")));
        BufferedImage image = ImageIO.read(png.toFile());
        assertEquals(WIDTH, image.getWidth());
        assertEquals(HEIGHT, image.getHeight());
        int ink = 0;
        int accent = 0;
        for (int y = 0; y < HEIGHT; y++) {
            for (int x = 0; x < WIDTH; x++) {
                int rgb = image.getRGB(x, y) & 0xFFFFFF;
                if (rgb != 0xFFFFFF) {
                    ink++;
                }
                int r = rgb >> 16;
                int g = (rgb >> 8) & 0xFF;
                int b = rgb & 0xFF;
                if (b > r + 40 && b > g + 20) {
                    accent++;
                }
            }
        }
        // a first page of text, tables and the verdict box: well over 2 % of the pixels inked
        // (a blank or error page has almost none); the blue title and rules show the CSS applied
        assertTrue(ink > WIDTH * HEIGHT / 50, "inked pixels " + ink);
        assertTrue(accent > 500, "accent-coloured pixels " + accent);
    }

    private static String tail(Path log) {
        try {
            String text = Files.readString(log);
            return text.length() > 400 ? text.substring(text.length() - 400) : text;
        } catch (java.io.IOException e) {
            return "no log";
        }
    }
}

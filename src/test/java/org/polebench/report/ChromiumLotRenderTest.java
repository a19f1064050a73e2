package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Renders the lot report in headless Chromium ({@link HeadlessChromium}) and checks the
 * screenshot shows the page: text, the accent-blue title and rules, and the red of the
 * systematic finding's bar and the charts' flagged points and limits. Skips, saying why, where
 * Chromium is missing or cannot start.
 */
class ChromiumLotRenderTest {
    private static final int WIDTH = 1240;
    private static final int HEIGHT = 3000;

    @Test
    void theLotReportRendersWithItsChartsAndFinding(@TempDir Path dir) throws Exception {
        Optional<Path> chromium = HeadlessChromium.find();
        assumeTrue(chromium.isPresent(), "chromium is not installed (apt-get install chromium); render test skipped");
        Path out = dir.resolve("lot");
        new LotReportWriter().write(out, DemoLot.findings(), false, Instant.parse("2026-05-05T12:00:00Z"));
        Path png = dir.resolve("page.png");
        Optional<String> failed = HeadlessChromium.run(chromium.get(), dir, out.resolve(LotReportWriter.HTML),
                List.of("--screenshot=" + png, "--window-size=" + WIDTH + "," + HEIGHT));
        assumeTrue(failed.isEmpty(), "chromium could not run here (" + failed.orElse("") + ")");
        BufferedImage image = ImageIO.read(png.toFile());
        assertEquals(WIDTH, image.getWidth());
        int ink = 0;
        int accent = 0;
        int red = 0;
        for (int y = 0; y < image.getHeight(); y++) {
            for (int x = 0; x < WIDTH; x++) {
                int rgb = image.getRGB(x, y) & 0xFFFFFF;
                int r = rgb >> 16;
                int g = (rgb >> 8) & 0xFF;
                int b = rgb & 0xFF;
                ink += rgb != 0xFFFFFF ? 1 : 0;
                accent += b > r + 40 && b > g + 20 ? 1 : 0;
                red += r > 150 && g < 90 && b < 90 ? 1 : 0;
            }
        }
        // text, tables and three charts in the first 3000 px: well over 2 % inked (a blank or
        // error page has almost none); blue title and rules show the CSS; red the finding's bar,
        // the limits and the flagged points
        assertTrue(ink > WIDTH * HEIGHT / 50, "inked pixels " + ink);
        assertTrue(accent > 500, "accent-coloured pixels " + accent);
        assertTrue(red > 200, "red pixels " + red);
    }
}

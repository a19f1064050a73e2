package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.awt.image.BufferedImage;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.xy.XYDataset;
import org.junit.jupiter.api.Test;

class ReportChartsTest {
    private final ReportCharts charts = new ReportCharts();

    @Test
    void bodeHasEverySeriesOnALogAxisCoveringTheData() {
        JsonNode root = DemoResult.shared();
        JFreeChart chart = charts.bode(root).chart();
        CombinedDomainXYPlot plot = (CombinedDomainXYPlot) chart.getPlot();
        LogAxis frequency = assertInstanceOf(LogAxis.class, plot.getDomainAxis());
        XYPlot gain = plot.getSubplots().get(0);
        XYDataset curves = gain.getDataset(0);
        List<String> labels = List.of("fitted model", "nominal stage, exact", "SCTC single-pole estimate");
        assertEquals(labels.size(), curves.getSeriesCount());
        for (int s = 0; s < labels.size(); s++) {
            assertEquals(labels.get(s), curves.getSeriesKey(s));
        }
        assertEquals(1, gain.getDataset(1).getSeriesCount());
        assertEquals("measured", gain.getDataset(1).getSeriesKey(0));
        assertEquals(1, gain.getDataset(2).getSeriesCount());
        assertTrue(gain.getDataset(2).getSeriesKey(0).toString().startsWith("tolerance band"));
        // the sweep runs 0.5 Hz to 5 kHz (its own file); every curve point must be on the axes
        JsonNode points = root.path("sweep").path("points");
        assertTrue(frequency.getLowerBound() > 0 && frequency.getLowerBound() <= points.get(0).path("frequency_hz").asDouble());
        assertTrue(frequency.getUpperBound() >= points.get(points.size() - 1).path("frequency_hz").asDouble());
        ValueAxis gainAxis = gain.getRangeAxis();
        for (XYDataset lines : List.of(curves, gain.getDataset(1))) {
            for (int s = 0; s < lines.getSeriesCount(); s++) {
                for (int i = 0; i < lines.getItemCount(s); i++) {
                    double x = lines.getXValue(s, i);
                    double y = lines.getYValue(s, i);
                    assertTrue(frequency.getRange().contains(x), "f " + x);
                    assertTrue(gainAxis.getRange().contains(y), "gain " + y);
                }
            }
        }
    }

    @Test
    void capacitorChartCoversEveryBandAndEstimate() {
        JsonNode root = DemoResult.shared();
        XYPlot plot = (XYPlot) charts.capacitorBands(root).getPlot();
        LogAxis ratio = assertInstanceOf(LogAxis.class, plot.getRangeAxis());
        for (JsonNode c : root.path("capacitors")) {
            double nominal = c.path("nominal_farads").asDouble();
            assertTrue(ratio.getRange().contains(c.path("min_farads").asDouble() / nominal));
            assertTrue(ratio.getRange().contains(c.path("max_farads").asDouble() / nominal));
            assertTrue(ratio.getRange().contains(c.path("estimated_farads").asDouble() / nominal));
        }
        assertEquals(root.path("capacitors").size(), plot.getDataset(0).getItemCount(0));
        XYDataset estimates = plot.getDataset(1);
        int drawn = 0;
        for (int s = 0; s < estimates.getSeriesCount(); s++) {
            drawn += estimates.getItemCount(s);
        }
        assertEquals(root.path("capacitors").size(), drawn);
    }

    // drawn headless (surefire sets java.awt.headless): the raster is not blank
    @Test
    void chartsDrawHeadlessWithContent() {
        JsonNode root = DemoResult.shared();
        for (JFreeChart chart : List.of(charts.bode(root).chart(), charts.cornerShares(root), charts.capacitorBands(root))) {
            BufferedImage image = chart.createBufferedImage(600, 400);
            int ink = 0;
            for (int y = 0; y < image.getHeight(); y++) {
                for (int x = 0; x < image.getWidth(); x++) {
                    if ((image.getRGB(x, y) & 0xFFFFFF) != 0xFFFFFF) {
                        ink++;
                    }
                }
            }
            // axes, labels, and the data: well over 1 % of the pixels
            assertTrue(ink > image.getWidth() * image.getHeight() / 100, chart.getTitle().getText() + ": " + ink);
        }
    }

    // JFreeSVG's ids take the given prefix, so three inline charts cannot collide
    @Test
    void inlineSvgIsStableAndPrefixed() {
        JsonNode root = DemoResult.shared();
        String a = ReportCharts.svgElement(charts.capacitorBands(root), 720, 300, "pb-caps");
        String b = ReportCharts.svgElement(charts.capacitorBands(root), 720, 300, "pb-caps");
        assertEquals(a, b);
        assertTrue(a.startsWith("<svg"));
        assertTrue(a.contains("id='pb-capsclip-"));
        assertTrue(!a.contains("id='pbclip-"));
        assertTrue(!a.contains("<?xml"));
    }
}

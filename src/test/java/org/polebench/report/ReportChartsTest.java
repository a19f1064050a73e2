package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.awt.Rectangle;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;
import org.jfree.chart.ChartRenderingInfo;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.xy.XYDataset;
import org.jfree.svg.SVGGraphics2D;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.parser.Parser;
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

    /** The Bode chart drawn as SVG, with where JFreeChart put each panel's data area. */
    private record Drawn(Document svg, List<Rectangle2D> panels) {
    }

    private static Drawn draw(JFreeChart chart) {
        SVGGraphics2D g = ReportCharts.canvas(ReportCharts.WIDTH, ReportCharts.BODE_HEIGHT, "pb-t");
        ChartRenderingInfo info = new ChartRenderingInfo();
        chart.draw(g, new Rectangle(0, 0, ReportCharts.WIDTH, ReportCharts.BODE_HEIGHT), info);
        List<Rectangle2D> panels = new ArrayList<>();
        for (int i = 0; i < info.getPlotInfo().getSubplotCount(); i++) {
            panels.add(info.getPlotInfo().getSubplotInfo(i).getDataArea());
        }
        return new Drawn(Jsoup.parse(g.getSVGElement(), "", Parser.xmlParser()), panels);
    }

    // SVG paints in document order: every measured point of the gain panel (open black circles,
    // drawn as Bézier paths starting at the circle's right-hand point) must come before the
    // fitted model's line (red, unfilled, one path of many segments; the legend's swatch is one
    // segment), or the points hide the model
    @Test
    void fittedModelIsDrawnAfterTheMeasuredPoints() {
        JsonNode root = DemoResult.shared();
        Drawn drawn = draw(charts.bode(root).chart());
        Rectangle2D gainArea = drawn.panels().get(0);
        int markersBefore = 0;
        int markersAfter = 0;
        boolean modelFound = false;
        for (Element path : drawn.svg().select("path")) {
            // JFreeSVG puts a shape's stroke on the path or on a <g> around it
            String style = path.attr("style") + ";" + path.parent().attr("style");
            String d = path.attr("d");
            if (style.contains("stroke:rgb(200,40,40)") && style.contains("fill:none") && d.split("L").length > 10) {
                modelFound = modelFound || d.startsWith("M") && inside(gainArea, d);
                continue;
            }
            if (style.contains("stroke:rgb(0,0,0)") && style.contains("fill:none") && d.contains("C") && inside(gainArea, d)) {
                if (modelFound) {
                    markersAfter++;
                } else {
                    markersBefore++;
                }
            }
        }
        assertTrue(modelFound, "no fitted-model path");
        assertEquals(root.path("sweep").path("points").size(), markersBefore);
        assertEquals(0, markersAfter);
    }

    /** Whether a path's first point lies in the area (within the 3 px of a marker's radius). */
    private static boolean inside(Rectangle2D area, String d) {
        String[] xy = d.substring(1).split("[A-Za-z]")[0].split(",");
        double x = Double.parseDouble(xy[0]);
        double y = Double.parseDouble(xy[1]);
        return x >= area.getMinX() - 3 && x <= area.getMaxX() + 3 && y >= area.getMinY() - 3 && y <= area.getMaxY() + 3;
    }

    // the demo sweep runs 0.5 Hz to 5 kHz (its own file): the labelled ticks are the 1-2-5
    // sequence over those four decades, written with SI prefixes (common practice on Bode plots)
    @Test
    void frequencyTicksFollowOneTwoFive() {
        Document svg = draw(charts.bode(DemoResult.shared()).chart()).svg();
        List<String> ticks = new ArrayList<>();
        for (Element text : svg.select("text")) {
            if (text.text().matches("[0-9.]+ (m|k)?Hz")) {
                ticks.add(text.text());
            }
        }
        assertEquals(List.of("500 mHz", "1 Hz", "2 Hz", "5 Hz", "10 Hz", "20 Hz", "50 Hz", "100 Hz", "200 Hz", "500 Hz",
                "1 kHz", "2 kHz", "5 kHz"), ticks);
        assertEquals(List.of(0.5, 1.0, 2.0, 5.0, 10.0, 20.0), OneTwoFiveAxis.majorValues(0.45, 21));
        // gain ticks below zero carry U+2212, never the ASCII hyphen
        assertTrue(svg.select("text").stream().anyMatch(t -> t.text().matches("\u2212[0-9]+")));
        assertTrue(svg.select("text").stream().noneMatch(t -> t.text().matches("-[0-9.]+")));
        // too narrow for three 1-2-5 values: every whole step of the decade instead
        assertEquals(List.of(0.8, 0.9, 1.0, 2.0), OneTwoFiveAxis.majorValues(0.75, 2.2));
    }

    // the stage's lower-corner-max (35 Hz in the demo stage file) is a dashed red vertical line in
    // every panel, at x = left + width·ln(35/low)/ln(high/low) of the log axis; the −3 dB level is
    // a horizontal line at midband + 20·log10(1/√2) = midband − 3.0103 dB (closed form). Positions
    // are written to 0.01 px (ReportCharts.canvas), hence the 0.011 px tolerance
    @Test
    void lowerCornerLimitAndHalfPowerLevelAreDrawnWhereTheyBelong() {
        JsonNode root = DemoResult.shared();
        JFreeChart chart = charts.bode(root).chart();
        Drawn drawn = draw(chart);
        CombinedDomainXYPlot plot = (CombinedDomainXYPlot) chart.getPlot();
        ValueAxis frequency = plot.getDomainAxis();
        Rectangle2D gainArea = drawn.panels().get(0);
        double x = gainArea.getMinX() + gainArea.getWidth() * Math.log(35 / frequency.getLowerBound())
                / Math.log(frequency.getUpperBound() / frequency.getLowerBound());
        int limitLines = 0;
        for (Element line : drawn.svg().select("line")) {
            if (line.attr("style").contains("stroke:rgb(200,40,40)")
                    && Math.abs(Double.parseDouble(line.attr("x1")) - x) < 0.011
                    && Math.abs(Double.parseDouble(line.attr("x2")) - x) < 0.011) {
                limitLines++;
            }
        }
        assertEquals(3, limitLines, "one limit line per panel at x = " + x);
        assertTrue(drawn.svg().text().contains("lower-corner limit 35 Hz"));

        ValueAxis gainAxis = plot.getSubplots().get(0).getRangeAxis();
        double level = root.path("measured").path("midband_gain_db").asDouble() - 3.0103;
        double y = gainArea.getMaxY() - gainArea.getHeight() * (level - gainAxis.getLowerBound()) / gainAxis.getRange().getLength();
        boolean found = false;
        for (Element line : drawn.svg().select("line")) {
            if (line.attr("style").contains("stroke:rgb(90,90,90)")
                    && Math.abs(Double.parseDouble(line.attr("y1")) - y) < 0.011) {
                found = true;
            }
        }
        assertTrue(found, "no −3 dB line at y = " + y);
    }

    // the residual panel sits between gain and phase and holds each point's gain minus the
    // fitted curve's. The demo sweep's notes state Gaussian noise of 0.05 dB per point; 0.5 dB
    // (10 σ) leaves room for the fit's own error yet fails a residual taken against the wrong
    // curve (the nominal stage sits 10 dB and more away below 10 Hz) or at the wrong frequency
    @Test
    void residualPanelHoldsEveryPointAgainstTheModel() {
        JsonNode root = DemoResult.shared();
        CombinedDomainXYPlot plot = (CombinedDomainXYPlot) charts.bode(root).chart().getPlot();
        assertEquals(3, plot.getSubplots().size());
        XYPlot residuals = plot.getSubplots().get(1);
        assertEquals("Residual (dB)", residuals.getRangeAxis().getLabel());
        XYDataset data = residuals.getDataset();
        assertEquals(root.path("sweep").path("points").size(), data.getItemCount(0));
        for (int i = 0; i < data.getItemCount(0); i++) {
            assertTrue(Math.abs(data.getYValue(0, i)) < 0.5, "residual " + data.getYValue(0, i));
        }
    }

    // a sweep made noiselessly from a known rational response (a second-order high-pass with
    // poles at 1 and 3 Hz, 20 dB midband: the truth) and fitted: each residual is the point's
    // gain minus the model's at that same frequency, so it is at the fit's own error (well under
    // 1e-3 dB here), not the 0.1–0.3 dB that reading a drawn curve between its grid points gave
    // where the gain turns fastest
    @Test
    void residualsAreTakenAtEachPointsOwnFrequency() throws org.polebench.InputProblem {
        List<org.polebench.sweep.SweepPoint> points = new ArrayList<>();
        for (int i = 0; i <= 60; i++) {
            double f = 0.1 * Math.pow(1e4, i / 60.0);
            org.apache.commons.math3.complex.Complex s = new org.apache.commons.math3.complex.Complex(0, f);
            org.apache.commons.math3.complex.Complex h = s.multiply(s).multiply(10)
                    .divide(s.add(1).multiply(s.add(3)));
            points.add(new org.polebench.sweep.SweepPoint(f, 20 * Math.log10(h.abs()),
                    java.util.OptionalDouble.of(Math.toDegrees(h.getArgument())), java.util.OptionalDouble.empty(),
                    java.util.OptionalDouble.empty()));
        }
        org.polebench.sweep.Sweep sweep = new org.polebench.sweep.Sweep(
                org.polebench.sweep.Provenance.inMemory("noiseless second-order high-pass"), points);
        org.polebench.fit.FitResult fit = new org.polebench.fit.SweepFitter(org.polebench.fit.FitSettings.defaults()).fit(sweep);
        BodeChart chart = BodeChart.ofFit("truth", sweep, fit);
        assertEquals(points.size(), chart.residuals().size());
        for (ResponsePoint r : chart.residuals()) {
            assertTrue(Math.abs(r.gainDb()) < 1e-3, "residual " + r.gainDb() + " dB at " + r.frequencyHz() + " Hz");
        }
    }

    // the demo board's sweep was synthesized with C2 at 220 nF (the sweep file's notes), and the
    // most probable hypothesis names it: C2 alone is drawn in the culprit series
    @Test
    void culpritIsDrawnApart() {
        JsonNode root = DemoResult.shared();
        assertEquals("C2", ReportCharts.culprit(root).orElseThrow());
        XYPlot plot = (XYPlot) charts.capacitorBands(root).getPlot();
        XYDataset estimates = plot.getDataset(1);
        assertEquals(2, estimates.getSeriesCount());
        assertEquals(1, estimates.getItemCount(1));
        assertTrue(estimates.getSeriesKey(1).toString().endsWith("C2"));
        int row = 0;
        while (!"C2".equals(root.path("capacitors").get(row).path("id").asText())) {
            row++;
        }
        assertEquals(row, estimates.getXValue(1, 0), 0);
        assertTrue(!plot.getRenderer(1).getSeriesPaint(1).equals(plot.getRenderer(1).getSeriesPaint(0)));
        // and its bar among the SCTC shares has a colour of its own
        org.jfree.chart.plot.CategoryPlot shares = (org.jfree.chart.plot.CategoryPlot) charts.cornerShares(root).getPlot();
        int column = shares.getDataset().getColumnIndex("C2");
        for (int c = 0; c < shares.getDataset().getColumnCount(); c++) {
            boolean same = shares.getRenderer().getItemPaint(0, c).equals(shares.getRenderer().getItemPaint(0, column));
            assertEquals(c == column, same, "column " + c);
        }
    }

    // a title as long as a paragraph takes no more height than a short one: it keeps to one line
    @Test
    void titleNeverSqueezesThePlot() {
        JsonNode root = DemoResult.shared();
        JFreeChart shortTitle = charts.capacitorBands(root);
        JFreeChart longTitle = charts.capacitorBands(root);
        shortTitle.setTitle("C");
        longTitle.setTitle("Capacitors ".repeat(40));
        ReportCharts.titled(shortTitle);
        ReportCharts.titled(longTitle);
        ChartRenderingInfo a = new ChartRenderingInfo();
        ChartRenderingInfo b = new ChartRenderingInfo();
        shortTitle.createBufferedImage(ReportCharts.WIDTH, ReportCharts.BAR_HEIGHT, a);
        longTitle.createBufferedImage(ReportCharts.WIDTH, ReportCharts.BAR_HEIGHT, b);
        assertEquals(a.getPlotInfo().getDataArea().getHeight(), b.getPlotInfo().getDataArea().getHeight(), 1e-9);
    }
}

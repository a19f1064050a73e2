package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javax.imageio.ImageIO;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.fit.FitResult;
import org.polebench.fit.FitSettings;
import org.polebench.fit.SweepFitter;
import org.polebench.sweep.Sweep;

class BodeChartTest {

    private static BodeChart chart() throws InputProblem {
        Sweep sweep = ReportFixtures.stage(true, 1);
        FitResult fit = new SweepFitter(FitSettings.defaults()).fit(sweep);
        return BodeChart.ofFit("Demo stage, synthetic sweep", sweep, fit);
    }

    // JFreeSVG ids are time-based unless the defs key prefix is fixed (docs/contributing.md, "Library behaviour the code works around")
    @Test
    void svgIsByteIdenticalFromRunToRun() throws InputProblem {
        assertEquals(chart().svg(900, 700), chart().svg(900, 700));
    }

    // the SVG parses as XML (jsoup's XML parser, independent of JFreeSVG); horizontal labels are
    // <text> (JFreeChart draws rotated labels through TextLayout, which JFreeSVG writes as outlines)
    @Test
    void svgHasBothPanelsAndALogFrequencyAxis() throws InputProblem {
        Document svg = Jsoup.parse(chart().svg(900, 700), "", Parser.xmlParser());
        assertEquals("svg", svg.child(0).tagName());
        String text = svg.text();
        assertTrue(text.contains("Frequency"));
        assertTrue(text.contains("Demo stage, synthetic sweep"));
        assertTrue(text.contains("measured"));
        assertTrue(text.contains("fitted model (3 poles, 2 DC zeros, 1 real zero)"));
        CombinedDomainXYPlot plot = (CombinedDomainXYPlot) chart().chart().getPlot();
        // a log axis needs an explicit positive range (docs/contributing.md, "Library behaviour the code works around"); the sweep starts at 1 Hz
        assertTrue(plot.getDomainAxis().getLowerBound() > 0);
        assertTrue(plot.getDomainAxis().getLowerBound() < 1);
        // gain, residuals against the fitted model, phase
        assertEquals(3, plot.getSubplots().size());
        XYPlot gain = plot.getSubplots().get(0);
        // dataset 1 holds the measured points, dataset 0 the curves (drawn last, on top)
        assertEquals(100, gain.getDataset(1).getItemCount(0));
    }

    @Test
    void pngHasTheRequestedSize(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("bode.png");
        chart().write(file);
        BufferedImage image = ImageIO.read(new ByteArrayInputStream(Files.readAllBytes(file)));
        assertEquals(900, image.getWidth());
        assertEquals(700, image.getHeight());
    }

    @Test
    void unknownPlotFormatIsAnInputProblem(@TempDir Path dir) {
        InputProblem problem = assertThrows(InputProblem.class, () -> chart().write(dir.resolve("bode.pdf")));
        assertTrue(problem.hint().contains(".svg"));
    }

    // measured phases only known modulo 360° are drawn on the fitted curve's branch:
    // an inverting stage reads near ±180°, and both signs must land on one side
    @Test
    void measuredPhasesJoinTheCurvesBranch() throws InputProblem {
        List<ResponsePoint> curve = new ArrayList<>();
        List<ResponsePoint> measured = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            double f = 100 * Math.pow(10, i / 10.0);
            curve.add(new ResponsePoint(f, 0, java.util.OptionalDouble.of(179.0)));
            measured.add(new ResponsePoint(f, 0, java.util.OptionalDouble.of(i % 2 == 0 ? 179.5 : -179.5)));
        }
        BodeChart chart = new BodeChart("branch").with(new BodeSeries.Measured("m", measured))
                .with(new BodeSeries.Curve("c", curve));
        XYPlot phase = ((CombinedDomainXYPlot) chart.chart().getPlot()).getSubplots().get(1);
        for (int i = 0; i < 20; i++) {
            double y = phase.getDataset(1).getYValue(0, i);
            // 179.5° and −179.5° (≡ 180.5°) lie 0.5° and 1.5° from the curve's 179° on its branch;
            // drawn raw, −179.5° would sit 358.5° away
            assertEquals(179, y, 1.5 + 1e-9);
        }
    }
}

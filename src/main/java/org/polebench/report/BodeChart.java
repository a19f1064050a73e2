package org.polebench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.geom.Ellipse2D;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import org.polebench.fit.FitResult;
import org.polebench.fit.FittedModel;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * A Bode plot: gain (dB) above phase (°) on a shared logarithmic frequency axis, with any number
 * of measured series, computed curves and shaded gain bands ({@link BodeSeries}). Immutable: each
 * {@code with…} returns a new chart. Phases are drawn continuous: each curve is unwrapped along
 * frequency and placed so its top-frequency phase lies in (−180°, 180°]; a measured series is
 * unwrapped along frequency too (a phase reading is only known modulo 360°), then moved as a whole
 * by the whole turns that bring it nearest, on average, to the first curve. Moving each point on
 * its own would tear a sweep apart wherever that curve strays more than 180° from it (a poor fit,
 * or the nominal stage beside a faulty board).
 *
 * <p>SVG output goes through JFreeSVG with a fixed defs-key prefix, so the same chart gives the
 * same bytes on every run (docs/contributing.md, "Library behaviour the code works around"); the frequency axis gets an explicit
 * positive range (a log axis reaching 0 draws nothing).
 */
public final class BodeChart {
    /** Curve points per decade when drawing a fitted model. */
    private static final int CURVE_POINTS_PER_DECADE = 60;

    private final String title;
    private final List<BodeSeries> series;

    public BodeChart(String title) {
        this(title, List.of());
    }

    private BodeChart(String title, List<BodeSeries> series) {
        this.title = title;
        this.series = List.copyOf(series);
    }

    /** Data and fitted model of one sweep, the curve spanning the sweep. */
    public static BodeChart ofFit(String title, Sweep sweep, FitResult fit) {
        return new BodeChart(title)
                .with(new BodeSeries.Measured("measured", measured(sweep)))
                .with(new BodeSeries.Curve("fitted model (" + fit.structure().describe() + ")",
                        curve(fit.model(), sweep.lowestHz(), sweep.highestHz())));
    }

    public BodeChart with(BodeSeries more) {
        List<BodeSeries> all = new ArrayList<>(series);
        all.add(more);
        return new BodeChart(title, all);
    }

    public List<BodeSeries> series() {
        return series;
    }

    /** The sweep's points as a measured series. */
    public static List<ResponsePoint> measured(Sweep sweep) {
        List<ResponsePoint> points = new ArrayList<>();
        for (SweepPoint p : sweep.points()) {
            points.add(new ResponsePoint(p.frequencyHz(), p.gainDb(), p.phaseDeg()));
        }
        return points;
    }

    /** A model's response, log-spaced from lowHz to highHz. */
    public static List<ResponsePoint> curve(FittedModel model, double lowHz, double highHz) {
        int n = Math.max(2, (int) Math.ceil(CURVE_POINTS_PER_DECADE * Math.log10(highHz / lowHz)) + 1);
        List<ResponsePoint> points = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double f = lowHz * Math.pow(highHz / lowHz, i / (double) (n - 1));
            Complex h = model.responseAt(f);
            points.add(new ResponsePoint(f, 20 * Math.log10(h.abs()), OptionalDouble.of(Math.toDegrees(h.getArgument()))));
        }
        return points;
    }

    /** The JFreeChart object, for callers that draw it themselves. */
    public JFreeChart chart() {
        XYSeriesCollection gainLines = new XYSeriesCollection();
        XYSeriesCollection phaseLines = new XYSeriesCollection();
        YIntervalSeriesCollection bands = new YIntervalSeriesCollection();
        XYLineAndShapeRenderer gainRenderer = new XYLineAndShapeRenderer();
        XYLineAndShapeRenderer phaseRenderer = new XYLineAndShapeRenderer();
        // one path per curve instead of one <line> element per segment in the SVG
        gainRenderer.setDrawSeriesLineAsPath(true);
        phaseRenderer.setDrawSeriesLineAsPath(true);
        double low = Double.POSITIVE_INFINITY;
        double high = 0;
        double[][] reference = null;
        int index = 0;
        for (BodeSeries s : series) {
            Drawing drawing = s.match(DRAWING);
            if (drawing.curve()) {
                double[][] unwrapped = unwrappedPhases(drawing.points());
                if (reference == null && unwrapped != null) {
                    reference = unwrapped;
                }
            }
        }
        for (BodeSeries s : series) {
            Drawing drawing = s.match(DRAWING);
            if (drawing.band() != null) {
                YIntervalSeries band = new YIntervalSeries(s.label());
                for (GainBandPoint p : drawing.band()) {
                    band.add(p.frequencyHz(), 0.5 * (p.lowDb() + p.highDb()), p.lowDb(), p.highDb());
                    low = Math.min(low, p.frequencyHz());
                    high = Math.max(high, p.frequencyHz());
                }
                bands.addSeries(band);
                continue;
            }
            boolean isCurve = drawing.curve();
            List<ResponsePoint> points = drawing.points();
            XYSeries gain = new XYSeries(s.label(), false, true);
            XYSeries phase = new XYSeries(s.label(), false, true);
            double[][] curvePhase = isCurve ? unwrappedPhases(points) : null;
            double[] measuredPhase = isCurve ? null : measuredPhases(points, reference);
            for (int i = 0; i < points.size(); i++) {
                ResponsePoint p = points.get(i);
                gain.add(p.frequencyHz(), p.gainDb());
                low = Math.min(low, p.frequencyHz());
                high = Math.max(high, p.frequencyHz());
                if (p.phaseDeg().isPresent()) {
                    phase.add(p.frequencyHz(), curvePhase != null ? curvePhase[1][i] : measuredPhase[i]);
                }
            }
            gainLines.addSeries(gain);
            phaseLines.addSeries(phase);
            style(gainRenderer, index, isCurve);
            style(phaseRenderer, index, isCurve);
            index++;
        }
        if (!(high > low)) {
            low = high > 0 ? high / 10 : 1;
            high = low * 100;
        }
        LogAxis frequency = new LogAxis("Frequency (Hz)");
        frequency.setRange(low / 1.1, high * 1.1);
        frequency.setNumberFormatOverride(new DecimalFormat("#,##0.###", DecimalFormatSymbols.getInstance(Locale.ROOT)));
        frequency.setBase(10);
        // one tick per decade: the default half-decade ticks print as 3.162, 31.623, …
        frequency.setTickUnit(new NumberTickUnit(1));

        NumberAxis gainAxis = new NumberAxis("Gain (dB)");
        gainAxis.setAutoRangeIncludesZero(false);
        XYPlot gainPlot = new XYPlot(gainLines, null, gainAxis, gainRenderer);
        if (bands.getSeriesCount() > 0) {
            DeviationRenderer shade = new DeviationRenderer(true, false);
            for (int i = 0; i < bands.getSeriesCount(); i++) {
                shade.setSeriesFillPaint(i, new Color(120, 160, 220));
                shade.setSeriesPaint(i, new Color(120, 160, 220));
            }
            shade.setAlpha(0.3f);
            gainPlot.setDataset(1, bands);
            gainPlot.setRenderer(1, shade);
        }
        NumberAxis phaseAxis = new NumberAxis("Phase (°)");
        phaseAxis.setAutoRangeIncludesZero(false);
        XYPlot phasePlot = new XYPlot(phaseLines, null, phaseAxis, phaseRenderer);
        phasePlot.setRenderer(phaseRenderer);

        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(frequency);
        plot.setGap(10);
        plot.add(gainPlot, 3);
        plot.add(phasePlot, 2);
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        gainPlot.setBackgroundPaint(Color.WHITE);
        phasePlot.setBackgroundPaint(Color.WHITE);
        gainPlot.setDomainGridlinePaint(Color.LIGHT_GRAY);
        gainPlot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        phasePlot.setDomainGridlinePaint(Color.LIGHT_GRAY);
        phasePlot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        // the phase panel repeats the gain panel's series; one legend entry each is enough
        phaseRenderer.setDefaultSeriesVisibleInLegend(false);
        return chart;
    }

    /** The chart as an SVG document; byte-identical for an identical chart. */
    public String svg(int width, int height) {
        return ReportCharts.svgDocument(chart(), width, height, "pb");
    }

    /** The chart as PNG bytes. */
    public byte[] png(int width, int height) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        ChartUtils.writeChartAsPNG(bytes, chart(), width, height);
        return bytes.toByteArray();
    }

    /**
     * Writes the chart to a file ending in .svg or .png (900 × 700 pixels), replacing it
     * atomically ({@link OutputFile}; the caller has asked whether it may).
     *
     * @throws InputProblem when the file name has neither ending
     * @throws IOException  when the file cannot be written
     */
    public void write(Path file) throws IOException, InputProblem {
        String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".svg")) {
            byte[] bytes = svg(900, 700).getBytes(StandardCharsets.UTF_8);
            OutputFile.write(file, true, out -> out.write(bytes));
        } else if (name.endsWith(".png")) {
            byte[] bytes = png(900, 700);
            OutputFile.write(file, true, out -> out.write(bytes));
        } else {
            throw new InputProblem(null, 0, "cannot tell the plot format of '" + file.getFileName() + "'",
                    "name the plot file FILE.svg or FILE.png");
        }
    }

    /**
     * A series as the chart draws it: a shaded gain band ({@code band} set), or response points
     * drawn as a line ({@code curve}) or as markers.
     */
    private record Drawing(List<GainBandPoint> band, List<ResponsePoint> points, boolean curve) {
    }

    private static final BodeSeries.Cases<Drawing> DRAWING = new BodeSeries.Cases<>() {
        @Override
        public Drawing measured(BodeSeries.Measured measured) {
            return new Drawing(null, measured.points(), false);
        }

        @Override
        public Drawing curve(BodeSeries.Curve curve) {
            return new Drawing(null, curve.points(), true);
        }

        @Override
        public Drawing gainBand(BodeSeries.GainBand band) {
            return new Drawing(band.points(), null, false);
        }
    };

    private static void style(XYLineAndShapeRenderer renderer, int index, boolean curve) {
        Color[] palette = {new Color(0, 0, 0), new Color(200, 40, 40), new Color(30, 90, 200), new Color(20, 140, 60),
            new Color(150, 70, 170)};
        Color colour = palette[index % palette.length];
        renderer.setSeriesPaint(index, colour);
        renderer.setSeriesLinesVisible(index, curve);
        renderer.setSeriesShapesVisible(index, !curve);
        renderer.setSeriesShape(index, new Ellipse2D.Double(-2.5, -2.5, 5, 5));
        renderer.setSeriesStroke(index, new BasicStroke(curve ? 1.8f : 1f));
    }

    /** {frequencies, unwrapped phases} of a curve, top phase in (−180°, 180°]; null without phase. */
    private static double[][] unwrappedPhases(List<ResponsePoint> points) {
        int n = points.size();
        if (n == 0 || points.get(0).phaseDeg().isEmpty()) {
            return null;
        }
        double[] f = new double[n];
        double[] deg = new double[n];
        for (int i = 0; i < n; i++) {
            f[i] = points.get(i).frequencyHz();
            double raw = points.get(i).phaseDeg().orElse(Double.NaN);
            deg[i] = i == 0 ? raw : nearest(raw, deg[i - 1]);
        }
        double shift = deg[n - 1] - Math.IEEEremainder(deg[n - 1], 360);
        if (Math.IEEEremainder(deg[n - 1], 360) == -180) {
            shift -= 360;
        }
        for (int i = 0; i < n; i++) {
            deg[i] -= shift;
        }
        return new double[][]{f, deg};
    }

    /**
     * A measured series' phases unwrapped along frequency, then shifted by the whole turns that
     * bring their mean nearest the reference curve's at the same frequencies; NaN where a point
     * has no phase.
     */
    private static double[] measuredPhases(List<ResponsePoint> points, double[][] reference) {
        double[] deg = new double[points.size()];
        double previous = Double.NaN;
        double offset = 0;
        int counted = 0;
        for (int i = 0; i < points.size(); i++) {
            if (points.get(i).phaseDeg().isEmpty()) {
                deg[i] = Double.NaN;
                continue;
            }
            double raw = points.get(i).phaseDeg().getAsDouble();
            deg[i] = Double.isNaN(previous) ? raw : nearest(raw, previous);
            previous = deg[i];
            if (reference != null) {
                offset += interpolate(reference, points.get(i).frequencyHz()) - deg[i];
                counted++;
            }
        }
        if (counted > 0) {
            double turns = 360 * Math.rint(offset / counted / 360);
            for (int i = 0; i < deg.length; i++) {
                deg[i] += turns;
            }
        }
        return deg;
    }

    /** The angle congruent to {@code deg} modulo 360° nearest {@code target}. */
    private static double nearest(double deg, double target) {
        return target + Math.IEEEremainder(deg - target, 360);
    }

    /** Linear interpolation of the curve in log frequency, held constant beyond its ends. */
    private static double interpolate(double[][] curve, double f) {
        double[] x = curve[0];
        double[] y = curve[1];
        if (f <= x[0]) {
            return y[0];
        }
        for (int i = 1; i < x.length; i++) {
            if (f <= x[i]) {
                double t = Math.log(f / x[i - 1]) / Math.log(x[i] / x[i - 1]);
                return y[i - 1] + t * (y[i] - y[i - 1]);
            }
        }
        return y[y.length - 1];
    }
}

package org.polebench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
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
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.SeriesRenderingOrder;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
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
import org.polebench.units.MeasuredValueFormat;

/**
 * A Bode plot: gain (dB) above phase (°) on a shared logarithmic frequency axis with 1-2-5 ticks
 * (OneTwoFiveAxis), with any number of measured series, computed curves and shaded gain
 * bands ({@link BodeSeries}), labelled level and limit lines, and optionally a residual panel
 * between gain and phase. Immutable: each {@code with…} returns a new chart. Phases are drawn continuous: each curve is unwrapped along
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

    /** −3 dB below midband, to the digits the trade writes: 20·log10(1/√2) = −3.0103 dB. */
    public static final double HALF_POWER_DB = 20 * Math.log10(Math.sqrt(0.5));

    private static final Color LIMIT = new Color(200, 40, 40);
    private static final Color LEVEL = new Color(90, 90, 90);

    private final String title;
    private final List<BodeSeries> series;
    private final List<Level> gainLevels;
    private final List<Level> frequencyLimits;
    /** each measured point's gain minus the model's at its own frequency, in dB; empty for no panel */
    private final List<ResponsePoint> residuals;

    /** A labelled line across a panel: a gain level in dB or a frequency in Hz. */
    private record Level(String label, double value) {
    }

    public BodeChart(String title) {
        this(title, List.of(), List.of(), List.of(), List.of());
    }

    private BodeChart(String title, List<BodeSeries> series, List<Level> gainLevels, List<Level> frequencyLimits,
            List<ResponsePoint> residuals) {
        this.title = title;
        this.series = List.copyOf(series);
        this.gainLevels = List.copyOf(gainLevels);
        this.frequencyLimits = List.copyOf(frequencyLimits);
        this.residuals = List.copyOf(residuals);
    }

    /** Data and fitted model of one sweep, the curve spanning the sweep. */
    public static BodeChart ofFit(String title, Sweep sweep, FitResult fit) {
        String model = "fitted model (" + fit.structure().describe() + ")";
        return new BodeChart(title)
                .with(new BodeSeries.Measured("measured", measured(sweep)))
                .with(new BodeSeries.Curve(model, curve(fit.model(), sweep.lowestHz(), sweep.highestHz())))
                .withResiduals(residuals(sweep, fit.model()));
    }

    public BodeChart with(BodeSeries more) {
        List<BodeSeries> all = new ArrayList<>(series);
        all.add(more);
        return new BodeChart(title, all, gainLevels, frequencyLimits, residuals);
    }

    /** A horizontal line across the gain panel at {@code db}, labelled at its right end. */
    public BodeChart withGainLevel(String label, double db) {
        List<Level> all = new ArrayList<>(gainLevels);
        all.add(new Level(label, db));
        return new BodeChart(title, series, all, frequencyLimits, residuals);
    }

    /** A vertical line through every panel at {@code hz} (a limit), labelled on the gain panel. */
    public BodeChart withFrequencyLimit(String label, double hz) {
        List<Level> all = new ArrayList<>(frequencyLimits);
        all.add(new Level(label, hz));
        return new BodeChart(title, series, gainLevels, all, residuals);
    }

    /**
     * A residual panel under the gain panel: each point (frequency in Hz, residual in dB) is a
     * measured point's gain minus the model's at that point's own frequency, worked from the
     * model itself. Not read off a drawn curve: interpolating the curve between its grid points
     * put up to 0.3 dB of the grid's own error into the panel where the gain turns fastest.
     */
    public BodeChart withResiduals(List<ResponsePoint> pointResiduals) {
        return new BodeChart(title, series, gainLevels, frequencyLimits, pointResiduals);
    }

    /** @return the residual panel's points, empty when the chart has none */
    public List<ResponsePoint> residuals() {
        return residuals;
    }

    /** @return each sweep point's gain minus the model's gain at its frequency, in dB */
    public static List<ResponsePoint> residuals(Sweep sweep, FittedModel model) {
        List<ResponsePoint> list = new ArrayList<>();
        for (SweepPoint p : sweep.points()) {
            list.add(new ResponsePoint(p.frequencyHz(), p.gainDb() - 20 * Math.log10(model.responseAt(p.frequencyHz()).abs()),
                    OptionalDouble.empty()));
        }
        return list;
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

    /**
     * The JFreeChart object, for callers that draw it themselves. Each panel holds the curves in
     * dataset 0, the measured points in dataset 1 and (gain panel) the shaded bands in dataset 2;
     * datasets are drawn from the highest index down and series from the last down, so the
     * shading lies at the bottom, the points above it and the first curve (the fitted model, as
     * the callers list it) on top of everything: points drawn over the model hid it.
     */
    public JFreeChart chart() {
        XYSeriesCollection gainCurves = new XYSeriesCollection();
        XYSeriesCollection gainPoints = new XYSeriesCollection();
        XYSeriesCollection phaseCurves = new XYSeriesCollection();
        XYSeriesCollection phasePoints = new XYSeriesCollection();
        YIntervalSeriesCollection bands = new YIntervalSeriesCollection();
        XYLineAndShapeRenderer gainCurveRenderer = lines();
        XYLineAndShapeRenderer phaseCurveRenderer = lines();
        XYLineAndShapeRenderer gainPointRenderer = markers();
        XYLineAndShapeRenderer phasePointRenderer = markers();
        double low = Double.POSITIVE_INFINITY;
        double high = 0;
        double[][] reference = null;
        for (BodeSeries s : series) {
            Drawing drawing = s.match(DRAWING);
            if (drawing.curve()) {
                double[][] unwrapped = unwrappedPhases(drawing.points());
                if (reference == null && unwrapped != null) {
                    reference = unwrapped;
                }
            }
        }
        int index = 0;
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
            Color colour = PALETTE[index % PALETTE.length];
            if (isCurve) {
                gainCurves.addSeries(gain);
                phaseCurves.addSeries(phase);
                gainCurveRenderer.setSeriesPaint(gainCurves.getSeriesCount() - 1, colour);
                phaseCurveRenderer.setSeriesPaint(phaseCurves.getSeriesCount() - 1, colour);
            } else {
                gainPoints.addSeries(gain);
                phasePoints.addSeries(phase);
                gainPointRenderer.setSeriesPaint(gainPoints.getSeriesCount() - 1, colour);
                phasePointRenderer.setSeriesPaint(phasePoints.getSeriesCount() - 1, colour);
            }
            index++;
        }
        if (!(high > low)) {
            low = high > 0 ? high / 10 : 1;
            high = low * 100;
        }
        for (Level limit : frequencyLimits) {
            if (limit.value() > 0 && Double.isFinite(limit.value())) {
                low = Math.min(low, limit.value());
                high = Math.max(high, limit.value());
            }
        }
        OneTwoFiveAxis frequency = new OneTwoFiveAxis("Frequency", hz -> MeasuredValueFormat.engineering(hz, "Hz", 3));
        frequency.setRange(low / 1.1, high * 1.1);

        NumberAxis gainAxis = new NumberAxis("Gain (dB)");
        gainAxis.setNumberFormatOverride(plainNumbers());
        gainAxis.setAutoRangeIncludesZero(false);
        XYPlot gainPlot = panel(gainCurves, gainCurveRenderer, gainPoints, gainPointRenderer, gainAxis);
        if (bands.getSeriesCount() > 0) {
            DeviationRenderer shade = new DeviationRenderer(true, false);
            for (int i = 0; i < bands.getSeriesCount(); i++) {
                shade.setSeriesFillPaint(i, new Color(120, 160, 220));
                shade.setSeriesPaint(i, new Color(120, 160, 220));
            }
            shade.setAlpha(0.3f);
            gainPlot.setDataset(2, bands);
            gainPlot.setRenderer(2, shade);
        }
        for (Level level : gainLevels) {
            ValueMarker line = marker(level, LEVEL);
            line.setLabelAnchor(RectangleAnchor.BOTTOM_RIGHT);
            line.setLabelTextAnchor(TextAnchor.TOP_RIGHT);
            gainPlot.addRangeMarker(line, Layer.FOREGROUND);
        }
        NumberAxis phaseAxis = new NumberAxis("Phase (°)");
        phaseAxis.setNumberFormatOverride(plainNumbers());
        phaseAxis.setAutoRangeIncludesZero(false);
        XYPlot phasePlot = panel(phaseCurves, phaseCurveRenderer, phasePoints, phasePointRenderer, phaseAxis);
        // the phase panel repeats the gain panel's series; one legend entry each is enough
        phaseCurveRenderer.setDefaultSeriesVisibleInLegend(false);
        phasePointRenderer.setDefaultSeriesVisibleInLegend(false);

        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(frequency);
        plot.setGap(8);
        plot.add(gainPlot, 3);
        XYPlot residualPlot = residualPanel(residuals);
        if (residualPlot != null) {
            plot.add(residualPlot, 1);
        }
        plot.add(phasePlot, 2);
        for (Level limit : frequencyLimits) {
            for (XYPlot panel : plot.getSubplots()) {
                ValueMarker line = marker(limit, LIMIT);
                if (panel != gainPlot) {
                    line.setLabel(null);
                }
                line.setLabelAnchor(RectangleAnchor.BOTTOM_RIGHT);
                line.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
                panel.addDomainMarker(line, Layer.FOREGROUND);
            }
        }
        return ReportCharts.titled(new JFreeChart(title, TITLE_FONT, plot, true));
    }

    /** Font of a chart's title: smaller than JFreeChart's 18 pt bold, which took the plot's room. */
    static final Font TITLE_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 13);

    private static final Color[] PALETTE = {new Color(0, 0, 0), new Color(200, 40, 40), new Color(30, 90, 200),
        new Color(20, 140, 60), new Color(150, 70, 170)};

    /**
     * Tick labels with a decimal point whatever the default locale (JFreeChart's NumberAxis
     * formats with it: 0,2 under de_DE), so a plot's bytes do not depend on where it was drawn.
     */
    private static DecimalFormat plainNumbers() {
        DecimalFormatSymbols symbols = DecimalFormatSymbols.getInstance(Locale.ROOT);
        // the one minus sign the report prints everywhere (U+2212), not the hyphen
        symbols.setMinusSign('\u2212');
        return new DecimalFormat("0.####", symbols);
    }

    private static XYLineAndShapeRenderer lines() {
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        // one path per curve instead of one <line> element per segment in the SVG
        renderer.setDrawSeriesLineAsPath(true);
        renderer.setDefaultStroke(new BasicStroke(1.8f));
        renderer.setAutoPopulateSeriesStroke(false);
        return renderer;
    }

    private static XYLineAndShapeRenderer markers() {
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(false, true);
        renderer.setDefaultShape(new Ellipse2D.Double(-3, -3, 6, 6));
        renderer.setAutoPopulateSeriesShape(false);
        // open circles: the model's line drawn over them stays visible through each point
        renderer.setDefaultShapesFilled(false);
        return renderer;
    }

    private static XYPlot panel(XYSeriesCollection curves, XYLineAndShapeRenderer curveRenderer, XYSeriesCollection points,
            XYLineAndShapeRenderer pointRenderer, NumberAxis axis) {
        XYPlot panel = new XYPlot(curves, null, axis, curveRenderer);
        panel.setDataset(1, points);
        panel.setRenderer(1, pointRenderer);
        panel.setDatasetRenderingOrder(DatasetRenderingOrder.REVERSE);
        panel.setSeriesRenderingOrder(SeriesRenderingOrder.REVERSE);
        panel.setBackgroundPaint(Color.WHITE);
        panel.setDomainGridlinePaint(Color.LIGHT_GRAY);
        panel.setRangeGridlinePaint(Color.LIGHT_GRAY);
        return panel;
    }

    private static ValueMarker marker(Level level, Color colour) {
        ValueMarker line = new ValueMarker(level.value(), colour, new BasicStroke(1.2f, BasicStroke.CAP_BUTT,
                BasicStroke.JOIN_MITER, 1f, new float[]{6f, 3f}, 0f));
        line.setLabel(level.label());
        line.setLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
        line.setLabelPaint(colour);
        line.setLabelBackgroundColor(new Color(255, 255, 255, 220));
        line.setLabelOffset(new RectangleInsets(3, 4, 3, 4));
        return line;
    }

    /** The gain residuals as a small panel; null without any. */
    private static XYPlot residualPanel(List<ResponsePoint> points) {
        XYSeries residuals = new XYSeries("residual", false, true);
        for (ResponsePoint p : points) {
            residuals.add(p.frequencyHz(), p.gainDb());
        }
        if (residuals.getItemCount() == 0) {
            return null;
        }
        NumberAxis axis = new NumberAxis("Residual (dB)");
        axis.setNumberFormatOverride(plainNumbers());
        // symmetric about zero, so a bias shows as the points sitting to one side of the line
        double extent = Math.max(Math.abs(residuals.getMinY()), Math.abs(residuals.getMaxY()));
        extent = extent > 0 ? extent * 1.15 : 0.1;
        axis.setRange(-extent, extent);
        XYLineAndShapeRenderer dots = markers();
        dots.setSeriesPaint(0, PALETTE[0]);
        dots.setDefaultSeriesVisibleInLegend(false);
        XYPlot panel = new XYPlot(new XYSeriesCollection(residuals), null, axis, dots);
        panel.setBackgroundPaint(Color.WHITE);
        panel.setDomainGridlinePaint(Color.LIGHT_GRAY);
        panel.setRangeGridlinePaint(Color.LIGHT_GRAY);
        panel.addRangeMarker(new ValueMarker(0, Color.DARK_GRAY, new BasicStroke(1f)));
        return panel;
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

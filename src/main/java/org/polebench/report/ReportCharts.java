package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.Rectangle;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Rectangle2D;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;
import org.polebench.units.MeasuredValueFormat;

/**
 * The report's three charts, drawn with JFreeChart from a result's JSON object
 * ({@link ResultJson}) alone, so a saved {@code result.json} redraws them:
 * <ul>
 * <li>{@link #bode}: measured points, fitted model, the nominal stage's exact response, the SCTC
 *     single-pole estimate and the tolerance band shaded on the gain panel, the residuals against
 *     the fitted model under it, the measured midband less 3.01 dB and the lower-corner limit;</li>
 * <li>{@link #cornerShares}: each capacitor's share of the SCTC corner, (1/τᵢ)/Σ(1/τ), in %;</li>
 * <li>{@link #capacitorBands}: each back-solved capacitor as C/C_nom with ±U (k = 2) against its
 *     tolerance band, on a log axis with 1-2-5 ticks, the most probable culprit in red.</li>
 * </ul>
 * SVG goes through JFreeSVG with a fixed defs-key prefix per chart, so the bytes repeat from run
 * to run and several charts can sit inline in one page without their ids colliding
 * (docs/contributing.md, "Library behaviour the code works around").
 */
public final class ReportCharts {
    /** Width and height in CSS pixels of every chart as written. */
    public static final int WIDTH = 720;
    public static final int BODE_HEIGHT = 560;
    public static final int BAR_HEIGHT = 300;

    private static final Color BAND = new Color(120, 160, 220);
    private static final Color ESTIMATE = new Color(40, 40, 40);
    /** The most probable hypothesis' part, drawn apart from the rest. */
    private static final Color CULPRIT = new Color(200, 40, 40);
    private static final String FITTED = "fitted model";

    /** The Bode plot. */
    public BodeChart bode(JsonNode root) {
        JsonNode curves = root.path("curves");
        List<ResponsePoint> measured = new ArrayList<>();
        List<ResponsePoint> residuals = new ArrayList<>();
        for (JsonNode p : root.path("sweep").path("points")) {
            measured.add(new ResponsePoint(p.path("frequency_hz").asDouble(), p.path("gain_db").asDouble(),
                    p.path("phase_deg").isNumber() ? OptionalDouble.of(p.path("phase_deg").asDouble())
                            : OptionalDouble.empty()));
            if (p.path("fitted_gain_db").isNumber()) {
                // the fitted model at the point's own frequency, as result.json holds it
                residuals.add(new ResponsePoint(p.path("frequency_hz").asDouble(),
                        p.path("gain_db").asDouble() - p.path("fitted_gain_db").asDouble(), OptionalDouble.empty()));
            }
        }
        JsonNode grid = curves.path("frequency_hz");
        List<GainBandPoint> band = new ArrayList<>();
        for (int i = 0; i < grid.size(); i++) {
            JsonNode low = curves.path("band_low_db").path(i);
            JsonNode high = curves.path("band_high_db").path(i);
            if (low.isNumber() && high.isNumber()) {
                band.add(new GainBandPoint(grid.get(i).asDouble(), low.asDouble(), high.asDouble()));
            }
        }
        String coverage = Math.round(100 * curves.path("band_coverage").asDouble()) + " %";
        BodeChart chart = new BodeChart("Gain and phase: " + root.path("predicted").path("stage").asText())
                .with(new BodeSeries.Measured("measured", measured))
                .with(new BodeSeries.Curve(FITTED, curve(curves, "fitted")))
                .with(new BodeSeries.Curve("nominal stage, exact", curve(curves, "nominal")))
                .with(new BodeSeries.Curve("SCTC single-pole estimate", curve(curves, "sctc")))
                .with(new BodeSeries.GainBand("tolerance band, central " + coverage + " of "
                        + curves.path("band_boards").asInt() + " boards", band))
                .withResiduals(residuals);
        JsonNode midband = root.path("measured").path("midband_gain_db");
        if (midband.isNumber()) {
            double level = midband.asDouble() + BodeChart.HALF_POWER_DB;
            chart = chart.withGainLevel("midband − 3.01 dB = " + MeasuredValueFormat.fixed(level, 2) + " dB", level);
        }
        for (JsonNode check : root.path("verdict").path("checks")) {
            if (!"lower corner".equals(check.path("quantity").asText())) {
                continue;
            }
            if (check.path("max").isNumber() && check.path("max").asDouble() > 0) {
                double max = check.path("max").asDouble();
                chart = chart.withFrequencyLimit("lower-corner limit " + hz(max), max);
            }
            if (check.path("min").isNumber() && check.path("min").asDouble() > 0) {
                double min = check.path("min").asDouble();
                chart = chart.withFrequencyLimit("lower-corner minimum " + hz(min), min);
            }
        }
        return chart;
    }

    /**
     * The part the most probable hypothesis names when it is one capacitor's fault (the
     * hypotheses are stored most probable first), else empty.
     */
    static Optional<String> culprit(JsonNode root) {
        JsonNode top = root.path("hypotheses").path(0);
        if ("capacitor".equals(top.path("kind").asText()) && top.path("part").isTextual()) {
            return Optional.of(top.path("part").asText());
        }
        return Optional.empty();
    }

    private static String hz(double value) {
        return MeasuredValueFormat.engineering(value, "Hz", 3);
    }

    /** Each capacitor's share of the SCTC corner, in percent; the culprit's bar (see {@link #culprit}) in red. */
    public JFreeChart cornerShares(JsonNode root) {
        DefaultCategoryDataset shares = new DefaultCategoryDataset();
        for (JsonNode row : root.path("predicted").path("capacitors")) {
            shares.addValue(100 * row.path("share").asDouble(), "share of the SCTC corner", row.path("id").asText());
        }
        NumberAxis percent = new NumberAxis("Share of the SCTC corner Σ 1/(2πτᵢ) (%)");
        percent.setRange(0, Math.max(10, Math.ceil(maxValue(shares) / 10) * 10));
        percent.setTickUnit(new NumberTickUnit(5));
        int culpritColumn = culprit(root).map(shares::getColumnIndex).orElse(-1);
        BarRenderer bars = new BarRenderer() {
            private static final long serialVersionUID = 1L;

            @Override
            public Paint getItemPaint(int row, int column) {
                return column == culpritColumn ? CULPRIT : super.getItemPaint(row, column);
            }
        };
        bars.setBarPainter(new StandardBarPainter());
        bars.setShadowVisible(false);
        bars.setSeriesPaint(0, BAND);
        bars.setMaximumBarWidth(0.12);
        CategoryPlot plot = new CategoryPlot(shares, new CategoryAxis("Capacitor"), percent, bars);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        return titled(new JFreeChart("Shares of the SCTC lower corner", BodeChart.TITLE_FONT, plot, false));
    }

    /** Each back-solved capacitor against its tolerance band, as C/C_nom on a log axis. */
    public JFreeChart capacitorBands(JsonNode root) {
        JsonNode rows = root.path("capacitors");
        List<String> names = new ArrayList<>();
        XYIntervalSeries tolerance = new XYIntervalSeries("tolerance band");
        YIntervalSeries estimate = new YIntervalSeries("back-solved ± U (k = 2)");
        Optional<String> culprit = culprit(root);
        YIntervalSeries suspect = new YIntervalSeries("most probable fault" + culprit.map(c -> ", " + c).orElse(""));
        double low = 1;
        double high = 1;
        for (int i = 0; i < rows.size(); i++) {
            JsonNode row = rows.get(i);
            names.add(row.path("id").asText());
            double nominal = row.path("nominal_farads").asDouble();
            double factor = row.path("factor").asDouble(row.path("estimated_farads").asDouble() / nominal);
            double spread = Math.exp(2 * row.path("u_ln").asDouble(0));
            (culprit.isPresent() && culprit.get().equals(row.path("id").asText()) ? suspect : estimate)
                    .add(i, factor, factor / spread, factor * spread);
            low = Math.min(low, factor / spread);
            high = Math.max(high, factor * spread);
            if (row.path("min_farads").isNumber()) {
                double from = row.path("min_farads").asDouble() / nominal;
                double to = row.path("max_farads").asDouble() / nominal;
                tolerance.add(i, i - 0.3, i + 0.3, 1, from, to);
                low = Math.min(low, from);
                high = Math.max(high, to);
            }
        }
        XYIntervalSeriesCollection bands = new XYIntervalSeriesCollection();
        bands.addSeries(tolerance);
        YIntervalSeriesCollection estimates = new YIntervalSeriesCollection();
        estimates.addSeries(estimate);
        if (suspect.getItemCount() > 0) {
            estimates.addSeries(suspect);
        }

        SymbolAxis parts = new SymbolAxis("Capacitor", names.toArray(new String[0]));
        parts.setRange(-0.6, Math.max(0.6, names.size() - 0.4));
        parts.setGridBandsVisible(false);
        // a log axis over an unbounded range makes ticks without end until the heap runs out
        // (issue 14, "nominal_farads": 0); twelve decades hold any back-solve worth drawing
        low = Math.max(low, 1e-6);
        high = Math.min(high, 1e6);
        // 1-2-5 ticks: the default log ticks print as 0.126, 0.158, …
        DecimalFormat plain = new DecimalFormat("0.###", DecimalFormatSymbols.getInstance(Locale.ROOT));
        LogAxis ratio = new OneTwoFiveAxis("Back-solved value over nominal, C/C_nom", plain::format);
        ratio.setRange(low / 1.25, high * 1.25);

        XYBarRenderer shade = new XYBarRenderer();
        shade.setUseYInterval(true);
        shade.setBarPainter(new StandardXYBarPainter());
        shade.setShadowVisible(false);
        shade.setSeriesPaint(0, new Color(BAND.getRed(), BAND.getGreen(), BAND.getBlue(), 110));
        XYErrorRenderer marks = new XYErrorRenderer();
        marks.setDrawXError(false);
        marks.setDefaultLinesVisible(false);
        // error bars take each series' own colour (no error paint set), so the culprit's bar is red too
        marks.setSeriesPaint(0, ESTIMATE);
        marks.setSeriesPaint(1, CULPRIT);
        marks.setErrorStroke(new BasicStroke(1.6f));
        marks.setSeriesShape(0, new Ellipse2D.Double(-4, -4, 8, 8));
        marks.setSeriesShape(1, new Rectangle2D.Double(-4.5, -4.5, 9, 9));

        XYPlot plot = new XYPlot(bands, parts, ratio, shade);
        plot.setDataset(1, estimates);
        plot.setRenderer(1, marks);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        plot.setDomainGridlinesVisible(false);
        ValueMarker nominal = new ValueMarker(1, Color.DARK_GRAY, new BasicStroke(1f, BasicStroke.CAP_BUTT,
                BasicStroke.JOIN_MITER, 1f, new float[]{4f, 3f}, 0f));
        nominal.setLabel("nominal");
        nominal.setLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        nominal.setLabelBackgroundColor(Color.WHITE);
        plot.addRangeMarker(nominal);
        return titled(new JFreeChart("Capacitors against their tolerance bands", BodeChart.TITLE_FONT, plot, true));
    }

    /**
     * A white chart whose title keeps to one line: a long title wrapped onto a second and third
     * line and took that height from the plot (the figure's caption says the rest).
     */
    static JFreeChart titled(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.getTitle().setMaximumLinesToDisplay(1);
        return chart;
    }

    /**
     * The chart as an {@code <svg>} element to place inline in HTML: no XML declaration, a
     * view box instead of a fixed size (the page scales it), and ids prefixed with
     * {@code idPrefix} so that charts in one page do not collide.
     */
    public static String svgElement(JFreeChart chart, int width, int height, String idPrefix) {
        SVGGraphics2D g = canvas(width, height, idPrefix);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return g.getSVGElement(idPrefix + "-chart", false, new ViewBox(0, 0, width, height), null, null);
    }

    /** The chart as a stand-alone SVG file's text. */
    public static String svgDocument(JFreeChart chart, int width, int height, String idPrefix) {
        SVGGraphics2D g = canvas(width, height, idPrefix);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return g.getSVGDocument();
    }

    /**
     * An SVG canvas whose ids start with {@code idPrefix} (byte-identical output; docs/contributing.md, "Library behaviour the code works around")
     * and whose coordinates are written to 0.01 px: JFreeSVG's default writes every double in
     * full (111.01863861083984), which tripled the report's size for detail no screen or
     * printer resolves.
     */
    static SVGGraphics2D canvas(int width, int height, String idPrefix) {
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        g.setDefsKeyPrefix(idPrefix);
        g.setGeomDoubleConverter(ReportCharts::hundredths);
        g.setTransformDoubleConverter(ReportCharts::hundredths);
        return g;
    }

    private static String hundredths(double value) {
        double rounded = Math.round(value * 100) / 100.0;
        if (rounded == Math.rint(rounded) && Math.abs(rounded) < 1e15) {
            return Long.toString((long) rounded);
        }
        return Double.toString(rounded);
    }

    /** The chart as PNG bytes. */
    public static byte[] png(JFreeChart chart, int width, int height) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        ChartUtils.writeChartAsPNG(bytes, chart, width, height);
        return bytes.toByteArray();
    }

    private static List<ResponsePoint> curve(JsonNode curves, String name) {
        JsonNode grid = curves.path("frequency_hz");
        JsonNode gain = curves.path(name + "_gain_db");
        JsonNode phase = curves.path(name + "_phase_deg");
        List<ResponsePoint> points = new ArrayList<>();
        for (int i = 0; i < grid.size(); i++) {
            if (gain.path(i).isNumber()) {
                points.add(new ResponsePoint(grid.get(i).asDouble(), gain.get(i).asDouble(),
                        phase.path(i).isNumber() ? OptionalDouble.of(phase.get(i).asDouble()) : OptionalDouble.empty()));
            }
        }
        return points;
    }

    private static double maxValue(DefaultCategoryDataset data) {
        double max = 0;
        for (int c = 0; c < data.getColumnCount(); c++) {
            Number value = data.getValue(0, c);
            if (value != null) {
                max = Math.max(max, value.doubleValue());
            }
        }
        return max;
    }
}

package org.polebench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.LineAndShapeRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.polebench.lot.Capability;
import org.polebench.lot.ChartPoint;
import org.polebench.lot.Culprit;
import org.polebench.lot.IndividualsChart;
import org.polebench.lot.LotDistribution;
import org.polebench.lot.PredictedBand;
import org.polebench.lot.QuantityFindings;
import org.polebench.units.MeasuredValueFormat;

/**
 * The lot report's charts, drawn with JFreeChart from the findings:
 * <ul>
 * <li>{@link #spread}: the boards' values against their plotting position (a quantile plot,
 *     Hazen's positions 100·(i − ½)/n), the predicted tolerance band shaded, the nominal dashed
 *     and the stage's limits in red;</li>
 * <li>{@link #control}: the individuals chart in test order with its centre line, its ±3σ limits
 *     and the points that broke a run rule in red;</li>
 * <li>{@link #pareto}: the culprits' bars, most boards first, with the cumulative percentage.</li>
 * </ul>
 * SVG goes through {@link ReportCharts#svgElement} and {@link ReportCharts#svgDocument} with a
 * fixed id prefix per chart, so the page repeats byte for byte.
 */
public final class LotCharts {
    public static final int HEIGHT = 340;
    private static final Color BAND = new Color(120, 160, 220);
    private static final Color INK = new Color(40, 40, 40);
    private static final Color FLAG = new Color(200, 40, 40);
    private static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 11);

    /** The quantile plot of one quantity; empty of points when no board gave a value. */
    public JFreeChart spread(QuantityFindings q) {
        XYSeries boards = new XYSeries("boards, sorted");
        List<Double> extent = new ArrayList<>();
        if (q.distribution().isPresent()) {
            LotDistribution d = q.distribution().get();
            int n = d.boards();
            for (int i = 0; i < n; i++) {
                boards.add(100 * (i + 0.5) / n, d.valuesSorted().get(i));
                extent.add(d.valuesSorted().get(i));
            }
        }
        XYSeriesCollection data = new XYSeriesCollection(boards);
        NumberAxis position = new NumberAxis("Boards at or below (%)");
        position.setRange(0, 100);
        NumberAxis value = new NumberAxis(LotStatements.capitalised(q.quantity().words()) + " (" + q.quantity().unit() + ")");
        value.setAutoRangeIncludesZero(false);
        XYLineAndShapeRenderer marks = new XYLineAndShapeRenderer(false, true);
        marks.setSeriesPaint(0, INK);
        marks.setSeriesShape(0, new Ellipse2D.Double(-3, -3, 6, 6));
        XYPlot plot = new XYPlot(data, position, value, marks);
        style(plot);
        PredictedBand band = q.predicted();
        if (Double.isFinite(band.low()) && Double.isFinite(band.high())) {
            IntervalMarker shade = new IntervalMarker(band.low(), band.high(),
                    new Color(BAND.getRed(), BAND.getGreen(), BAND.getBlue(), 70));
            shade.setLabel("predicted, central " + MeasuredValueFormat.percent(band.coverage(), 0));
            shade.setLabelFont(LABEL);
            shade.setLabelBackgroundColor(Color.WHITE);
            shade.setLabelAnchor(RectangleAnchor.TOP_LEFT);
            shade.setLabelTextAnchor(TextAnchor.TOP_LEFT);
            plot.addRangeMarker(shade, Layer.BACKGROUND);
            extent.add(band.low());
            extent.add(band.high());
        }
        if (Double.isFinite(band.nominal())) {
            plot.addRangeMarker(line(band.nominal(), BAND.darker(), true, "nominal"));
            extent.add(band.nominal());
        }
        q.capability().ifPresent(c -> limits(plot, c, extent));
        range(value, extent);
        return ReportCharts.titled(new JFreeChart(LotStatements.capitalised(q.quantity().words())
                + " across the lot against the prediction", BodeChart.TITLE_FONT, plot, false));
    }

    /** The individuals chart. */
    public JFreeChart control(IndividualsChart c) {
        XYSeries all = new XYSeries("boards in test order");
        XYSeries flagged = new XYSeries("broke a run rule");
        List<Integer> marked = c.flagged();
        List<Double> extent = new ArrayList<>(List.of(c.lowerLimit(), c.upperLimit()));
        for (int i = 0; i < c.points().size(); i++) {
            ChartPoint p = c.points().get(i);
            all.add(i + 1, p.value());
            if (marked.contains(i)) {
                flagged.add(i + 1, p.value());
            }
            extent.add(p.value());
        }
        XYSeriesCollection data = new XYSeriesCollection(all);
        data.addSeries(flagged);
        NumberAxis order = new NumberAxis("Board, in test order");
        order.setRange(0.5, c.points().size() + 0.5);
        order.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        NumberAxis value = new NumberAxis(LotStatements.capitalised(c.quantity().words()) + " (" + c.quantity().unit() + ")");
        value.setAutoRangeIncludesZero(false);
        XYLineAndShapeRenderer marks = new XYLineAndShapeRenderer();
        marks.setSeriesPaint(0, INK);
        marks.setSeriesStroke(0, new BasicStroke(0.8f));
        marks.setSeriesShape(0, new Ellipse2D.Double(-2.5, -2.5, 5, 5));
        marks.setSeriesLinesVisible(1, false);
        marks.setSeriesPaint(1, FLAG);
        marks.setSeriesShape(1, new Rectangle2D.Double(-4.5, -4.5, 9, 9));
        XYPlot plot = new XYPlot(data, order, value, marks);
        style(plot);
        plot.addRangeMarker(line(c.centre(), INK, false, "centre"));
        plot.addRangeMarker(line(c.upperLimit(), FLAG, true, "+3σ"));
        plot.addRangeMarker(line(c.lowerLimit(), FLAG, true, "−3σ"));
        range(value, extent);
        return ReportCharts.titled(new JFreeChart("Individuals chart: " + c.quantity().words(), BodeChart.TITLE_FONT,
                plot, true));
    }

    /** The Pareto of culprits. */
    public JFreeChart pareto(List<Culprit> culprits) {
        DefaultCategoryDataset counts = new DefaultCategoryDataset();
        DefaultCategoryDataset cumulative = new DefaultCategoryDataset();
        int most = 1;
        for (Culprit k : culprits) {
            counts.addValue(k.boards(), "boards", k.name());
            cumulative.addValue(100 * k.cumulative(), "cumulative %", k.name());
            most = Math.max(most, k.boards());
        }
        NumberAxis boards = new NumberAxis("Boards");
        boards.setRange(0, most * 1.1);
        boards.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        BarRenderer bars = new BarRenderer();
        bars.setBarPainter(new StandardBarPainter());
        bars.setShadowVisible(false);
        bars.setSeriesPaint(0, BAND);
        bars.setMaximumBarWidth(0.15);
        CategoryAxis names = new CategoryAxis("Most probable cause");
        names.setCategoryLabelPositions(culprits.size() > 6 ? CategoryLabelPositions.UP_45 : CategoryLabelPositions.STANDARD);
        CategoryPlot plot = new CategoryPlot(counts, names, boards, bars);
        NumberAxis percent = new NumberAxis("Cumulative (%)");
        percent.setRange(0, 105);
        plot.setRangeAxis(1, percent);
        plot.setDataset(1, cumulative);
        plot.mapDatasetToRangeAxis(1, 1);
        LineAndShapeRenderer line = new LineAndShapeRenderer();
        line.setSeriesPaint(0, INK);
        line.setSeriesShape(0, new Ellipse2D.Double(-3, -3, 6, 6));
        plot.setRenderer(1, line);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        return ReportCharts.titled(new JFreeChart("Culprits of failed and unexplained boards", BodeChart.TITLE_FONT,
                plot, true));
    }

    private static void limits(XYPlot plot, Capability c, List<Double> extent) {
        add(plot, c.lowerLimit(), "lower limit", extent);
        add(plot, c.upperLimit(), "upper limit", extent);
    }

    private static void add(XYPlot plot, OptionalDouble limit, String label, List<Double> extent) {
        if (limit.isPresent()) {
            plot.addRangeMarker(line(limit.getAsDouble(), FLAG, false, label));
            extent.add(limit.getAsDouble());
        }
    }

    private static ValueMarker line(double at, Color colour, boolean dashed, String label) {
        BasicStroke stroke = dashed ? new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 1f,
                new float[]{5f, 3f}, 0f) : new BasicStroke(1.4f);
        ValueMarker marker = new ValueMarker(at, colour, stroke);
        marker.setLabel(label);
        marker.setLabelFont(LABEL);
        marker.setLabelPaint(colour);
        marker.setLabelBackgroundColor(Color.WHITE);
        marker.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
        marker.setLabelTextAnchor(TextAnchor.BOTTOM_RIGHT);
        return marker;
    }

    private static void style(XYPlot plot) {
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
        plot.setDomainGridlinePaint(Color.LIGHT_GRAY);
    }

    /** A range holding every value, band and limit, padded by 8 % (a value axis cannot autorange to markers). */
    private static void range(NumberAxis axis, List<Double> values) {
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (double v : values) {
            if (Double.isFinite(v)) {
                low = Math.min(low, v);
                high = Math.max(high, v);
            }
        }
        if (!Double.isFinite(low)) {
            axis.setRange(0, 1);
            return;
        }
        double pad = high > low ? 0.08 * (high - low) : Math.max(1e-9, 0.05 * Math.abs(high) + 1e-9);
        axis.setRange(low - pad, high + pad);
    }
}

package org.polebench.report;

import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleFunction;
import org.jfree.chart.axis.AxisState;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberTick;
import org.jfree.chart.axis.TickType;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;

/**
 * A base-10 logarithmic axis whose labelled ticks follow the 1-2-5 sequence (1, 2, 5 × 10ⁿ, the
 * steps of the E3-like series instrument ranges and graph papers use), with unlabelled minor
 * ticks at 3, 4, 6, 7, 8 and 9 × 10ⁿ. LogAxis on its own puts ticks at equal steps of the
 * logarithm, which between decades gives values such as 3.162 and 31.623 that nobody reads off a
 * Bode plot. Where the 2 and 5 labels would overlap their neighbours at the drawn width, only
 * the decades are labelled; the 2 and 5 ticks stay as unlabelled major ticks (with gridlines).
 * Horizontal placement only (the report's log axes all run along the bottom); a vertical
 * placement falls back to LogAxis' own ticks.
 */
final class OneTwoFiveAxis extends LogAxis {
    private static final long serialVersionUID = 1L;

    /** Smallest gap in pixels between two labels drawn side by side. */
    private static final double LABEL_GAP_PX = 6;

    private final transient DoubleFunction<String> labels;

    /** @param labels the text of a tick at a value, such as {@code 2 Hz} */
    OneTwoFiveAxis(String label, DoubleFunction<String> labels) {
        super(label);
        this.labels = labels;
        setBase(10);
        setMinorTickMarksVisible(true);
    }

    /**
     * The 1-2-5 values within [low, high], ascending; over a range too narrow to hold three of
     * them (a back-solve near nominal, 0.8 to 1.25), every whole step 1…9 × 10ⁿ instead.
     */
    static List<Double> majorValues(double low, double high) {
        List<Double> values = steps(low, high, new int[]{1, 2, 5});
        return values.size() >= 3 ? values : steps(low, high, new int[]{1, 2, 3, 4, 5, 6, 7, 8, 9});
    }

    private static List<Double> steps(double low, double high, int[] steps) {
        List<Double> values = new ArrayList<>();
        for (int decade = (int) Math.floor(Math.log10(low)); decade <= (int) Math.ceil(Math.log10(high)); decade++) {
            for (int step : steps) {
                // parsed from text so that 2e-1 is the double nearest 0.2, not 2 × 0.1000…01
                double v = Double.parseDouble(step + "e" + decade);
                if (v >= low && v <= high) {
                    values.add(v);
                }
            }
        }
        return values;
    }

    @Override
    @SuppressWarnings({"rawtypes", "unchecked"})
    public List refreshTicks(Graphics2D g2, AxisState state, Rectangle2D dataArea, RectangleEdge edge) {
        if (!RectangleEdge.isTopOrBottom(edge)) {
            return super.refreshTicks(g2, state, dataArea, edge);
        }
        double low = getLowerBound();
        double high = getUpperBound();
        List<Double> majors = majorValues(low, high);
        boolean all = fitsSideBySide(g2, majors, dataArea, edge);
        TextAnchor anchor = edge == RectangleEdge.TOP ? TextAnchor.BOTTOM_CENTER : TextAnchor.TOP_CENTER;
        List ticks = new ArrayList();
        for (double v : majors) {
            boolean decade = Math.abs(Math.log10(v) - Math.rint(Math.log10(v))) < 1e-9;
            ticks.add(new NumberTick(TickType.MAJOR, v, all || decade ? labels.apply(v) : "", anchor, TextAnchor.CENTER, 0));
        }
        for (double v : steps(low, high, new int[]{1, 2, 3, 4, 5, 6, 7, 8, 9})) {
            if (!majors.contains(v)) {
                ticks.add(new NumberTick(TickType.MINOR, v, "", anchor, TextAnchor.CENTER, 0));
            }
        }
        return ticks;
    }

    /** Whether every 1-2-5 label fits beside its neighbours without overlapping them. */
    private boolean fitsSideBySide(Graphics2D g2, List<Double> majors, Rectangle2D dataArea, RectangleEdge edge) {
        if (g2 == null || majors.size() < 2) {
            return true;
        }
        FontMetrics metrics = g2.getFontMetrics(getTickLabelFont());
        double previousX = Double.NaN;
        double previousHalf = 0;
        for (double v : majors) {
            double x = valueToJava2D(v, dataArea, edge);
            double half = metrics.stringWidth(labels.apply(v)) / 2.0;
            if (!Double.isNaN(previousX) && Math.abs(x - previousX) < previousHalf + half + LABEL_GAP_PX) {
                return false;
            }
            previousX = x;
            previousHalf = half;
        }
        return true;
    }
}

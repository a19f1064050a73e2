package org.polebench.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;

/**
 * Prints a value with its uncertainty as the GUM asks (JCGM 100:2008, 7.2.6): the uncertainty to
 * at most two significant figures, the value rounded to the same last digit. A zero uncertainty
 * (an exact fit of noise-free data, or a structural value) prints the value to six significant
 * figures.
 */
final class MeasuredValueFormat {
    private static final MathContext TWO_FIGURES = new MathContext(2, RoundingMode.HALF_UP);

    private MeasuredValueFormat() {
    }

    /** @return {value, uncertainty} as text, rounded together */
    static String[] withUncertainty(double value, double uncertainty) {
        if (!(uncertainty > 0) || !Double.isFinite(uncertainty)) {
            return new String[]{sixFigures(value), uncertainty == 0 ? "0" : "n/a"};
        }
        BigDecimal u = new BigDecimal(uncertainty).round(TWO_FIGURES);
        int scale = u.scale();
        BigDecimal v = new BigDecimal(value).setScale(scale, RoundingMode.HALF_EVEN);
        return new String[]{plain(v), plain(u)};
    }

    /** The uncertainty alone, two significant figures. */
    static String uncertainty(double uncertainty) {
        return withUncertainty(0, uncertainty)[1];
    }

    /** The value rounded to the last digit of the uncertainty's two figures. */
    static String value(double value, double uncertainty) {
        return withUncertainty(value, uncertainty)[0];
    }

    /** Six significant figures; scientific notation outside 10⁻⁴…10⁹, where plain digits mislead. */
    static String sixFigures(double value) {
        if (value == 0) {
            return "0";
        }
        double magnitude = Math.abs(value);
        if (magnitude < 1e-4 || magnitude >= 1e9) {
            String text = String.format(Locale.ROOT, "%.5e", value);
            return text.startsWith("-") ? "−" + text.substring(1) : text;
        }
        BigDecimal rounded = new BigDecimal(value).round(new MathContext(6, RoundingMode.HALF_EVEN));
        return plain(rounded.scale() > 0 ? rounded.stripTrailingZeros() : rounded);
    }

    private static String plain(BigDecimal d) {
        String text = d.scale() < 0 ? d.setScale(0, RoundingMode.UNNECESSARY).toPlainString() : d.toPlainString();
        return text.startsWith("-") ? "−" + text.substring(1) : text;
    }

    static String fixed(double value, int decimals) {
        String text = String.format(Locale.ROOT, "%." + decimals + "f", value);
        return text.startsWith("-") ? "−" + text.substring(1) : text;
    }
}

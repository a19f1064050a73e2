package org.polebench.units;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;

/**
 * The one formatter of numbers meant for people: a value with its uncertainty as the GUM asks
 * (JCGM 100:2008, 7.2.6: the uncertainty to at most two significant figures, the value rounded to
 * the same last digit), in engineering notation with an SI prefix where the unit takes one
 * (BIPM, The International System of Units, 9th edition, 2019, table 7), with the minus sign
 * U+2212 and never a negative zero ({@code −0.000} reads as a signed result that is not there).
 * Every digit comes from {@link BigDecimal} or a {@link Locale#ROOT} format, so the output does
 * not depend on the JVM's locale. A zero uncertainty (an exact fit of noise-free data, or a
 * structural value) prints the value to six significant figures. JSON keeps plain numbers and
 * does not use this class.
 */
public final class MeasuredValueFormat {
    /** The minus sign of printed text (U+2212), never the ASCII hyphen. */
    public static final String MINUS = "−";
    private static final MathContext TWO_FIGURES = new MathContext(2, RoundingMode.HALF_UP);

    private MeasuredValueFormat() {
    }

    /**
     * A value and its uncertainty in one unit with one SI prefix, rounded together.
     *
     * @param value       the value's digits, with the prefix applied
     * @param uncertainty the uncertainty's digits, same prefix and last decimal place
     * @param unit        the prefixed unit, such as {@code mHz}; empty for a plain number
     */
    public record Rounded(String value, String uncertainty, String unit) {
        /** @return "59.99 ± 0.64 Hz" */
        public String text() {
            return value + " ± " + uncertainty + (unit.isEmpty() ? "" : " " + unit);
        }

        /** @return the value alone with its unit, "59.99 Hz" */
        public String valueText() {
            return value + (unit.isEmpty() ? "" : " " + unit);
        }

        /** @return the uncertainty alone with its unit, "0.64 Hz" */
        public String uncertaintyText() {
            return uncertainty + (unit.isEmpty() ? "" : " " + unit);
        }
    }

    /**
     * The value and its uncertainty rounded as GUM 7.2.6 asks, with the SI prefix that suits the
     * larger of the two (dB, degrees, percent and plain numbers take no prefix).
     *
     * @param value       in the base unit (Hz, F, Ω, dB, …)
     * @param uncertainty U or u in the same unit; zero or not finite prints the value alone to six
     *                    significant figures and "0" or "n/a" for the uncertainty
     * @param unit        the base unit's symbol, may be empty
     */
    public static Rounded rounded(double value, double uncertainty, String unit) {
        String base = unit == null ? "" : unit;
        if (!Double.isFinite(value)) {
            return new Rounded(String.valueOf(value), "n/a", base);
        }
        if (!(uncertainty > 0) || !Double.isFinite(uncertainty)) {
            int exponent3 = takesPrefix(base) ? exponent3(roundedSixFigures(value)) : 0;
            return new Rounded(sixFigures(value / Math.pow(10, exponent3)), uncertainty == 0 ? "0" : "n/a",
                    prefixFor(exponent3) + base);
        }
        BigDecimal u = new BigDecimal(uncertainty).round(TWO_FIGURES);
        BigDecimal v = new BigDecimal(value).setScale(u.scale(), RoundingMode.HALF_EVEN);
        int exponent3 = takesPrefix(base) ? exponent3(Math.max(Math.abs(v.doubleValue()), u.doubleValue())) : 0;
        return new Rounded(plain(v.movePointLeft(exponent3)), plain(u.movePointLeft(exponent3)),
                prefixFor(exponent3) + base);
    }

    /**
     * "59.99 ± 0.64 Hz (U, k = 2.02)": the value with its expanded uncertainty and the coverage
     * factor beside it, so that no U is printed without its k.
     *
     * @param expanded U = k·u, in the base unit
     */
    public static String expanded(double value, double expanded, double coverageFactor, String unit) {
        return rounded(value, expanded, unit).text() + " (U, k = " + coverage(coverageFactor) + ")";
    }

    /** A coverage factor to two decimals with trailing zeros dropped: "2", "2.02". */
    public static String coverage(double k) {
        if (!Double.isFinite(k)) {
            return "n/a";
        }
        BigDecimal d = new BigDecimal(k).setScale(2, RoundingMode.HALF_UP).stripTrailingZeros();
        return plain(d.scale() < 0 ? d.setScale(0) : d);
    }

    /**
     * A complex-conjugate pair, written so that the uncertainties cannot be read as a third
     * term: "−3.565 ± j2.064 Hz, U(re) 0.043 Hz, U(im) 0.060 Hz". One SI prefix for both parts,
     * chosen by the larger; each part rounded to its own uncertainty (GUM 7.2.6).
     *
     * @param label "U" or "u", what the uncertainties are
     */
    public static String complexPair(double re, double uRe, double im, double uIm, String unit, String label) {
        String base = unit == null ? "" : unit;
        int exponent3 = takesPrefix(base) ? exponent3(Math.max(Math.abs(re), Math.abs(im))) : 0;
        double scale = Math.pow(10, exponent3);
        Rounded real = rounded(re / scale, uRe / scale, "");
        Rounded imaginary = rounded(Math.abs(im) / scale, uIm / scale, "");
        String u = prefixFor(exponent3) + base;
        String gap = u.isEmpty() ? "" : " ";
        return real.value() + " ± j" + imaginary.value() + gap + u + ", " + label + "(re) " + real.uncertainty() + gap + u
                + ", " + label + "(im) " + imaginary.uncertainty() + gap + u;
    }

    /** @return {value, uncertainty} as text, rounded together, no prefix (GUM 7.2.6) */
    public static String[] withUncertainty(double value, double uncertainty) {
        Rounded r = rounded(value, uncertainty, "");
        return new String[]{r.value(), r.uncertainty()};
    }

    /** The uncertainty alone, two significant figures. */
    public static String uncertainty(double uncertainty) {
        return withUncertainty(0, uncertainty)[1];
    }

    /** The value rounded to the last digit of the uncertainty's two figures. */
    public static String value(double value, double uncertainty) {
        return withUncertainty(value, uncertainty)[0];
    }

    /**
     * A value with no uncertainty of its own, to {@code significant} figures with an SI prefix:
     * {@code 4.7e-6, "F", 3} gives {@code 4.7 µF}; trailing zeros are dropped.
     */
    public static String engineering(double value, String unit, int significant) {
        if (significant < 1 || significant > 15) {
            throw new IllegalArgumentException("significant digits must be 1..15, was " + significant);
        }
        String base = unit == null ? "" : unit;
        String gap = base.isEmpty() ? "" : " ";
        if (!Double.isFinite(value)) {
            return value + gap + base;
        }
        BigDecimal rounded = value == 0 ? BigDecimal.ZERO
                : new BigDecimal(value).round(new MathContext(significant, RoundingMode.HALF_UP));
        if (rounded.signum() == 0) {
            return "0" + gap + base;
        }
        int exponent3 = Math.max(-15, Math.min(12, exponent3(rounded.doubleValue())));
        String prefix = prefixFor(exponent3);
        BigDecimal scaled = rounded.movePointLeft(exponent3).stripTrailingZeros();
        return plain(scaled.scale() < 0 ? scaled.setScale(0) : scaled) + (prefix.isEmpty() && base.isEmpty() ? "" : " ")
                + prefix + base;
    }

    /** Six significant figures; scientific notation outside 10⁻⁴…10⁹, where plain digits mislead. */
    public static String sixFigures(double value) {
        if (value == 0 || !Double.isFinite(value)) {
            return value == 0 ? "0" : String.valueOf(value);
        }
        double magnitude = Math.abs(value);
        if (magnitude < 1e-4 || magnitude >= 1e9) {
            return minus(String.format(Locale.ROOT, "%.5e", value));
        }
        BigDecimal rounded = new BigDecimal(value).round(new MathContext(6, RoundingMode.HALF_EVEN));
        return plain(rounded.scale() > 0 ? rounded.stripTrailingZeros() : rounded);
    }

    /** A fixed number of decimals; a value that rounds to zero prints without a sign. */
    public static String fixed(double value, int decimals) {
        return minus(String.format(Locale.ROOT, "%." + decimals + "f", value));
    }

    /** Like {@link #fixed} with a sign always written: "+0.54", "−0.54", and "0.00" for zero. */
    public static String signed(double value, int decimals) {
        String text = fixed(value, decimals);
        return text.startsWith(MINUS) || isZero(text) ? text : "+" + text;
    }

    /** A fraction as a percentage to {@code decimals} places: 0.713 gives "71 %"; −0.001 gives "0 %". */
    public static String percent(double fraction, int decimals) {
        return fixed(100 * fraction, decimals) + " %";
    }

    /**
     * Text written by {@link Locale#ROOT} formatting with the ASCII hyphen as its sign turned into
     * printed text: the sign becomes U+2212, and a number that reads zero loses its sign.
     */
    public static String minus(String formatted) {
        if (!formatted.startsWith("-")) {
            return formatted;
        }
        String rest = formatted.substring(1);
        return isZero(rest) ? rest : MINUS + rest;
    }

    // "0", "0.000", "0.00e+00": digits that are all zero before any exponent
    private static boolean isZero(String number) {
        String mantissa = number.split("[eE]")[0];
        return mantissa.chars().allMatch(c -> c == '0' || c == '.');
    }

    private static String plain(BigDecimal d) {
        if (d.signum() == 0) {
            d = d.abs();
        }
        String text = d.scale() < 0 ? d.setScale(0, RoundingMode.UNNECESSARY).toPlainString() : d.toPlainString();
        return minus(text);
    }

    private static double roundedSixFigures(double value) {
        return value == 0 ? 0 : new BigDecimal(value).round(new MathContext(6, RoundingMode.HALF_EVEN)).doubleValue();
    }

    /** Units that take an SI prefix; dB, degrees, percent and plain numbers do not. */
    private static boolean takesPrefix(String unit) {
        return !(unit.isEmpty() || unit.equals("dB") || unit.equals("°") || unit.equals("%"));
    }

    private static int exponent3(double magnitude) {
        double m = Math.abs(magnitude);
        if (m == 0 || !Double.isFinite(m)) {
            return 0;
        }
        // a decimal exponent from the digits, not from log10, which can land a hair below 3, 6, …;
        // the shortest decimal that gives m back (Double.toString) has the same leading digits to
        // 15 figures as m's exact binary value, and is far cheaper to round than that value's
        // hundreds of digits
        BigDecimal digits = BigDecimal.valueOf(m).round(new MathContext(15, RoundingMode.HALF_EVEN));
        int exponent = digits.precision() - digits.scale() - 1;
        return Math.max(-15, Math.min(12, Math.floorDiv(exponent, 3) * 3));
    }

    private static String prefixFor(int exponent3) {
        switch (exponent3) {
            case -15: return "f";
            case -12: return "p";
            case -9: return "n";
            case -6: return "µ";
            case -3: return "m";
            case 0: return "";
            case 3: return "k";
            case 6: return "M";
            case 9: return "G";
            case 12: return "T";
            default: throw new IllegalArgumentException("no SI prefix for 1e" + exponent3);
        }
    }
}

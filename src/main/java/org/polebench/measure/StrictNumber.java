package org.polebench.measure;

/**
 * Reads one decimal number from a cell, strictly: the whole cell (blanks around it aside)
 * must be {@code [+-]digits[.digits][e[+-]digits]}, with a comma as the decimal mark when
 * asked. Unlike {@link Double#parseDouble} it refuses {@code NaN}, {@code Infinity}, hex,
 * {@code d}/{@code f} suffixes and thousands separators, and unlike locale number parsing it
 * never stops silently at a bad character (PITFALLS, OpenCSV).
 *
 * <p>Short numbers take Clinger's fast path (W. D. Clinger, "How to read floating point
 * numbers accurately", PLDI 1990): a mantissa below 2^53 times or divided by an exact power of
 * ten up to 10^22 is correctly rounded by one IEEE operation. Longer ones go through
 * {@link Double#parseDouble}, which is correctly rounded too.
 */
final class StrictNumber {
    private static final double[] POWERS_OF_TEN = new double[23];
    private static final long FAST_MANTISSA_LIMIT = 1L << 53;

    static {
        double power = 1;
        for (int i = 0; i < POWERS_OF_TEN.length; i++) {
            POWERS_OF_TEN[i] = power;
            power *= 10;
        }
    }

    private StrictNumber() {
    }

    /**
     * @return the number; NaN when the text is not a number of this form; ±Infinity when it is
     *         one but beyond the double range (such as {@code 1e999})
     */
    static double parse(CharSequence text, int from, int to, boolean decimalComma) {
        while (from < to && isBlank(text.charAt(from))) {
            from++;
        }
        while (to > from && isBlank(text.charAt(to - 1))) {
            to--;
        }
        if (from >= to) {
            return Double.NaN;
        }
        char mark = decimalComma ? ',' : '.';
        int i = from;
        boolean negative = false;
        char first = text.charAt(i);
        if (first == '+' || first == '-') {
            negative = first == '-';
            i++;
        }
        long mantissa = 0;
        int significant = 0;
        int digits = 0;
        int fractionDigits = 0;
        boolean seenMark = false;
        for (; i < to; i++) {
            char c = text.charAt(i);
            if (c >= '0' && c <= '9') {
                digits++;
                if (seenMark) {
                    fractionDigits++;
                }
                if (significant > 0 || c != '0') {
                    significant++;
                    if (significant <= 18) {
                        mantissa = mantissa * 10 + (c - '0');
                    }
                }
            } else if (c == mark && !seenMark) {
                seenMark = true;
            } else {
                break;
            }
        }
        if (digits == 0) {
            return Double.NaN;
        }
        int exponent = 0;
        if (i < to) {
            char e = text.charAt(i);
            if (e != 'e' && e != 'E') {
                return Double.NaN;
            }
            i++;
            boolean negativeExponent = false;
            if (i < to && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
                negativeExponent = text.charAt(i) == '-';
                i++;
            }
            int exponentDigits = 0;
            for (; i < to; i++) {
                char c = text.charAt(i);
                if (c < '0' || c > '9') {
                    return Double.NaN;
                }
                exponentDigits++;
                if (exponent < 100_000) {
                    exponent = exponent * 10 + (c - '0');
                }
            }
            if (exponentDigits == 0) {
                return Double.NaN;
            }
            if (negativeExponent) {
                exponent = -exponent;
            }
        }
        int scale = exponent - fractionDigits;
        double value;
        if (significant <= 15 && mantissa < FAST_MANTISSA_LIMIT && Math.abs(scale) <= 22) {
            value = scale >= 0 ? mantissa * POWERS_OF_TEN[scale] : mantissa / POWERS_OF_TEN[-scale];
        } else if (significant == 0) {
            value = 0.0;
        } else {
            String plain = text.subSequence(from, to).toString();
            value = Double.parseDouble(decimalComma ? plain.replace(',', '.') : plain);
            return value;
        }
        return negative ? -value : value;
    }

    static double parse(CharSequence text, boolean decimalComma) {
        return parse(text, 0, text.length(), decimalComma);
    }

    private static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }
}

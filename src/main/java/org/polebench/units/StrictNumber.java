package org.polebench.units;

/**
 * Reads one decimal number from a cell, strictly: the whole cell (blanks around it aside)
 * must be {@code [+-]digits[.digits][e[+-]digits]}, with a comma as the decimal mark when
 * asked. Unlike {@link Double#parseDouble} it refuses {@code NaN}, {@code Infinity}, hex,
 * {@code d}/{@code f} suffixes and thousands separators, and unlike locale number parsing it
 * never stops silently at a bad character (PITFALLS, OpenCSV).
 *
 * <p>Short numbers take Clinger's fast path (W. D. Clinger, "How to read floating point
 * numbers accurately", PLDI 1990): a mantissa below 2^53 times or divided by an exact power of
 * ten up to 10^22 is correctly rounded by one IEEE operation. Numbers of up to 18 significant
 * digits (the 17 that {@link Double#toString} writes) take the Eisel–Lemire algorithm (D.
 * Lemire, "Number parsing at a gigabyte per second", Software: Practice and Experience 51(8),
 * 2021), which multiplies by a 128-bit truncated power of ten and gives up in the rare cases
 * where truncation could change the rounding. What neither settles goes through
 * {@link Double#parseDouble}, which is correctly rounded too (its Javadoc) but allocates, and
 * is four times slower on a million 17-digit rows (seen here).
 */
public final class StrictNumber {
    private static final double[] POWERS_OF_TEN = new double[23];
    private static final long FAST_MANTISSA_LIMIT = 1L << 53;
    private static final int MIN_EXP10 = -348;
    private static final int MAX_EXP10 = 347;

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
    public static double parse(CharSequence text, int from, int to, boolean decimalComma) {
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
            value = significant <= 18 ? eiselLemire(mantissa, scale) : Double.NaN;
            if (Double.isNaN(value)) {
                String plain = text.subSequence(from, to).toString();
                return Double.parseDouble(decimalComma ? plain.replace(',', '.') : plain);
            }
        }
        return negative ? -value : value;
    }

    /**
     * @param mantissa decimal digits, 1 to 10^18 − 1
     * @param exp10    power of ten to scale by
     * @return the correctly rounded double, or NaN when the algorithm cannot decide (the caller
     *         falls back); follows the published algorithm step by step
     */
    static double eiselLemire(long mantissa, int exp10) {
        if (exp10 < MIN_EXP10 || exp10 > MAX_EXP10) {
            return Double.NaN;
        }
        int clz = Long.numberOfLeadingZeros(mantissa);
        long man = mantissa << clz;
        long retExp2 = ((217706L * exp10) >> 16) + 64 + 1023 - clz;
        // decide by the exponent alone: naming Powers128.TABLE (even to compare) would build it
        boolean near = Math.abs(exp10) <= Powers128Near.REACH;
        long[] table = near ? Powers128Near.TABLE : Powers128.TABLE;
        int row = 2 * (exp10 - (near ? -Powers128Near.REACH : MIN_EXP10));
        long powHi = table[row];
        long powLo = table[row + 1];
        long xHi = unsignedMultiplyHigh(man, powHi);
        long xLo = man * powHi;
        if ((xHi & 0x1FF) == 0x1FF && Long.compareUnsigned(xLo + man, man) < 0) {
            long yHi = unsignedMultiplyHigh(man, powLo);
            long yLo = man * powLo;
            long mergedHi = xHi;
            long mergedLo = xLo + yHi;
            if (Long.compareUnsigned(mergedLo, xLo) < 0) {
                mergedHi++;
            }
            if ((mergedHi & 0x1FF) == 0x1FF && mergedLo + 1 == 0 && Long.compareUnsigned(yLo + man, man) < 0) {
                return Double.NaN;
            }
            xHi = mergedHi;
            xLo = mergedLo;
        }
        long msb = xHi >>> 63;
        long retMantissa = xHi >>> (msb + 9);
        retExp2 -= 1 ^ msb;
        if (xLo == 0 && (xHi & 0x1FF) == 0 && (retMantissa & 3) == 1) {
            return Double.NaN;    // exactly half way: the truncated table cannot tell which way
        }
        retMantissa += retMantissa & 1;
        retMantissa >>>= 1;
        if ((retMantissa >>> 53) > 0) {
            retMantissa >>>= 1;
            retExp2 += 1;
        }
        if (retExp2 <= 0 || retExp2 >= 0x7FF) {
            return Double.NaN;    // subnormal or overflow: leave to the JDK
        }
        return Double.longBitsToDouble(retExp2 << 52 | retMantissa & 0x000FFFFFFFFFFFFFL);
    }

    /** The high 64 bits of the unsigned 128-bit product (Math.unsignedMultiplyHigh arrived in Java 18). */
    private static long unsignedMultiplyHigh(long a, long b) {
        return Math.multiplyHigh(a, b) + ((a >> 63) & b) + ((b >> 63) & a);
    }

    public static double parse(CharSequence text, boolean decimalComma) {
        return parse(text, 0, text.length(), decimalComma);
    }

    private static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }

    /** 10^e as a 128-bit mantissa rounded down, top bit set: [0] high 64 bits, [1] low. */
    private static long[] power128(int e) {
        java.math.BigInteger v;
        if (e >= 0) {
            v = java.math.BigInteger.TEN.pow(e);
            int bits = v.bitLength();
            v = bits >= 128 ? v.shiftRight(bits - 128) : v.shiftLeft(128 - bits);
        } else {
            java.math.BigInteger d = java.math.BigInteger.TEN.pow(-e);
            v = java.math.BigInteger.ONE.shiftLeft(127 + d.bitLength()).divide(d);
        }
        return new long[] {v.shiftRight(64).longValue(), v.longValue()};
    }

    private static long[] table(int from, int to) {
        long[] table = new long[2 * (to - from + 1)];
        for (int e = from; e <= to; e++) {
            long[] row = power128(e);
            table[2 * (e - from)] = row[0];
            table[2 * (e - from) + 1] = row[1];
        }
        return table;
    }

    /**
     * The rows for 10^-40 … 10^40, which every sweep's numbers fall in, apart from the full table:
     * holder classes are initialised on first use (JLS 12.4.1), so a start-up builds 81 rows with
     * BigInteger arithmetic, not 696.
     */
    private static final class Powers128Near {
        static final int REACH = 40;
        static final long[] TABLE = table(-REACH, REACH);

        private Powers128Near() {
        }
    }

    /** Every row, 10^{@value #MIN_EXP10} … 10^{@value #MAX_EXP10}, built when a number needs one beyond the near rows. */
    private static final class Powers128 {
        static final long[] TABLE = table(MIN_EXP10, MAX_EXP10);

        private Powers128() {
        }
    }
}

package org.polebench.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class StrictNumberTest {
    @Test
    void agreesWithTheJdkParserOnRandomDoublesBitForBit() {
        // Double.parseDouble is correctly rounded (its Javadoc), as is Clinger's fast path; seed 7
        Random random = new Random(7);
        for (int i = 0; i < 200_000; i++) {
            double value = switch (i % 3) {
                case 0 -> random.nextDouble() * Math.pow(10, random.nextInt(40) - 20);
                case 1 -> Math.round(random.nextDouble() * 1e6) / 1e3;
                default -> Double.longBitsToDouble(random.nextLong() & 0x7fefffffffffffffL);
            };
            String text = Double.toString(value);
            assertEquals(Double.doubleToLongBits(Double.parseDouble(text)),
                    Double.doubleToLongBits(StrictNumber.parse(text, false)), text);
            String plain = String.format(java.util.Locale.ROOT, "%.6f", value);
            assertEquals(Double.parseDouble(plain), StrictNumber.parse(plain.replace('.', ','), true), plain);
        }
    }

    @Test
    void eiselLemireDecidesNearlyEveryToStringAndAgreesWithTheJdk() {
        // seed 11; the JDK's correctly rounded parse is the reference
        Random random = new Random(11);
        int decided = 0;
        int n = 100_000;
        for (int i = 0; i < n; i++) {
            double value = Double.longBitsToDouble(random.nextLong() & 0x7fefffffffffffffL);
            java.math.BigDecimal exact = new java.math.BigDecimal(Double.toString(value));
            java.math.BigInteger digits = exact.unscaledValue();
            if (digits.bitLength() > 62 || value < Double.MIN_NORMAL) {
                continue;
            }
            double fast = StrictNumber.eiselLemire(digits.longValueExact(), -exact.scale());
            if (!Double.isNaN(fast)) {
                decided++;
                assertEquals(Double.doubleToLongBits(value), Double.doubleToLongBits(fast), exact.toString());
            }
        }
        // Lemire (2021) reports fallbacks as rare; 99 % is a loose floor
        assertTrue(decided > 0.99 * n * 0.9, "decided " + decided);
    }

    @Test
    void refusesWhatIsNotAPlainDecimalNumber() {
        for (String text : new String[] {"NaN", "Infinity", "-Inf", "0x10", "1d", "1f", "17,739.89", "1.5.5", "1e",
                "e5", "", " ", "+", "1 2", "--1", "1e+", "١٢"}) {
            assertTrue(Double.isNaN(StrictNumber.parse(text, false)), text);
        }
        assertTrue(Double.isNaN(StrictNumber.parse("1.5", true)), "a point under a decimal-comma profile");
    }

    @Test
    void hugeExponentsOverflowToInfinityRatherThanWrapping() {
        assertEquals(Double.POSITIVE_INFINITY, StrictNumber.parse("1e999", false));
        assertEquals(Double.NEGATIVE_INFINITY, StrictNumber.parse("-1e99999999999", false));
        assertEquals(0.0, StrictNumber.parse("1e-99999", false));
        assertEquals(1.5, StrictNumber.parse(" 1,5 ", true));
    }
}

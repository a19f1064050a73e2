package org.polebench.units;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The one formatter of printed numbers (issue 14). */
class MeasuredValueFormatTest {

    // GUM (JCGM 100:2008) 7.2.6: U to at most two significant figures, the value rounded to the
    // same decimal place; cases worked by hand
    @Test
    void uncertaintyToTwoFiguresValueToTheSamePlace() {
        assertEquals("59.99 ± 0.64 Hz", MeasuredValueFormat.rounded(59.9913, 0.6371, "Hz").text());
        assertEquals("100.0215 ± 0.0035 g", MeasuredValueFormat.rounded(100.02147, 0.00350, "g").text()); // GUM 7.2.2's own example, m_s
        assertEquals("55.93 ± 0.12 dB", MeasuredValueFormat.rounded(55.9278, 0.1234, "dB").text());
        assertEquals("1230 ± 120", MeasuredValueFormat.rounded(1234.5678, 123.4, "").text());
        // the value and U take one prefix, that of the larger: 0.709792 Hz with U 0.00123 Hz, and
        // with U 0.0123 Hz the value goes to the mHz place
        assertEquals("709.8 ± 1.2 mHz", MeasuredValueFormat.rounded(0.709792, 0.00123, "Hz").text());
        assertEquals("710 ± 12 mHz", MeasuredValueFormat.rounded(0.709792, 0.0123, "Hz").text());
        // 6388.13 Hz with U 4.1 Hz: 6388.1 ± 4.1 Hz is 6.3881 ± 0.0041 kHz
        assertEquals("6.3881 ± 0.0041 kHz", MeasuredValueFormat.rounded(6388.13, 4.1, "Hz").text());
        // U rounds up into a third figure's place: 0.996 to two figures is 1.0
        assertEquals("3.0 ± 1.0 Hz", MeasuredValueFormat.rounded(2.9712, 0.996, "Hz").text());
        // dB takes no prefix
        assertEquals("0.0012 ± 0.0034 dB", MeasuredValueFormat.rounded(0.00123, 0.00342, "dB").text());
    }

    @Test
    void kIsPrintedBesideU() {
        assertEquals("59.99 ± 0.64 Hz (U, k = 2.02)", MeasuredValueFormat.expanded(59.9913, 0.6371, 2.0231, "Hz"));
        assertEquals("2", MeasuredValueFormat.coverage(2.0));
    }

    // one minus sign, U+2212, and no negative zero: a value that rounds to zero has no sign
    @Test
    void oneMinusSignAndNoNegativeZero() {
        assertEquals("−0.257", MeasuredValueFormat.fixed(-0.2571, 3));
        assertEquals("0.000", MeasuredValueFormat.fixed(-0.0001, 3));
        assertEquals("0 %", MeasuredValueFormat.percent(-0.003, 0));
        assertEquals("0.0000", MeasuredValueFormat.signed(-0.00001, 4));
        assertEquals("+0.0499", MeasuredValueFormat.signed(0.04994, 4));
        assertEquals("−24.99 Hz", MeasuredValueFormat.rounded(-24.991, 0.64, "Hz").valueText());
        assertEquals("0 ± 640 mHz", MeasuredValueFormat.rounded(-0.001, 0.64, "Hz").text());
        assertEquals("0 F", MeasuredValueFormat.engineering(-0.0, "F", 3));
        assertEquals("−2.2 MΩ", MeasuredValueFormat.engineering(-2.2e6, "Ω", 3));
        assertEquals("0", MeasuredValueFormat.sixFigures(-0.0));
    }

    // a complex pair with each part's uncertainty labelled: never "−3.565 ± j2.064 ± 0.021"
    @Test
    void complexPairNamesEachUncertainty() {
        assertEquals("−3.565 ± j2.064 Hz, u(re) 0.021 Hz, u(im) 0.030 Hz",
                MeasuredValueFormat.complexPair(-3.5651, 0.0213, -2.0642, 0.0301, "Hz", "u"));
    }

    @Test
    void printedMinusReadsBack() {
        assertEquals(-2.2e6, EngineeringValue.parse("−2.2 MΩ", Quantity.OHMS), 1e-6);
    }
}

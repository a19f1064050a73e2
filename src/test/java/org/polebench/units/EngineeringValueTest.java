package org.polebench.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class EngineeringValueTest {

    // SI prefixes: BIPM SI Brochure, 9th edition (2019), table 7. 4u7 style: IEC 60062.
    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
            "4.7u;4.7e-6", "4u7;4.7e-6", "4.7 µF;4.7e-6", "4.7uF;4.7e-6", "4.7μF;4.7e-6",
            "100n;1e-7", "100nF;1e-7", "1mF;1e-3", "22p;22e-12", "1;1", "1e-6;1e-6", "1.5e-6F;1.5e-6"})
    void readsCapacitanceInEngineeringNotation(String text, double farads) {
        assertEquals(farads, EngineeringValue.parse(text, Quantity.FARADS), 1e-12 * farads);
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
            "10k;1e4", "4k7;4.7e3", "2.2M;2.2e6", "2M2;2.2e6", "100R;100", "4R7;4.7", "600;600",
            "47kΩ;47e3", "1 ohm;1", "10m;0.01"})
    void readsResistanceWithMegaAndMilliDistinct(String text, double ohms) {
        assertEquals(ohms, EngineeringValue.parse(text, Quantity.OHMS), 1e-12 * ohms);
    }

    // issue 14: a capacitor value states its scale; SI (BIPM SI Brochure, table 7) makes m milli
    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {"4.7u;4.7e-6;u;", "4u7;4.7e-6;u;", "100nF;1e-7;n;F", "4.7F;4.7;;F",
            "4.7mF;4.7e-3;m;F", "2m2;2.2e-3;m;", "0;0;;"})
    void capacitanceKeepsThePrefixAndUnitWritten(String text, double farads, String prefix, String unit) {
        EngineeringValue.Written written = EngineeringValue.capacitance(text);
        assertEquals(farads, written.value(), 1e-12 * farads);
        assertEquals(prefix == null ? "" : prefix, written.prefix());
        assertEquals(unit == null ? "" : unit, written.unit());
        assertEquals("m".equals(prefix), written.milli());
    }

    @Test
    void bareCapacitanceIsRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> EngineeringValue.capacitance("4.7"));
        assertTrue(e.getMessage().contains("neither a prefix nor the unit F"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.capacitance("47"));
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {"4,7u;4.7u", "4,7 µF;4.7µF", "-1,5;-1.5"})
    void decimalCommaIsNamedWithThePointedSpelling(String text, String pointed) {
        // issue 14: '4,7u' was read as 4 followed by the bad unit ',7u'
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> EngineeringValue.parse(text, Quantity.FARADS));
        assertTrue(e.getMessage().contains("comma") && e.getMessage().contains("write " + pointed), e.getMessage());
    }

    @Test
    void readsFrequencyTemperatureAndDecibels() {
        assertEquals(20, EngineeringValue.parse("20 Hz", Quantity.HERTZ));
        assertEquals(2e5, EngineeringValue.parse("200kHz", Quantity.HERTZ));
        assertEquals(1e6, EngineeringValue.parse("1MHz", Quantity.HERTZ));
        assertEquals(300, EngineeringValue.parse("300K", Quantity.KELVIN));
        assertEquals(300, EngineeringValue.parse("300 K", Quantity.KELVIN));
        assertEquals(-3, EngineeringValue.parse("-3 dB", Quantity.DECIBELS));
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {"abc", "NaN", "Infinity", "1d", "0x10", "4.7 uH", "1e999", "--1", "4.7 uu"})
    void refusesWhatIsNotEngineeringNotation(String text) {
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.parse(text, Quantity.FARADS));
    }

    @Test
    void formatsWithThreeSignificantDigitsAndAPrefix() {
        assertEquals("4.7 µF", EngineeringValue.format(4.7e-6, "F"));
        assertEquals("1 kΩ", EngineeringValue.format(999.96, "Ω"));
        assertEquals("15.9 Hz", EngineeringValue.format(15.9155, "Hz"));
        assertEquals("−2.2 MΩ", EngineeringValue.format(-2.2e6, "Ω")); // U+2212, the printed minus (issue 14)
        assertEquals("0 F", EngineeringValue.format(0, "F"));
    }

    // identity: format then parse returns the value to the printed precision
    @Property(tries = 2000, seed = "20261201")
    void formattedValuesReadBack(@ForAll @DoubleRange(min = -30, max = 20) double log10) {
        double value = Math.pow(10, log10 / 2);
        String text = EngineeringValue.format(value, "F", 12);
        assertEquals(value, EngineeringValue.parse(text, Quantity.FARADS), 1e-10 * value);
    }

    @Test
    void decibelsAndNepersAgree() {
        // 1 dB = ln(10)/20 Np = 0.1151 Np (IEC 60027-3)
        assertEquals(0.11512925, Decibels.toNepers(1), 1e-8);
        assertEquals(20, Decibels.fromRatio(10), 1e-12);
        assertEquals(-3.0103, Decibels.fromRatio(1 / Math.sqrt(2)), 1e-4);
    }
}

package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class ThermalVoltageTest {

    @Test
    void thermalVoltageAt300KelvinComesFromTheExactSiConstants() {
        // k = 1.380649e-23 J/K and q = 1.602176634e-19 C are exact (BIPM SI Brochure, 9th ed.,
        // 2019, table 1); kT/q at 300 K = 0.025852 V. 1e-15 relative: one division and one product.
        double expected = 1.380649e-23 * 300 / 1.602176634e-19;
        assertEquals(expected, ThermalVoltage.volts(300), 1e-15 * expected);
        // the familiar figure, 25.85 mV at 300 K (common practice), to the 4 digits it is quoted with
        assertEquals(0.02585, ThermalVoltage.volts(300), 0.000005);
    }

    @Test
    void thermalVoltageIsProportionalToTemperature() {
        // VT = kT/q is linear in T: an exact identity, so only round-off (1e-15) separates them
        assertEquals(2 * ThermalVoltage.volts(150), ThermalVoltage.volts(300), 1e-15);
    }

    @Test
    void refusesANonPositiveTemperature() {
        assertThrows(IllegalArgumentException.class, () -> ThermalVoltage.volts(0));
    }
}

package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class PriorTest {

    @Test
    void asymmetricElectrolyticBandHasTheGumRectangularCentreAndWidth() {
        // GUM (JCGM 100:2008) 4.3.7 rectangular: centre (ln 0.8 + ln 1.8)/2 = 0.1823,
        // u = (ln 1.8 − ln 0.8)/√12 = 0.2341 (figures also in docs/method.md, "The back-solve")
        Prior prior = Prior.fromBand(-0.2, 0.8);
        assertEquals(0.5 * (Math.log(0.8) + Math.log(1.8)), prior.mean(), 1e-15);
        assertEquals(0.182, prior.mean(), 5e-4);
        assertEquals(0.234, prior.standardDeviation(), 5e-4);
    }

    @Test
    void symmetricTenPercentBandHasUOfAboutFivePointEightPercent() {
        // ln(1.1/0.9)/√12 = 0.0579 (GUM 4.3.7)
        assertEquals(0.0579, Prior.fromBand(-0.1, 0.1).standardDeviation(), 1e-4);
    }

    @Test
    void gainBandIsRectangularInDecibels() {
        // ±1 dB rectangular: u = 1/√3 dB (GUM 4.3.7)
        assertEquals(1 / Math.sqrt(3), Prior.fromGainBandDb(1).standardDeviation(), 1e-15);
    }
}

package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class PreferredSeriesTest {

    @Test
    void seriesHoldThePublishedMemberCounts() {
        // IEC 60063:2015: E6, E12 and E24 have 6, 12 and 24 members per decade
        assertEquals(6, PreferredSeries.E6.decade().size());
        assertEquals(12, PreferredSeries.E12.decade().size());
        assertEquals(24, PreferredSeries.E24.decade().size());
    }

    @Test
    void e24KeepsTheMembersThatRoundingWouldGetWrong() {
        // IEC 60063:2015 E24 has 2.7, 4.7, 8.2 where round(10^(n/24)) gives 2.6, 4.6, 8.3, so the tables are written out
        assertEquals(2.7, PreferredSeries.E24.nearest(2.65), 1e-12);
        assertEquals(4.7, PreferredSeries.E24.nearest(4.62), 1e-12);
        assertEquals(8.2, PreferredSeries.E24.nearest(8.28), 1e-12);
    }

    @Test
    void aFittedDecadeSlipMapsToTheSlippedPart() {
        // 4.8 µF fitted at a 47 µF position of a ±20 % electrolytic: E6 nearest is 4.7 µF
        assertEquals(4.7e-6, PreferredSeries.forTolerance(0.2).nearest(4.8e-6), 1e-18);
        // across the decade boundary: 9.6 lies nearer 10 than 9.1 in log space (E24)
        assertEquals(10.0, PreferredSeries.E24.nearest(9.6), 1e-12);
    }

    @Test
    void toleranceChoosesTheSeries() {
        // common practice: ±20 % parts in E6, ±10 % in E12, ±5 % in E24
        assertEquals(PreferredSeries.E6, PreferredSeries.forTolerance(0.8));
        assertEquals(PreferredSeries.E12, PreferredSeries.forTolerance(0.1));
        assertEquals(PreferredSeries.E24, PreferredSeries.forTolerance(0.05));
    }
}

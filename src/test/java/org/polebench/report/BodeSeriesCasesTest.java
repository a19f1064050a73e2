package org.polebench.report;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.polebench.SealedCases;

/**
 * The Bode chart tells its series apart through {@link BodeSeries.Cases}: one case per kind,
 * and each kind's {@code match} calls its own (issue 12), so a new kind of series is drawn
 * as itself or fails to compile, never as another.
 */
class BodeSeriesCasesTest {

    @SuppressWarnings("unchecked")
    @Test
    void everyKindOfSeriesHasItsOwnCase() {
        List<ResponsePoint> points = List.of(new ResponsePoint(10, -3, OptionalDouble.of(45)));
        List<BodeSeries> series = List.of(new BodeSeries.Measured("measured", points),
                new BodeSeries.Curve("fit", points), new BodeSeries.GainBand("spread",
                        List.of(new GainBandPoint(10, -4, -2))));
        SealedCases.assertEveryTypeHasItsOwnCase(BodeSeries.class, BodeSeries.Cases.class, series,
                (s, cases) -> s.match((BodeSeries.Cases<Object>) cases));
    }
}

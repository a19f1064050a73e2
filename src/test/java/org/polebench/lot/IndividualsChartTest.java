package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class IndividualsChartTest {
    private static List<ChartPoint> points(double... values) {
        List<ChartPoint> out = new ArrayList<>();
        for (int i = 0; i < values.length; i++) {
            out.add(new ChartPoint(i + 1, "B" + (i + 1), values[i]));
        }
        return out;
    }

    @Test
    void constantMovingRangesGiveLimitsInClosedForm() {
        // 10, 12, 10, 12, …: every moving range is 2, so MR̄ = 2, σ̂ = 2/1.128 and the limits are
        // 11 ± 3·2/1.128 (Montgomery's individuals chart: closed form by hand)
        double[] values = new double[20];
        for (int i = 0; i < values.length; i++) {
            values[i] = i % 2 == 0 ? 10 : 12;
        }
        IndividualsChart chart = IndividualsChart.of(LotQuantity.LOWER_CORNER, points(values));

        assertEquals(11, chart.centre(), 1e-12);
        assertEquals(2, chart.averageMovingRange(), 1e-12);
        assertEquals(2 / 1.128, chart.sigma(), 1e-12);
        assertEquals(11 - 6 / 1.128, chart.lowerLimit(), 1e-12);
        assertEquals(11 + 6 / 1.128, chart.upperLimit(), 1e-12);
        // every point lies 1 from the centre, 0.564σ: inside every zone. Rule 4 (eight on one
        // side) cannot hold as the points alternate sides, so nothing is flagged
        assertEquals(List.of(), chart.breaks());
    }

    @Test
    void cpkIsTheNearerLimitOverThreeSigmaAndOneSidedWithOneLimit() {
        // the same chart: μ = 11, σ̂ = 2/1.128; USL 20, LSL 5: Cpk = min(9, 6)/(3σ̂) = 6·1.128/6
        // (Montgomery's Cpk, closed form by hand)
        double[] values = new double[20];
        for (int i = 0; i < values.length; i++) {
            values[i] = i % 2 == 0 ? 10 : 12;
        }
        IndividualsChart chart = IndividualsChart.of(LotQuantity.MIDBAND_GAIN, points(values));
        // sample standard deviation of ten 10s and ten 12s: √(20/19)
        double sd = Math.sqrt(20 / 19.0);
        Capability both = Capability.of(chart, 11, sd, OptionalDouble.of(5), OptionalDouble.of(20)).orElseThrow();
        assertEquals(1.128, both.cpk(), 1e-12);
        assertEquals(6 / (3 * sd), both.ppk(), 1e-12);
        assertEquals(false, both.oneSided());
        assertEquals(20, both.boards());

        Capability upper = Capability.of(chart, 11, sd, OptionalDouble.empty(), OptionalDouble.of(20)).orElseThrow();
        // Cpu = (20 − 11)/(3·2/1.128) = 9·1.128/6
        assertEquals(9 * 1.128 / 6, upper.cpk(), 1e-12);
        assertTrue(upper.oneSided());
        assertTrue(Capability.of(chart, 11, sd, OptionalDouble.empty(), OptionalDouble.empty()).isEmpty());
    }

    @Test
    void aPointBeyondTheTrialLimitsIsSetAsideAndFlaggedByRuleOne() {
        // 21 points alternating 101, 99 with 130 in place of the 101 at index 10. Trial limits
        // from all 21: MR̄ = (18·2 + 2·31)/20 = 4.9, centre 2130/21 = 101.43, σ̂ = 4.344; 130 lies
        // 6.6σ̂ above, so it is set aside. Revised, from the other 20 (by hand): centre 100, the
        // moving ranges between successive kept points are eighteen 2s and one 0 (99 at 9 to 99
        // at 11), MR̄ = 36/19; every kept point is 1 from the centre, 0.53σ̂, on alternating sides
        double[] values = new double[21];
        for (int i = 0; i < 21; i++) {
            values[i] = i % 2 == 0 ? 101 : 99;
        }
        values[10] = 130;
        IndividualsChart chart = IndividualsChart.of(LotQuantity.LOWER_CORNER, points(values));
        assertEquals(List.of(10), chart.setAside());
        assertEquals(20, chart.pointsUsed());
        assertEquals(100, chart.centre(), 1e-12);
        assertEquals(36 / 19.0, chart.averageMovingRange(), 1e-12);
        assertEquals(List.of(new RuleBreak(RunRule.BEYOND_3_SIGMA, List.of(10))), chart.breaks());
        assertEquals(List.of(10), chart.flagged());
    }

    @net.jqwik.api.Property(tries = 200)
    void shiftingAndScalingTheValuesMovesTheChartAndKeepsItsFlags(
            @net.jqwik.api.ForAll("sequences") List<Double> values,
            @net.jqwik.api.ForAll @net.jqwik.api.constraints.DoubleRange(min = -1000, max = 1000) double shift,
            @net.jqwik.api.ForAll @net.jqwik.api.constraints.DoubleRange(min = 0.01, max = 100) double scale) {
        // identities of the chart's definition: x → a + b·x (b > 0) maps the centre and the
        // limits the same way, σ̂ to b·σ̂, and leaves every run rule's flags where they were
        double[] x = values.stream().mapToDouble(Double::doubleValue).toArray();
        double[] y = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            y[i] = shift + scale * x[i];
        }
        IndividualsChart a = IndividualsChart.of(LotQuantity.MIDBAND_GAIN, points(x));
        IndividualsChart b = IndividualsChart.of(LotQuantity.MIDBAND_GAIN, points(y));
        double tolerance = 1e-9 * (Math.abs(shift) + scale * 100);
        assertEquals(shift + scale * a.centre(), b.centre(), tolerance);
        assertEquals(scale * a.sigma(), b.sigma(), tolerance);
        assertEquals(shift + scale * a.upperLimit(), b.upperLimit(), tolerance);
        // flags compare points against limits: round-off could move a point lying within 1e-9 of
        // a zone edge, which random doubles almost never do
        assertEquals(a.flagged(), b.flagged());
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<List<Double>> sequences() {
        return net.jqwik.api.Arbitraries.integers().between(-50, 50).map(i -> i / 7.0).list().ofMinSize(2).ofMaxSize(40);
    }
}

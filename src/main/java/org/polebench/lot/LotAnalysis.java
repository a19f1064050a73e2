package org.polebench.lot;

import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.TreeMap;
import java.util.function.Function;
import org.polebench.InputProblem;
import org.polebench.analysis.Prediction;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Limits;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.spread.CornerSpread;
import org.polebench.spread.GainSpread;
import org.polebench.spread.ResponseSpread;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.ToleranceSpread;

/**
 * Works out what a lot says (docs/method.md, "What a lot says"): yield and counts, the measured
 * lower corner and midband gain against the stage's predicted tolerance spread, individuals
 * charts with the Western Electric run rules, Cpk against the stage's limits, the Pareto of
 * culprits and each part's systematic shift. Stateless.
 */
public final class LotAnalysis {
    /** The central fraction of drawn boards the predicted band holds: the 5th to 95th percentile. */
    public static final double BAND_COVERAGE = 0.90;
    /**
     * Boards drawn for the predicted bands when the caller does not say: a 5 % point of 2,000
     * draws has a standard error of √(0.05·0.95/2000) ≈ 0.005 in probability (the binomial
     * standard error of a sample quantile's level), half a percent of the boards.
     */
    public static final int DEFAULT_DRAWS = 2000;
    /** The seed when the caller does not say: the tolerance spread's own, so lot and predict agree. */
    public static final long DEFAULT_SEED = ToleranceSpread.DEFAULT_SEED;
    /** The Pareto's name for a failed or unexplained board whose result named no hypothesis. */
    public static final String NONE_NAMED = "none named";

    private LotAnalysis() {
    }

    /**
     * @param lot    the lot's name
     * @param boards every test of the lot's boards, in any order
     * @param stage  the stage the boards were built from (its limits and tolerances)
     * @param seed   the seed of the predicted tolerance spread
     * @param draws  boards drawn for it, at least 20
     * @throws InputProblem when the stage cannot be predicted (a singular network)
     */
    public static LotFindings of(String lot, List<BoardOutcome> boards, Stage stage, long seed, int draws)
            throws InputProblem {
        PredictedBand[] bands = predicted(stage, seed, draws);
        return of(lot, boards, stage, bands[0], bands[1], seed, draws);
    }

    /**
     * As {@link #of(String, List, Stage, long, int)} with the predicted bands given, so that the
     * statistics can be checked against known bands without a Monte Carlo.
     */
    static LotFindings of(String lot, List<BoardOutcome> boards, Stage stage, PredictedBand cornerBand,
                          PredictedBand gainBand, long seed, int draws) {
        List<BoardOutcome> tests = boards.stream()
                .sorted(Comparator.comparingLong(BoardOutcome::testOrder)).toList();
        Map<String, BoardOutcome> first = new LinkedHashMap<>();
        Map<String, BoardOutcome> last = new LinkedHashMap<>();
        for (BoardOutcome t : tests) {
            first.putIfAbsent(t.boardId(), t);
            last.put(t.boardId(), t);
        }
        List<BoardOutcome> asBuilt = List.copyOf(first.values());
        List<BoardOutcome> latest = last.values().stream()
                .sorted(Comparator.comparingLong(BoardOutcome::testOrder)).toList();
        OutcomeCounts counts = OutcomeCounts.none();
        OutcomeCounts firstPass = OutcomeCounts.none();
        for (BoardOutcome b : latest) {
            counts = counts.plus(b.outcome());
        }
        for (BoardOutcome b : asBuilt) {
            firstPass = firstPass.plus(b.outcome());
        }
        Limits limits = stage.limits();
        List<QuantityFindings> quantities = List.of(
                quantity(LotQuantity.LOWER_CORNER, asBuilt, BoardOutcome::lowerCornerHz, cornerBand,
                        limits.lowerCornerMinHz(), limits.lowerCornerMaxHz()),
                quantity(LotQuantity.MIDBAND_GAIN, asBuilt, BoardOutcome::midbandGainDb, gainBand,
                        limits.midbandGainMinDb(), limits.midbandGainMaxDb()));
        return new LotFindings(lot, tests, counts, firstPass, grouped(latest, BoardOutcome::station),
                grouped(latest, b -> b.testedAt().atZone(ZoneOffset.UTC).toLocalDate().toString()), quantities,
                culprits(asBuilt), SystematicShifts.of(asBuilt.stream()
                        .filter(b -> b.outcome() != BoardOutcome.Outcome.INPUT_PROBLEM).toList(), stage),
                seed, draws);
    }

    private static List<GroupCounts> grouped(List<BoardOutcome> boards, Function<BoardOutcome, String> key) {
        Map<String, OutcomeCounts> groups = new TreeMap<>();
        for (BoardOutcome b : boards) {
            groups.merge(key.apply(b), OutcomeCounts.none().plus(b.outcome()),
                    (a, one) -> a.plus(b.outcome()));
        }
        List<GroupCounts> out = new ArrayList<>();
        groups.forEach((k, v) -> out.add(new GroupCounts(k, v)));
        return out;
    }

    private static QuantityFindings quantity(LotQuantity quantity, List<BoardOutcome> boards,
                                             Function<BoardOutcome, Optional<Double>> value, PredictedBand band,
                                             OptionalDouble lower, OptionalDouble upper) {
        List<ChartPoint> points = new ArrayList<>();
        for (BoardOutcome b : boards) {
            Optional<Double> v = value.apply(b);
            if (b.outcome() != BoardOutcome.Outcome.INPUT_PROBLEM && v.isPresent() && Double.isFinite(v.get())) {
                points.add(new ChartPoint(b.testOrder(), b.boardId(), v.get()));
            }
        }
        if (points.isEmpty()) {
            return new QuantityFindings(quantity, band, Optional.empty(), Optional.empty(), Optional.empty());
        }
        LotDistribution distribution = LotDistribution.of(quantity,
                points.stream().map(ChartPoint::value).toList(), band);
        if (points.size() < 2) {
            return new QuantityFindings(quantity, band, Optional.of(distribution), Optional.empty(), Optional.empty());
        }
        IndividualsChart chart = IndividualsChart.of(quantity, points);
        return new QuantityFindings(quantity, band, Optional.of(distribution), Optional.of(chart),
                Capability.of(chart, distribution.mean(), distribution.standardDeviation(), positive(quantity, lower),
                        positive(quantity, upper)));
    }

    /** A corner limit of 0 Hz is no limit (the reader's "none"); a gain limit may be any number. */
    private static OptionalDouble positive(LotQuantity quantity, OptionalDouble limit) {
        if (quantity == LotQuantity.LOWER_CORNER && limit.isPresent() && !(limit.getAsDouble() > 0)) {
            return OptionalDouble.empty();
        }
        return limit;
    }

    /**
     * The Pareto of culprits (Juran's Pareto principle, as Montgomery presents the Pareto chart):
     * the most probable hypothesis of every board whose first test failed or was not explained,
     * counted by name, most boards first (ties by name), with the cumulative fraction.
     */
    static List<Culprit> culprits(List<BoardOutcome> asBuilt) {
        Map<String, Integer> counts = new TreeMap<>();
        int total = 0;
        for (BoardOutcome b : asBuilt) {
            if (b.outcome() == BoardOutcome.Outcome.INPUT_PROBLEM) {
                continue;
            }
            if (b.outcome() == BoardOutcome.Outcome.FAIL || !b.explained()) {
                String name = b.topHypothesis().isBlank() ? NONE_NAMED : samePairOneName(b.topHypothesis());
                counts.merge(name, 1, Integer::sum);
                total++;
            }
        }
        List<Map.Entry<String, Integer>> sorted = new ArrayList<>(counts.entrySet());
        sorted.sort(Map.Entry.<String, Integer>comparingByValue().reversed().thenComparing(Map.Entry.comparingByKey()));
        List<Culprit> out = new ArrayList<>();
        int running = 0;
        for (Map.Entry<String, Integer> e : sorted) {
            running += e.getValue();
            out.add(new Culprit(e.getKey(), e.getValue(), running / (double) total));
        }
        return out;
    }

    /**
     * A pair is named in the order its board's ranking happened to form it ("C3 and C2" on one
     * board, "C2 and C3" on the next); the Pareto counts one cause, so a pair's two names are put
     * in order.
     */
    static String samePairOneName(String hypothesis) {
        String[] two = hypothesis.split(" and ");
        if (two.length != 2) {
            return hypothesis;
        }
        return two[0].compareTo(two[1]) <= 0 ? hypothesis : two[1] + " and " + two[0];
    }

    /**
     * @return the predicted bands of the lower corner and the midband gain, from the same seeded
     *         draws (docs/method.md, "Tolerance spread")
     */
    static PredictedBand[] predicted(Stage stage, long seed, int draws) throws InputProblem {
        Prediction nominal = new StageAnalysis().predictNetwork(stage,
                new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage)));
        CornerSpread corners = new ToleranceSpread(draws, seed).lowerCorner(stage);
        double low = (1 - BAND_COVERAGE) / 2;
        double high = (1 + BAND_COVERAGE) / 2;
        PredictedBand corner = new PredictedBand(nominal.exactLowerCornerHz().orElse(Double.NaN),
                corners.percentileHz(low).orElse(Double.NaN), corners.percentileHz(high).orElse(Double.NaN),
                BAND_COVERAGE, corners.samplesDrawn(), corners.analysed(), seed);
        GainSpread gains = new ResponseSpread(draws, seed, BAND_COVERAGE).gain(stage, List.of(midbandHz(nominal)));
        PredictedBand gain = new PredictedBand(nominal.midbandGainDb(), gains.lowDb().get(0), gains.highDb().get(0),
                BAND_COVERAGE, gains.boardsDrawn(), gains.boardsAnalysed(), seed);
        return new PredictedBand[]{corner, gain};
    }

    /**
     * A frequency in the midband: the geometric mean of the nominal lower and upper corners, or
     * a thousand times the lower corner when the stage has no upper band (there the full
     * response is within a millionth of the midband gain D of a first-order corner); 1 kHz when
     * the stage has neither.
     */
    static double midbandHz(Prediction nominal) {
        OptionalDouble lower = nominal.exactLowerCornerHz();
        OptionalDouble upper = nominal.upperBand().flatMap(u -> u.exactUpperCornerHz().isPresent()
                ? Optional.of(u.exactUpperCornerHz().getAsDouble()) : Optional.empty())
                .map(OptionalDouble::of).orElse(OptionalDouble.empty());
        if (lower.isPresent() && upper.isPresent()) {
            return Math.sqrt(lower.getAsDouble() * upper.getAsDouble());
        }
        return lower.isPresent() ? 1000 * lower.getAsDouble() : 1000;
    }
}

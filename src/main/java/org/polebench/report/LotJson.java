package org.polebench.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.lot.ApartBoard;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.Capability;
import org.polebench.lot.ChartPoint;
import org.polebench.lot.Culprit;
import org.polebench.lot.GroupCounts;
import org.polebench.lot.IndividualsChart;
import org.polebench.lot.LotDistribution;
import org.polebench.lot.LotFindings;
import org.polebench.lot.OutcomeCounts;
import org.polebench.lot.PartShift;
import org.polebench.lot.PredictedBand;
import org.polebench.lot.QuantityFindings;
import org.polebench.lot.RuleBreak;

/**
 * The JSON object of {@code polebench lot --json} and the lot report's {@code lot.json}. The keys
 * {@code boards}, {@code passed}, {@code failed}, {@code incomplete}, {@code yield},
 * {@code culprits} and {@code systematic} (a list of {@code part}, {@code factor}, {@code u},
 * {@code boards}, {@code statement}) are fixed by issue 16; the rest are ours. Keys are
 * snake_case with their unit; a number that is not known is null, never NaN.
 */
public final class LotJson {
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;
    private final ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public ObjectNode of(LotFindings lot) {
        ObjectNode root = nodes.objectNode();
        root.put("lot", lot.lot());
        OutcomeCounts c = lot.counts();
        root.put("boards", c.boards());
        root.put("passed", c.passed());
        root.put("failed", c.failed());
        root.put("incomplete", c.incomplete());
        root.put("input_problems", c.inputProblems());
        number(root, "yield", c.yield());
        number(root, "first_pass_yield", lot.firstPass().yield());
        root.put("tests", lot.tests().size());
        root.put("summary", LotStatements.counts(lot));
        ArrayNode systematic = root.putArray("systematic");
        for (PartShift p : lot.systematic()) {
            ObjectNode s = systematic.addObject();
            s.put("part", p.part());
            number(s, "factor", p.factor());
            number(s, "u", p.uFactor());
            s.put("boards", p.boardsPooled());
            s.put("statement", LotStatements.systematic(p));
            s.put("boards_identified", p.identifiable());
            number(s, "ln_factor", p.pooled().get().mean());
            number(s, "u_ln_factor", p.pooled().get().uMean());
            number(s, "tau_ln", p.pooled().get().tau());
        }
        ArrayNode single = root.putArray("single_board_faults");
        for (PartShift p : lot.parts()) {
            for (ApartBoard a : p.singleBoardFaults()) {
                ObjectNode s = single.addObject();
                s.put("board", a.boardId());
                s.put("part", p.part());
                number(s, "factor", a.factor());
                number(s, "u_ln_factor", a.uLnFactor());
                s.put("statement", LotStatements.singleBoard(p, a));
            }
        }
        ArrayNode culprits = root.putArray("culprits");
        for (Culprit k : lot.culprits()) {
            ObjectNode o = culprits.addObject();
            o.put("name", k.name());
            o.put("boards", k.boards());
            number(o, "cumulative_fraction", k.cumulative());
        }
        root.put("culprits_statement", LotStatements.culprits(lot));
        for (QuantityFindings q : lot.quantities()) {
            root.set(q.quantity().key(), quantity(q));
        }
        root.set("by_station", groups(lot, true));
        root.set("by_day", groups(lot, false));
        ArrayNode parts = root.putArray("parts");
        for (PartShift p : lot.parts()) {
            parts.add(part(p));
        }
        ObjectNode spread = root.putObject("predicted_spread");
        spread.put("seed", lot.seed());
        spread.put("draws", lot.draws());
        ArrayNode table = root.putArray("board_table");
        for (BoardOutcome b : lot.tests()) {
            table.add(board(b));
        }
        return root;
    }

    /** @return the object as indented text with a final line end */
    public String text(ObjectNode root) {
        try {
            return mapper.writeValueAsString(root) + "\n";
        } catch (JsonProcessingException impossible) {
            throw new IllegalStateException(impossible);
        }
    }

    static String finding(PartShift.Finding finding) {
        switch (finding) {
            case SYSTEMATIC:
                return "systematic";
            case WITHIN_TOLERANCE:
                return "within tolerance";
            default:
                return "too few readings";
        }
    }

    private ArrayNode groups(LotFindings lot, boolean stations) {
        ArrayNode out = nodes.arrayNode();
        for (GroupCounts g : stations ? lot.byStation() : lot.byDay()) {
            ObjectNode o = out.addObject();
            o.put(stations ? "station" : "date_utc", g.key());
            o.put("boards", g.counts().boards());
            o.put("passed", g.counts().passed());
            o.put("failed", g.counts().failed());
            o.put("incomplete", g.counts().incomplete());
            o.put("input_problems", g.counts().inputProblems());
            number(o, "yield", g.counts().yield());
        }
        return out;
    }

    private ObjectNode quantity(QuantityFindings q) {
        ObjectNode o = nodes.objectNode();
        o.put("unit", q.quantity().unit());
        o.put("statement", LotStatements.distribution(q));
        PredictedBand band = q.predicted();
        ObjectNode predicted = o.putObject("predicted");
        number(predicted, "nominal", band.nominal());
        number(predicted, "low", band.low());
        number(predicted, "high", band.high());
        number(predicted, "coverage", band.coverage());
        predicted.put("drawn", band.drawn());
        predicted.put("analysed", band.analysed());
        predicted.put("seed", band.seed());
        if (q.distribution().isPresent()) {
            LotDistribution d = q.distribution().get();
            ObjectNode m = o.putObject("measured");
            m.put("boards", d.boards());
            number(m, "min", d.minimum());
            number(m, "p05", d.q05());
            number(m, "p25", d.q25());
            number(m, "median", d.median());
            number(m, "p75", d.q75());
            number(m, "p95", d.q95());
            number(m, "max", d.maximum());
            number(m, "mean", d.mean());
            number(m, "standard_deviation", d.standardDeviation());
            m.put("inside_predicted_band", d.insideBand());
        }
        if (q.chart().isPresent()) {
            IndividualsChart c = q.chart().get();
            ObjectNode chart = o.putObject("control_chart");
            chart.put("statement", LotStatements.chart(c));
            number(chart, "centre", c.centre());
            number(chart, "average_moving_range", c.averageMovingRange());
            number(chart, "sigma", c.sigma());
            number(chart, "lower_limit", c.lowerLimit());
            number(chart, "upper_limit", c.upperLimit());
            chart.put("points_used", c.pointsUsed());
            ArrayNode aside = chart.putArray("set_aside");
            for (int i : c.setAside()) {
                aside.add(c.points().get(i).boardId());
            }
            chart.put("rules", "Western Electric Statistical Quality Control Handbook (1956), rules 1 to 4");
            ArrayNode breaks = chart.putArray("breaks");
            for (RuleBreak b : c.breaks()) {
                ObjectNode r = breaks.addObject();
                r.put("rule", b.rule().number());
                r.put("words", b.rule().words());
                ArrayNode boards = r.putArray("boards");
                ArrayNode orders = r.putArray("test_order");
                for (int i : b.points()) {
                    boards.add(c.points().get(i).boardId());
                    orders.add(c.points().get(i).testOrder());
                }
            }
            ArrayNode points = chart.putArray("points");
            for (ChartPoint p : c.points()) {
                ObjectNode point = points.addObject();
                point.put("board", p.boardId());
                point.put("test_order", p.testOrder());
                number(point, "value", p.value());
            }
        }
        if (q.capability().isPresent()) {
            Capability k = q.capability().get();
            ObjectNode cap = o.putObject("capability");
            cap.put("statement", LotStatements.capability(k));
            number(cap, "cpk", k.cpk());
            number(cap, "ppk", k.ppk());
            cap.put("one_sided", k.oneSided());
            optional(cap, "lower_limit", k.lowerLimit());
            optional(cap, "upper_limit", k.upperLimit());
            number(cap, "mean", k.mean());
            number(cap, "sigma", k.sigma());
            cap.put("boards", k.boards());
            cap.put("boards_ppk", k.allBoards());
        }
        return o;
    }

    private ObjectNode part(PartShift p) {
        ObjectNode o = nodes.objectNode();
        o.put("part", p.part());
        o.put("finding", finding(p.finding()));
        o.put("readings", p.readings());
        o.put("identified", p.identifiable());
        o.put("pooled", p.boardsPooled());
        number(o, "factor", p.factor());
        number(o, "u", p.uFactor());
        number(o, "tau_ln", p.pooled().map(e -> e.tau()).orElse(Double.NaN));
        number(o, "band_low_factor", Math.exp(p.lnBandLow()));
        number(o, "band_high_factor", Math.exp(p.lnBandHigh()));
        ArrayNode apart = o.putArray("apart");
        for (ApartBoard a : p.apart()) {
            ObjectNode b = apart.addObject();
            b.put("board", a.boardId());
            number(b, "factor", a.factor());
            number(b, "u_ln_factor", a.uLnFactor());
            b.put("outside_tolerance", a.outsideTolerance());
        }
        return o;
    }

    private ObjectNode board(BoardOutcome b) {
        ObjectNode o = nodes.objectNode();
        o.put("board", b.boardId());
        o.put("test_order", b.testOrder());
        o.put("tested_utc", b.testedAt().toString());
        o.put("station", b.station());
        o.put("operator", b.operator());
        o.put("outcome", b.outcome().word());
        optional(o, "midband_gain_db", b.midbandGainDb());
        optional(o, "midband_gain_u_db", b.midbandGainUDb());
        optional(o, "lower_corner_hz", b.lowerCornerHz());
        optional(o, "lower_corner_u_hz", b.lowerCornerUHz());
        number(o, "coverage_factor", b.coverageFactor());
        o.put("explained", b.explained());
        o.put("top_hypothesis", b.topHypothesis());
        number(o, "top_probability", b.topProbability());
        if (b.problem().isPresent()) {
            o.put("problem", b.problem().get());
        }
        return o;
    }

    private static void number(ObjectNode o, String key, double value) {
        if (Double.isFinite(value)) {
            o.put(key, value);
        } else {
            o.putNull(key);
        }
    }

    private static void optional(ObjectNode o, String key, Optional<Double> value) {
        number(o, key, value.orElse(Double.NaN));
    }

    private static void optional(ObjectNode o, String key, OptionalDouble value) {
        number(o, key, value.orElse(Double.NaN));
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import java.util.Optional;
import org.polebench.ledger.BoardHistory;
import org.polebench.ledger.PartMove;
import org.polebench.ledger.RecordedTest;
import org.polebench.ledger.TestChange;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/**
 * {@code polebench history --json}: {@code board}, {@code tests} (each with its figures and part
 * factors) and {@code changes} (between consecutive tests: {@code verdict_changed}, and per part
 * {@code ratio}, {@code z} and {@code moved}).
 */
public final class HistoryJson {
    public ObjectNode of(BoardHistory history) {
        ObjectNode root = JsonNodeFactory.instance.objectNode();
        root.put("board", history.boardId());
        ArrayNode tests = root.putArray("tests");
        for (RecordedTest test : history.tests()) {
            tests.add(test(test));
        }
        ArrayNode changes = root.putArray("changes");
        List<TestChange> list = history.changes();
        for (TestChange change : list) {
            ObjectNode node = changes.addObject();
            node.put("from_test", change.before().outcome().testOrder());
            node.put("to_test", change.after().outcome().testOrder());
            node.put("verdict_before", change.before().outcome().outcome().word());
            node.put("verdict_after", change.after().outcome().outcome().word());
            node.put("verdict_changed", change.verdictChanged());
            node.put("stage_changed", change.stageChanged());
            ArrayNode parts = node.putArray("parts");
            for (PartMove move : change.parts()) {
                ObjectNode part = parts.addObject();
                part.put("part", move.part());
                part.put("ln_factor_before", move.before());
                part.put("ln_factor_after", move.after());
                part.put("ratio", move.ratio());
                part.put("z", move.zScore());
                part.put("moved", move.moved());
            }
        }
        return root;
    }

    private static ObjectNode test(RecordedTest test) {
        BoardOutcome o = test.outcome();
        ObjectNode node = JsonNodeFactory.instance.objectNode();
        node.put("test", o.testOrder());
        node.put("tested_at", o.testedAt().toString());
        node.put("lot", o.lot());
        node.put("station", o.station());
        node.put("operator", o.operator());
        node.put("outcome", o.outcome().word());
        o.problem().ifPresent(p -> node.put("problem", p));
        node.put("sweep_file", test.sweepFile());
        node.put("sweep_sha256", test.sweepSha256());
        node.put("stage_sha256", test.stageSha256());
        node.put("polebench_version", test.toolVersion());
        putOptional(node, "midband_gain_db", o.midbandGainDb());
        putOptional(node, "midband_gain_u_db", o.midbandGainUDb());
        putOptional(node, "lower_corner_hz", o.lowerCornerHz());
        putOptional(node, "lower_corner_u_hz", o.lowerCornerUHz());
        node.put("coverage_factor", o.coverageFactor());
        node.put("explained", o.explained());
        node.put("top_hypothesis", o.topHypothesis());
        node.put("top_probability", o.topProbability());
        ArrayNode parts = node.putArray("parts");
        for (PartFactor factor : o.parts()) {
            ObjectNode part = parts.addObject();
            part.put("part", factor.part());
            part.put("ln_factor", factor.lnFactor());
            part.put("u_ln_factor", factor.uLnFactor());
            part.put("identifiable", factor.identifiable());
        }
        return node;
    }

    private static void putOptional(ObjectNode node, String key, Optional<Double> value) {
        if (value.isPresent()) {
            node.put(key, value.get());
        } else {
            node.putNull(key);
        }
    }
}

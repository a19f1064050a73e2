package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;

class LotJsonTest {
    @Test
    void theIssuesKeysCarryTheCountsTheCulpritsAndTheSystematicPart() throws Exception {
        String text = new LotJson().text(new LotJson().of(DemoLot.findings()));
        // read back by Jackson's strict parser: NaN would be refused, so none was written
        JsonNode root = new ObjectMapper().readTree(text);

        int boards = root.path("boards").asInt();
        assertEquals(DemoLot.BOARDS, boards);
        // counts by construction: one input problem; the rest pass or fail, and add up
        assertEquals(1, root.path("input_problems").asInt());
        assertEquals(boards, root.path("passed").asInt() + root.path("failed").asInt()
                + root.path("incomplete").asInt() + 1);
        assertEquals(root.path("passed").asDouble() / boards, root.path("yield").asDouble(), 1e-15);
        // issue 16's systematic entry: C2 read at ×0.68 (times the mean of the ±20 % draw) on 37
        JsonNode systematic = root.path("systematic");
        assertEquals(1, systematic.size());
        JsonNode c2 = systematic.get(0);
        assertEquals("C2", c2.path("part").asText());
        assertTrue(c2.path("boards").asInt() >= 36, c2.toString());
        assertTrue(Math.abs(c2.path("factor").asDouble() - 0.68 * Math.sqrt(0.8 * 1.2)) < 0.06, c2.toString());
        assertTrue(c2.path("u").asDouble() > 0);
        assertTrue(c2.path("statement").asText().contains("lot finding"), c2.toString());
        // the decade slip on board 12 is a single-board fault of C3, not a lot finding
        assertEquals("HP-012", root.path("single_board_faults").get(0).path("board").asText());
        assertEquals("C3", root.path("single_board_faults").get(0).path("part").asText());
        assertTrue(root.path("culprits").size() >= 1);
        // failed boards only (every sweep is explained here): board 12's decade slip on C3 first
        assertEquals("C3", root.path("culprits").get(0).path("name").asText());
        assertEquals(1.0, root.path("culprits").get(root.path("culprits").size() - 1)
                .path("cumulative_fraction").asDouble(), 1e-12);
        assertTrue(root.path("lower_corner").path("control_chart").path("rules").asText().contains("Western Electric"));
        // the demo stage has only lower-corner-max: Cpk is one-sided
        assertTrue(root.path("lower_corner").path("capability").path("one_sided").asBoolean());
        assertFalse(root.path("midband_gain").has("capability"));
        assertEquals(DemoLot.BOARDS, root.path("board_table").size());
    }
}

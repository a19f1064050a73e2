package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.fit.FitSettings;
import org.polebench.fit.SweepFitter;

class FitJsonTest {

    private static Set<String> keys(JsonNode node) {
        Set<String> names = new TreeSet<>();
        Iterator<String> it = node.fieldNames();
        it.forEachRemaining(names::add);
        return names;
    }

    // the key set is the contract of `polebench fit --json` (issue 4); values are the synthetic
    // truth of ReportFixtures, recovered to the issue's 1e-6 relative from noise-free data
    @Test
    void jsonCarriesExactlyTheIssueKeysAndTheTruth() throws Exception {
        String text = new FitJson().write(new SweepFitter(FitSettings.defaults()).fit(ReportFixtures.stage(true, 1)));
        JsonNode json = new ObjectMapper().readTree(text);
        assertEquals(new TreeSet<>(List.of("midband_gain_db", "poles_hz", "zeros_hz", "lower_corner_hz", "order",
                "residual_rms_db", "residual_rms_deg", "warnings", "midband_gain_u_db", "coverage_factor",
                "calibration")), keys(json));
        // issue 13: the calibration term's basis and figures (an in-memory sweep states none: the default)
        assertEquals(Set.of("basis", "u_gain_db", "u_phase_deg", "statement"), keys(json.get("calibration")));
        assertEquals("default", json.get("calibration").get("basis").asText());
        assertEquals(3, json.get("order").asInt());
        List<Double> poles = new ArrayList<>();
        for (JsonNode pole : json.get("poles_hz")) {
            assertEquals(Set.of("re", "im", "u"), keys(pole));
            assertEquals(0, pole.get("im").asDouble(), 0);
            poles.add(-pole.get("re").asDouble());
        }
        poles.sort(Double::compare);
        for (int i = 0; i < 3; i++) {
            assertEquals(ReportFixtures.POLES[i], poles.get(i), 1e-6 * ReportFixtures.POLES[i]);
        }
        // two structural DC zeros are exact zeros, the bypass zero is at −4.2 Hz
        List<Double> zeros = new ArrayList<>();
        json.get("zeros_hz").forEach(z -> zeros.add(z.get("re").asDouble()));
        zeros.sort(Double::compare);
        assertEquals(List.of(-ReportFixtures.Z, 0.0, 0.0).size(), zeros.size());
        assertEquals(-ReportFixtures.Z, zeros.get(0), 1e-6 * ReportFixtures.Z);
        assertEquals(0, zeros.get(1), 0);
        assertEquals(20 * Math.log10(ReportFixtures.K), json.get("midband_gain_db").asDouble(), 1e-6 * 32.5);
        assertEquals(Set.of("value", "u"), keys(json.get("lower_corner_hz")));
        assertTrue(json.get("lower_corner_hz").get("value").asDouble() > 0);
        assertTrue(json.get("warnings").isArray());
    }

    // magnitude-only: no phase residual exists, so it is null rather than a made-up 0
    @Test
    void magnitudeOnlySweepHasNullPhaseResidual() throws InputProblem {
        JsonNode json = new FitJson().toJson(new SweepFitter(FitSettings.defaults()).fit(ReportFixtures.stage(false, 1)));
        assertTrue(json.get("residual_rms_deg").isNull());
        assertTrue(json.get("warnings").size() > 0);
    }

    // a pole forced into a model but far below the band is written as nulls, never as a number
    @Test
    void unidentifiablePoleIsWrittenAsNulls() throws InputProblem {
        // sweep from 500 Hz: the 3 Hz and 16 Hz poles and the 4.2 Hz zero lie a decade and more below
        JsonNode json = new FitJson().toJson(new SweepFitter(FitSettings.defaults().withPoleCount(3).withDcZeros(2))
                .fit(ReportFixtures.stage(true, 500)));
        boolean sawNull = false;
        for (JsonNode pole : json.get("poles_hz")) {
            if (pole.get("re").isNull()) {
                sawNull = true;
                assertTrue(pole.get("im").isNull() && pole.get("u").isNull());
            } else {
                // what is quoted lies within a decade of the band
                assertTrue(Math.hypot(pole.get("re").asDouble(), pole.get("im").asDouble()) >= 50);
            }
        }
        assertTrue(sawNull);
    }
}

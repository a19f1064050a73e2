package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

/**
 * {@code polebench report} reads result.json as untrusted input (issue 14). Each case edits one
 * field of the bundled demo's result (invented demo data; it fails its 35 Hz corner limit with
 * the corner at 60 Hz) and expects a refusal naming that field's JSON path.
 */
class ResultCheckTest {
    private static Path write(Path dir, ObjectNode root) throws Exception {
        return Files.writeString(dir.resolve("result.json"), new ResultJson().text(root), StandardCharsets.UTF_8);
    }

    private static InputProblem refused(Path dir, Consumer<ObjectNode> edit) throws Exception {
        ObjectNode root = DemoResult.shared();
        edit.accept(root);
        Path file = write(dir, root);
        // bounded work: the refusal comes at once, never after the heap runs out (issue 14)
        return assertTimeoutPreemptively(Duration.ofSeconds(20),
                () -> assertThrows(InputProblem.class, () -> new ResultFile().read(file)));
    }

    @Test
    void theUneditedResultIsAccepted(@TempDir Path dir) throws Exception {
        Path file = write(dir, DemoResult.shared());
        assertEquals("fail", new ResultFile().read(file).path("verdict").path("overall").asText());
    }

    // issue 14: "nominal_farads": 0 made C/C_nom infinite and JFreeChart's log axis made ticks
    // until the JVM ran out of memory
    @Test
    void aZeroNominalCapacitanceIsRefusedByPath(@TempDir Path dir) throws Exception {
        InputProblem p = refused(dir, r -> ((ObjectNode) r.withArray("capacitors").get(0)).put("nominal_farads", 0));
        assertTrue(p.getMessage().contains("$.capacitors[0].nominal_farads is 0"), p.getMessage());
        assertTrue(p.getMessage().contains("positive"), p.getMessage());
    }

    @Test
    void aWrongTypeAMissingFieldAndAnOverflowAreRefusedByPath(@TempDir Path dir) throws Exception {
        InputProblem text = refused(dir, r -> ((ObjectNode) r.withArray("/sweep/points").get(3)).put("gain_db", "high"));
        assertTrue(text.getMessage().contains("$.sweep.points[3].gain_db is \"high\""), text.getMessage());
        InputProblem missing = refused(dir, r -> ((ObjectNode) r.path("diagnosis")).remove("statement"));
        assertTrue(missing.getMessage().contains("$.diagnosis.statement is missing"), missing.getMessage());
        // 1e999 parses to an infinite double: JSON itself has no bound, the result does
        InputProblem huge = refused(dir, r -> ((ObjectNode) r.withArray("capacitors").get(1)).put("u_ln", 1e300));
        assertTrue(huge.getMessage().contains("$.capacitors[1].u_ln"), huge.getMessage());
        InputProblem order = refused(dir, r -> ((ObjectNode) r.withArray("/sweep/points").get(5))
                .put("frequency_hz", 1e-3));
        assertTrue(order.getMessage().contains("$.sweep.points[5].frequency_hz"), order.getMessage());
    }

    // issue 14: the identification fields are optional (a result written before them is read), and
    // typed when present: a calibration due date in ISO 8601 form, a test level measured one of three ways
    @Test
    void identificationFieldsAreOptionalAndTyped(@TempDir Path dir) throws Exception {
        ObjectNode older = DemoResult.shared();
        ((ObjectNode) older.path("run")).remove(List.of("approved_by", "ambient_celsius", "supply_volts",
                "test_level_volts", "test_level_measure", "instruments"));
        assertEquals("fail", new ResultFile().read(write(dir, older)).path("verdict").path("overall").asText());

        InputProblem date = refused(dir, r -> ((ObjectNode) r.path("run")).putArray("instruments").addObject()
                .put("identity", "Generator G1").put("calibration_due", "31/03/2027"));
        assertTrue(date.getMessage().contains("$.run.instruments[0].calibration_due is \"31/03/2027\""),
                date.getMessage());
        InputProblem nameless = refused(dir, r -> ((ObjectNode) r.path("run")).putArray("instruments").addObject()
                .put("serial", "SN-1"));
        assertTrue(nameless.getMessage().contains("$.run.instruments[0].identity is missing"), nameless.getMessage());
        InputProblem measure = refused(dir, r -> ((ObjectNode) r.path("run")).put("test_level_volts", 0.1)
                .put("test_level_measure", "loud"));
        assertTrue(measure.getMessage().contains("$.run.test_level_measure"), measure.getMessage());
        InputProblem level = refused(dir, r -> ((ObjectNode) r.path("run")).put("test_level_volts", -1));
        assertTrue(level.getMessage().contains("$.run.test_level_volts is -1"), level.getMessage());
        InputProblem ambient = refused(dir, r -> ((ObjectNode) r.path("run")).put("ambient_celsius", "warm"));
        assertTrue(ambient.getMessage().contains("$.run.ambient_celsius"), ambient.getMessage());
    }

    // the verdict is decided again from the file (LimitCheck.decide, simple acceptance): the corner
    // 59.99 Hz against "at most 35 Hz" fails whatever the file says
    @Test
    void aVerdictThatDisagreesWithTheFilesOwnValuesIsRefused(@TempDir Path dir) throws Exception {
        InputProblem overall = refused(dir, r -> ((ObjectNode) r.path("verdict")).put("overall", "pass"));
        assertTrue(overall.getMessage().contains("$.verdict.overall says \"pass\" but the checks in the file give \"fail\""),
                overall.getMessage());
        InputProblem pass = refused(dir, r -> ((ObjectNode) r.withArray("/verdict/checks").get(0)).put("pass", true));
        assertTrue(pass.getMessage().contains("$.verdict.checks[0].pass says true"), pass.getMessage());
        // a value moved inside the limit with its margin moved alike: margin 35 − 30 = 5 Hz, so the
        // check passes and the stored "pass": false and "overall": "fail" no longer follow
        InputProblem moved = refused(dir, r -> ((ObjectNode) r.withArray("/verdict/checks").get(0))
                .put("value", 30.0).put("margin", 5.0));
        assertTrue(moved.getMessage().contains("$.verdict.checks[0].pass says false"), moved.getMessage());
        InputProblem rule = refused(dir, r -> ((ObjectNode) r.path("verdict")).put("rule", "lenient"));
        assertTrue(rule.getMessage().contains("$.verdict.rule"), rule.getMessage());
    }

    @Test
    void aBiggerFileThanAnyResultIsRefusedBeforeParsing(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("big.json");
        try (var out = Files.newOutputStream(file)) {
            out.write(new byte[(int) ResultFile.MAX_BYTES + 1]);
        }
        InputProblem p = assertThrows(InputProblem.class, () -> new ResultFile().read(file));
        assertTrue(p.getMessage().contains("bytes"), p.getMessage());
    }

    // SHA-256 of the files as they are (FIPS 180-4 through the JDK's MessageDigest) against the
    // digests the result recorded: the bundled files match, an edited copy does not
    @Test
    void theStageAndSweepAreCheckedAgainstTheirRecordedDigests(@TempDir Path dir) throws Exception {
        ObjectNode root = DemoResult.shared();
        Path file = write(dir, root);
        List<String> said = new ResultFile().checkInputs(file, root);
        assertTrue(said.get(0).endsWith("SHA-256 matches"), said.toString());
        assertTrue(said.get(1).endsWith("SHA-256 matches"), said.toString());

        Path copy = Files.copy(DemoResult.STAGE, dir.resolve("edited.stage.yaml"));
        Files.writeString(copy, "\n# edited\n", java.nio.file.StandardOpenOption.APPEND);
        root.put("stage_file", copy.toString());
        InputProblem p = assertThrows(InputProblem.class, () -> new ResultFile().checkInputs(file, root));
        assertTrue(p.getMessage().contains("$.stage_sha256"), p.getMessage());
        assertTrue(p.getMessage().contains("changed since the result was written"), p.getMessage());

        root.put("stage_file", dir.resolve("gone.stage.yaml").toString());
        assertTrue(new ResultFile().checkInputs(file, root).get(0).contains("not at hand"));
    }
}

package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

class TestReportWriterTest {
    private static final Instant NOW = Instant.parse("2026-03-14T09:30:00Z");

    @Test
    void writesEveryFileAndLeavesNoTemporaryFolder(@TempDir Path dir) throws Exception {
        ObjectNode root = DemoResult.shared();
        Path out = dir.resolve("board-0417");
        ReportStamp stamp = new TestReportWriter().write(root, out, false, true, NOW);
        for (String name : TestReportWriter.FILES) {
            assertTrue(Files.isRegularFile(out.resolve(name)), name);
        }
        // result.json is the --json text, and the HTML names its digest (JDK SHA-256 via FileDigest)
        assertEquals(new ResultJson().text(root), Files.readString(out.resolve("result.json")));
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains(FileDigest.sha256(Files.readAllBytes(out.resolve("result.json")))));
        assertTrue(html.contains(stamp.reportId()));
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(1, left.count(), "only the report folder remains beside it");
        }
    }

    // nothing the user has is overwritten without --force: refused, bytes untouched
    @Test
    void existingReportIsRefusedWithoutForce(@TempDir Path dir) throws Exception {
        ObjectNode root = DemoResult.shared();
        Path out = dir.resolve("r");
        new TestReportWriter().write(root, out, false, false, NOW);
        byte[] before = Files.readAllBytes(out.resolve("report.html"));
        Files.writeString(out.resolve("notes.txt"), "mine");
        InputProblem problem = assertThrows(InputProblem.class,
                () -> new TestReportWriter().write(root, out, false, false, NOW.plusSeconds(60)));
        assertTrue(problem.hint().contains("--force"));
        assertArrayEquals(before, Files.readAllBytes(out.resolve("report.html")));
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(1, left.count());
        }
        ReportStamp again = new TestReportWriter().write(root, out, true, false, NOW.plusSeconds(60));
        assertTrue(Files.readString(out.resolve("report.html")).contains(again.reportId()));
        assertEquals("mine", Files.readString(out.resolve("notes.txt")));
    }

    @Test
    void aFileInTheWayIsAnInputProblem(@TempDir Path dir) throws Exception {
        Path file = Files.writeString(dir.resolve("taken"), "x");
        assertThrows(InputProblem.class, () -> new TestReportWriter().write(DemoResult.shared(), file, true, false, NOW));
        assertEquals("x", Files.readString(file));
    }

    // polebench report reads back what reconcile wrote, and refuses other JSON naming the line
    @Test
    void resultFileReadsBackAndRefusesOthers(@TempDir Path dir) throws Exception {
        ObjectNode root = DemoResult.shared();
        Path saved = Files.writeString(dir.resolve("result.json"), new ResultJson().text(root));
        // read back and written again, the bytes are the same: a re-rendered report carries the same result.json
        assertEquals(new ResultJson().text(root), new ResultJson().text(new ResultFile().read(saved)));
        Path broken = Files.writeString(dir.resolve("broken.json"), "{\n  \"format\": \n");
        InputProblem bad = assertThrows(InputProblem.class, () -> new ResultFile().read(broken));
        assertTrue(bad.line() >= 2, "line " + bad.line());
        Path other = Files.writeString(dir.resolve("other.json"), "{\"stage\": \"x\"}");
        assertFalse(assertThrows(InputProblem.class, () -> new ResultFile().read(other)).hint().isBlank());
    }
}

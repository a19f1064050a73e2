package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A report folder is replaced whole: the user's other files survive, nothing temporary is left
 * behind, and a run killed with SIGKILL part-way leaves the old report or the new one, never a
 * mix (issue 15).
 */
class ReportReplacementTest {
    @TempDir
    static Path shared;
    @TempDir
    Path dir;

    private static Path resultA;
    private static Path resultB;

    private static int run(String... args) {
        return Main.run(args, new PrintWriter(new StringWriter(), true), new PrintWriter(new StringWriter(), true));
    }

    @BeforeAll
    static void twoDifferentResults() {
        // the demo reconcile under two seeds of its tolerance spread: two results that differ
        // (the exit code is the demo's verdict; the report is written whatever it is)
        run("reconcile", "--samples", "200", "--seed", "1", "--report", shared.resolve("a").toString());
        run("reconcile", "--samples", "200", "--seed", "2", "--report", shared.resolve("b").toString());
        resultA = shared.resolve("a").resolve("result.json");
        resultB = shared.resolve("b").resolve("result.json");
        assertTrue(Files.exists(resultA) && Files.exists(resultB), "the demo wrote both reports");
    }

    @Test
    void replacingAReportKeepsTheUsersOtherFilesAndLeavesNoTemporaryFolder() throws Exception {
        Path out = dir.resolve("report");
        run("report", resultA.toString(), "--out", out.toString(), "--png");
        assertTrue(Files.exists(out.resolve("bode.png")));
        Files.writeString(out.resolve("notes.txt"), "bench notes");
        Files.createDirectories(out.resolve("photos")).resolve("board.jpg").toFile().createNewFile();

        run("report", resultB.toString(), "--out", out.toString(), "--force");

        assertEquals(Files.readString(resultB), Files.readString(out.resolve("result.json")));
        assertEquals("bench notes", Files.readString(out.resolve("notes.txt")));
        assertTrue(Files.exists(out.resolve("photos").resolve("board.jpg")));
        // the PNG of the replaced report is gone: this one made none, and it would be stale
        assertTrue(Files.notExists(out.resolve("bode.png")));
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of("report"), left.map(p -> p.getFileName().toString()).collect(Collectors.toList()));
        }
    }

    @Test
    void aReportLeftAsideByAKilledRunIsPutBackBeforeTheNextWrite() throws Exception {
        Path out = dir.resolve("report");
        run("report", resultA.toString(), "--out", out.toString());
        // as a run killed between its two renames leaves it: the old report aside, no folder
        Files.move(out, dir.resolve(".report.polebench-old-k1ll3d"));
        int exit = run("report", resultB.toString(), "--out", out.toString());
        // the old report is back, and without --force it is kept (exit 2, bad usage)
        assertEquals(ExitCodes.BAD_INPUT, exit);
        assertEquals(Files.readString(resultA), Files.readString(out.resolve("result.json")));
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of("report"), left.map(p -> p.getFileName().toString()).collect(Collectors.toList()));
        }
    }

    @Test
    void aKilledReplacementLeavesTheOldReportOrTheNewOneWhole() throws Exception {
        Path out = dir.resolve("report");
        run("report", resultA.toString(), "--out", out.toString());
        assertWhole(out);
        String classpath = DocumentCommandsTest.runtimeClasspath().stream().map(Object::toString)
                .collect(Collectors.joining(File.pathSeparator));
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Random random = new Random(15);   // stated seed: the kill times
        for (int round = 0; round < 4; round++) {
            Path result = round % 2 == 0 ? resultB : resultA;
            Process process = new ProcessBuilder(java, "-cp", classpath, "org.polebench.cli.Main", "report",
                    result.toString(), "--out", out.toString(), "--force")
                    .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(ProcessBuilder.Redirect.DISCARD).start();
            // a kill anywhere from start-up to the end of the write
            process.waitFor(300 + random.nextInt(2500), TimeUnit.MILLISECONDS);
            process.destroyForcibly();   // SIGKILL on Linux: no shutdown hook, no finally block runs
            process.waitFor(30, TimeUnit.SECONDS);
            assertWhole(out);
        }
    }

    /** One report: result.json is A's or B's, and the HTML beside it cites that file's SHA-256. */
    private static void assertWhole(Path out) throws Exception {
        String result = Files.readString(out.resolve("result.json"));
        assertTrue(result.equals(Files.readString(resultA)) || result.equals(Files.readString(resultB)),
                "result.json is neither report's");
        String digest = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(Files.readAllBytes(out.resolve("result.json"))));
        assertTrue(Files.readString(out.resolve("report.html")).contains(digest),
                "report.html does not cite the result.json beside it");
        Path sameRun = result.equals(Files.readString(resultA)) ? resultA.getParent() : resultB.getParent();
        assertEquals(Files.readString(sameRun.resolve("capacitors.csv")), Files.readString(out.resolve("capacitors.csv")));
    }
}

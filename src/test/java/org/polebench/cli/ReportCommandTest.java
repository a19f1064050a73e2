package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReportCommandTest {
    private static final Pattern ID = Pattern.compile("PB-\\d{8}-[0-9A-F]{8}");
    private static final Pattern ISSUED = Pattern.compile("issued (<time id=\"date-of-issue\">)?\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ");

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    // the demo board (C2 fitted as 220 nF, its sweep's notes) fails its 35 Hz corner limit: exit 1,
    // with the report written; again without --force: exit 2 and nothing touched
    @Test
    void reconcileWritesAReportAndRefusesToOverwriteIt(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("board-0417");
        String[] first = run("reconcile", "--samples", "100", "--operator", "A. Tester", "--report", out.toString());
        assertEquals("1", first[0], first[2]);
        assertTrue(first[1].contains("written to"));
        for (String name : new String[]{"report.html", "result.json", "capacitors.csv", "bode.svg",
            "capacitor-shares.svg", "capacitors.svg"}) {
            assertTrue(Files.isRegularFile(out.resolve(name)), name);
        }
        byte[] html = Files.readAllBytes(out.resolve("report.html"));
        String[] again = run("reconcile", "--samples", "100", "--report", out.toString());
        assertEquals("2", again[0]);
        assertTrue(again[2].contains("--force"), again[2]);
        assertArrayEquals(html, Files.readAllBytes(out.resolve("report.html")));
        assertEquals("1", run("reconcile", "--samples", "100", "--report", out.toString(), "--force")[0]);
    }

    // --json prints exactly the report's result.json; polebench report re-renders it to the same
    // page apart from the report id and the date of issue
    @Test
    void reportCommandReRendersTheSamePage(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("a");
        String[] json = run("reconcile", "--samples", "100", "--json", "--report", out.toString());
        assertEquals("1", json[0], json[2]);
        assertEquals(Files.readString(out.resolve("result.json")), json[1]);
        Path again = dir.resolve("b");
        String[] report = run("report", out.resolve("result.json").toString(), "--out", again.toString());
        assertEquals("0", report[0], report[2]);
        assertArrayEquals(Files.readAllBytes(out.resolve("result.json")), Files.readAllBytes(again.resolve("result.json")));
        assertEquals(neutral(Files.readString(out.resolve("report.html"))),
                neutral(Files.readString(again.resolve("report.html"))));
        assertArrayEquals(Files.readAllBytes(out.resolve("bode.svg")), Files.readAllBytes(again.resolve("bode.svg")));
    }

    // issue 11: an incomplete verdict stays incomplete when the saved result is rendered again;
    // the report command's own exit code says only that the report was written
    @Test
    void anIncompleteVerdictIsRenderedAgainAsIncomplete(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("hp12");
        String[] first = run("reconcile", "--stage", "sample-measurements/hydrophone-preamp-ce.stage.yaml", "--sweep",
                "sample-measurements/boards/hp12-healthy.sweep.csv", "--samples", "100", "--report", out.toString());
        assertEquals("4", first[0], first[2]);
        Path again = dir.resolve("again");
        String[] report = run("report", out.resolve("result.json").toString(), "--out", again.toString());
        assertEquals("0", report[0], report[2]);
        for (Path folder : new Path[]{out, again}) {
            String html = Files.readString(folder.resolve("report.html"));
            assertTrue(html.contains("<b id=\"verdict-overall\">INCOMPLETE</b>"), folder.toString());
            assertTrue(html.contains("Upper corner limit not decided"), folder.toString());
            assertTrue(html.contains("<b>not decided</b>"), folder.toString());
        }
    }

    // a result of format version 1 does not say which limits the sweep decided: refused, with
    // what to do instead
    @Test
    void aVersionOneResultIsRefusedWithAHint(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("a");
        assertEquals("1", run("reconcile", "--samples", "100", "--report", out.toString())[0]);
        String text = Files.readString(out.resolve("result.json"));
        assertTrue(text.contains("\"format_version\" : 2"), text.substring(0, 200));
        Path old = Files.writeString(dir.resolve("old.json"), text.replace("\"format_version\" : 2",
                "\"format_version\" : 1"));
        String[] run = run("report", old.toString(), "--out", dir.resolve("b").toString());
        assertEquals("2", run[0]);
        assertTrue(run[2].contains("which limits the sweep decided"), run[2]);
        assertTrue(run[2].contains("re-run polebench reconcile"), run[2]);
    }

    @Test
    void reportRefusesAFileThatIsNotAResult(@TempDir Path dir) throws Exception {
        Path bad = Files.writeString(dir.resolve("x.json"), "{\n  \"stage\": [1, 2\n");
        String[] run = run("report", bad.toString(), "--out", dir.resolve("out").toString());
        assertEquals("2", run[0]);
        assertTrue(run[2].contains("x.json"), run[2]);
        assertTrue(!Files.exists(dir.resolve("out")));
    }

    private static String neutral(String html) {
        Matcher id = ID.matcher(html);
        String text = id.replaceAll("PB-ID");
        return ISSUED.matcher(text).replaceAll("issued DATE").replaceAll(
                "Date of issue \\(UTC\\)</th><td>[^<]*<", "Date of issue (UTC)</th><td>DATE<");
    }
}

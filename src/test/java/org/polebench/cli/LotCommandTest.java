package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.report.LotReportWriter;

/**
 * {@code polebench lot} on the bundled invented lot (sample-measurements/lot-saltmarsh-run3,
 * demo data): its 40 sweeps are recorded by {@code batch} against the design, then the lot is
 * read back from the ledger. The truth is how make-lot.sh built the boards, not anything the
 * lot analysis computes: C2 is 4.7 µF for 10 µF on boards 1 to 36 (a factor 0.47 before each
 * board's tolerance draw), boards 9 and 17 have C3 too small and 38 has C1 a decade low (each
 * moves the lower corner past its 40 Hz limit), and board 33's file is cut short.
 */
class LotCommandTest {
    private static final String DESIGN = "sample-measurements/hydrophone-preamp-ce.stage.yaml";
    private static final String SWEEPS = "sample-measurements/lot-saltmarsh-run3/sweeps";
    private static final String LOT = "saltmarsh-run3";

    @TempDir
    static Path folder;

    private static String ledger() {
        return folder.resolve("ledger.db").toString();
    }

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    @BeforeAll
    static void recordTheLot() {
        String[] batch = run("batch", "--stage", DESIGN, "--ledger", ledger(), "--lot", LOT, "--station", "saltmarsh-1",
                SWEEPS);
        // three boards fail their corner limit: exit 1
        assertEquals("1", batch[0], batch[1] + batch[2]);
    }

    @Test
    void theLotNamesTheWrongReelAsASystematicShiftAndCountsTheBoards() throws Exception {
        String[] lot = run("lot", "--ledger", ledger(), "--lot", LOT, "--json");
        assertEquals("0", lot[0], lot[2]);
        JsonNode root = new ObjectMapper().readTree(lot[1]);
        assertEquals(40, root.get("boards").asInt());
        assertEquals(3, root.get("failed").asInt(), lot[1]);
        assertEquals(1, root.get("input_problems").asInt());
        assertEquals(36, root.get("passed").asInt());
        JsonNode c2 = null;
        for (JsonNode s : root.get("systematic")) {
            if (s.get("part").asText().equals("C2")) {
                c2 = s;
            }
        }
        assertTrue(c2 != null, "C2 is not among the systematic shifts: " + root.get("systematic"));
        // 4.7 µF / 10 µF, times a mean tolerance draw within ±20 % that averages near 1
        assertEquals(0.47, c2.get("factor").asDouble(), 0.04, c2.toString());
        assertTrue(c2.get("boards").asInt() >= 30 && c2.get("boards").asInt() <= 36, c2.toString());
        List<String> culprits = new ArrayList<>();
        root.get("culprits").forEach(k -> culprits.add(k.get("name").asText()));
        assertTrue(culprits.stream().anyMatch(name -> name.contains("C3")), culprits.toString());
    }

    @Test
    void theTextSaysTheSameAndTheReportFolderIsWrittenAndNotOverwrittenWithoutForce() throws Exception {
        Path report = folder.resolve("lot-report");
        String[] text = run("lot", "--ledger", ledger(), "--lot", LOT, "--report", report.toString());
        assertEquals("0", text[0], text[2]);
        assertTrue(text[1].contains("C2"), text[1]);
        for (String name : List.of(LotReportWriter.HTML, LotReportWriter.JSON, LotReportWriter.CSV)) {
            assertTrue(Files.size(report.resolve(name)) > 0, name);
        }
        byte[] before = Files.readAllBytes(report.resolve(LotReportWriter.JSON));
        String[] again = run("lot", "--ledger", ledger(), "--lot", LOT, "--report", report.toString());
        assertEquals("2", again[0]);
        assertTrue(again[2].contains("--force"), again[2]);
        assertEquals(new String(before), Files.readString(report.resolve(LotReportWriter.JSON)));
        // with --force the folder is replaced whole, and a file of the user's in it is kept
        Files.writeString(report.resolve("notes.txt"), "the reel was changed after board 36");
        assertEquals("0", run("lot", "--ledger", ledger(), "--lot", LOT, "--report", report.toString(), "--force")[0]);
        assertEquals("the reel was changed after board 36", Files.readString(report.resolve("notes.txt")));
    }

    @Test
    void aLotTheLedgerDoesNotHoldIsAnInputProblemNamingIt() {
        String[] none = run("lot", "--ledger", ledger(), "--lot", "no-such-lot");
        assertEquals("2", none[0]);
        assertTrue(none[2].contains("no-such-lot"), none[2]);
        String[] noLedger = run("lot", "--ledger", folder.resolve("missing.db").toString(), "--lot", LOT);
        assertEquals("2", noLedger[0]);
        assertTrue(noLedger[2].contains("missing.db"), noLedger[2]);
    }
}

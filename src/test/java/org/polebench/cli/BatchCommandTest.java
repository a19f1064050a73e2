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
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.ledger.Ledger;
import org.polebench.ledger.LedgerLocation;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;

/**
 * {@code polebench batch} and {@code polebench history} on boards the synthesizer makes with
 * known faults (invented demo data): the Ostrova geophone stage's healthy boards pass, and a
 * decade-slipped C2 fails its 35 Hz corner limit (the demo board of ReconcileCommandTest); the
 * Brackwater hydrophone stage's healthy boards are incomplete, since a default sweep never
 * reaches the 50 kHz upper corner its limits name.
 */
class BatchCommandTest {
    private static final String GEOPHONE = "sample-measurements/geophone-two-stage.stage.yaml";
    private static final String HYDROPHONE = "sample-measurements/hydrophone-preamp-ce.stage.yaml";

    @TempDir
    Path folder;

    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(code), out.toString(), err.toString()};
    }

    private Path synthesize(String stage, Path file, long seed, String... faults) throws Exception {
        Files.createDirectories(file.getParent());
        List<String> args = new ArrayList<>(List.of("synthesize", "--stage", stage, "--seed", Long.toString(seed),
                "--out", file.toString()));
        for (String fault : faults) {
            args.add("--fault");
            args.add(fault);
        }
        String[] made = run(args.toArray(String[]::new));
        assertEquals("0", made[0], made[2]);
        return file;
    }

    private String ledger() {
        return folder.resolve("ledger.db").toString();
    }

    private List<BoardOutcome> lot(String name) throws Exception {
        try (Ledger ledger = Ledger.open(LedgerLocation.parse(Optional.of(ledger()), Map.of()))) {
            return ledger.lot(name);
        }
    }

    @Test
    void aFailedBoardFailsTheBatchAndABadFileIsRecordedAsAnInputProblem() throws Exception {
        Path sweeps = folder.resolve("sweeps");
        synthesize(GEOPHONE, sweeps.resolve("gf-001.sweep.csv"), 1);
        synthesize(GEOPHONE, sweeps.resolve("gf-002.sweep.csv"), 2, "C2=220n");
        Files.writeString(sweeps.resolve("gf-003.csv"), "this is no sweep\n");
        String[] batch = run("batch", "--stage", GEOPHONE, "--ledger", ledger(), "--lot", "W49", "--station", "s2",
                sweeps.toString());
        // one board failed: exit 1, whatever else the batch met
        assertEquals("1", batch[0], batch[2]);
        assertTrue(batch[1].contains("pass 1  fail 1  incomplete 0  input problem 1"), batch[1]);
        List<BoardOutcome> lot = lot("W49");
        assertEquals(3, lot.size());
        BoardOutcome bad = lot.stream().filter(o -> o.boardId().equals("gf-003")).findFirst().orElseThrow();
        assertEquals(Outcome.INPUT_PROBLEM, bad.outcome());
        assertTrue(bad.problem().orElseThrow().contains("gf-003.csv"), bad.problem().toString());
        BoardOutcome failed = lot.stream().filter(o -> o.boardId().equals("gf-002")).findFirst().orElseThrow();
        assertEquals(Outcome.FAIL, failed.outcome());
        assertEquals("s2", failed.station());
        // the synthesizer fitted C2 at a tenth of its 2.2 µF: the top hypothesis names it, and its
        // back-solved factor is 0.1 within 5 % (issue 5's accuracy target)
        assertEquals("C2", failed.topHypothesis());
        BoardOutcome.PartFactor c2 = failed.parts().stream().filter(p -> p.part().equals("C2")).findFirst()
                .orElseThrow();
        assertEquals(0.1, Math.exp(c2.lnFactor()), 0.005);

        // run again: nothing is added, and the recorded outcomes still decide the exit code
        String[] again = run("batch", "--stage", GEOPHONE, "--ledger", ledger(), "--lot", "W49", sweeps.toString());
        assertEquals("1", again[0], again[2]);
        assertTrue(again[1].contains("3 boards were already in the ledger"), again[1]);
        assertEquals(3, lot("W49").size());
    }

    @Test
    void anInputProblemAnOptionCausedGivesWayToTheTestOnceTheOptionIsRight() throws Exception {
        Path sweeps = folder.resolve("layout");
        Files.createDirectories(sweeps);
        String[] made = run("synthesize", "--stage", GEOPHONE, "--seed", "5", "--layout", "two-channel-rms", "--out",
                sweeps.resolve("gf-020.txt").toString());
        assertEquals("0", made[0], made[2]);
        // read with the wrong layout: an input problem, recorded
        String[] wrong = run("batch", "--stage", GEOPHONE, "--ledger", ledger(), "--lot", "L", "--profile",
                "canonical", sweeps.toString());
        assertEquals("2", wrong[0], wrong[2]);
        assertEquals(Outcome.INPUT_PROBLEM, lot("L").get(0).outcome());
        // the same file with its layout recognised: the healthy board's test replaces the problem
        String[] right = run("batch", "--stage", GEOPHONE, "--ledger", ledger(), "--lot", "L", sweeps.toString());
        assertEquals("0", right[0], right[2]);
        List<BoardOutcome> lot = lot("L");
        assertEquals(1, lot.size());
        assertEquals(Outcome.PASS, lot.get(0).outcome());
        // a profile that does not exist stops the batch before any board
        assertEquals("2", run("batch", "--stage", GEOPHONE, "--ledger", ledger(), "--profile", "no-such-layout",
                sweeps.toString())[0]);
        assertEquals(1, lot("L").size());
    }

    @Test
    void exitCodesFollowTheWorstOutcome() throws Exception {
        Path passing = synthesize(GEOPHONE, folder.resolve("pass").resolve("gf-010.csv"), 10);
        assertEquals("0", run("batch", "--stage", GEOPHONE, "--ledger", ledger(), passing.toString())[0]);
        Path incomplete = synthesize(HYDROPHONE, folder.resolve("inc").resolve("hp-010.csv"), 10);
        String[] four = run("batch", "--stage", HYDROPHONE, "--ledger", ledger(), incomplete.toString());
        assertEquals("4", four[0], four[2]);
        // the lot is named after the stage file when --lot is not given
        assertEquals(1, lot("hydrophone-preamp-ce").size());
        Path bad = Files.writeString(folder.resolve("bad.csv"), "frequency_hz,gain_db\n10,oops\n");
        assertEquals("2", run("batch", "--stage", HYDROPHONE, "--ledger", ledger(), bad.toString())[0]);
        String[] noStage = run("batch", "--stage", folder.resolve("missing.stage.yaml").toString(), "--ledger",
                ledger(), passing.toString());
        assertEquals("2", noStage[0], noStage[2]);
        String[] credentials = run("batch", "--stage", GEOPHONE, "--ledger",
                "jdbc:postgresql://localhost/db?user=a&password=b", passing.toString());
        assertEquals("2", credentials[0]);
        assertTrue(credentials[2].contains("PGPASSWORD"), credentials[2]);
    }

    @Test
    void historyShowsWhatChangedBetweenTests() throws Exception {
        // the same board measured before and after rework: a decade-slipped C2, then the right part
        synthesize(GEOPHONE, folder.resolve("before").resolve("gf-0417.csv"), 2, "C2=220n");
        synthesize(GEOPHONE, folder.resolve("after").resolve("gf-0417.csv"), 4);
        assertEquals("1", run("batch", "--stage", GEOPHONE, "--ledger", ledger(),
                folder.resolve("before").toString())[0]);
        assertEquals("0", run("batch", "--stage", GEOPHONE, "--ledger", ledger(),
                folder.resolve("after").toString())[0]);
        String[] text = run("history", "--ledger", ledger(), "--board", "gf-0417");
        assertEquals("0", text[0], text[2]);
        assertTrue(text[1].contains("Board gf-0417: 2 tests"), text[1]);
        assertTrue(text[1].contains("verdict fail → pass"), text[1]);
        assertTrue(text[1].contains("C2 moved ×"), text[1]);
        String[] json = run("history", "--ledger", ledger(), "--board", "gf-0417", "--json");
        assertEquals("0", json[0], json[2]);
        JsonNode change = new ObjectMapper().readTree(json[1]).get("changes").get(0);
        assertTrue(change.get("verdict_changed").asBoolean());
        JsonNode c2 = change.get("parts").get(0);
        // the largest move first: C2, from a tenth of nominal back to nominal, ×10 within 5 %
        // (each back-solve within issue 5's 5 % of the synthesizer's truth, 0.22 µF and 2.2 µF)
        assertEquals("C2", c2.get("part").asText());
        assertEquals(10, c2.get("ratio").asDouble(), 0.5);
        assertTrue(c2.get("moved").asBoolean());

        String[] unknown = run("history", "--ledger", ledger(), "--board", "no-such-board");
        assertEquals("2", unknown[0]);
        String[] noLedger = run("history", "--ledger", folder.resolve("none.db").toString(), "--board", "x");
        assertEquals("2", noLedger[0]);
        assertTrue(!Files.exists(folder.resolve("none.db")), "history must not create a ledger");
    }

    @Test
    void aSubFolderOfScopeRecordsIsOneBoard() throws Exception {
        // the bundled scope records of HP-12 board 31 (invented demo data, C2 fitted as 1 µF for
        // 10 µF: sample-measurements/waveforms/README.md) beside one board's sweep file
        Path sweeps = folder.resolve("run");
        Path records = sweeps.resolve("hp12-board-31");
        Files.createDirectories(records);
        try (var listing = Files.list(Path.of("sample-measurements/waveforms/hp12-board-31"))) {
            for (Path file : listing.toList()) {
                Files.copy(file, records.resolve(file.getFileName().toString()));
            }
        }
        synthesize(HYDROPHONE, sweeps.resolve("hp12-board-32.csv"), 32);
        String[] batch = run("batch", "--stage", HYDROPHONE, "--ledger", ledger(), "--lot", "scope", sweeps.toString());
        assertTrue(batch[2].contains("batch: 2 sweeps"), batch[2]);
        List<BoardOutcome> lot = lot("scope");
        assertEquals(2, lot.size(), lot.toString());
        BoardOutcome board31 = lot.stream().filter(b -> b.boardId().equals("hp12-board-31")).findFirst().orElseThrow();
        // the truth the records were made with: C2
        assertEquals("C2", board31.topHypothesis(), board31.toString());
        // run again: the folder is the same sweep, so nothing is added
        run("batch", "--stage", HYDROPHONE, "--ledger", ledger(), "--lot", "scope", sweeps.toString());
        assertEquals(2, lot("scope").size());
        // a record changed makes a new test of that board
        Path first;
        try (var listing = Files.list(records)) {
            first = listing.sorted().findFirst().orElseThrow();
        }
        Files.writeString(first, Files.readString(first) + "\n");
        run("batch", "--stage", HYDROPHONE, "--ledger", ledger(), "--lot", "scope", sweeps.toString());
        assertEquals(3, lot("scope").size());
    }
}

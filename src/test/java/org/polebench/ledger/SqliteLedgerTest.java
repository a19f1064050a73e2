package org.polebench.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Instant;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;

/** The ledger in an SQLite file, through the real xerial driver. */
class SqliteLedgerTest {
    @TempDir
    Path folder;

    private LedgerLocation location() throws Exception {
        return LedgerLocation.parse(Optional.of(folder.resolve("ledger.db").toString()), Map.of());
    }

    @Test
    void flywayCreatesTheSchemaInWalMode() throws Exception {
        try (Ledger ledger = Ledger.open(location())) {
            assertEquals(0, ledger.size());
        }
        try (Connection plain = DriverManager.getConnection("jdbc:sqlite:" + folder.resolve("ledger.db"));
             Statement statement = plain.createStatement()) {
            // Flyway's own history table holds the one migration, applied successfully
            try (ResultSet rows = statement.executeQuery(
                    "SELECT version, success FROM flyway_schema_history WHERE version IS NOT NULL")) {
                assertTrue(rows.next());
                assertEquals(Ledger.SCHEMA_VERSION, rows.getString(1));
                assertTrue(rows.getBoolean(2));
            }
            // WAL mode persists in the file (SQLite documentation, "Write-Ahead Logging", 3.3)
            try (ResultSet rows = statement.executeQuery("PRAGMA journal_mode")) {
                rows.next();
                assertEquals("wal", rows.getString(1));
            }
            for (String table : List.of("board_test", "part_factor", "stage_file")) {
                try (ResultSet rows = statement.executeQuery(
                        "SELECT COUNT(*) FROM sqlite_master WHERE type = 'table' AND name = '" + table + "'")) {
                    rows.next();
                    assertEquals(1, rows.getInt(1), table);
                }
            }
        }
    }

    @Test
    void theSameSweepOfTheSameStageIsRecordedOnce() throws Exception {
        Instant at = Instant.parse("2026-12-01T08:00:00Z");
        try (Ledger ledger = Ledger.open(location())) {
            assertEquals(Recording.RECORDED,
                    ledger.record(LedgerSamples.test("b1", "L", "s1", Outcome.PASS, 0.0, at)));
            // the same sweep again, later, from another station: the same test (issue 16)
            assertEquals(Recording.ALREADY_RECORDED,
                    ledger.record(LedgerSamples.test("b1", "L", "s1", Outcome.PASS, 0.0, at.plusSeconds(60))));
            // a new sweep of the same board is a new test
            assertEquals(Recording.RECORDED,
                    ledger.record(LedgerSamples.test("b1", "L", "s2", Outcome.FAIL, -0.4, at.plusSeconds(120))));
            assertEquals(2, ledger.size());
            assertEquals(Optional.of(new Ledger.Held("b1", Outcome.FAIL)),
                    ledger.recorded(LedgerSamples.STAGE_SHA, LedgerSamples.sweepSha("s2")));
        }
        // what was committed is there after the ledger is opened again
        try (Ledger again = Ledger.open(location())) {
            assertEquals(2, again.size());
        }
    }

    @Test
    void aLotReadsBackInTestOrderWithEveryFigureAndPart() throws Exception {
        Instant at = Instant.parse("2026-12-01T08:00:00.125Z");
        try (Ledger ledger = Ledger.open(location())) {
            ledger.record(LedgerSamples.test("b2", "L", "s2", Outcome.FAIL, Math.log(0.68), at.plusSeconds(5)));
            ledger.record(LedgerSamples.test("b1", "L", "s1", Outcome.PASS, 0.01, at));
            ledger.record(LedgerSamples.test("x9", "other", "s3", Outcome.PASS, 0.0, at));
            List<BoardOutcome> lot = ledger.lot("L");
            assertEquals(List.of("b2", "b1"), lot.stream().map(BoardOutcome::boardId).toList());
            assertTrue(lot.get(0).testOrder() < lot.get(1).testOrder());
            BoardOutcome first = lot.get(0);
            // the values written by LedgerSamples, read back unchanged: a double survives the
            // database exactly (IEEE 754 binary64 in both), the time to the millisecond
            assertEquals(Outcome.FAIL, first.outcome());
            assertEquals(at.plusSeconds(5), first.testedAt());
            assertEquals(Optional.of(40.0), first.midbandGainDb());
            assertEquals(Optional.of(12.5), first.lowerCornerHz());
            assertEquals(Optional.of(0.4), first.lowerCornerUHz());
            assertEquals("station-1", first.station());
            assertEquals(3, first.parts().size());
            assertEquals("C2", first.parts().get(0).part());
            assertEquals(Math.log(0.68), first.parts().get(0).lnFactor(), 0.0);
            // a NaN (a part the sweep does not determine) is kept as NULL and comes back as NaN
            assertTrue(Double.isNaN(first.parts().get(2).lnFactor()));
            assertEquals(Optional.of(LedgerSamples.STAGE_TEXT), ledger.stageTextOfLot("L"));
            assertEquals(Optional.empty(), ledger.stageTextOfLot("no such lot"));
        }
    }

    @Test
    void fourProcessesRecordEveryBoardExactlyOnce() throws Exception {
        String file = folder.resolve("shared.db").toString();
        List<Integer> recorded = WriterProcesses.run(file, Map.of(), 4, 250);
        // each board recorded by exactly one of the four: the counts add up to the boards
        assertEquals(250, recorded.stream().mapToInt(Integer::intValue).sum(), recorded.toString());
        try (Ledger ledger = Ledger.open(LedgerLocation.parse(Optional.of(file), Map.of()))) {
            List<BoardOutcome> lot = ledger.lot("concurrent");
            assertEquals(250, lot.size());
            Set<String> boards = new HashSet<>();
            lot.forEach(o -> boards.add(o.boardId()));
            assertEquals(250, boards.size());
        }
    }
}

package org.polebench.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Instant;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;

/**
 * The ledger in PostgreSQL, through the real driver and a real server: a throwaway cluster this
 * test starts itself ({@link ThrowawayPostgres}), rather than an embedded-server artifact, so
 * that the server is the distribution's own, as a test line runs it. One cluster serves the
 * class; the tests run in order, each in a lot of its own.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class PostgresLedgerTest {
    private ThrowawayPostgres server;

    @BeforeAll
    void start() throws Exception {
        server = ThrowawayPostgres.start();
    }

    @AfterAll
    void stop() throws Exception {
        if (server != null) {
            server.close();
        }
    }

    private LedgerLocation location() throws Exception {
        return LedgerLocation.parse(Optional.of(server.url()), server.environment());
    }

    @Test
    @Order(1)
    void flywayCreatesTheSchema() throws Exception {
        try (Ledger ledger = Ledger.open(location())) {
            assertEquals(0, ledger.size());
        }
        try (Connection plain = server.connect(); Statement statement = plain.createStatement()) {
            try (ResultSet rows = statement.executeQuery(
                    "SELECT version, success FROM flyway_schema_history WHERE version IS NOT NULL")) {
                assertTrue(rows.next());
                assertEquals(Ledger.SCHEMA_VERSION, rows.getString(1));
                assertTrue(rows.getBoolean(2));
            }
            // the three tables of the one migration, as PostgreSQL's catalogue lists them
            try (ResultSet rows = statement.executeQuery("SELECT COUNT(*) FROM information_schema.tables WHERE "
                    + "table_name IN ('board_test', 'part_factor', 'stage_file')")) {
                rows.next();
                assertEquals(3, rows.getInt(1));
            }
        }
    }

    @Test
    @Order(2)
    void theSameSweepIsRecordedOnceAndReadsBack() throws Exception {
        Instant at = Instant.parse("2026-12-01T09:30:00.250Z");
        try (Ledger ledger = Ledger.open(location())) {
            assertEquals(Recording.RECORDED,
                    ledger.record(LedgerSamples.test("p1", "pg", "p1-a", Outcome.FAIL, Math.log(0.68), at)));
            assertEquals(Recording.ALREADY_RECORDED,
                    ledger.record(LedgerSamples.test("p1", "pg", "p1-a", Outcome.FAIL, Math.log(0.68), at)));
            assertEquals(Recording.RECORDED,
                    ledger.record(LedgerSamples.test("p1", "pg", "p1-b", Outcome.PASS, 0.0, at.plusSeconds(600))));
            List<RecordedTest> history = ledger.history("p1");
            assertEquals(2, history.size());
            BoardOutcome first = history.get(0).outcome();
            // the values LedgerSamples wrote, read back exactly (binary64 both ways)
            assertEquals(at, first.testedAt());
            assertEquals(Math.log(0.68), first.parts().get(0).lnFactor(), 0.0);
            assertTrue(Double.isNaN(first.parts().get(2).lnFactor()));
            assertEquals(Outcome.PASS, history.get(1).outcome().outcome());
            assertEquals(Optional.of(LedgerSamples.STAGE_TEXT), ledger.stageTextOfLot("pg"));
        }
    }

    @Test
    @Order(3)
    void aWrongPasswordIsRefusedAsAnIoFault() throws Exception {
        LedgerLocation wrong = LedgerLocation.parse(Optional.of(server.url()),
                Map.of("PGUSER", ThrowawayPostgres.USER, "PGPASSWORD", "not-the-password"));
        IOException refused = assertThrows(IOException.class, () -> Ledger.open(wrong));
        // the message names the ledger and never the password
        assertTrue(refused.getMessage().contains(server.url()), refused.getMessage());
        assertTrue(!refused.getMessage().contains("not-the-password"), refused.getMessage());
    }

    @Test
    @Order(4)
    void thePasswordMayComeFromAPasswordFile(@TempDir Path home) throws Exception {
        // the .pgpass format (PostgreSQL documentation, "The Password File"):
        // hostname:port:database:username:password, in a file only its owner may read
        // a new database, so that Flyway too (creating the schema) connects with that password
        try (Connection plain = server.connect(); Statement statement = plain.createStatement()) {
            statement.execute("CREATE DATABASE fresh");
        }
        String fresh = server.url().replace("/" + ThrowawayPostgres.DATABASE, "/fresh");
        Path passwordFile = home.resolve("pgpass");
        Files.writeString(passwordFile, "127.0.0.1:" + fresh.replaceAll(".*:(\\d+)/.*", "$1") + ":fresh:"
                + ThrowawayPostgres.USER + ":" + ThrowawayPostgres.PASSWORD + "\n");
        Files.setPosixFilePermissions(passwordFile, PosixFilePermissions.fromString("rw-------"));
        List<Integer> recorded = WriterProcesses.run(fresh,
                Map.of("PGUSER", ThrowawayPostgres.USER, "PGPASSFILE", passwordFile.toString()), 1, 3, "pgpass");
        assertEquals(List.of(3), recorded);
    }

    @Test
    @Order(5)
    void fourProcessesRecordEveryBoardExactlyOnce() throws Exception {
        List<Integer> recorded = WriterProcesses.run(server.url(), server.environment(), 4, 250);
        assertEquals(250, recorded.stream().mapToInt(Integer::intValue).sum(), recorded.toString());
        try (Ledger ledger = Ledger.open(location())) {
            List<BoardOutcome> lot = ledger.lot("concurrent");
            assertEquals(250, lot.size());
            Set<String> boards = new HashSet<>();
            lot.forEach(o -> boards.add(o.boardId()));
            assertEquals(250, boards.size());
        }
    }
}

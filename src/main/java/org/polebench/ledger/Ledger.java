package org.polebench.ledger;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Types;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Properties;
import org.flywaydb.core.Flyway;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/**
 * The results ledger (issue 16): an SQLite file or a PostgreSQL database holding every board's
 * test, each written in one transaction, with one schema that Flyway migrations create and
 * version on both ({@code src/main/resources/db/ledger}). The same sweep of the same stage is one
 * test: the table's unique key on the two files' SHA-256 makes a second recording of it, by a
 * later run or by another process at the same moment, add nothing ({@code INSERT … ON CONFLICT
 * DO NOTHING}, which both databases understand).
 *
 * <p>SQLite is opened in write-ahead-log mode with a busy timeout, and every write transaction
 * starts {@code IMMEDIATE}, so several processes on one file wait their turn for the single
 * writer instead of failing (SQLite's documentation, "Write-Ahead Logging" and "File Locking And
 * Concurrency In SQLite Version 3"). PostgreSQL runs plain READ COMMITTED transactions; a
 * unique-key race there ends in the conflict clause, or at worst in SQLSTATE 23505, read as
 * "already recorded".
 *
 * <p>One instance holds one connection; its methods are synchronized, so the batch's workers
 * share it. Flyway is loaded only when the schema is missing or older than this build's, and only
 * by commands that open a ledger.
 */
public final class Ledger implements AutoCloseable {
    /** The schema version this build writes: the newest migration's. */
    static final String SCHEMA_VERSION = "1";
    /** How long an SQLite writer waits for another process's transaction, in milliseconds. */
    static final int BUSY_TIMEOUT_MS = 60_000;
    private static final String UNIQUE_VIOLATION = "23505";
    private static final DateTimeFormatter TIME = DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSX", Locale.ROOT)
            .withZone(ZoneOffset.UTC);
    private static final String COLUMNS = "test_id, board_id, lot_name, station, operator_name, tested_at, outcome, "
            + "midband_gain_db, midband_gain_u_db, lower_corner_hz, lower_corner_u_hz, coverage_factor, explained, "
            + "top_hypothesis, top_probability, problem, tool_version, stage_sha256, sweep_sha256, sweep_file";

    private final LedgerLocation location;
    private final Connection connection;

    private Ledger(LedgerLocation location, Connection connection) {
        this.location = location;
        this.connection = connection;
    }

    /**
     * Opens the ledger, creating it or bringing its schema up to date first.
     *
     * @throws IOException when the database cannot be reached, refuses the user, or its schema
     *                     cannot be migrated; the message names the ledger
     */
    public static Ledger open(LedgerLocation location) throws IOException {
        try {
            if (location.kind() == LedgerLocation.Kind.SQLITE) {
                Path file = location.file().orElseThrow().toAbsolutePath();
                Path folder = file.getParent();
                if (folder != null && !Files.isDirectory(folder)) {
                    throw new IOException("ledger " + location + ": the folder " + folder + " does not exist");
                }
            }
            Connection connection = connect(location);
            try {
                if (!schemaCurrent(connection)) {
                    migrate(location, connection);
                }
                return new Ledger(location, connection);
            } catch (SQLException | IOException | RuntimeException e) {
                connection.close();
                throw e;
            }
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    /** @return where this ledger lives */
    public LedgerLocation location() {
        return location;
    }

    /**
     * Records one test in one transaction: its stage text (once per stage), its row and its part
     * factors.
     *
     * @return {@link Recording#ALREADY_RECORDED} when the ledger already holds this sweep of this
     *         stage; a held input problem is replaced by a test that reconciled
     * @throws IOException when the database fails
     */
    public synchronized Recording record(TestRecord test) throws IOException {
        try {
            // reads run in autocommit mode; only a recording is a transaction, so that an SQLite
            // connection holds the write lock only while it writes (the driver begins the
            // transaction when autocommit is turned off)
            connection.setAutoCommit(false);
            try {
                Recording done = insert(test);
                connection.commit();
                return done;
            } catch (SQLException e) {
                connection.rollback();
                if (UNIQUE_VIOLATION.equals(e.getSQLState())) {
                    return Recording.ALREADY_RECORDED;
                }
                throw e;
            } finally {
                connection.setAutoCommit(true);
            }
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    /**
     * A test the ledger holds, as a batch run again counts it.
     *
     * @param boardId the board it was recorded for
     * @param outcome its outcome
     */
    public record Held(String boardId, Outcome outcome) {
    }

    /**
     * @return the test the ledger holds for this sweep of this stage; empty when it holds none
     * @throws IOException when the database fails
     */
    public synchronized Optional<Held> recorded(String stageSha256, String sweepSha256) throws IOException {
        try (PreparedStatement query = connection.prepareStatement(
                "SELECT board_id, outcome FROM board_test WHERE stage_sha256 = ? AND sweep_sha256 = ?")) {
            query.setString(1, stageSha256);
            query.setString(2, sweepSha256);
            try (ResultSet rows = query.executeQuery()) {
                return rows.next() ? Optional.of(new Held(rows.getString(1), outcome(rows.getString(2))))
                        : Optional.empty();
            }
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    /**
     * @return every test of the lot, in test order (the ledger's sequence), each with its part factors
     * @throws IOException when the database fails
     */
    public synchronized List<BoardOutcome> lot(String name) throws IOException {
        List<BoardOutcome> outcomes = new ArrayList<>();
        for (RecordedTest test : tests("lot_name = ?", name, "test_id")) {
            outcomes.add(test.outcome());
        }
        return outcomes;
    }

    /**
     * @return the stage file text of the lot's latest test (a lot is tested against one stage;
     *         should a revised stage have joined it, the newest is the one its limits now say);
     *         empty when the ledger holds no test of that lot
     * @throws IOException when the database fails
     */
    public synchronized Optional<String> stageTextOfLot(String name) throws IOException {
        try (PreparedStatement query = connection.prepareStatement("SELECT s.stage_text FROM board_test t "
                + "JOIN stage_file s ON s.stage_sha256 = t.stage_sha256 WHERE t.lot_name = ? "
                + "ORDER BY t.test_id DESC LIMIT 1")) {
            query.setString(1, name);
            try (ResultSet rows = query.executeQuery()) {
                return rows.next() ? Optional.of(rows.getString(1)) : Optional.empty();
            }
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    /**
     * @return every test of one board in time order (ties in test order), each with its part factors
     * @throws IOException when the database fails
     */
    public synchronized List<RecordedTest> history(String boardId) throws IOException {
        return tests("board_id = ?", boardId, "tested_at, test_id");
    }

    /** @return how many tests the ledger holds */
    public synchronized long size() throws IOException {
        try (PreparedStatement query = connection.prepareStatement("SELECT COUNT(*) FROM board_test");
             ResultSet rows = query.executeQuery()) {
            rows.next();
            return rows.getLong(1);
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    @Override
    public synchronized void close() throws IOException {
        try {
            connection.close();
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    private Recording insert(TestRecord test) throws SQLException {
        try (PreparedStatement stage = connection.prepareStatement("INSERT INTO stage_file (stage_sha256, stage_text) "
                + "VALUES (?, ?) ON CONFLICT (stage_sha256) DO NOTHING")) {
            stage.setString(1, test.stageSha256());
            stage.setString(2, test.stageText());
            stage.executeUpdate();
        }
        BoardOutcome outcome = test.outcome();
        long testId;
        try (PreparedStatement row = connection.prepareStatement("INSERT INTO board_test (board_id, lot_name, station, "
                + "operator_name, tested_at, tool_version, stage_sha256, sweep_sha256, sweep_file, sweep_text, "
                + "bench_text, result_json, outcome, problem, midband_gain_db, midband_gain_u_db, lower_corner_hz, "
                + "lower_corner_u_hz, coverage_factor, explained, top_hypothesis, top_probability) "
                + "VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?) "
                + "ON CONFLICT (stage_sha256, sweep_sha256) DO NOTHING RETURNING test_id")) {
            int i = 0;
            row.setString(++i, outcome.boardId());
            row.setString(++i, outcome.lot());
            row.setString(++i, outcome.station());
            row.setString(++i, outcome.operator());
            row.setString(++i, TIME.format(outcome.testedAt()));
            row.setString(++i, test.toolVersion());
            row.setString(++i, test.stageSha256());
            row.setString(++i, test.sweepSha256());
            row.setString(++i, test.sweepFile());
            setText(row, ++i, test.sweepText());
            setText(row, ++i, test.benchText());
            setText(row, ++i, test.resultJson());
            row.setString(++i, outcome.outcome().word());
            setText(row, ++i, outcome.problem());
            setNumber(row, ++i, outcome.midbandGainDb());
            setNumber(row, ++i, outcome.midbandGainUDb());
            setNumber(row, ++i, outcome.lowerCornerHz());
            setNumber(row, ++i, outcome.lowerCornerUHz());
            setNumber(row, ++i, Optional.of(outcome.coverageFactor()));
            row.setBoolean(++i, outcome.explained());
            row.setString(++i, outcome.topHypothesis());
            setNumber(row, ++i, Optional.of(outcome.topProbability()));
            try (ResultSet key = row.executeQuery()) {
                if (!key.next()) {
                    return replacesInputProblem(test) ? insert(test) : Recording.ALREADY_RECORDED;
                }
                testId = key.getLong(1);
            }
        }
        try (PreparedStatement part = connection.prepareStatement("INSERT INTO part_factor (test_id, position, part, "
                + "ln_factor, u_ln_factor, identifiable) VALUES (?, ?, ?, ?, ?, ?)")) {
            int position = 0;
            for (PartFactor factor : outcome.parts()) {
                part.setLong(1, testId);
                part.setInt(2, ++position);
                part.setString(3, factor.part());
                setNumber(part, 4, Optional.of(factor.lnFactor()));
                setNumber(part, 5, Optional.of(factor.uLnFactor()));
                part.setBoolean(6, factor.identifiable());
                part.addBatch();
            }
            if (position > 0) {
                part.executeBatch();
            }
        }
        return Recording.RECORDED;
    }

    /**
     * Reads tests and then their part factors, each in autocommit mode: a test and its parts are
     * committed together, so every test the first query sees has all its parts by the second.
     */
    /**
     * An input problem that an option caused (a wrong {@code --profile}, a missing bench file)
     * is no test of the board: when the same sweep now reconciles, the new test takes its place,
     * in the same transaction. Input problems have no part factors to remove.
     *
     * @return whether an input-problem row of this sweep and stage was removed for the new test
     */
    private boolean replacesInputProblem(TestRecord test) throws SQLException {
        if (test.outcome().outcome() == Outcome.INPUT_PROBLEM) {
            return false;
        }
        try (PreparedStatement delete = connection.prepareStatement("DELETE FROM board_test WHERE stage_sha256 = ? "
                + "AND sweep_sha256 = ? AND outcome = ?")) {
            delete.setString(1, test.stageSha256());
            delete.setString(2, test.sweepSha256());
            delete.setString(3, Outcome.INPUT_PROBLEM.word());
            return delete.executeUpdate() == 1;
        }
    }

    private List<RecordedTest> tests(String where, String value, String order) throws IOException {
        try {
            List<RecordedTest> tests = new ArrayList<>();
            try (PreparedStatement query = connection.prepareStatement("SELECT " + COLUMNS + " FROM board_test WHERE "
                    + where + " ORDER BY " + order)) {
                query.setString(1, value);
                try (ResultSet rows = query.executeQuery()) {
                    while (rows.next()) {
                        BoardOutcome outcome = new BoardOutcome(rows.getString("board_id"), rows.getString("lot_name"),
                                rows.getString("station"), rows.getString("operator_name"),
                                Instant.parse(rows.getString("tested_at")), rows.getLong("test_id"),
                                outcome(rows.getString("outcome")),
                                optional(rows, "midband_gain_db"), optional(rows, "midband_gain_u_db"),
                                optional(rows, "lower_corner_hz"), optional(rows, "lower_corner_u_hz"),
                                number(rows, "coverage_factor"), rows.getBoolean("explained"),
                                rows.getString("top_hypothesis"), number(rows, "top_probability"), List.of(),
                                Optional.ofNullable(rows.getString("problem")));
                        tests.add(new RecordedTest(outcome, rows.getString("tool_version"),
                                rows.getString("stage_sha256"), rows.getString("sweep_sha256"),
                                rows.getString("sweep_file")));
                    }
                }
            }
            Map<Long, List<PartFactor>> parts = new HashMap<>();
            try (PreparedStatement query = connection.prepareStatement("SELECT p.test_id, p.part, p.ln_factor, "
                    + "p.u_ln_factor, p.identifiable FROM part_factor p JOIN board_test t ON t.test_id = p.test_id "
                    + "WHERE t." + where + " ORDER BY p.test_id, p.position")) {
                query.setString(1, value);
                try (ResultSet rows = query.executeQuery()) {
                    while (rows.next()) {
                        parts.computeIfAbsent(rows.getLong(1), id -> new ArrayList<>()).add(new PartFactor(
                                rows.getString(2), number(rows, 3), number(rows, 4), rows.getBoolean(5)));
                    }
                }
            }
            List<RecordedTest> whole = new ArrayList<>(tests.size());
            for (RecordedTest test : tests) {
                BoardOutcome o = test.outcome();
                whole.add(new RecordedTest(new BoardOutcome(o.boardId(), o.lot(), o.station(), o.operator(),
                        o.testedAt(), o.testOrder(), o.outcome(), o.midbandGainDb(), o.midbandGainUDb(),
                        o.lowerCornerHz(), o.lowerCornerUHz(), o.coverageFactor(), o.explained(), o.topHypothesis(),
                        o.topProbability(), parts.getOrDefault(o.testOrder(), List.of()), o.problem()),
                        test.toolVersion(), test.stageSha256(), test.sweepSha256(), test.sweepFile()));
            }
            return whole;
        } catch (SQLException e) {
            throw fault(location, e);
        }
    }

    /** @return a new connection to the ledger, set up as every ledger connection is */
    static Connection connect(LedgerLocation location) throws SQLException {
        Properties properties = new Properties();
        if (location.kind() == LedgerLocation.Kind.SQLITE) {
            // xerial's driver applies these as pragmas on every connection it opens
            properties.setProperty("journal_mode", "WAL");
            properties.setProperty("busy_timeout", Integer.toString(BUSY_TIMEOUT_MS));
            properties.setProperty("synchronous", "NORMAL");
            properties.setProperty("foreign_keys", "true");
            // a write transaction takes the write lock at BEGIN, so a waiting writer waits on the
            // busy timeout instead of failing when it upgrades a read lock (SQLite, "File Locking")
            properties.setProperty("transaction_mode", "IMMEDIATE");
            return DriverManager.getConnection(location.url(), properties);
        }
        location.user().ifPresent(user -> properties.setProperty("user", user));
        location.password().ifPresent(password -> properties.setProperty("password", password));
        properties.setProperty("ApplicationName", "polebench");
        return DriverManager.getConnection(location.url(), properties);
    }

    /** @return whether the newest migration this build knows has been applied */
    private static boolean schemaCurrent(Connection connection) {
        try (PreparedStatement query = connection.prepareStatement(
                "SELECT COUNT(*) FROM flyway_schema_history WHERE version = ? AND success")) {
            query.setString(1, SCHEMA_VERSION);
            try (ResultSet rows = query.executeQuery()) {
                return rows.next() && rows.getLong(1) > 0;
            }
        } catch (SQLException e) {
            // no history table yet: a new ledger
            return false;
        }
    }

    /**
     * Runs the migrations. Flyway serialises concurrent migrations on PostgreSQL with an advisory
     * lock, but cannot on SQLite (its documentation's SQLite page, "Limitations"); there a file
     * lock beside the ledger keeps a second process from migrating at the same time, and the
     * process that waited finds the schema current.
     */
    private static void migrate(LedgerLocation location, Connection connection) throws IOException, SQLException {
        if (location.kind() == LedgerLocation.Kind.POSTGRESQL) {
            flyway(location, "BIGINT GENERATED BY DEFAULT AS IDENTITY PRIMARY KEY");
            return;
        }
        Path lockFile = Path.of(location.file().orElseThrow().toAbsolutePath() + ".migrate-lock");
        try (FileChannel channel = FileChannel.open(lockFile, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
             FileLock lock = channel.lock()) {
            if (!schemaCurrent(connection)) {
                // AUTOINCREMENT: a number is never given twice, even after the newest row is gone
                flyway(location, "INTEGER PRIMARY KEY AUTOINCREMENT");
            }
        }
    }

    private static void flyway(LedgerLocation location, String serialKey) throws IOException {
        try {
            Flyway.configure(Ledger.class.getClassLoader())
                    .dataSource(new LedgerDataSource(location))
                    .locations("classpath:db/ledger")
                    .placeholders(Map.of("serial_key", serialKey))
                    .loggers(SilentFlywayLog.class.getName())
                    .load()
                    .migrate();
        } catch (RuntimeException e) {
            // Flyway reports every failure unchecked (FlywayException): a database the ledger
            // cannot be created in is an I/O fault of that database, not a bug
            throw new IOException("ledger " + location + ": its schema could not be created or updated: "
                    + e.getMessage(), e);
        }
    }

    private static IOException fault(LedgerLocation location, SQLException e) {
        return new IOException("ledger " + location + ": " + e.getMessage(), e);
    }

    private static Outcome outcome(String word) {
        return Outcome.valueOf(word.toUpperCase(Locale.ROOT).replace('-', '_'));
    }

    private static void setText(PreparedStatement statement, int index, Optional<String> text) throws SQLException {
        if (text.isPresent()) {
            statement.setString(index, text.get());
        } else {
            statement.setNull(index, Types.VARCHAR);
        }
    }

    /** A number that is absent or not finite is NULL: SQLite keeps no NaN. */
    private static void setNumber(PreparedStatement statement, int index, Optional<Double> value) throws SQLException {
        if (value.isPresent() && Double.isFinite(value.get())) {
            statement.setDouble(index, value.get());
        } else {
            statement.setNull(index, Types.DOUBLE);
        }
    }

    private static Optional<Double> optional(ResultSet rows, String column) throws SQLException {
        double value = rows.getDouble(column);
        return rows.wasNull() ? Optional.empty() : Optional.of(value);
    }

    private static double number(ResultSet rows, String column) throws SQLException {
        double value = rows.getDouble(column);
        return rows.wasNull() ? Double.NaN : value;
    }

    private static double number(ResultSet rows, int column) throws SQLException {
        double value = rows.getDouble(column);
        return rows.wasNull() ? Double.NaN : value;
    }
}

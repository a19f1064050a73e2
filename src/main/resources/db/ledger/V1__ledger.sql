-- The results ledger of issue 16: one row per board test, one row per back-solved part of it,
-- and each stage file's text once. The same migration runs on SQLite and on PostgreSQL; the one
-- word that differs between them is a Flyway placeholder set by org.polebench.ledger.Ledger:
-- ${serial_key}, an integer key the database numbers.
-- A number that is not finite (NaN) is kept as NULL: SQLite stores no NaN.

CREATE TABLE stage_file (
    stage_sha256 VARCHAR(64) NOT NULL PRIMARY KEY,
    stage_text   TEXT NOT NULL
);

CREATE TABLE board_test (
    test_id              ${serial_key},
    board_id             VARCHAR(200) NOT NULL,
    lot_name             VARCHAR(200) NOT NULL,
    station              VARCHAR(200) NOT NULL,
    operator_name        VARCHAR(200) NOT NULL,
    -- ISO-8601 in UTC with milliseconds, so that text order is time order
    tested_at            VARCHAR(32) NOT NULL,
    tool_version         VARCHAR(100) NOT NULL,
    stage_sha256         VARCHAR(64) NOT NULL REFERENCES stage_file (stage_sha256),
    -- the SHA-256 of the sweep file's bytes, and the sweep as polebench's canonical CSV
    sweep_sha256         VARCHAR(64) NOT NULL,
    sweep_file           TEXT NOT NULL,
    sweep_text           TEXT,
    bench_text           TEXT,
    result_json          TEXT,
    outcome              VARCHAR(20) NOT NULL,
    problem              TEXT,
    midband_gain_db      DOUBLE PRECISION,
    midband_gain_u_db    DOUBLE PRECISION,
    lower_corner_hz      DOUBLE PRECISION,
    lower_corner_u_hz    DOUBLE PRECISION,
    coverage_factor      DOUBLE PRECISION,
    explained            BOOLEAN NOT NULL,
    top_hypothesis       VARCHAR(200) NOT NULL,
    top_probability      DOUBLE PRECISION,
    -- the same sweep of the same stage is one test, however often a batch is run again
    CONSTRAINT board_test_once UNIQUE (stage_sha256, sweep_sha256)
);

CREATE INDEX board_test_board ON board_test (board_id, tested_at);
CREATE INDEX board_test_lot ON board_test (lot_name, test_id);

CREATE TABLE part_factor (
    test_id      BIGINT NOT NULL REFERENCES board_test (test_id),
    position     INTEGER NOT NULL,
    part         VARCHAR(100) NOT NULL,
    ln_factor    DOUBLE PRECISION,
    u_ln_factor  DOUBLE PRECISION,
    identifiable BOOLEAN NOT NULL,
    PRIMARY KEY (test_id, position)
);

package org.polebench.ledger;

import java.util.Optional;
import org.polebench.lot.BoardOutcome;

/**
 * One board's test as the ledger records it in one transaction (issue 16): the outcome with its
 * key figures (its {@code testOrder} is the ledger's to give and is ignored here), and what makes
 * the test traceable and repeatable.
 *
 * @param outcome      board, lot, station, operator, time, outcome, key figures and part factors
 * @param toolVersion  the polebench version that ran the test
 * @param stageSha256  hex SHA-256 of the stage file's bytes
 * @param stageText    the stage file's text
 * @param sweepSha256  hex SHA-256 of the sweep file's bytes: with the stage's, the test's identity
 * @param sweepFile    the sweep file as it was named
 * @param sweepText    the sweep as polebench's canonical CSV; empty when the file could not be read
 * @param benchText    the bench file's text, when the sweep was measured on a declared bench
 * @param resultJson   the reconcile result document; empty for an input problem
 */
public record TestRecord(BoardOutcome outcome, String toolVersion, String stageSha256, String stageText,
                         String sweepSha256, String sweepFile, Optional<String> sweepText, Optional<String> benchText,
                         Optional<String> resultJson) {
}

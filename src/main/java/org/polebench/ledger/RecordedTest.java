package org.polebench.ledger;

import org.polebench.lot.BoardOutcome;

/**
 * One test as the ledger holds it, for a board's history.
 *
 * @param outcome     the test's outcome, key figures and part factors, with its test order
 * @param toolVersion the polebench version that ran it
 * @param stageSha256 hex SHA-256 of the stage file it was reconciled against
 * @param sweepSha256 hex SHA-256 of its sweep file
 * @param sweepFile   the sweep file as it was named
 */
public record RecordedTest(BoardOutcome outcome, String toolVersion, String stageSha256, String sweepSha256,
                           String sweepFile) {
}

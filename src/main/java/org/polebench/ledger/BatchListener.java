package org.polebench.ledger;

import org.polebench.lot.BoardOutcome.Outcome;

/** Hears a batch's progress: called on the batch's threads, one call at a time. */
public interface BatchListener {
    /** @param boards how many sweep files the batch will take */
    void started(int boards);

    /**
     * @param tally         the batch so far, this board included
     * @param boardId       the board just done
     * @param outcome       its outcome
     * @param earlier       true when the ledger already held this test (a batch run again)
     */
    void boardDone(BatchTally tally, String boardId, Outcome outcome, boolean earlier);

    /** A listener that hears nothing. */
    BatchListener SILENT = new BatchListener() {
        @Override
        public void started(int boards) {
        }

        @Override
        public void boardDone(BatchTally tally, String boardId, Outcome outcome, boolean earlier) {
        }
    };
}

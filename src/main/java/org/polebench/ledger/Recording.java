package org.polebench.ledger;

/** What recording one test did. */
public enum Recording {
    /** The test is a new row of the ledger. */
    RECORDED,
    /** The ledger already held this sweep of this stage (an earlier or a concurrent run): nothing was added. */
    ALREADY_RECORDED
}

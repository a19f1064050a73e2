package org.polebench.spread;

/**
 * Told how far a tolerance spread has got, after each batch of boards, on the thread that
 * called {@link ToleranceSpread#lowerCorner}; what to show (and whether, say after a second) is
 * the caller's choice: the library prints nothing.
 */
@FunctionalInterface
public interface SpreadProgress {
    /** Tells nothing. */
    SpreadProgress NONE = (drawn, planned) -> { };

    /**
     * @param drawn   boards drawn and analysed so far
     * @param planned boards the spread would draw if its percentiles never became known sooner
     */
    void drawn(int drawn, int planned);
}

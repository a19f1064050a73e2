package org.polebench.lot;

import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * One board's test as a lot sees it: what the ledger keeps as columns of a recorded test, and
 * all that the lot's statistics read (issue 16). The ledger fills it from its rows; the lot
 * statistics never read result files themselves.
 *
 * @param boardId        the board's identity (from the sweep's provenance or its file name)
 * @param lot            the lot's name
 * @param station        the test station's name, empty when not given
 * @param operator       who ran the test, empty when not given
 * @param testedAt       when the test was recorded
 * @param testOrder      the ledger's sequence number of the test: the order of the control chart
 * @param outcome        pass, fail, incomplete, or an input problem that stopped the test
 * @param midbandGainDb  the measured midband gain in dB, when the sweep gave one
 * @param midbandGainUDb its expanded uncertainty U in dB (k in {@code coverageFactor})
 * @param lowerCornerHz  the board's lower −3 dB corner in Hz, when the sweep determined it
 * @param lowerCornerUHz its expanded uncertainty U in Hz
 * @param coverageFactor the coverage factor k of both U
 * @param explained      whether the most probable hypothesis explains the sweep
 * @param topHypothesis  the most probable hypothesis in words (empty for an input problem)
 * @param topProbability its posterior probability, 0 to 1
 * @param parts          each part's back-solved factor under the most probable hypothesis
 * @param problem        the input problem's message when {@code outcome} is INPUT_PROBLEM
 */
public record BoardOutcome(String boardId, String lot, String station, String operator, Instant testedAt,
                           long testOrder, Outcome outcome, Optional<Double> midbandGainDb,
                           Optional<Double> midbandGainUDb, Optional<Double> lowerCornerHz,
                           Optional<Double> lowerCornerUHz, double coverageFactor, boolean explained,
                           String topHypothesis, double topProbability, List<PartFactor> parts,
                           Optional<String> problem) {

    public BoardOutcome {
        parts = List.copyOf(parts);
    }

    /** The overall result of one board's test. */
    public enum Outcome {
        PASS, FAIL, INCOMPLETE, INPUT_PROBLEM;

        /** @return the word the ledger and the JSON store: pass, fail, incomplete, input-problem */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
        }
    }

    /**
     * One part's back-solved value on one board, on the log scale the back-solve works in.
     *
     * @param part          the part's name in the stage file (C2, RE, Q1 bias, gain …)
     * @param lnFactor      ln(value / nominal)
     * @param uLnFactor     its standard uncertainty u on that scale
     * @param identifiable  whether the sweep determined it (else it only echoes its prior)
     */
    public record PartFactor(String part, double lnFactor, double uLnFactor, boolean identifiable) {
    }
}

package org.polebench.lot;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.fit.Estimate;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;
import org.polebench.reconcile.Hypothesis;
import org.polebench.reconcile.LimitAssessment;
import org.polebench.reconcile.LimitCheck;
import org.polebench.reconcile.NotDecidedCheck;
import org.polebench.reconcile.ParameterEstimate;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.SideBySide;
import org.polebench.reconcile.Verdict;

/**
 * One board's outcome taken from its reconcile result (issue 16): the overall verdict, the key
 * figures a lot compares, the most probable hypothesis and every part's back-solved factor under
 * it.
 *
 * <p>The midband gain and the lower corner are the ones the verdict decided its limits on, with
 * their expanded uncertainty; where the verdict leaves a limit not decided, the sweep does not
 * determine that figure and it is left empty, so that a lot's statistics never mix a model's
 * value with measured ones (docs/method.md, "The verdict"). Where the stage names no limit for a
 * figure, it is taken as the verdict would have taken it: the fit's, when the fit describes the
 * sweep (the back-solved model's with the bench taken out, when the sweep was read through a
 * measuring chain), else none.
 */
public final class OutcomeOfBoard {

    /**
     * @param boardId  the board's identity
     * @param lot      the lot's name
     * @param station  the test station, empty when not given
     * @param operator who ran the test, empty when not given
     * @param testedAt when the board was tested
     * @return the outcome, with test order 0 (the ledger numbers its tests)
     */
    public BoardOutcome of(ReconcileResult result, String boardId, String lot, String station, String operator,
                           Instant testedAt) {
        Verdict verdict = result.conformity().verdict();
        Outcome outcome;
        switch (verdict.overall()) {
            case PASS:
                outcome = Outcome.PASS;
                break;
            case FAIL:
                outcome = Outcome.FAIL;
                break;
            default:
                outcome = Outcome.INCOMPLETE;
                break;
        }
        SideBySide side = result.sideBySide();
        Optional<Estimate> gain = figure(verdict, LimitAssessment.MIDBAND_GAIN, !side.fitAdequate() ? Optional.empty()
                : result.bench().isPresent() ? side.backSolvedMidbandGainDb() : Optional.of(side.measuredMidbandGainDb()));
        Optional<Estimate> corner = figure(verdict, LimitAssessment.LOWER_CORNER, !side.fitAdequate() ? Optional.empty()
                : result.chainTakenOut() ? side.backSolvedLowerCornerHz() : side.measuredLowerCornerHz());
        double k = corner.or(() -> gain).map(Estimate::coverageFactor).orElse(2.0);
        Hypothesis top = result.diagnosis().top();
        List<PartFactor> parts = new ArrayList<>();
        for (ParameterEstimate estimate : result.backSolve().parameters()) {
            parts.add(new PartFactor(partName(estimate), estimate.logEstimate(), estimate.logUncertainty(),
                    estimate.identifiable()));
        }
        return new BoardOutcome(boardId, lot, station, operator, testedAt, 0, outcome,
                gain.map(Estimate::value), gain.map(Estimate::expandedUncertainty),
                corner.map(Estimate::value), corner.map(Estimate::expandedUncertainty), k,
                result.adequacy().explained(), top.label(), top.probability(), parts, Optional.empty());
    }

    /**
     * @param problem what stopped the test, as the user reads it
     * @return the outcome of a board whose sweep could not be reconciled
     */
    public BoardOutcome ofInputProblem(String problem, String boardId, String lot, String station, String operator,
                                       Instant testedAt) {
        return new BoardOutcome(boardId, lot, station, operator, testedAt, 0, Outcome.INPUT_PROBLEM,
                Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), 2.0, false, "", 0, List.of(),
                Optional.of(problem));
    }

    /**
     * @return the part's name as the lot reports it: the designator for a capacitor or a resistor,
     *         "Q1 bias" and "Q1 beta" for a transistor, "gain" for the flat gain, and the channel
     *         with "corner" for a measuring channel's coupling
     */
    static String partName(ParameterEstimate estimate) {
        String label = estimate.parameter().label();
        switch (estimate.parameter().kind()) {
            case BIAS:
                return label + " bias";
            case CURRENT_GAIN:
                return label + " beta";
            case CHANNEL_CORNER:
                return label + " corner";
            default:
                return label;
        }
    }

    private static Optional<Estimate> figure(Verdict verdict, String quantity, Optional<Estimate> unlimited) {
        for (LimitCheck check : verdict.checks()) {
            if (check.quantity().equals(quantity)) {
                return Optional.of(new Estimate(check.value(), check.expandedUncertainty() / check.coverageFactor(),
                        check.coverageFactor()));
            }
        }
        for (NotDecidedCheck check : verdict.notDecided()) {
            if (check.quantity().equals(quantity)) {
                return Optional.empty();
            }
        }
        return unlimited;
    }
}

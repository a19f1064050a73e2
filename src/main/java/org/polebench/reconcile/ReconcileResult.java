package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;
import org.polebench.bench.Bench;
import org.polebench.spread.StagePrediction;
import org.polebench.fit.FitResult;
import org.polebench.sweep.Sweep;

/**
 * Everything {@code polebench reconcile} shows: the prediction, the measurement, their
 * comparison, the first-order apportionment, the back-solve and its hypotheses, the verdict.
 *
 * @param predicted      the nominal stage's prediction with its tolerance spread
 * @param sweep          the sweep as read
 * @param measured       the rational fit of the sweep
 * @param sideBySide     predicted against measured
 * @param apportionment  the corner error split among the capacitors; empty without a measured
 *                       or a predicted corner
 * @param diagnosis      the ranked fault hypotheses, each with its MAP back-solve
 * @param adequacy       whether the most probable hypothesis explains the sweep, stated first
 * @param conformity     the verdict against the stage's limits, and the limits left unchecked
 * @param midbandSource  where the verdict's midband gain came from, in words
 * @param cornerSource   where the verdict's lower corner came from, in words
 */
public record ReconcileResult(StagePrediction predicted, Sweep sweep, FitResult measured, SideBySide sideBySide,
                              Optional<Apportionment> apportionment, Diagnosis diagnosis, ModelAdequacy adequacy,
                              Conformity conformity,
                              String midbandSource, String cornerSource, Optional<Bench> bench) {

    /** @return the MAP back-solve of the most probable hypothesis: the estimates to report */
    public BackSolve backSolve() {
        return diagnosis.top().backSolve();
    }

    /**
     * @return whether the sweep was read through the measuring chain: a bench file declares it,
     *         or a bench hypothesis is the most probable, identifiable, and the stage explains the
     *         sweep with it; the board's
     *         own corner is then the back-solved model's, with the chain taken out, and the fit's
     *         is the corner as measured
     */
    public boolean chainTakenOut() {
        return bench.isPresent() || Diagnosis.chainTakenOut(diagnosis, adequacy);
    }

    /** @return the capacitor estimates of that back-solve, in port order */
    public List<ParameterEstimate> capacitors() {
        return backSolve().of(ParameterKind.CAPACITOR);
    }
}

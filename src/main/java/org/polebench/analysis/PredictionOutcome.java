package org.polebench.analysis;

import java.util.Optional;

/**
 * What {@link StagePredictor#predict} gives: a {@link Prediction}, or the named reason there is
 * none. Callers ask the two methods below rather than testing the type.
 */
public sealed interface PredictionOutcome permits Prediction, Reduction.Singular {

    /** @return the prediction, empty when the low band is singular */
    Optional<Prediction> prediction();

    /** @return why there is no prediction, empty when there is one */
    Optional<Reduction.Singular> singular();
}

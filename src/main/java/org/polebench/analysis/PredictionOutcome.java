package org.polebench.analysis;

/** What {@link StagePredictor#predict} gives: a {@link Prediction}, or the named reason there is none. */
public sealed interface PredictionOutcome permits Prediction, Reduction.Singular {
}

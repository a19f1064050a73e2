package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.analysis.ComplexFrequency;
import org.polebench.fit.FittedRoot;

/**
 * One predicted pole or zero set beside the measured one nearest to it.
 *
 * @param zero      true for a zero, false for a pole
 * @param predicted the stage's root in rad/s; empty when the fit found a root the stage lacks
 * @param measured  the fitted root; empty when the fit resolved fewer roots than predicted
 */
public record RootMatch(boolean zero, Optional<ComplexFrequency> predicted, Optional<FittedRoot> measured) {
}

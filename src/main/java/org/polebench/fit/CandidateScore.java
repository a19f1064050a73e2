package org.polebench.fit;

/**
 * One model order the selection tried.
 *
 * @param structure  its shape
 * @param parameters free parameters
 * @param chiSquare  χ² at its optimum (NaN when it did not converge)
 * @param criterion  its BIC value (NaN when it was not eligible: no convergence or a singular
 *                   information matrix)
 * @param chosen     whether it was selected
 */
public record CandidateScore(ModelStructure structure, int parameters, double chiSquare, double criterion,
                             boolean chosen) {
}

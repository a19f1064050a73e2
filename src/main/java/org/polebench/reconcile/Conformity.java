package org.polebench.reconcile;

/**
 * The statement of conformity against the stage's limits (ISO/IEC 17025:2017 7.8.6): the
 * verdict, with the limits the sweep decides and those it does not (issue 11).
 *
 * @param verdict every limit of the stage, decided or not, under the stated rule
 */
public record Conformity(Verdict verdict) {
}

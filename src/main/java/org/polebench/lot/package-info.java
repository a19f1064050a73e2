/**
 * A lot of boards: the outcomes of many boards' tests turned into what a lot says that one board
 * cannot — yield, the spread of the measured figures against the predicted one, the control
 * chart, Cpk, the Pareto of culprits and the systematic shifts of a part across the lot; and the
 * outcome of one board taken from its reconcile result. Computes values only; sentences are
 * written in {@code report}. Uses the root package and units, circuit, analysis, spread, bench,
 * sweep, fit, reconcile.
 */
package org.polebench.lot;

/**
 * Predicted against measured: the side-by-side comparison, the capacitor back-solve, the
 * single-fault hypotheses ranked by evidence, and the verdict against the stage's limits
 * under a stated decision rule. Uses units, circuit, analysis, measure and fit.
 */
package org.polebench.reconcile;

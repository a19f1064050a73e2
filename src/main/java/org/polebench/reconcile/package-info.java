/**
 * Predicted against measured: the side-by-side comparison, the back-solve of every capacitor,
 * bias current and β, the fault hypotheses (capacitors, resistors, bias currents, the gain,
 * and pairs of them) ranked by evidence, whether the best of them explains the sweep, and the
 * verdict against the stage's limits under a stated decision rule, decided only from what the
 * sweep shows. Uses units, linalg, circuit, analysis, spread, sweep and fit.
 */
package org.polebench.reconcile;

/**
 * Predicted against measured: the side-by-side comparison, the back-solve of every capacitor,
 * bias current and β, the fault hypotheses (capacitors, resistors, bias currents, the gain,
 * the measuring chain, and pairs of them) ranked by evidence, whether the best of them explains
 * the sweep, and the verdict against the stage's limits under a stated decision rule, decided
 * only from what the sweep shows, on the board's own response when a bench is declared or
 * inferred. Uses units, linalg, circuit, analysis, spread, bench, sweep and fit.
 */
package org.polebench.reconcile;

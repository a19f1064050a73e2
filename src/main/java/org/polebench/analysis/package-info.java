/**
 * Small-signal analysis of a {@link org.polebench.circuit.SmallSignalNetwork}: MNA assembly and
 * solve, capacitor-port reduction to a state-space model, poles and zeros, H(jω), the SCTC and
 * OCTC estimates, the exact −3 dB corners and their sensitivities to each capacitor
 * (docs/method.md, "The small-signal network" to "Sensitivities").
 * {@link org.polebench.analysis.StagePredictor} is the entry point; the tolerance spread is in spread.
 * Uses units, linalg and circuit; knows nothing of sweeps, fits or reports.
 */
package org.polebench.analysis;

/**
 * Invented data: sweeps of demo boards synthesized from a stage with faults and noise
 * ({@link org.polebench.synth.BoardSynthesizer}, {@link org.polebench.synth.Fault}, the faults'
 * text), and the {@link org.polebench.synth.InstrumentSimulator} that answers a live capture as
 * an instrument would. The only sweep-side package that uses circuit and analysis.
 * Uses units, circuit, analysis, bench, sweep, profile, capture and waveform (records a simulated scope serves).
 */
package org.polebench.synth;

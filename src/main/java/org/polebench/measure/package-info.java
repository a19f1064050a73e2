/**
 * Bench sweeps: the {@link org.polebench.measure.Sweep} model, instrument profiles, CSV and
 * serial-log importers, live capture over a serial port and the instrument simulator.
 * Uses units and yaml (and circuit and analysis only for the simulator and synthesis).
 */
package org.polebench.measure;

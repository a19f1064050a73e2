/**
 * Scope waveforms: records of a stage's input and output against time read through a waveform
 * profile, the sine fits of IEEE Std 1057 that turn each record into one gain and phase point
 * with its uncertainty, and the checks of each record (clipping, periods, noise, harmonics).
 * Uses the root package and units, yaml, sweep, profile.
 */
package org.polebench.waveform;

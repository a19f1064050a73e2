/**
 * Instrument profiles: how a table file, a serial instrument or a set of scope waveform records
 * lays out its readings ({@link org.polebench.profile.TableProfile},
 * {@link org.polebench.profile.SerialProfile}, {@link org.polebench.profile.WaveformProfile}), the
 * reading scale and limits, the instrument's accuracy, SCPI command templates, the profile
 * reader (every key with its line) and the bundled {@link org.polebench.profile.ProfileLibrary}.
 * A profile's {@code bench:} section is read by the bench package's reader.
 * Uses units, yaml, sweep and bench; reads and writes no sweep file.
 */
package org.polebench.profile;

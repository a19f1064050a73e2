/**
 * The measured-data model: a bench {@link org.polebench.sweep.Sweep} of
 * {@link org.polebench.sweep.SweepPoint}s with its {@link org.polebench.sweep.Provenance},
 * phase unwrapping, and the rough lower corner read straight off the points.
 * Uses only the root package; knows nothing of files, instruments, circuits or fits.
 */
package org.polebench.sweep;

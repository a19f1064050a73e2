/**
 * Live capture of a sweep from an instrument over a serial port or TCP: the line transports,
 * the capture loop with its retries and deadlines, its transcript and progress
 * ({@link org.polebench.capture.SweepCapture} is the entry point). The capture writes through
 * sweepfile, so a captured sweep reads back as an imported one.
 * Uses units, sweep, profile, sweepfile and waveform (records fetched from a scope); knows nothing of circuits or fits.
 */
package org.polebench.capture;

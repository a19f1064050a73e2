/**
 * Import and export of sweep files: layout sniffing, the streaming table parser and the
 * serial-log parser, the conversion of readings into sweep points with the data checks,
 * {@link org.polebench.sweepfile.SweepReader}, {@link org.polebench.sweepfile.SweepWriter} and
 * the canonical file that a live capture fills row by row
 * ({@link org.polebench.sweepfile.AppendedSweep}).
 * Uses units, sweep, profile and waveform (a folder of scope records read as a sweep); knows nothing of serial ports, circuits or fits.
 */
package org.polebench.sweepfile;

/**
 * The bench a sweep was measured on, in the model: the bench file and a profile's
 * {@code bench:} section read into values ({@link Bench}), and the measuring chain applied to a
 * stage ({@link MeasuringChain}): the generator's output resistance in series with the source,
 * each channel's R ∥ C as a load on its node, each AC coupling as a first-order high-pass on its
 * channel's reading (docs/method.md, "The bench in the model"). Uses units, yaml, circuit and
 * analysis; knows nothing of sweeps, fits or reports.
 */
package org.polebench.bench;

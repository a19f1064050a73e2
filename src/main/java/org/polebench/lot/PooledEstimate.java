package org.polebench.lot;

/**
 * A random-effects pooled estimate: the mean of readings whose true values differ from board to
 * board, each reading with its own standard uncertainty.
 *
 * @param mean   μ̂, the inverse-variance weighted mean with τ² added to every variance
 * @param uMean  its standard uncertainty, 1/√Σwᵢ*
 * @param tau    τ̂, the between-board standard deviation (≥ 0)
 * @param q      Cochran's Q, the weighted sum of squares about the fixed-effect mean
 * @param count  how many readings were pooled
 */
public record PooledEstimate(double mean, double uMean, double tau, double q, int count) {
}

package org.polebench.sweep;

import java.util.OptionalDouble;

/**
 * A rough reading of a sweep's midband level and lower −3 dB corner, straight from the data.
 *
 * @param midbandGainDb the midband level in dB (see {@link RoughLowerCorner})
 * @param cornerHz      the interpolated lower −3 dB frequency in Hz; empty when the sweep
 *                      does not reach both below and above it
 * @param reachesBelow  true when some point below the midband lies more than 3 dB down
 * @param reachesAbove  true when the sweep levels off at its top instead of still rising
 */
public record LowerCornerEstimate(double midbandGainDb, OptionalDouble cornerHz, boolean reachesBelow,
                                  boolean reachesAbove) {
}

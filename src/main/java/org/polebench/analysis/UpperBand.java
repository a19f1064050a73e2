package org.polebench.analysis;

import java.util.OptionalDouble;

/**
 * The upper-corner part of a prediction, from the high-band model (high-band capacitors as
 * ports, low-band ones shorted).
 *
 * @param model              the high-band state-space model
 * @param octc               the open-circuit time-constant estimate
 * @param exactUpperCornerHz the lowest frequency above midband where |H| falls to |midband|/√2,
 *                           in Hz; empty when it never does (for example a feedforward zero that
 *                           holds the gain up)
 * @param poles              the high-band poles in rad/s
 */
public record UpperBand(StateModel model, OctcEstimate octc, OptionalDouble exactUpperCornerHz, Spectrum poles) {

    /** @return the OCTC estimate of the upper corner, 1/(2π·Σ τ_i°), in Hz */
    public double octcUpperCornerHz() {
        return octc.cornerHz();
    }
}

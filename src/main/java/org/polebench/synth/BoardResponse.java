package org.polebench.synth;

import org.apache.commons.math3.complex.Complex;

/**
 * The frequency response of a board on the bench, V(out)/V(in) as the instrument's two
 * channels see it: what an {@link InstrumentSimulator} measures.
 */
public interface BoardResponse {
    /**
     * @param frequencyHz test frequency, positive
     * @return the complex gain (V/V; arg in radians, output leading input positive)
     */
    Complex atHz(double frequencyHz);

    /** @return what board this is, for the simulator's identity and notes */
    String describe();
}

package org.polebench.circuit;

import java.util.OptionalDouble;

/**
 * The stage's acceptance limits from {@code limits:}; every bound is optional.
 *
 * @param lowerCornerMaxHz   the lower −3 dB corner must be at most this, in Hz
 * @param lowerCornerMinHz   the lower corner must be at least this, in Hz
 * @param upperCornerMinHz   the upper −3 dB corner must be at least this, in Hz
 * @param midbandGainMinDb   the midband gain must be at least this, in dB
 * @param midbandGainMaxDb   the midband gain must be at most this, in dB
 * @param line               1-based line of {@code limits:}, 0 when absent or built in code
 */
public record Limits(OptionalDouble lowerCornerMaxHz, OptionalDouble lowerCornerMinHz,
                     OptionalDouble upperCornerMinHz, OptionalDouble midbandGainMinDb,
                     OptionalDouble midbandGainMaxDb, int line) {

    public static Limits none() {
        return new Limits(OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
    }

    public boolean isEmpty() {
        return lowerCornerMaxHz.isEmpty() && lowerCornerMinHz.isEmpty() && upperCornerMinHz.isEmpty()
                && midbandGainMinDb.isEmpty() && midbandGainMaxDb.isEmpty();
    }
}

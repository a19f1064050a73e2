package org.polebench.profile;

import java.util.Optional;

/**
 * The columns a table profile reads. Exactly one of {@code gain} or the pair
 * {@code inputAmplitude}/{@code outputAmplitude} is present, as the scale's gain form says.
 *
 * @param frequency        test frequency
 * @param gain             gain in dB or as a ratio
 * @param inputAmplitude   amplitude at the stage input (channel 1)
 * @param outputAmplitude  amplitude at the stage output (channel 2)
 * @param phase            phase; empty for a magnitude-only instrument
 * @param gainUncertainty  per-point standard uncertainty of gain in dB
 * @param phaseUncertainty per-point standard uncertainty of phase in degrees
 */
public record TableColumns(ColumnRef frequency, Optional<ColumnRef> gain, Optional<ColumnRef> inputAmplitude,
                           Optional<ColumnRef> outputAmplitude, Optional<ColumnRef> phase,
                           Optional<ColumnRef> gainUncertainty, Optional<ColumnRef> phaseUncertainty) {
    public TableColumns {
        if (gain.isPresent() == (inputAmplitude.isPresent() || outputAmplitude.isPresent())) {
            throw new IllegalArgumentException("give either a gain column or two amplitude columns");
        }
        if (inputAmplitude.isPresent() != outputAmplitude.isPresent()) {
            throw new IllegalArgumentException("amplitudes need both an input and an output column");
        }
    }
}

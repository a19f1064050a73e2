package org.polebench.bench;

import java.time.LocalDate;
import java.util.Optional;

/**
 * One instrument of the bench as its file names it, for the test report's equipment list
 * (ISO/IEC 17025:2017 7.8.2.1 and 6.4.13): it takes no part in the model.
 *
 * @param identity       maker and model, or the laboratory's own asset name; never blank
 * @param serial         its serial number; empty when the file does not give one
 * @param calibrationDue the date its calibration falls due; empty when the file does not give one
 */
public record BenchInstrument(String identity, Optional<String> serial, Optional<LocalDate> calibrationDue) {
    public BenchInstrument {
        if (identity.isBlank()) {
            throw new IllegalArgumentException("an instrument needs an identity");
        }
    }
}

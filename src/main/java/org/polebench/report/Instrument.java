package org.polebench.report;

import java.time.LocalDate;
import java.util.Optional;

/**
 * One instrument used for the test, as the report identifies it (ISO/IEC 17025:2017 7.8.2.1 and
 * 6.4.13: the equipment's identity and its calibration status).
 *
 * @param identity       maker and model, or the laboratory's own asset name; never blank
 * @param serial         its serial number; empty when not given
 * @param calibrationDue the date its calibration falls due; empty when not given
 */
public record Instrument(String identity, Optional<String> serial, Optional<LocalDate> calibrationDue) {
    public Instrument {
        if (identity.isBlank()) {
            throw new IllegalArgumentException("an instrument needs an identity");
        }
    }
}

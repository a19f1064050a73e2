package org.polebench.sweep;

import java.util.OptionalDouble;

/**
 * An instrument's stated accuracy carried with a sweep as what it mostly is: one calibration
 * error common to every point of the sweep (a flat gain error and a flat phase offset), not
 * noise that averages out over the points (docs/method.md, "Uncertainty (GUM, JCGM 100:2008)").
 *
 * @param gainStandardUncertaintyDb   standard uncertainty of the flat gain error, dB; empty when
 *                                    the instrument states none
 * @param phaseStandardUncertaintyDeg standard uncertainty of the flat phase offset, degrees;
 *                                    empty when the instrument states none
 * @param statement                   where the figures come from and how they were read, for
 *                                    people: "profile db-degrees: ±0.05 dB, ±0.5°, rectangular"
 */
public record CalibrationAccuracy(OptionalDouble gainStandardUncertaintyDb, OptionalDouble phaseStandardUncertaintyDeg,
                                  String statement) {
    public CalibrationAccuracy {
        if (gainStandardUncertaintyDb.isPresent() && !(gainStandardUncertaintyDb.getAsDouble() >= 0
                && Double.isFinite(gainStandardUncertaintyDb.getAsDouble()))) {
            throw new IllegalArgumentException("a gain calibration uncertainty must be finite and >= 0");
        }
        if (phaseStandardUncertaintyDeg.isPresent() && !(phaseStandardUncertaintyDeg.getAsDouble() >= 0
                && Double.isFinite(phaseStandardUncertaintyDeg.getAsDouble()))) {
            throw new IllegalArgumentException("a phase calibration uncertainty must be finite and >= 0");
        }
        statement = statement == null ? "" : statement;
    }

    /** @return true when neither gain nor phase is stated */
    public boolean isEmpty() {
        return gainStandardUncertaintyDb.isEmpty() && phaseStandardUncertaintyDeg.isEmpty();
    }
}

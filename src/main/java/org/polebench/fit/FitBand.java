package org.polebench.fit;

import org.polebench.InputProblem;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;

/**
 * The frequency range a fit uses, inclusive at both ends.
 *
 * @param lowHz  lowest frequency used, positive
 * @param highHz highest frequency used, above {@code lowHz}
 */
public record FitBand(double lowHz, double highHz) {
    public FitBand {
        if (!(lowHz > 0) || !(highHz > lowHz) || !Double.isFinite(highHz)) {
            throw new IllegalArgumentException("a fit band needs 0 < low < high, was " + lowHz + ":" + highHz);
        }
    }

    /**
     * Reads a band as the command line writes it, F1:F2 in engineering notation with or without
     * the unit ("20:20k", "20 Hz:20 kHz").
     *
     * @throws InputProblem when the text is not two positive frequencies, lower first
     */
    public static FitBand parse(String text) throws InputProblem {
        String hint = "write the band as F1:F2 with F1 below F2, such as --band 20:20k";
        String[] parts = text.split(":", -1);
        if (parts.length != 2) {
            throw new InputProblem(null, 0, "band '" + text + "' is not two frequencies separated by ':'", hint);
        }
        double low;
        double high;
        try {
            low = EngineeringValue.parse(parts[0].trim(), Quantity.HERTZ);
            high = EngineeringValue.parse(parts[1].trim(), Quantity.HERTZ);
        } catch (IllegalArgumentException notAFrequency) {
            throw new InputProblem(null, 0, "band '" + text + "': " + notAFrequency.getMessage(), hint);
        }
        if (!(low > 0) || !(high > low)) {
            throw new InputProblem(null, 0, "band '" + text + "' needs 0 < F1 < F2", hint);
        }
        return new FitBand(low, high);
    }

    public boolean contains(double frequencyHz) {
        return frequencyHz >= lowHz && frequencyHz <= highHz;
    }
}

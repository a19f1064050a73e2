package org.polebench.fit;

/**
 * Where the flat calibration term of a fit's uncertainty comes from (docs/method.md,
 * "Uncertainty (GUM, JCGM 100:2008)").
 */
public enum CalibrationBasis {
    /** The instrument profile the sweep was read with states its accuracy. */
    PROFILE("profile"),
    /**
     * No profile states one, but the sweep's points state their uncertainties (the {@code u_}
     * columns of a canonical file): their median is taken as the flat part.
     */
    POINT_UNCERTAINTIES("point_uncertainties"),
    /** Neither: polebench's stated default applies ({@link CalibrationTerm#DEFAULT_GAIN_HALF_WIDTH_DB}). */
    DEFAULT("default");

    private final String word;

    CalibrationBasis(String word) {
        this.word = word;
    }

    /** @return the JSON name */
    public String word() {
        return word;
    }
}

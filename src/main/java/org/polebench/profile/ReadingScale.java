package org.polebench.profile;

import org.polebench.sweep.PhaseUnwrap;

/**
 * How to turn an instrument's raw numbers into polebench's units (hertz, dB, degrees with
 * lead positive), and back for writing a layout. Shared by table and serial profiles.
 *
 * @param frequencyUnit  unit of the frequency readings
 * @param gainForm       dB, ratio or two amplitudes
 * @param amplitudeKind  kind of both amplitudes (matters for limits and generator levels only)
 * @param phaseUnit      unit of the phase readings
 * @param phaseSign      the instrument's sign convention
 * @param phaseWrapped   true when the instrument folds phase into one turn; the importer then
 *                       unwraps it along frequency (see {@code SweepAssembly} in sweepfile)
 */
public record ReadingScale(FrequencyUnit frequencyUnit, GainForm gainForm, AmplitudeKind amplitudeKind,
                           AngleUnit phaseUnit, PhaseSign phaseSign, boolean phaseWrapped) {

    /** Hz, dB, degrees, lead positive, not wrapped: the canonical sweep's own units. */
    public static ReadingScale canonical() {
        return new ReadingScale(FrequencyUnit.HZ, GainForm.DB, AmplitudeKind.RMS, AngleUnit.DEGREES,
                PhaseSign.LEAD_POSITIVE, false);
    }

    /** @return the frequency in Hz; may be infinite when the raw value is huge */
    public double hertz(double raw) {
        return raw * frequencyUnit.hertzPerUnit();
    }

    public double rawFrequency(double frequencyHz) {
        return frequencyHz / frequencyUnit.hertzPerUnit();
    }

    /** @return phase in degrees, lead positive, before any unwrapping */
    public double phaseDeg(double raw) {
        double degrees = phaseUnit == AngleUnit.RADIANS ? Math.toDegrees(raw) : raw;
        return degrees * phaseSign.toLeadPositive();
    }

    /** @return the raw phase an instrument of this scale would print, folded into (−180°, 180°] when wrapped */
    public double rawPhase(double phaseDeg) {
        double degrees = phaseDeg * phaseSign.toLeadPositive();
        if (phaseWrapped) {
            degrees = PhaseUnwrap.fold(degrees);
        }
        return phaseUnit == AngleUnit.RADIANS ? Math.toRadians(degrees) : degrees;
    }

    /** @return a short description such as "kHz, dB, radians, lag positive, wrapped" */
    public String describe() {
        String gain = gainForm == GainForm.AMPLITUDES ? "amplitudes in " + amplitudeKind.symbol() : gainForm.word();
        return frequencyUnit.symbol() + ", " + gain + ", phase in " + phaseUnit.word() + " "
                + phaseSign.word() + (phaseWrapped ? " (wrapped; unwrapped on import)" : "");
    }
}

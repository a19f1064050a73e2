package org.polebench.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.polebench.sweep.CalibrationAccuracy;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * The instrument's calibration error common to every point of one sweep, as a fit carries it: a
 * flat gain error and a flat phase offset, each with a standard uncertainty, beside the
 * independent point noise (docs/method.md, "Uncertainty (GUM, JCGM 100:2008)"; GUM, JCGM 100:2008, 5.1.2 and 5.2).
 *
 * @param basis                       where the figures come from
 * @param gainStandardUncertaintyDb   u of the flat gain error, dB
 * @param phaseStandardUncertaintyDeg u of the flat phase offset, degrees; empty for a
 *                                    magnitude-only sweep
 * @param statement                   the figures and their source, for people
 */
public record CalibrationTerm(CalibrationBasis basis, double gainStandardUncertaintyDb,
                             OptionalDouble phaseStandardUncertaintyDeg, String statement) {
    /**
     * The default gain accuracy, ±0.1 dB read as rectangular: the wider of the figures the shipped
     * profiles carry (±0.05 and ±0.1 dB), and a usual level-accuracy figure for a bench analyser's
     * or audio analyser's gain at low frequencies (common practice). A sweep from a worse
     * instrument needs a profile that says so.
     */
    public static final double DEFAULT_GAIN_HALF_WIDTH_DB = 0.1;
    /** The default phase accuracy, ±1° read as rectangular, chosen the same way (common practice). */
    public static final double DEFAULT_PHASE_HALF_WIDTH_DEG = 1.0;
    private static final double SQRT3 = Math.sqrt(3);

    public CalibrationTerm {
        if (!(gainStandardUncertaintyDb >= 0) || !Double.isFinite(gainStandardUncertaintyDb)) {
            throw new IllegalArgumentException("gain calibration uncertainty must be finite and >= 0");
        }
    }

    /**
     * The term for a sweep: its profile's accuracy where it carries one; else the median of the
     * points' stated uncertainties where every point states one; else the default. A half the
     * profile leaves out (a phase figure, say) takes the default, and the statement says so.
     */
    static CalibrationTerm of(Sweep sweep) {
        boolean phase = sweep.hasPhase();
        if (sweep.calibration().isPresent() && !sweep.calibration().get().isEmpty()) {
            CalibrationAccuracy a = sweep.calibration().get();
            List<String> defaulted = new ArrayList<>();
            double gain = a.gainStandardUncertaintyDb().orElse(DEFAULT_GAIN_HALF_WIDTH_DB / SQRT3);
            if (a.gainStandardUncertaintyDb().isEmpty()) {
                defaulted.add(String.format(Locale.ROOT, "gain ±%s dB", plain(DEFAULT_GAIN_HALF_WIDTH_DB)));
            }
            OptionalDouble phaseU = OptionalDouble.empty();
            if (phase) {
                phaseU = OptionalDouble.of(a.phaseStandardUncertaintyDeg().orElse(DEFAULT_PHASE_HALF_WIDTH_DEG / SQRT3));
                if (a.phaseStandardUncertaintyDeg().isEmpty()) {
                    defaulted.add(String.format(Locale.ROOT, "phase ±%s°", plain(DEFAULT_PHASE_HALF_WIDTH_DEG)));
                }
            }
            String statement = a.statement() + (defaulted.isEmpty() ? ""
                    : "; the default " + String.join(", ", defaulted) + " (rectangular) where it states none");
            return new CalibrationTerm(CalibrationBasis.PROFILE, gain, phaseU, statement);
        }
        boolean stated = true;
        for (SweepPoint point : sweep.points()) {
            stated &= point.gainUncertaintyDb().isPresent() && (!phase || point.phaseUncertaintyDeg().isPresent());
        }
        if (stated) {
            double gain = median(sweep, true);
            OptionalDouble phaseU = phase ? OptionalDouble.of(median(sweep, false)) : OptionalDouble.empty();
            return new CalibrationTerm(CalibrationBasis.POINT_UNCERTAINTIES, gain, phaseU,
                    "the points' stated uncertainties (median), taken whole as the flat part");
        }
        return new CalibrationTerm(CalibrationBasis.DEFAULT, DEFAULT_GAIN_HALF_WIDTH_DB / SQRT3,
                phase ? OptionalDouble.of(DEFAULT_PHASE_HALF_WIDTH_DEG / SQRT3) : OptionalDouble.empty(),
                String.format(Locale.ROOT, "no accuracy stated: the default ±%s dB%s, rectangular",
                        plain(DEFAULT_GAIN_HALF_WIDTH_DB), phase ? String.format(Locale.ROOT, ", ±%s°",
                                plain(DEFAULT_PHASE_HALF_WIDTH_DEG)) : ""));
    }

    /** 1.0 as "1", 0.1 as "0.1". */
    private static String plain(double value) {
        return java.math.BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }

    private static double median(Sweep sweep, boolean gain) {
        double[] u = new double[sweep.size()];
        for (int i = 0; i < u.length; i++) {
            SweepPoint point = sweep.points().get(i);
            u[i] = gain ? point.gainUncertaintyDb().getAsDouble() : point.phaseUncertaintyDeg().getAsDouble();
        }
        Arrays.sort(u);
        int n = u.length;
        return n % 2 == 1 ? u[n / 2] : 0.5 * (u[n / 2 - 1] + u[n / 2]);
    }
}

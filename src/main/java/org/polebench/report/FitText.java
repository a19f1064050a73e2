package org.polebench.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.polebench.InputWarning;
import org.polebench.fit.CandidateScore;
import org.polebench.fit.CalibrationBasis;
import org.polebench.fit.CalibrationTerm;
import org.polebench.fit.Estimate;
import org.polebench.fit.FitQuality;
import org.polebench.fit.FitResult;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootCluster;
import org.polebench.fit.RootStatus;
import org.polebench.fit.UncertaintyBasis;
import org.polebench.units.MeasuredValueFormat;

/**
 * The fit as a plain-text summary for a terminal: the warnings first, then the model, every
 * pole and zero with u and U, both lower corners labelled for what they are, fit quality and
 * the parameter correlations. Uncertainties are rounded to two significant figures and values to match
 * (GUM, JCGM 100:2008, 7.2.6).
 */
public final class FitText {
    private static final String NL = System.lineSeparator();

    public String format(FitResult result) {
        StringBuilder out = new StringBuilder();
        long tried = result.candidates().size();
        // warnings first, so that they are read before the figures they qualify (issue 14)
        out.append("Warnings").append(NL);
        if (result.warnings().isEmpty()) {
            out.append("  none").append(NL);
        }
        for (InputWarning warning : result.warnings()) {
            out.append("  - ").append(warning.describe()).append(NL);
        }
        out.append(NL);
        out.append("Fitted low-frequency model: ").append(result.structure().describe()).append(NL);
        out.append("  order chosen by BIC from ").append(tried).append(tried == 1 ? " candidate" : " candidates")
                .append("; every expanded uncertainty U = k·u with k = ")
                .append(MeasuredValueFormat.coverage(result.coverageFactor())).append(NL);
        out.append("  fitted band        ").append(hz(result.band().lowHz())).append(" to ")
                .append(hz(result.band().highHz())).append(", ").append(result.quality().pointsUsed()).append(" points");
        if (!result.droppedPoints().isEmpty()) {
            out.append(" (").append(result.droppedPoints().size()).append(" dropped as outliers)");
        }
        out.append(NL);
        Estimate gain = result.midbandGainDb();
        out.append("  midband gain       ").append(estimate(gain, "dB"));
        if (result.inverting()) {
            out.append("  (inverting: K < 0)");
        }
        out.append(NL);
        out.append(NL).append("Poles").append(NL);
        roots(out, result.poles(), result.coverageFactor(), "poles");
        out.append(NL).append("Zeros").append(NL);
        if (result.zeros().isEmpty()) {
            out.append("  none").append(NL);
        }
        roots(out, result.zeros(), result.coverageFactor(), "zeros");
        out.append(NL).append("Lower -3 dB corner").append(NL);
        out.append("  of the fitted model (exact)        ")
                .append(result.lowerCornerModelHz().map(e -> estimate(e, "Hz")).orElse("not quoted (see warnings)"))
                .append(NL);
        out.append("  interpolated between data points   ")
                .append(result.lowerCornerDataHz().map(e -> estimate(e, "Hz")).orElse("not available (see warnings)"))
                .append(NL);
        out.append("    (both at midband - 3.01 dB, the midband taken from the fit)").append(NL);
        quality(out, result.quality());
        correlation(out, result);
        return out.toString();
    }

    private static void roots(StringBuilder out, List<FittedRoot> roots, double k, String kind) {
        int dc = 0;
        for (FittedRoot r : roots) {
            dc += r.status() == RootStatus.STRUCTURAL ? 1 : 0;
        }
        if (dc > 0) {
            out.append(String.format(Locale.ROOT, "  %-8s at DC, %d (structural: fixed by the model)%n", "z0", dc));
        }
        List<RootCluster> printed = new ArrayList<>();
        for (FittedRoot r : roots) {
            if (r.status() == RootStatus.STRUCTURAL || (!r.isReal() && r.imaginaryHz() < 0)) {
                continue;
            }
            if (r.cluster().isPresent() && r.status() == RootStatus.FITTED) {
                if (!printed.contains(r.cluster().get())) {
                    printed.add(r.cluster().get());
                    cluster(out, r.cluster().get(), roots, k, kind);
                }
                continue;
            }
            out.append(String.format(Locale.ROOT, "  %-8s ", r.label()));
            if (r.status() == RootStatus.UNIDENTIFIABLE) {
                out.append("unidentifiable: more than a decade outside the swept band").append(NL);
                continue;
            }
            if (r.isReal()) {
                out.append(withU(r.realHz(), r.uRealHz(), k, "Hz"));
            } else {
                out.append(MeasuredValueFormat.complexPair(r.realHz(), k * r.uRealHz(), r.imaginaryHz(),
                        k * r.uImaginaryHz(), "Hz", "U")).append(" (k = ").append(MeasuredValueFormat.coverage(k))
                        .append(");").append(NL).append("           |p| ").append(withU(r.magnitudeHz(), r.uMagnitudeHz(), k, "Hz"));
            }
            out.append(NL);
        }
    }

    /**
     * Roots the data do not separate: their geometric mean with u and U, the damping ratio when
     * they are one fitted pair, and the members' values (which have no uncertainty of their own).
     */
    private static void cluster(StringBuilder out, RootCluster c, List<FittedRoot> roots, double k, String kind) {
        out.append(String.format(Locale.ROOT, "  %-8s ", String.join(",", c.labels())));
        if (c.dampingRatio().isPresent()) {
            out.append("a pair at damping ratio 1 within its uncertainty (complex or two real ").append(kind)
                    .append(" cannot be told)").append(NL).append("           natural frequency ")
                    .append(withU(c.meanHz(), c.uMeanHz(), k, "Hz")).append(NL).append("           damping ratio     ")
                    .append(withU(c.dampingRatio().getAsDouble(), c.uDampingRatio(), k, "")).append(NL);
        } else {
            out.append(c.roots()).append(' ').append(kind).append(" the data do not separate, quoted together")
                    .append(NL).append("           geometric mean    ").append(withU(c.meanHz(), c.uMeanHz(), k, "Hz"))
                    .append(NL);
        }
        StringBuilder values = new StringBuilder();
        for (FittedRoot r : roots) {
            if (r.cluster().isPresent() && r.cluster().get().equals(c)) {
                values.append(values.length() == 0 ? "" : ", ").append(MeasuredValueFormat.sixFigures(r.realHz()));
                if (!r.isReal()) {
                    values.append(r.imaginaryHz() < 0 ? " − j" : " + j")
                            .append(MeasuredValueFormat.sixFigures(Math.abs(r.imaginaryHz())));
                }
            }
        }
        out.append("           the fitted model's roots ").append(values).append(" Hz (no uncertainty of their own)")
                .append(NL);
    }

    /** Below this relative uncertainty the digits are round-off: the data fit the model exactly. */
    private static final double EXACT = 1e-9;

    /**
     * "−800.0 ± 9.8 mHz (U, k = 2.03; u = 4.8 mHz)": the value with its expanded uncertainty and
     * k, as every other command prints a measured value, and u beside it (GUM 7.2.6 rounding).
     */
    static String withU(double value, double u, double k, String unit) {
        if (!(u > EXACT * Math.abs(value))) {
            return MeasuredValueFormat.engineering(value, unit, 6) + "  (u below 1e-9 relative: an exact fit)";
        }
        MeasuredValueFormat.Rounded standard = MeasuredValueFormat.rounded(value, u, unit);
        if (!(k * u < Math.abs(value))) {
            // rounded to the digits of U the value would read 0: give it, and say what U means
            return MeasuredValueFormat.engineering(value, unit, 6) + "  U = "
                    + MeasuredValueFormat.rounded(value, k * u, unit).uncertaintyText() + " (k = "
                    + MeasuredValueFormat.coverage(k) + "; u = " + standard.uncertaintyText()
                    + "): U exceeds the value, these data do not determine it";
        }
        return MeasuredValueFormat.rounded(value, k * u, unit).text() + " (U, k = " + MeasuredValueFormat.coverage(k)
                + "; u = " + MeasuredValueFormat.rounded(value, u, unit).uncertaintyText() + ")";
    }

    private static String estimate(Estimate e, String unit) {
        return withU(e.value(), e.standardUncertainty(), e.coverageFactor(), unit);
    }

    private static void quality(StringBuilder out, FitQuality q) {
        out.append(NL).append("Fit quality").append(NL);
        out.append("  residual RMS       ").append(MeasuredValueFormat.sixFigures(q.residualRmsDb())).append(" dB");
        if (q.residualRmsDeg().isPresent()) {
            out.append(", ").append(MeasuredValueFormat.sixFigures(q.residualRmsDeg().getAsDouble())).append("°");
        } else {
            out.append(" (magnitude only)");
        }
        out.append(NL);
        out.append(String.format(Locale.ROOT, "  chi-square         %s for nu = %d (chi-square/nu = %s)%n",
                MeasuredValueFormat.sixFigures(q.chiSquare()), q.degreesOfFreedom(),
                MeasuredValueFormat.fixed(q.reducedChiSquare(), 3)));
        out.append("  uncertainty basis  ").append(basis(q.basis())).append(NL);
        CalibrationTerm c = q.calibration();
        out.append("  calibration term   ").append(calibrationBasis(c.basis())).append(": ").append(c.statement())
                .append(NL).append("                     ").append(calibrationFigures(c)).append(NL);
    }

    /** "flat gain u = 0.0288675 dB, flat phase u = 0.288675°, combined with the point noise (GUM 5.1.2)" */
    static String calibrationFigures(CalibrationTerm c) {
        StringBuilder out = new StringBuilder("flat gain u = ")
                .append(MeasuredValueFormat.sixFigures(c.gainStandardUncertaintyDb())).append(" dB");
        if (c.phaseStandardUncertaintyDeg().isPresent()) {
            out.append(", flat phase u = ")
                    .append(MeasuredValueFormat.sixFigures(c.phaseStandardUncertaintyDeg().getAsDouble())).append("°");
        }
        return out.append(", combined with the point noise (GUM 5.1.2)").toString();
    }

    static String calibrationBasis(CalibrationBasis basis) {
        switch (basis) {
            case PROFILE:
                return "the profile's accuracy";
            case POINT_UNCERTAINTIES:
                return "the per-point u_ columns";
            default:
                return "the default";
        }
    }

    private static String basis(UncertaintyBasis basis) {
        switch (basis) {
            case STATED:
                return "the sweep's stated point uncertainties (residuals consistent with them)";
            case STATED_SCALED_BY_RESIDUALS:
                return "stated point uncertainties scaled up by sqrt(chi-square/nu) (residuals exceed them)";
            default:
                return "Type A: scale from the residuals (the sweep states no point uncertainties)";
        }
    }

    private static void correlation(StringBuilder out, FitResult result) {
        out.append(NL).append("Correlation of the fit parameters").append(NL);
        List<String> names = result.parameterNames();
        for (int i = 0; i < names.size(); i++) {
            out.append(String.format(Locale.ROOT, "  %-22s", names.get(i)));
            for (int j = 0; j <= i; j++) {
                out.append(String.format(Locale.ROOT, " %6.3f", result.correlation().get(i).get(j)));
            }
            out.append(NL);
        }
    }

    // the same engineering form as inspect and reconcile print a band
    private static String hz(double value) {
        return MeasuredValueFormat.engineering(value, "Hz", 4);
    }

    /** One line per candidate order, for a verbose listing. */
    public String candidates(FitResult result) {
        StringBuilder out = new StringBuilder();
        for (CandidateScore c : result.candidates()) {
            out.append(String.format(Locale.ROOT, "  %s %-50s k = %d  chi-square = %s  BIC = %s%n", c.chosen() ? "*" : " ",
                    c.structure().describe(), c.parameters(),
                    Double.isNaN(c.chiSquare()) ? "did not converge" : MeasuredValueFormat.sixFigures(c.chiSquare()),
                    Double.isNaN(c.criterion()) ? "not eligible" : MeasuredValueFormat.fixed(c.criterion(), 2)));
        }
        return out.toString();
    }
}

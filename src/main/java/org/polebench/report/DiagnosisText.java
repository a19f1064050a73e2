package org.polebench.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.polebench.reconcile.Diagnosis;
import org.polebench.reconcile.FaultRanking;
import org.polebench.reconcile.Hypothesis;
import org.polebench.reconcile.HypothesisKind;
import org.polebench.reconcile.ModelAdequacy;
import org.polebench.reconcile.ModelMeasurement;
import org.polebench.reconcile.ParameterEstimate;
import org.polebench.reconcile.ParameterKind;
import org.polebench.reconcile.PartReading;
import org.polebench.reconcile.SharedCause;
import org.polebench.units.EngineeringValue;
import org.polebench.units.MeasuredValueFormat;

/**
 * The sentences of a diagnosis: each hypothesis in plain words, whether the stage explains the
 * sweep, and the "most likely" line. One writer for the terminal, the JSON and the report, so
 * the three say the same.
 */
public final class DiagnosisText {
    private DiagnosisText() {
    }

    /** @return the hypothesis in plain words */
    public static String statement(Hypothesis hypothesis) {
        if (hypothesis.kind() == HypothesisKind.NONE) {
            return "no fault: the sweep agrees with the stage within its part tolerances";
        }
        if (hypothesis.kind() == HypothesisKind.DOUBLE) {
            return "two faults at once: " + reading(hypothesis.faults().get(0)) + "; and "
                    + reading(hypothesis.faults().get(1));
        }
        if (hypothesis.kind() == HypothesisKind.BENCH) {
            return bench(hypothesis);
        }
        return reading(hypothesis.faults().get(0));
    }

    // what a measuring-chain hypothesis looks like on the bench, and what to do about it
    private static String bench(Hypothesis hypothesis) {
        if (hypothesis.faults().isEmpty()) {
            return "looks measured from a generator whose " + EngineeringValue.format(FaultRanking.GENERATOR_OHMS, "Ω", 2)
                    + " output resistance the stage file leaves out: add it to the stage's source resistance, or "
                    + "declare it in a bench file (generator: output-resistance)";
        }
        for (PartReading reading : hypothesis.faults()) {
            if (!reading.estimate().identifiable()) {
                return "a measuring channel's AC coupling cannot be identified from this sweep (its corner lies "
                        + "outside the swept band or is masked by the board's own): not blamed";
            }
        }
        if (hypothesis.faults().size() == 1) {
            return "looks measured through an AC-coupled output channel at about " + corner(hypothesis.faults().get(0))
                    + ": measure with DC coupling, or declare the coupling in a bench file; the board's own corner is "
                    + "the one with the channel taken out";
        }
        return "looks like the ratio of two channels AC-coupled at different corners (output channel "
                + corner(hypothesis.faults().get(0)) + ", input channel " + corner(hypothesis.faults().get(1))
                + "): use DC coupling on both, or declare them in a bench file";
    }

    private static String corner(PartReading reading) {
        ParameterEstimate estimate = reading.estimate();
        return withU(estimate, "Hz");
    }

    /**
     * An estimate with its expanded uncertainty and k, as the tables print it: the statements, the
     * back-solve table and the report then quote the same U (GUM 7.2.6 rounding).
     */
    static String withU(ParameterEstimate estimate, String unit) {
        return MeasuredValueFormat.expanded(estimate.value(), ModelMeasurement.COVERAGE * estimate.uncertainty(),
                ModelMeasurement.COVERAGE, unit);
    }

    private static String reading(PartReading reading) {
        ParameterEstimate estimate = reading.estimate();
        String label = estimate.parameter().label();
        if (!estimate.identifiable()) {
            String what = estimate.parameter().kind() == ParameterKind.BIAS ? label + " bias current"
                    : estimate.parameter().kind() == ParameterKind.GAIN ? "the flat gain error" : label;
            return what + " cannot be identified from this sweep (its effect lies outside the swept band or is "
                    + "masked by other parts): not blamed";
        }
        switch (estimate.parameter().kind()) {
            case CAPACITOR:
            case RESISTOR:
                return valued(reading);
            case CHANNEL_CORNER:
                return label + " AC coupling at " + corner(reading);
            case BIAS:
                return String.format(Locale.ROOT, "%s bias current reads %s against %s designed (×%s): "
                                + "check its bias network and supply", label, withU(estimate, "A"),
                        EngineeringValue.format(estimate.parameter().nominal(), "A", 3), factor(estimate.factor()));
            default:
                double db = estimate.value();
                double tenfold = Math.abs(Math.abs(db) - 20);
                MeasuredValueFormat.Rounded gain = MeasuredValueFormat.rounded(db,
                        ModelMeasurement.COVERAGE * estimate.uncertainty(), "dB");
                return String.format(Locale.ROOT, "a flat gain error of %s%s ± %s dB (U, k = %s) (×%s)",
                        db > 0 && !gain.value().matches("[0.]+") ? "+" : "", gain.value(), gain.uncertainty(),
                        MeasuredValueFormat.coverage(ModelMeasurement.COVERAGE), factor(estimate.factor()))
                        + (tenfold < 1 ? ": likely a ×10 probe or attenuator setting mixed up"
                        : ": a probe, attenuator or generator level mistake");
        }
    }

    private static String valued(PartReading reading) {
        ParameterEstimate estimate = reading.estimate();
        String unit = estimate.parameter().kind() == ParameterKind.CAPACITOR ? "F" : "Ω";
        String label = estimate.parameter().label();
        double nominal = estimate.parameter().nominal();
        String text = String.format(Locale.ROOT, "%s reads %s against %s nominal (×%s)", label, withU(estimate, unit),
                EngineeringValue.format(nominal, unit, 2), factor(estimate.factor()));
        if (reading.nearestPreferred().isEmpty()) {
            return text;
        }
        double near = reading.nearestPreferred().getAsDouble();
        String series = reading.series().map(Enum::name).orElse("");
        String band = estimate.parameter().tolerance().map(t -> t.describe()).orElse("");
        if (reading.fitsPreferredPart() && Math.abs(near / nominal - 1) > 1e-9) {
            return text + ": likely a " + EngineeringValue.format(near, unit, 2) + " part"
                    + (reading.decadeSlip() ? ", a decade slip" : " (" + series + " series)");
        }
        if (reading.fitsPreferredPart()) {
            return text + ": within its " + band + " tolerance";
        }
        return text + ": outside its " + band + " tolerance and no " + series + " value fits (nearest "
                + EngineeringValue.format(near, unit, 2) + "); "
                + (estimate.parameter().kind() == ParameterKind.CAPACITOR ? "an aged, damaged or misfitted part"
                : "a damaged part, a bad joint or a misfitted value");
    }

    private static String factor(double factor) {
        return String.format(Locale.ROOT, "%.3g", factor);
    }

    /** @return whether the stage explains the sweep, in one or two sentences, the evidence named */
    public static String adequacy(ModelAdequacy adequacy) {
        StringBuilder text = new StringBuilder();
        if (adequacy.explained()) {
            text.append("The stage explains the sweep: ");
        } else if (!adequacy.looksLikeStage()) {
            text.append("This sweep does not look like a board of this stage: ");
        } else {
            boolean onlyParts = adequacy.findings().stream()
                    .allMatch(f -> f == ModelAdequacy.Finding.PARTS_OUTSIDE_TOLERANCE);
            text.append(onlyParts
                    ? "The stage does not explain the sweep: the best hypothesis fits it only with parts it holds "
                    + "within tolerance far outside it; "
                    : "The stage does not explain the sweep: no hypothesis fits it as well as the noise allows; ");
        }
        text.append(String.join("; ", evidence(adequacy))).append('.');
        if (!adequacy.explained()) {
            text.append(" Likely causes: a wrong stage file or board; the measuring chain (an AC-coupled scope "
                    + "channel, a probe setting, the generator's output resistance); or a fault outside the "
                    + "hypotheses (several parts, a dead device).");
        }
        return text.toString();
    }

    private static List<String> evidence(ModelAdequacy adequacy) {
        List<String> evidence = new ArrayList<>();
        evidence.add(String.format(Locale.ROOT, "χ² = %s over ν = %d", MeasuredValueFormat.sixFigures(
                adequacy.chiSquared()), adequacy.degreesOfFreedom())
                + (adequacy.basis() == ModelAdequacy.PValueBasis.STATED_UNCERTAINTIES
                ? " at the sweep's stated uncertainties, " + pEquals(adequacy.pValue().getAsDouble()) : ""));
        if (adequacy.freeFitRatio().isPresent()) {
            evidence.add(String.format(Locale.ROOT, "χ²/ν %s× that of a free rational fit of the same sweep, %s",
                    ratio(adequacy.freeFitRatio().getAsDouble()), pEquals(adequacy.freeFitPValue().getAsDouble())));
        }
        evidence.add("residual structure along frequency (lag-1 autocorrelation) " + pEquals(adequacy.structurePValue()));
        for (ModelAdequacy.Finding finding : adequacy.findings()) {
            switch (finding) {
                case GAIN_FAR_FROM_STAGE:
                case CORNER_OUTSIDE_SPREAD:
                    evidence.add(finding(finding));
                    break;
                case PARTS_OUTSIDE_TOLERANCE:
                    List<String> parts = adequacy.partsOutsideTolerance();
                    evidence.add(parts.isEmpty()
                            ? "the parts it holds within tolerance sit far from their tolerances as a set ("
                            + pEquals(adequacy.tolerancePValue()) + ")"
                            : String.join(", ", parts) + " would have to lie far outside "
                            + (parts.size() == 1 ? "its tolerance" : "their tolerances"));
                    break;
                case FAR_FROM_EVERY_HYPOTHESIS:
                    evidence.add(finding(finding));
                    break;
                default:
                    break;
            }
        }
        return evidence;
    }

    /** @return one finding of the adequacy test in words: the terminal's and the report's */
    public static String finding(ModelAdequacy.Finding finding) {
        switch (finding) {
            case CHI_SQUARED_ABOVE_STATED_NOISE:
                return "χ² far above its distribution at the sweep's stated point uncertainties";
            case WORSE_THAN_FREE_FIT:
                return "the stage model fits far worse than a free rational model of the same sweep";
            case RESIDUAL_RUNS:
                return "the residuals run in long stretches of one sign along frequency";
            case PARTS_OUTSIDE_TOLERANCE:
                return "the best hypothesis fits only by moving parts it does not free far out of tolerance";
            case WORSE_THAN_STATED_NOISE_BY_FAR:
                return "the misfit's RMS is a hundred point σ or more";
            case FAR_FROM_EVERY_HYPOTHESIS:
                return "every hypothesis misses the sweep by far more than the noise or a free fit allows";
            case CORNER_OUTSIDE_SPREAD:
                return "the measured lower corner lies far outside every board of the tolerance spread";
            default:
                return "the measured midband gain lies further from the stage's than any board or a ×10 probe "
                        + "mistake puts it";
        }
    }

    /** @return "p = 0.4778", or "p < 0.0001" below what four decimals can show */
    static String pEquals(double p) {
        return p < 1e-4 ? "p < 0.0001" : String.format(Locale.ROOT, "p = %.4f", p);
    }

    /** @return a ratio of two χ²/ν to three significant figures, as the statement gives it */
    static String ratio(double ratio) {
        return String.format(Locale.ROOT, "%.3g", ratio);
    }

    /** @return the "most likely" line: a named hypothesis, or a plain statement that none is named */
    public static String mostLikely(Diagnosis diagnosis, ModelAdequacy adequacy) {
        if (!adequacy.explained()) {
            Hypothesis closest = diagnosis.top();
            if (closest.kind() != HypothesisKind.NONE && !closest.identifiable()) {
                // never name what the sweep cannot identify, not even as the closest
                return "no hypothesis explains the sweep, and the closest frees parts this sweep cannot identify "
                        + "(probabilities are relative among hypotheses that do not explain it)";
            }
            return "no hypothesis explains the sweep; the closest is \"" + closest.label()
                    + "\" (probabilities are relative among hypotheses that do not explain it)";
        }
        Optional<SharedCause> shared = diagnosis.sharedCause();
        if (shared.isPresent()) {
            return sharedCause(shared.get());
        }
        if (diagnosis.mostLikely().isEmpty()) {
            return "none can be named: the most probable, \"" + diagnosis.top().label()
                    + "\", is not identifiable from this sweep";
        }
        return statement(diagnosis.mostLikely().get());
    }

    /**
     * @return "Q1's bias current is off (reads ×0.58), and this sweep cannot tell which part set
     *         it: R2 55.1 %, Q1 bias current 13.4 %, RE 4.0 % (together 72.5 %); …"
     */
    static String sharedCause(SharedCause shared) {
        StringBuilder parts = new StringBuilder();
        String reads = "";
        for (Hypothesis member : shared.members()) {
            ParameterEstimate estimate = member.culprit().orElseThrow();
            if (estimate.parameter().kind() == ParameterKind.BIAS) {
                reads = " (reads ×" + factor(estimate.factor()) + ")";
            }
            parts.append(parts.length() == 0 ? "" : ", ").append(member.label())
                    .append(String.format(Locale.ROOT, " %.1f %%", 100 * member.probability()));
        }
        return shared.transistor() + "'s bias current is off" + reads + ", and this sweep cannot tell which part set "
                + "it: " + parts + String.format(Locale.ROOT, " (together %.1f %%)", 100 * shared.probability())
                + "; the sweep shows the current, not its cause: measure " + shared.transistor()
                + "'s terminal voltages and the resistors named to tell";
    }
}

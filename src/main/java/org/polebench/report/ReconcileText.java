package org.polebench.report;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.OptionalDouble;
import org.polebench.analysis.ComplexFrequency;
import org.polebench.fit.CalibrationTerm;
import org.polebench.fit.Estimate;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootStatus;
import org.polebench.reconcile.Apportionment;
import org.polebench.reconcile.BackSolve;
import org.polebench.reconcile.CapacitorShare;
import org.polebench.reconcile.FaultRanking;
import org.polebench.reconcile.Hypothesis;
import org.polebench.reconcile.HypothesisKind;
import org.polebench.reconcile.LimitCheck;
import org.polebench.reconcile.MeasuredQuantity;
import org.polebench.reconcile.ModelMeasurement;
import org.polebench.reconcile.NoiseBasis;
import org.polebench.reconcile.NotDecidedCheck;
import org.polebench.reconcile.OverallResult;
import org.polebench.reconcile.ParameterEstimate;
import org.polebench.reconcile.ParameterKind;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.RootMatch;
import org.polebench.reconcile.SideBySide;
import org.polebench.reconcile.Verdict;
import org.polebench.spread.CornerSpread;
import org.polebench.units.EngineeringValue;
import org.polebench.units.MeasuredValueFormat;

/**
 * The readable summary {@code polebench reconcile} prints: predicted beside measured, the
 * first-order apportionment, the capacitor back-solve, the ranked hypotheses and the verdict
 * with its decision rule stated (ISO/IEC 17025:2017 7.8.6). Uncertainties to two significant
 * figures (GUM 7.2.6).
 */
public final class ReconcileText {
    /** A pair below this probability is listed only among the first {@value #LISTED_PAIRS} pairs. */
    static final double LISTED_PROBABILITY = 0.001;
    static final int LISTED_PAIRS = 5;

    public void write(ReconcileResult result, PrintWriter out) {
        out.println("Stage: " + result.predicted().stage().name());
        out.println("Sweep: " + result.sweep().size() + " points, " + hz(result.sweep().lowestHz()) + " to "
                + hz(result.sweep().highestHz()) + (result.sweep().hasPhase() ? ", gain and phase" : ", gain only"));
        for (String note : result.sweep().source().notes()) {
            out.println("  " + note);
        }
        out.println();
        diagnosis(result, out);
        sideBySide(result, out);
        if (result.apportionment().isPresent()) {
            apportionment(result.apportionment().get(), out);
        }
        backSolve(result, out);
        hypotheses(result, out);
        verdict(result, out);
    }

    // first, above everything else: whether the stage explains the sweep at all
    private static void diagnosis(ReconcileResult result, PrintWriter out) {
        out.println("Does the stage explain the sweep? " + (result.adequacy().explained() ? "yes"
                : result.adequacy().looksLikeStage() ? "NO" : "NO, and it does not look like a board of this stage"));
        out.println("  " + DiagnosisText.adequacy(result.adequacy()));
        out.println();
    }

    private static void sideBySide(ReconcileResult result, PrintWriter out) {
        SideBySide side = result.sideBySide();
        CalibrationTerm calibration = result.measured().quality().calibration();
        boolean chainTakenOut = result.chainTakenOut();
        boolean declared = result.bench().isPresent();
        CornerSpread spread = result.predicted().spread();
        out.println("Predicted against measured");
        // why this fit may differ from `polebench fit` on the same file (issue 14: the output says why)
        out.println("  measured: a fit of " + result.measured().order() + " poles, at most "
                + org.polebench.reconcile.Reconciler.fitPoleLimit(result.predicted().prediction().lowBand().order())
                + " (the stage's low-band order), started from the predicted poles; `polebench fit` fits the same"
                + " sweep without the stage and may choose another order");
        out.println(String.format(Locale.ROOT, "  %-26s %14s   %s", "", "predicted", "measured ± U (k)"));
        Estimate gain = side.measuredMidbandGainDb();
        out.println(String.format(Locale.ROOT, "  %-26s %14s   %s", "midband gain",
                MeasuredValueFormat.fixed(side.predictedMidbandGainDb(), 2) + " dB", estimate(gain, "dB")));
        out.println(String.format(Locale.ROOT, "  %-26s %14s", "lower corner, SCTC", hz(side.sctcLowerCornerHz())));
        out.println(String.format(Locale.ROOT, "  %-26s %14s   %s", "lower corner, exact",
                side.exactLowerCornerHz().isPresent() ? hz(side.exactLowerCornerHz().getAsDouble()) : "none",
                side.measuredLowerCornerHz().isPresent() ? estimate(side.measuredLowerCornerHz().get(), "Hz")
                        : "not quoted by the fit"));
        if (side.backSolvedMidbandGainDb().isPresent()) {
            out.println(String.format(Locale.ROOT, "  %-26s %14s   %s", "midband gain, back-solved", "",
                    estimate(side.backSolvedMidbandGainDb().get(), "dB")));
        }
        if (side.backSolvedLowerCornerHz().isPresent()) {
            out.println(String.format(Locale.ROOT, "  %-26s %14s   %s", "lower corner, back-solved", "",
                    estimate(side.backSolvedLowerCornerHz().get(), "Hz")));
        }
        if (chainTakenOut) {
            out.println(declared
                    ? "  the measured values are the ones the declared bench showed; the board's own are the back-solved "
                    + "ones, with the bench taken out, and the limits are decided on them"
                    : "  the measured corner is the one the bench showed, through an AC-coupled channel; the board's "
                    + "own is the back-solved one, with the channel taken out, and the limits are decided on it");
        }
        if (!side.fitAdequate()) {
            out.println("  the rational fit does not describe this sweep (χ²/ν above "
                    + MeasuredValueFormat.sixFigures(org.polebench.reconcile.Reconciler.FIT_ADEQUATE_CHI_SQUARE)
                    + "): the back-solved values are shown, and no limit is decided from them");
        }
        if (side.cornerPercentile().isPresent()) {
            // the draws and seed beside the percentile, as predict states them: the two commands
            // draw different numbers of boards by default (--samples)
            out.println(String.format(Locale.ROOT, "  measured corner at the %.1f %% point of the design spread: %s "
                            + "(%d boards drawn, seed %d)",
                    100 * side.cornerPercentile().getAsDouble(), side.insideDesignSpread()
                            ? "inside the design spread (central 95 %)" : "OUTSIDE the design spread (central 95 %)",
                    spread.samplesDrawn(), spread.seed()));
        }
        double k = side.measuredMidbandGainDb().coverageFactor();
        out.println("  poles and zeros (s/2π)           predicted   measured ± U (k = " + MeasuredValueFormat.coverage(k)
                + ")");
        for (RootMatch match : side.roots()) {
            String predicted = match.predicted().isPresent() ? root(match.predicted().get()) : "-";
            String measured = "not resolved";
            if (match.measured().isPresent()) {
                FittedRoot root = match.measured().get();
                if (root.status() == RootStatus.UNIDENTIFIABLE) {
                    measured = "unidentifiable (outside the band)";
                } else if (root.status() == RootStatus.STRUCTURAL) {
                    measured = "0 (at DC, structural)";
                } else {
                    measured = root.isReal() ? MeasuredValueFormat.rounded(root.realHz(), k * root.uRealHz(), "Hz").text()
                            : MeasuredValueFormat.complexPair(root.realHz(), k * root.uRealHz(), root.imaginaryHz(),
                            k * root.uImaginaryHz(), "Hz", "U");
                }
            }
            out.println(String.format(Locale.ROOT, "    %-6s %30s   %s", match.zero() ? "zero" : "pole", predicted, measured));
        }
        out.println("  measured U includes the instrument's calibration term, from "
                + FitText.calibrationBasis(calibration.basis()) + ": " + calibration.statement() + "; "
                + FitText.calibrationFigures(calibration));
        out.println();
    }

    private static void apportionment(Apportionment apportionment, PrintWriter out) {
        out.println("The corner's change from the design to the back-solved board, shared along the path between them"
                + " (ln f_solved/f_pred = " + MeasuredValueFormat.signed(apportionment.lnCornerRatio(), 4) + ", u = "
                + MeasuredValueFormat.fixed(apportionment.uLnCorner(), 4) + ")");
        out.println(String.format(Locale.ROOT, "  %-18s %10s %12s %14s %8s", "part", "dlnf/dlnC", "estimate", "Δln f",
                "share"));
        for (CapacitorShare share : apportionment.shares()) {
            out.println(String.format(Locale.ROOT, "  %-18s %10s %12s %14s %8s", share.capacitor(),
                    MeasuredValueFormat.fixed(share.cornerSensitivity(), 3),
                    EngineeringValue.format(share.estimatedFarads(), "F", 3),
                    MeasuredValueFormat.signed(share.cornerContribution(), 4), percentShare(share.share())));
        }
        out.println(String.format(Locale.ROOT, "  %-18s %10s %12s %14s %8s", "bias, β, resistors", "", "",
                MeasuredValueFormat.signed(apportionment.otherContribution(), 4), percentShare(apportionment.otherShare())));
        out.println();
    }

    // a share in whole percent, without a negative zero
    private static String percentShare(double share) {
        return Double.isFinite(share) ? MeasuredValueFormat.percent(share, 0) : "-";
    }

    private static void backSolve(ReconcileResult result, PrintWriter out) {
        BackSolve backSolve = result.backSolve();
        out.println("Capacitor back-solve (MAP on the stage's exact model, under \"" + result.diagnosis().top().label()
                + "\"; ± U, k = " + MeasuredValueFormat.coverage(ModelMeasurement.COVERAGE) + "; identifiable: at these"
                + " estimates; each hypothesis judges a part at its own)");
        out.println(String.format(Locale.ROOT, "  %-8s %10s %12s %24s %8s  %s", "part", "nominal", "tolerance",
                "estimate", "×nominal", "identifiable"));
        for (ParameterEstimate estimate : backSolve.of(ParameterKind.CAPACITOR)) {
            out.println(String.format(Locale.ROOT, "  %-8s %10s %12s %24s %8.3f  %s", estimate.parameter().label(),
                    EngineeringValue.format(estimate.parameter().nominal(), "F", 3),
                    estimate.parameter().tolerance().get().describe(), expanded(estimate, "F"),
                    estimate.factor(), estimate.identifiable() ? "yes" : "no (the sweep barely sees it; not blamed)"));
        }
        for (ParameterEstimate estimate : backSolve.of(ParameterKind.RESISTOR)) {
            out.println(String.format(Locale.ROOT, "  %-8s %10s %12s %24s %8.3f  %s", estimate.parameter().label(),
                    EngineeringValue.format(estimate.parameter().nominal(), "Ω", 3),
                    estimate.parameter().tolerance().get().describe(), expanded(estimate, "Ω"),
                    estimate.factor(), estimate.identifiable() ? "yes" : "no (the sweep barely sees it; not blamed)"));
        }
        for (ParameterEstimate estimate : backSolve.of(ParameterKind.BIAS)) {
            out.println(String.format(Locale.ROOT, "  %-8s bias current %s against %s (×%.3f)%s",
                    estimate.parameter().label(), expanded(estimate, "A"),
                    EngineeringValue.format(estimate.parameter().nominal(), "A", 3), estimate.factor(),
                    estimate.identifiable() ? "" : "  (not identifiable)"));
        }
        for (ParameterEstimate estimate : backSolve.of(ParameterKind.CURRENT_GAIN)) {
            out.println(String.format(Locale.ROOT, "  %-8s β %s against %.0f (×%.3f), device spread%s",
                    estimate.parameter().label(), expanded(estimate, ""),
                    estimate.parameter().nominal(), estimate.factor(),
                    estimate.identifiable() ? "" : "  (not identifiable)"));
        }
        ParameterEstimate gain = backSolve.gain();
        out.println(String.format(Locale.ROOT, "  flat gain calibration (nuisance) %s%s", expanded(gain, "dB"),
                gain.identifiable() ? "" : "  (not identifiable)"));
        NoiseBasis noise = result.diagnosis().noise();
        out.println(String.format(Locale.ROOT, "  χ² = %.1f over %d residuals; %s, times %.3f for the gain and %.3f "
                        + "for the phase (the best hypothesis' residual scales)", backSolve.chiSquared(),
                backSolve.dataRows(), noise.stated() ? "the sweep's own point σ"
                        : "point σ " + MeasuredValueFormat.sixFigures(noise.defaultGainSigmaDb()) + " dB and "
                        + MeasuredValueFormat.sixFigures(noise.defaultPhaseSigmaDeg()) + "° (the sweep states none)",
                noise.magnitudeScale(), noise.phaseScale()));
        out.println();
    }

    // the back-solve's estimates with U and k, as the statements and the report quote them
    private static String expanded(ParameterEstimate estimate, String unit) {
        return MeasuredValueFormat.rounded(estimate.value(), ModelMeasurement.COVERAGE * estimate.uncertainty(), unit)
                .text();
    }

    // a prior share as the shortest decimal that gives it back (0.45, 0.4, 0.05)
    private static String share(double fraction) {
        return java.math.BigDecimal.valueOf(fraction).stripTrailingZeros().toPlainString();
    }

    private static void hypotheses(ReconcileResult result, PrintWriter out) {
        boolean explained = result.adequacy().explained();
        out.println((result.diagnosis().pairsRanked() ? "Fault hypotheses, single and double" : "Single-fault hypotheses")
                + " (Laplace evidence; prior: no fault " + share(FaultRanking.NO_FAULT_PRIOR) + ", single faults share "
                + share(FaultRanking.SINGLE_FAULTS_PRIOR) + ", the measuring chain " + share(FaultRanking.BENCH_PRIOR)
                + ", pairs share " + share(FaultRanking.DOUBLE_FAULTS_PRIOR) + ")"
                + (explained ? "" : "; RELATIVE probabilities: none of these explains the sweep"));
        // every single fault is listed; of the pairs, the ones that carry any probability and the
        // few closest: a full list of pairs would bury the lines that matter (the JSON and the
        // report keep all of them)
        int pairsShown = 0;
        int pairsLeft = 0;
        for (Hypothesis hypothesis : result.diagnosis().hypotheses()) {
            if (hypothesis.kind() == HypothesisKind.DOUBLE && hypothesis.probability() < LISTED_PROBABILITY
                    && pairsShown >= LISTED_PAIRS) {
                pairsLeft++;
                continue;
            }
            pairsShown += hypothesis.kind() == HypothesisKind.DOUBLE ? 1 : 0;
            out.println(String.format(Locale.ROOT, "  %7.3f %%  %-20s  %s", 100 * hypothesis.probability(),
                    hypothesis.label(), hypothesis.kind() == HypothesisKind.NONE && hypothesis.probability() < 0.5
                            ? "" : DiagnosisText.statement(hypothesis)));
        }
        if (pairsLeft > 0) {
            out.println(String.format(Locale.ROOT, "  (%d more pairs, each below %.1f %%: in the JSON and the report)",
                    pairsLeft, 100 * LISTED_PROBABILITY));
        }
        out.println("  Most likely: " + DiagnosisText.mostLikely(result.diagnosis(), result.adequacy()));
        out.println();
    }

    private static void verdict(ReconcileResult result, PrintWriter out) {
        Verdict verdict = result.conformity().verdict();
        out.println("Verdict against the stage's limits");
        out.println("  rule: " + verdict.rule().statement());
        out.println("  lower corner from " + result.cornerSource() + "; midband gain from " + result.midbandSource());
        for (LimitCheck check : verdict.checks()) {
            // the margin to the value's own last digit (GUM 7.2.6): it is a difference of the value
            MeasuredValueFormat.Rounded margin = MeasuredValueFormat.rounded(check.marginToLimit(),
                    check.expandedUncertainty(), check.unit());
            out.println(String.format(Locale.ROOT, "  %-14s %-36s limit %-20s margin %-14s %s", check.quantity(),
                    MeasuredValueFormat.expanded(check.value(), check.expandedUncertainty(), check.coverageFactor(),
                            check.unit()), limit(check.min(), check.max(), check.unit()), margin.valueText(),
                    check.pass() ? "pass" : "FAIL"));
        }
        // a limit the sweep does not decide: the value (if any) for information, no margin, no decision
        for (NotDecidedCheck check : verdict.notDecided()) {
            MeasuredQuantity shown = check.shown();
            out.println(String.format(Locale.ROOT, "  %-14s %-36s limit %-20s %-21s %s", check.quantity(),
                    shown.value().isPresent() ? MeasuredValueFormat.expanded(shown.value().getAsDouble(),
                            shown.expandedUncertainty(), shown.coverageFactor(), check.unit()) : "none",
                    limit(check.min(), check.max(), check.unit()), "", "NOT DECIDED"));
        }
        for (NotDecidedCheck check : verdict.notDecided()) {
            out.println("  " + new NotDecidedStatement().of(check, result.measured()));
        }
        if (verdict.nothingToCheck()) {
            out.println("  the stage file names no limits: nothing was decided");
        }
        out.println("  overall: " + verdict.overall().word().toUpperCase(Locale.ROOT) + overallNote(verdict));
    }

    private static String overallNote(Verdict verdict) {
        if (verdict.overall() != OverallResult.INCOMPLETE || verdict.notDecided().isEmpty()) {
            return "";
        }
        StringBuilder names = new StringBuilder();
        for (NotDecidedCheck check : verdict.notDecided()) {
            names.append(names.length() == 0 ? "" : ", ").append(check.quantity());
        }
        return " (not a pass: the sweep does not decide the " + names + " limit"
                + (verdict.notDecided().size() > 1 ? "s" : "") + ")";
    }

    private static String limit(OptionalDouble min, OptionalDouble max, String unit) {
        if (min.isPresent() && max.isPresent()) {
            return value(min.getAsDouble(), unit) + " to " + value(max.getAsDouble(), unit);
        }
        return min.isPresent() ? "≥ " + value(min.getAsDouble(), unit) : "≤ " + value(max.getAsDouble(), unit);
    }

    private static String value(double value, String unit) {
        return unit.equals("dB") ? MeasuredValueFormat.fixed(value, 2) + " dB" : EngineeringValue.format(value, unit, 4);
    }

    private static String estimate(Estimate estimate, String unit) {
        return MeasuredValueFormat.expanded(estimate.value(), estimate.expandedUncertainty(), estimate.coverageFactor(),
                unit);
    }

    private static String root(ComplexFrequency root) {
        if (root.magnitudeRadPerS() == 0) {
            return "0 (at DC)";
        }
        return root.isReal() ? EngineeringValue.format(root.realHz(), "Hz", 4)
                : EngineeringValue.format(root.realHz(), "", 4) + " ± j" + EngineeringValue.format(Math.abs(root.imaginaryHz()),
                "Hz", 4);
    }

    private static String hz(double hz) {
        return EngineeringValue.format(hz, "Hz", 4);
    }
}

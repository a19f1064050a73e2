package org.polebench.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.fit.Estimate;
import org.polebench.reconcile.Apportionment;
import org.polebench.reconcile.BackSolve;
import org.polebench.reconcile.CapacitorShare;
import org.polebench.reconcile.Hypothesis;
import org.polebench.reconcile.HypothesisKind;
import org.polebench.reconcile.ModelAdequacy;
import org.polebench.reconcile.NoiseBasis;
import org.polebench.reconcile.PartReading;
import org.polebench.reconcile.LimitCheck;
import org.polebench.reconcile.MeasuredQuantity;
import org.polebench.reconcile.NotDecidedCheck;
import org.polebench.reconcile.ParameterEstimate;
import org.polebench.reconcile.ParameterKind;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.RootMatch;
import org.polebench.reconcile.SharedCause;
import org.polebench.reconcile.SideBySide;
import org.polebench.reconcile.Verdict;

/**
 * The JSON object of {@code polebench reconcile --json} (issue 5): {@code predicted} as
 * {@code predict --json}, {@code measured} as {@code fit --json}, {@code capacitors},
 * {@code nuisance}, {@code hypotheses} (most probable first), {@code verdict}; and beside them
 * {@code side_by_side}, {@code apportionment}, {@code correlation} and {@code noise}. Keys are
 * snake_case and carry their unit; a value that does not exist is {@code null}. In
 * {@code verdict}, {@code overall} is {@code pass}, {@code fail} or {@code incomplete}; every
 * limit of the stage is one of {@code checks}, with {@code decided} and, for a limit the sweep
 * does not decide, its {@code reason} (issue 11) and a sentence in {@code not_checked}.
 */
public final class ReconcileJson {
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;

    public ObjectNode of(ReconcileResult result) {
        ObjectNode root = nodes.objectNode();
        root.set("diagnosis", diagnosis(result.adequacy()));
        root.set("predicted", new PredictionJson().of(result.predicted()));
        ObjectNode measured = new FitJson().toJson(result.measured());
        // the corner the bench showed, and, when a measuring-chain hypothesis explains the sweep,
        // the board's own in lower_corner_hz (the back-solved model with the chain taken out)
        measured.set("as_measured_lower_corner_hz", measured.path("lower_corner_hz").deepCopy());
        if (result.chainTakenOut() && result.sideBySide().backSolvedLowerCornerHz().isPresent()) {
            ObjectNode own = measured.putObject("lower_corner_hz");
            own.put("value", result.sideBySide().backSolvedLowerCornerHz().get().value());
            own.put("u", result.sideBySide().backSolvedLowerCornerHz().get().standardUncertainty());
        }
        measured.put("chain_taken_out", result.chainTakenOut());
        root.set("measured", measured);
        // the bench as declared (a bench file) or as inferred (a measuring-chain hypothesis on top)
        ObjectNode benchNode = root.putObject("bench");
        if (result.bench().isPresent()) {
            benchNode.put("basis", "declared");
            benchNode.put("file", result.bench().get().source().map(Object::toString).orElse(null));
            benchNode.put("description", result.bench().get().describe());
        } else if (result.chainTakenOut()) {
            benchNode.put("basis", "inferred");
            benchNode.putNull("file");
            benchNode.put("description", DiagnosisText.statement(result.diagnosis().top()));
        } else {
            benchNode.put("basis", "none");
            benchNode.putNull("file");
            benchNode.putNull("description");
        }
        root.set("side_by_side", sideBySide(result.sideBySide()));
        root.set("apportionment", result.apportionment().isPresent()
                ? apportionment(result.apportionment().get()) : nodes.nullNode());
        BackSolve backSolve = result.backSolve();
        root.put("back_solve_hypothesis", result.diagnosis().top().label());
        estimates(root.putArray("capacitors"), backSolve, ParameterKind.CAPACITOR, "farads");
        ObjectNode nuisance = root.putObject("nuisance");
        estimates(nuisance.putArray("bias"), backSolve, ParameterKind.BIAS, "a");
        estimates(nuisance.putArray("current_gain"), backSolve, ParameterKind.CURRENT_GAIN, "beta");
        estimates(root.putArray("resistors"), backSolve, ParameterKind.RESISTOR, "ohms");
        ParameterEstimate gain = backSolve.gain();
        ObjectNode gainNode = nuisance.putObject("gain");
        gainNode.put("estimated_db", gain.value());
        gainNode.put("u_db", gain.uncertainty());
        gainNode.put("identifiable", gain.identifiable());
        ArrayNode correlation = root.putArray("correlation");
        for (List<Double> row : backSolve.correlation()) {
            ArrayNode line = correlation.addArray();
            row.forEach(line::add);
        }
        ObjectNode noise = root.putObject("noise");
        NoiseBasis basis = result.diagnosis().noise();
        noise.put("stated_by_sweep", basis.stated());
        noise.put("default_gain_sigma_db", basis.defaultGainSigmaDb());
        noise.put("default_phase_sigma_deg", basis.defaultPhaseSigmaDeg());
        noise.put("gain_scale", basis.magnitudeScale());
        noise.put("phase_scale", basis.phaseScale());
        noise.put("chi_squared", backSolve.chiSquared());
        noise.put("data_rows", backSolve.dataRows());
        root.put("pairs_ranked", result.diagnosis().pairsRanked());
        root.put("probabilities_relative", !result.adequacy().explained());
        root.put("most_likely", DiagnosisText.mostLikely(result.diagnosis(), result.adequacy()));
        // the "most likely" line names a transistor's bias current, not one part, when the
        // evidence splits among the parts that set it (only where the stage explains the sweep)
        Optional<SharedCause> shared = result.adequacy().explained() ? result.diagnosis().sharedCause() : Optional.empty();
        if (shared.isPresent()) {
            ObjectNode cause = root.putObject("shared_cause");
            cause.put("transistor", shared.get().transistor());
            cause.put("probability", shared.get().probability());
            ArrayNode members = cause.putArray("hypotheses");
            for (Hypothesis member : shared.get().members()) {
                ObjectNode row = members.addObject();
                row.put("kind", member.kind().word());
                row.put("part", member.culprit().orElseThrow().parameter().label());
                row.put("probability", member.probability());
            }
        } else {
            root.putNull("shared_cause");
        }
        ArrayNode hypotheses = root.putArray("hypotheses");
        for (Hypothesis hypothesis : result.diagnosis().hypotheses()) {
            hypotheses.add(hypothesis(hypothesis));
        }
        root.set("verdict", verdict(result));
        return root;
    }

    // one row per estimate of one kind: id, nominal_UNIT, estimated_UNIT, u_UNIT, identifiable
    private static void estimates(ArrayNode rows, BackSolve backSolve, ParameterKind kind, String unit) {
        for (ParameterEstimate estimate : backSolve.of(kind)) {
            ObjectNode row = rows.addObject();
            row.put("id", estimate.parameter().label());
            row.put("nominal_" + unit, estimate.parameter().nominal());
            row.put("estimated_" + unit, estimate.value());
            row.put("u_" + unit, estimate.uncertainty());
            row.put("identifiable", estimate.identifiable());
        }
    }

    // issue 11: {"explained", "statement", "chi_squared", "degrees_of_freedom", "p_value",
    // "structure_p_value"}, and the rest of the evidence
    private ObjectNode diagnosis(ModelAdequacy adequacy) {
        ObjectNode node = nodes.objectNode();
        node.put("explained", adequacy.explained());
        node.put("statement", DiagnosisText.adequacy(adequacy));
        node.put("looks_like_stage", adequacy.looksLikeStage());
        node.put("chi_squared", adequacy.chiSquared());
        node.put("degrees_of_freedom", adequacy.degreesOfFreedom());
        putOptional(node, "p_value", adequacy.pValue());
        node.put("p_value_basis", adequacy.basis().name().toLowerCase(Locale.ROOT));
        node.put("structure_p_value", adequacy.structurePValue());
        node.put("tolerance_p_value", adequacy.tolerancePValue());
        ArrayNode outside = node.putArray("parts_outside_tolerance");
        adequacy.partsOutsideTolerance().forEach(outside::add);
        putOptional(node, "free_fit_ratio", adequacy.freeFitRatio());
        putOptional(node, "free_fit_p_value", adequacy.freeFitPValue());
        ArrayNode findings = node.putArray("findings");
        for (ModelAdequacy.Finding finding : adequacy.findings()) {
            findings.add(finding.name().toLowerCase(Locale.ROOT));
        }
        return node;
    }

    private ObjectNode hypothesis(Hypothesis hypothesis) {
        ObjectNode row = nodes.objectNode();
        row.put("kind", hypothesis.kind().word());
        if (hypothesis.element().isPresent()) {
            row.put("part", hypothesis.element().get());
        } else if (hypothesis.part().isPresent()) {
            row.put("part", hypothesis.part().get());
        } else {
            row.putNull("part");
        }
        row.put("probability", hypothesis.probability());
        row.put("prior_probability", hypothesis.priorProbability());
        row.put("identifiable", hypothesis.identifiable());
        if (hypothesis.culprit().isPresent()) {
            PartReading reading = hypothesis.faults().get(0);
            ParameterEstimate culprit = reading.estimate();
            row.put("estimated_value", culprit.value());
            row.put("u_value", culprit.uncertainty());
            row.put("unit", culprit.parameter().kind().unit());
            row.put("estimated_factor", culprit.factor());
            putOptional(row, "nearest_preferred", reading.nearestPreferred());
            row.put("decade_slip", reading.decadeSlip());
        } else {
            row.putNull("estimated_value");
            row.putNull("u_value");
            row.putNull("unit");
            row.putNull("estimated_factor");
            row.putNull("nearest_preferred");
            row.put("decade_slip", false);
        }
        if (hypothesis.kind() == HypothesisKind.DOUBLE || hypothesis.faults().size() > 1) {
            ArrayNode faults = row.putArray("faults");
            for (PartReading reading : hypothesis.faults()) {
                ParameterEstimate estimate = reading.estimate();
                ObjectNode fault = faults.addObject();
                fault.put("kind", estimate.parameter().kind().faultKind().word());
                if (estimate.parameter().part().isPresent()) {
                    fault.put("part", estimate.parameter().part().get());
                } else {
                    fault.putNull("part");
                }
                fault.put("estimated_factor", estimate.factor());
                fault.put("estimated_value", estimate.value());
                fault.put("u_value", estimate.uncertainty());
                fault.put("unit", estimate.parameter().kind().unit());
                fault.put("identifiable", estimate.identifiable());
                putOptional(fault, "nearest_preferred", reading.nearestPreferred());
                fault.put("decade_slip", reading.decadeSlip());
            }
        }
        row.put("statement", DiagnosisText.statement(hypothesis));
        return row;
    }

    private ObjectNode sideBySide(SideBySide side) {
        ObjectNode node = nodes.objectNode();
        ObjectNode gain = node.putObject("midband_gain_db");
        gain.put("predicted", side.predictedMidbandGainDb());
        putEstimate(gain, Optional.of(side.measuredMidbandGainDb()));
        ObjectNode corner = node.putObject("lower_corner_hz");
        corner.put("sctc", side.sctcLowerCornerHz());
        putOptional(corner, "exact", side.exactLowerCornerHz());
        putEstimate(corner, side.measuredLowerCornerHz());
        putOptional(corner, "spread_percentile", side.cornerPercentile());
        putBackSolved(corner, side.backSolvedLowerCornerHz());
        putBackSolved(gain, side.backSolvedMidbandGainDb());
        node.put("fit_adequate", side.fitAdequate());
        corner.put("inside_design_spread", side.insideDesignSpread());
        ArrayNode roots = node.putArray("roots_hz");
        for (RootMatch match : side.roots()) {
            ObjectNode row = roots.addObject();
            row.put("kind", match.zero() ? "zero" : "pole");
            if (match.predicted().isPresent()) {
                row.put("predicted_re", match.predicted().get().realHz());
                row.put("predicted_im", match.predicted().get().imaginaryHz());
            } else {
                row.putNull("predicted_re");
                row.putNull("predicted_im");
            }
            if (match.measured().isPresent()) {
                row.put("measured_re", match.measured().get().realHz());
                row.put("measured_im", match.measured().get().imaginaryHz());
                row.put("measured_u", match.measured().get().uMagnitudeHz());
                row.put("measured_status", match.measured().get().status().name().toLowerCase(Locale.ROOT));
            } else {
                row.putNull("measured_re");
                row.putNull("measured_im");
                row.putNull("measured_u");
                row.putNull("measured_status");
            }
        }
        return node;
    }

    private ObjectNode apportionment(Apportionment apportionment) {
        ObjectNode node = nodes.objectNode();
        node.put("ln_corner_ratio", apportionment.lnCornerRatio());
        node.put("u_ln_corner_ratio", apportionment.uLnCorner());
        ArrayNode shares = node.putArray("shares");
        for (CapacitorShare share : apportionment.shares()) {
            ObjectNode row = shares.addObject();
            row.put("id", share.capacitor());
            row.put("corner_sensitivity", share.cornerSensitivity());
            row.put("estimated_farads", share.estimatedFarads());
            row.put("corner_contribution", share.cornerContribution());
            if (Double.isFinite(share.share())) {
                row.put("share", share.share());
            } else {
                row.putNull("share");
            }
        }
        node.put("other_contribution", apportionment.otherContribution());
        if (Double.isFinite(apportionment.otherShare())) {
            node.put("other_share", apportionment.otherShare());
        } else {
            node.putNull("other_share");
        }
        return node;
    }

    private ObjectNode verdict(ReconcileResult result) {
        Verdict verdict = result.conformity().verdict();
        ObjectNode node = nodes.objectNode();
        node.put("overall", verdict.overall().word());
        node.put("lower_corner_source", result.cornerSource());
        node.put("midband_gain_source", result.midbandSource());
        node.put("rule", verdict.rule().name().toLowerCase(Locale.ROOT));
        node.put("rule_statement", verdict.rule().statement());
        ArrayNode checks = node.putArray("checks");
        for (LimitCheck check : verdict.checks()) {
            ObjectNode row = checks.addObject();
            row.put("quantity", check.quantity());
            row.put("unit", check.unit());
            row.put("value", check.value());
            row.put("expanded_uncertainty", check.expandedUncertainty());
            row.put("coverage_factor", check.coverageFactor());
            putOptional(row, "min", check.min());
            putOptional(row, "max", check.max());
            row.put("margin", check.marginToLimit());
            row.put("guard_band", check.rule().guardBand(check.expandedUncertainty()));
            row.put("pass", check.pass());
            row.put("decided", true);
            row.putNull("reason");
        }
        // a limit the sweep does not decide: any value only for information, and no margin or decision
        for (NotDecidedCheck check : verdict.notDecided()) {
            ObjectNode row = checks.addObject();
            MeasuredQuantity shown = check.shown();
            row.put("quantity", check.quantity());
            row.put("unit", check.unit());
            putOptional(row, "value", shown.value());
            if (shown.value().isPresent()) {
                row.put("expanded_uncertainty", shown.expandedUncertainty());
                row.put("coverage_factor", shown.coverageFactor());
            } else {
                row.putNull("expanded_uncertainty");
                row.putNull("coverage_factor");
            }
            putOptional(row, "min", check.min());
            putOptional(row, "max", check.max());
            row.putNull("margin");
            row.putNull("guard_band");
            row.putNull("pass");
            row.put("decided", false);
            row.put("reason", check.reason().word());
        }
        ArrayNode unchecked = node.putArray("not_checked");
        for (NotDecidedCheck check : verdict.notDecided()) {
            unchecked.add(new NotDecidedStatement().of(check, result.measured()));
        }
        return node;
    }

    private static void putEstimate(ObjectNode node, Optional<Estimate> estimate) {
        if (estimate.isPresent()) {
            node.put("measured", estimate.get().value());
            node.put("u_measured", estimate.get().standardUncertainty());
            node.put("coverage_factor", estimate.get().coverageFactor());
        } else {
            node.putNull("measured");
            node.putNull("u_measured");
            node.putNull("coverage_factor");
        }
    }

    private static void putBackSolved(ObjectNode node, Optional<Estimate> estimate) {
        if (estimate.isPresent()) {
            node.put("back_solved", estimate.get().value());
            node.put("u_back_solved", estimate.get().standardUncertainty());
            node.put("back_solved_coverage_factor", estimate.get().coverageFactor());
        } else {
            node.putNull("back_solved");
            node.putNull("u_back_solved");
        }
    }

    private static void putOptional(ObjectNode node, String key, OptionalDouble value) {
        if (value.isPresent()) {
            node.put(key, value.getAsDouble());
        } else {
            node.putNull(key);
        }
    }
}

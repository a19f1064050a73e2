package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.time.format.ResolverStyle;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.LimitCheck;

/**
 * Checks a {@code result.json} read back for {@code polebench report} as untrusted input (issue
 * 14): every field the report reads has the type and range {@link ResultJson} writes, every
 * number in the file is finite and of bounded size, every list is of bounded length, and the
 * verdict is decided again from the values, uncertainties and limits in the file under its own
 * rule ({@link LimitCheck#decide}, the library's one decision) and refused when the stored
 * decisions or the overall verdict disagree. A refusal names the field by its JSON path
 * ({@code $.capacitors[0].nominal_farads}) and, where it can, the line.
 *
 * <p>The bounds are what keeps rendering finite: a zero or negative nominal value once made
 * C/C_nom infinite, and JFreeChart's log axis then made ticks without end until the heap ran out.
 * Stateless.
 */
final class ResultCheck {
    /** No list in a result is longer: a sweep of a million points is already beyond any bench. */
    static final int MAX_LIST = 1_000_000;
    /** No number in a result is larger in magnitude (a frequency, a value, a χ²). */
    static final double MAX_MAGNITUDE = 1e30;
    /** The largest standard uncertainty of ln C drawn: e^(2·50) still fits a double's range. */
    static final double MAX_U_LN = 50;

    private enum Kind {
        TEXT, BOOLEAN, NUMBER, POSITIVE, NON_NEGATIVE, FRACTION, COUNT, INTEGER, OBJECT, LIST;

        String words() {
            switch (this) {
                case TEXT: return "a string";
                case BOOLEAN: return "true or false";
                case NUMBER: return "a number";
                case POSITIVE: return "a positive number";
                case NON_NEGATIVE: return "a number ≥ 0";
                case FRACTION: return "a number from 0 to 1";
                case COUNT: return "a whole number ≥ 0";
                case INTEGER: return "a whole number";
                case OBJECT: return "an object";
                case LIST: return "a list";
                default: throw new IllegalStateException(name());
            }
        }
    }

    /** @param path dotted keys, {@code []} after a key for each element of its list */
    private record Rule(String path, Kind kind, boolean nullable) {}

    /** How a test level may be measured, as {@link ResultJson} writes it. */
    private static final List<String> MEASURES = List.of("rms", "peak-to-peak", "peak");

    private static final List<Rule> RULES = List.of(
            must("polebench_version", Kind.TEXT), must("stage_file", Kind.TEXT), must("stage_sha256", Kind.TEXT),
            must("sweep_file", Kind.TEXT), must("sweep_sha256", Kind.TEXT), must("profile", Kind.TEXT),
            must("import_warnings", Kind.LIST), must("import_warnings[]", Kind.TEXT),
            must("report_warnings", Kind.LIST), must("report_warnings[]", Kind.TEXT),
            must("fit_model", Kind.TEXT), must("back_solve_hypothesis", Kind.TEXT), must("most_likely", Kind.TEXT),
            must("probabilities_relative", Kind.BOOLEAN), must("pairs_ranked", Kind.BOOLEAN),

            must("predicted", Kind.OBJECT), must("predicted.stage", Kind.TEXT),
            must("predicted.warnings", Kind.LIST), must("predicted.warnings[]", Kind.TEXT),
            must("predicted.tolerance_spread", Kind.OBJECT), must("predicted.tolerance_spread.samples", Kind.COUNT),
            must("predicted.tolerance_spread.seed", Kind.INTEGER),
            may("predicted.tolerance_spread.p05_hz", Kind.POSITIVE), may("predicted.tolerance_spread.p50_hz", Kind.POSITIVE),
            may("predicted.tolerance_spread.p95_hz", Kind.POSITIVE),
            must("predicted.capacitors", Kind.LIST), must("predicted.capacitors[].id", Kind.TEXT),
            must("predicted.capacitors[].farads", Kind.POSITIVE),
            must("predicted.capacitors[].sctc_resistance_ohm", Kind.POSITIVE),
            must("predicted.capacitors[].sctc_time_constant_s", Kind.POSITIVE),
            must("predicted.capacitors[].share", Kind.FRACTION),
            may("predicted.capacitors[].corner_sensitivity", Kind.NUMBER),

            must("measured", Kind.OBJECT), must("measured.warnings", Kind.LIST), must("measured.warnings[]", Kind.TEXT),

            must("side_by_side", Kind.OBJECT), must("side_by_side.fit_adequate", Kind.BOOLEAN),
            must("side_by_side.midband_gain_db", Kind.OBJECT), may("side_by_side.midband_gain_db.predicted", Kind.NUMBER),
            may("side_by_side.midband_gain_db.measured", Kind.NUMBER),
            may("side_by_side.midband_gain_db.u_measured", Kind.NON_NEGATIVE),
            may("side_by_side.midband_gain_db.coverage_factor", Kind.POSITIVE),
            may("side_by_side.midband_gain_db.back_solved", Kind.NUMBER),
            may("side_by_side.midband_gain_db.u_back_solved", Kind.NON_NEGATIVE),
            must("side_by_side.lower_corner_hz", Kind.OBJECT), may("side_by_side.lower_corner_hz.sctc", Kind.POSITIVE),
            may("side_by_side.lower_corner_hz.exact", Kind.POSITIVE), may("side_by_side.lower_corner_hz.measured", Kind.POSITIVE),
            may("side_by_side.lower_corner_hz.u_measured", Kind.NON_NEGATIVE),
            may("side_by_side.lower_corner_hz.coverage_factor", Kind.POSITIVE),
            may("side_by_side.lower_corner_hz.back_solved", Kind.POSITIVE),
            may("side_by_side.lower_corner_hz.u_back_solved", Kind.NON_NEGATIVE),
            may("side_by_side.lower_corner_hz.spread_percentile", Kind.FRACTION),
            may("side_by_side.lower_corner_hz.inside_design_spread", Kind.BOOLEAN),
            must("side_by_side.roots_hz", Kind.LIST), must("side_by_side.roots_hz[].kind", Kind.TEXT),
            may("side_by_side.roots_hz[].predicted_re", Kind.NUMBER), may("side_by_side.roots_hz[].predicted_im", Kind.NUMBER),
            may("side_by_side.roots_hz[].measured_re", Kind.NUMBER), may("side_by_side.roots_hz[].measured_im", Kind.NUMBER),
            may("side_by_side.roots_hz[].measured_u", Kind.NON_NEGATIVE),
            may("side_by_side.roots_hz[].measured_status", Kind.TEXT),

            may("apportionment", Kind.OBJECT), must("apportionment.ln_corner_ratio", Kind.NUMBER),
            must("apportionment.u_ln_corner_ratio", Kind.NON_NEGATIVE), must("apportionment.shares", Kind.LIST),
            must("apportionment.shares[].id", Kind.TEXT), must("apportionment.shares[].estimated_farads", Kind.POSITIVE),
            must("apportionment.shares[].corner_contribution", Kind.NUMBER), may("apportionment.shares[].share", Kind.NUMBER),

            must("capacitors", Kind.LIST), must("capacitors[].id", Kind.TEXT),
            must("capacitors[].nominal_farads", Kind.POSITIVE), must("capacitors[].estimated_farads", Kind.POSITIVE),
            must("capacitors[].u_farads", Kind.NON_NEGATIVE), must("capacitors[].identifiable", Kind.BOOLEAN),
            must("capacitors[].factor", Kind.POSITIVE), must("capacitors[].u_ln", Kind.NON_NEGATIVE),
            may("capacitors[].tolerance", Kind.TEXT), may("capacitors[].min_farads", Kind.POSITIVE),
            may("capacitors[].max_farads", Kind.POSITIVE), may("capacitors[].within_tolerance", Kind.BOOLEAN),

            must("resistors", Kind.LIST), must("resistors[].id", Kind.TEXT), must("resistors[].nominal_ohms", Kind.POSITIVE),
            must("resistors[].estimated_ohms", Kind.POSITIVE), must("resistors[].u_ohms", Kind.NON_NEGATIVE),
            must("resistors[].identifiable", Kind.BOOLEAN),

            must("nuisance", Kind.OBJECT), must("nuisance.bias", Kind.LIST), must("nuisance.bias[].id", Kind.TEXT),
            must("nuisance.bias[].nominal_a", Kind.NUMBER), must("nuisance.bias[].estimated_a", Kind.NUMBER),
            must("nuisance.bias[].u_a", Kind.NON_NEGATIVE), must("nuisance.bias[].identifiable", Kind.BOOLEAN),
            must("nuisance.current_gain", Kind.LIST), must("nuisance.current_gain[].id", Kind.TEXT),
            must("nuisance.current_gain[].nominal_beta", Kind.POSITIVE),
            must("nuisance.current_gain[].estimated_beta", Kind.NUMBER),
            must("nuisance.current_gain[].u_beta", Kind.NON_NEGATIVE),
            must("nuisance.current_gain[].identifiable", Kind.BOOLEAN),
            may("nuisance.gain", Kind.OBJECT), may("nuisance.gain.estimated_db", Kind.NUMBER),
            may("nuisance.gain.u_db", Kind.NON_NEGATIVE), must("nuisance.gain.identifiable", Kind.BOOLEAN),

            must("diagnosis", Kind.OBJECT), must("diagnosis.explained", Kind.BOOLEAN),
            must("diagnosis.looks_like_stage", Kind.BOOLEAN), must("diagnosis.statement", Kind.TEXT),
            must("diagnosis.chi_squared", Kind.NON_NEGATIVE), must("diagnosis.degrees_of_freedom", Kind.COUNT),
            may("diagnosis.p_value", Kind.FRACTION), must("diagnosis.p_value_basis", Kind.TEXT),
            may("diagnosis.structure_p_value", Kind.FRACTION), may("diagnosis.free_fit_ratio", Kind.NON_NEGATIVE),
            may("diagnosis.free_fit_p_value", Kind.FRACTION), may("diagnosis.tolerance_p_value", Kind.FRACTION),
            must("diagnosis.parts_outside_tolerance", Kind.LIST), must("diagnosis.parts_outside_tolerance[]", Kind.TEXT),
            must("diagnosis.findings", Kind.LIST), must("diagnosis.findings[]", Kind.TEXT),

            must("hypotheses", Kind.LIST), must("hypotheses[].kind", Kind.TEXT),
            must("hypotheses[].prior_probability", Kind.FRACTION), must("hypotheses[].probability", Kind.FRACTION),
            may("hypotheses[].estimated_value", Kind.NUMBER), may("hypotheses[].u_value", Kind.NON_NEGATIVE),
            may("hypotheses[].estimated_factor", Kind.NUMBER), may("hypotheses[].nearest_preferred", Kind.POSITIVE),
            may("hypotheses[].decade_slip", Kind.BOOLEAN), must("hypotheses[].statement", Kind.TEXT),
            may("hypotheses[].identifiable", Kind.BOOLEAN), may("hypotheses[].unit", Kind.TEXT),
            may("hypotheses[].part", Kind.TEXT), may("hypotheses[].faults", Kind.LIST),
            must("hypotheses[].faults[].kind", Kind.TEXT), may("hypotheses[].faults[].part", Kind.TEXT),
            may("hypotheses[].faults[].estimated_value", Kind.NUMBER),
            may("hypotheses[].faults[].u_value", Kind.NON_NEGATIVE),
            may("hypotheses[].faults[].estimated_factor", Kind.NUMBER), may("hypotheses[].faults[].unit", Kind.TEXT),

            must("noise", Kind.OBJECT), must("noise.stated_by_sweep", Kind.BOOLEAN),
            must("noise.gain_scale", Kind.POSITIVE), must("noise.phase_scale", Kind.POSITIVE),
            must("noise.default_gain_sigma_db", Kind.POSITIVE), must("noise.default_phase_sigma_deg", Kind.POSITIVE),
            must("noise.chi_squared", Kind.NON_NEGATIVE), must("noise.data_rows", Kind.COUNT),

            must("verdict", Kind.OBJECT), must("verdict.rule_statement", Kind.TEXT), must("verdict.lower_corner_source", Kind.TEXT),
            must("verdict.midband_gain_source", Kind.TEXT), must("verdict.checks", Kind.LIST),
            must("verdict.checks[].quantity", Kind.TEXT), must("verdict.checks[].unit", Kind.TEXT),
            must("verdict.checks[].decided", Kind.BOOLEAN), may("verdict.checks[].value", Kind.NUMBER),
            may("verdict.checks[].expanded_uncertainty", Kind.NON_NEGATIVE), may("verdict.checks[].min", Kind.NUMBER),
            may("verdict.checks[].max", Kind.NUMBER), may("verdict.checks[].margin", Kind.NUMBER),
            may("verdict.checks[].guard_band", Kind.NON_NEGATIVE), may("verdict.checks[].pass", Kind.BOOLEAN),
            may("verdict.checks[].reason", Kind.TEXT),
            must("verdict.not_checked", Kind.LIST), must("verdict.not_checked[]", Kind.TEXT),

            must("run", Kind.OBJECT), may("run.operator", Kind.TEXT), may("run.board", Kind.TEXT),
            must("run.board_from", Kind.TEXT), must("run.spread_samples", Kind.COUNT), must("run.spread_seed", Kind.INTEGER),
            may("run.approved_by", Kind.TEXT), may("run.ambient_celsius", Kind.NUMBER), may("run.supply_volts", Kind.NUMBER),
            may("run.test_level_volts", Kind.POSITIVE), may("run.test_level_measure", Kind.TEXT),
            may("run.test_level_from", Kind.TEXT),
            may("run.instruments", Kind.LIST), must("run.instruments[].identity", Kind.TEXT),
            may("run.instruments[].serial", Kind.TEXT), may("run.instruments[].calibration_due", Kind.TEXT),

            must("sweep", Kind.OBJECT), must("sweep.instrument", Kind.TEXT), must("sweep.profile_used", Kind.TEXT),
            may("sweep.captured_utc", Kind.TEXT), may("sweep.board", Kind.TEXT), must("sweep.notes", Kind.LIST),
            must("sweep.notes[]", Kind.TEXT), must("sweep.has_phase", Kind.BOOLEAN), must("sweep.points", Kind.LIST),
            must("sweep.points[].frequency_hz", Kind.POSITIVE), must("sweep.points[].gain_db", Kind.NUMBER),
            may("sweep.points[].phase_deg", Kind.NUMBER), may("sweep.points[].fitted_gain_db", Kind.NUMBER),

            must("curves", Kind.OBJECT), must("curves.frequency_hz", Kind.LIST), must("curves.frequency_hz[]", Kind.POSITIVE),
            may("curves.fitted_gain_db[]", Kind.NUMBER), may("curves.fitted_phase_deg[]", Kind.NUMBER),
            may("curves.nominal_gain_db[]", Kind.NUMBER), may("curves.nominal_phase_deg[]", Kind.NUMBER),
            may("curves.sctc_gain_db[]", Kind.NUMBER), may("curves.sctc_phase_deg[]", Kind.NUMBER),
            may("curves.band_low_db[]", Kind.NUMBER), may("curves.band_high_db[]", Kind.NUMBER),
            must("curves.band_coverage", Kind.FRACTION), must("curves.band_boards", Kind.COUNT),
            must("curves.band_boards_out_of_active_region", Kind.COUNT), must("curves.band_seed", Kind.INTEGER),
            may("curves.sctc_corner_hz", Kind.POSITIVE));

    /** The curves drawn on the Bode plot's grid: each, when present, one value per grid frequency. */
    private static final List<String> CURVES = List.of("fitted_gain_db", "fitted_phase_deg", "nominal_gain_db",
            "nominal_phase_deg", "sctc_gain_db", "sctc_phase_deg", "band_low_db", "band_high_db");

    private static Rule must(String path, Kind kind) {
        return new Rule(path, kind, false);
    }

    private static Rule may(String path, Kind kind) {
        return new Rule(path, kind, true);
    }

    /**
     * @param file the result file, for the messages
     * @param root the parsed file, already known to be a result object of the current format
     * @throws InputProblem naming the first field that is out of place, by JSON path
     */
    void check(Path file, JsonNode root) throws InputProblem {
        bounded(file, root, "$");
        for (Rule rule : RULES) {
            apply(file, root, rule.path().split("\\."), 0, "$", rule);
        }
        for (String name : CURVES) {
            JsonNode curve = root.path("curves").path(name);
            if (!curve.isMissingNode() && curve.size() != root.path("curves").path("frequency_hz").size()) {
                throw problem(file, "$.curves." + name, "has " + curve.size() + " values for "
                        + root.path("curves").path("frequency_hz").size() + " frequencies");
            }
        }
        ascending(file, root.path("sweep").path("points"), "$.sweep.points", true);
        ascending(file, root.path("curves").path("frequency_hz"), "$.curves.frequency_hz", false);
        if (root.path("sweep").path("points").size() < 2) {
            throw problem(file, "$.sweep.points", "holds fewer than two points; a sweep has at least two");
        }
        for (int i = 0; i < root.path("capacitors").size(); i++) {
            JsonNode c = root.path("capacitors").get(i);
            if (c.path("u_ln").asDouble() > MAX_U_LN) {
                throw problem(file, "$.capacitors[" + i + "].u_ln", "is " + c.path("u_ln").asDouble()
                        + ", beyond any uncertainty of ln C a back-solve gives (at most " + (int) MAX_U_LN + ")");
            }
            if (c.path("min_farads").isNumber() != c.path("max_farads").isNumber()
                    || c.path("min_farads").asDouble() > c.path("max_farads").asDouble()) {
                throw problem(file, "$.capacitors[" + i + "].min_farads", "and max_farads do not make a band");
            }
        }
        identification(file, root.path("run"));
        verdict(file, root.path("verdict"));
    }

    /** The identification fields' own forms (issue 14), beyond their JSON types. */
    private static void identification(Path file, JsonNode run) throws InputProblem {
        JsonNode measure = run.path("test_level_measure");
        if (measure.isTextual() && !MEASURES.contains(measure.asText())) {
            throw problem(file, "$.run.test_level_measure", "is " + measure + "; it must be one of "
                    + String.join(", ", MEASURES) + ", or null");
        }
        JsonNode from = run.path("test_level_from");
        if (from.isTextual() && !from.asText().equals(TestLevel.COMMAND_LINE) && !from.asText().equals(TestLevel.CAPTURE_PLAN)) {
            throw problem(file, "$.run.test_level_from", "is " + from + "; it must be \"" + TestLevel.COMMAND_LINE
                    + "\", \"" + TestLevel.CAPTURE_PLAN + "\" or null");
        }
        JsonNode instruments = run.path("instruments");
        for (int i = 0; i < instruments.size(); i++) {
            JsonNode due = instruments.get(i).path("calibration_due");
            if (due.isTextual()) {
                try {
                    LocalDate.parse(due.asText(), DateTimeFormatter.ISO_LOCAL_DATE.withResolverStyle(ResolverStyle.STRICT));
                } catch (DateTimeParseException notADate) {
                    throw problem(file, "$.run.instruments[" + i + "].calibration_due", "is " + due
                            + "; it must be a date written YYYY-MM-DD, or null");
                }
            }
        }
    }

    /**
     * Decides the verdict again from the file's own values, uncertainties and limits, and refuses a
     * stored decision, margin, guard band or overall result that disagrees.
     */
    private static void verdict(Path file, JsonNode verdict) throws InputProblem {
        String ruleWord = verdict.path("rule").asText("");
        DecisionRule rule;
        if (ruleWord.equals("simple")) {
            rule = DecisionRule.SIMPLE;
        } else if (ruleWord.equals("guarded")) {
            rule = DecisionRule.GUARDED;
        } else {
            throw problem(file, "$.verdict.rule", "is " + verdict.path("rule") + "; it must be \"simple\" or \"guarded\"");
        }
        if (!verdict.path("rule_statement").asText().equals(rule.statement())) {
            throw problem(file, "$.verdict.rule_statement", "does not state the " + ruleWord + " rule");
        }
        boolean anyFail = false;
        int undecided = 0;
        JsonNode checks = verdict.path("checks");
        for (int i = 0; i < checks.size(); i++) {
            JsonNode c = checks.get(i);
            String at = "$.verdict.checks[" + i + "]";
            OptionalDouble min = optional(c.path("min"));
            OptionalDouble max = optional(c.path("max"));
            if (min.isEmpty() && max.isEmpty()) {
                throw problem(file, at + ".min", "and max are both null; a check needs a limit");
            }
            if (min.isPresent() && max.isPresent() && min.getAsDouble() > max.getAsDouble()) {
                throw problem(file, at + ".min", "is above " + at + ".max");
            }
            if (!c.path("decided").asBoolean()) {
                undecided++;
                for (String key : new String[] {"pass", "margin", "guard_band"}) {
                    if (!c.path(key).isNull()) {
                        throw problem(file, at + "." + key, "is set on a limit the sweep does not decide; it must be null");
                    }
                }
                if (!c.path("reason").isTextual()) {
                    throw problem(file, at + ".reason", "is missing; a limit not decided says why");
                }
                continue;
            }
            for (String key : new String[] {"value", "expanded_uncertainty", "margin", "guard_band", "pass"}) {
                if (c.path(key).isNull() || c.path(key).isMissingNode()) {
                    throw problem(file, at + "." + key, "is missing from a decided check");
                }
            }
            LimitCheck again = LimitCheck.decide(c.path("quantity").asText(), c.path("unit").asText(),
                    c.path("value").asDouble(), c.path("expanded_uncertainty").asDouble(),
                    c.path("coverage_factor").isNumber() && c.path("coverage_factor").asDouble() > 0
                            ? c.path("coverage_factor").asDouble() : 2, min, max, rule);
            double scale = Math.max(1e-300, Math.abs(c.path("value").asDouble())
                    + Math.abs(min.orElse(0)) + Math.abs(max.orElse(0)));
            // the file holds shortest round-trip decimals, so a margin written by reconcile comes
            // back to the last bit; 1e-12 of the values' size allows a hand copy of them
            if (Math.abs(again.marginToLimit() - c.path("margin").asDouble()) > 1e-12 * scale) {
                throw problem(file, at + ".margin", "is " + c.path("margin").asDouble() + " but the value and limits "
                        + "in the file give " + again.marginToLimit());
            }
            if (Math.abs(rule.guardBand(again.expandedUncertainty()) - c.path("guard_band").asDouble()) > 1e-12 * scale) {
                throw problem(file, at + ".guard_band", "is not the " + ruleWord + " rule's guard band for this U");
            }
            if (again.pass() != c.path("pass").asBoolean()) {
                throw problem(file, at + ".pass", "says " + c.path("pass").asBoolean() + " but the value, U and limits "
                        + "in the file give " + (again.pass() ? "pass" : "fail") + " under the " + ruleWord + " rule");
            }
            anyFail |= !again.pass();
        }
        if (verdict.path("not_checked").size() != undecided) {
            throw problem(file, "$.verdict.not_checked", "holds " + verdict.path("not_checked").size()
                    + " statements for " + undecided + " limits not decided");
        }
        // the overall rule of docs/method.md, "The verdict" (reconcile's Verdict.overall)
        String overall = anyFail ? "fail" : checks.size() == 0 || undecided > 0 ? "incomplete" : "pass";
        if (!verdict.path("overall").asText().equals(overall)) {
            throw problem(file, "$.verdict.overall", "says " + verdict.path("overall") + " but the checks in the file "
                    + "give \"" + overall + "\"");
        }
    }

    private static OptionalDouble optional(JsonNode value) {
        return value.isNumber() ? OptionalDouble.of(value.asDouble()) : OptionalDouble.empty();
    }

    private static void ascending(Path file, JsonNode list, String at, boolean points) throws InputProblem {
        double previous = 0;
        for (int i = 0; i < list.size(); i++) {
            double f = points ? list.get(i).path("frequency_hz").asDouble() : list.get(i).asDouble();
            if (f <= previous) {
                throw problem(file, at + "[" + i + "]" + (points ? ".frequency_hz" : ""),
                        "is not above the frequency before it; frequencies rise along the list");
            }
            previous = f;
        }
    }

    /** Every number finite and of bounded size, every list of bounded length, anywhere in the file. */
    private static void bounded(Path file, JsonNode node, String at) throws InputProblem {
        if (node.isNumber()) {
            double v = node.asDouble();
            if (!Double.isFinite(v) || Math.abs(v) > MAX_MAGNITUDE) {
                throw problem(file, at, "is " + node.asText() + ", beyond any number a result holds (|x| ≤ 1e30)");
            }
        } else if (node.isArray()) {
            if (node.size() > MAX_LIST) {
                throw problem(file, at, "holds " + node.size() + " entries, more than " + MAX_LIST);
            }
            for (int i = 0; i < node.size(); i++) {
                bounded(file, node.get(i), at + "[" + i + "]");
            }
        } else if (node.isObject()) {
            Iterator<Map.Entry<String, JsonNode>> fields = node.fields();
            while (fields.hasNext()) {
                Map.Entry<String, JsonNode> field = fields.next();
                bounded(file, field.getValue(), at + "." + field.getKey());
            }
        }
    }

    private static void apply(Path file, JsonNode node, String[] keys, int k, String at, Rule rule) throws InputProblem {
        String key = keys[k];
        boolean each = key.endsWith("[]");
        String name = each ? key.substring(0, key.length() - 2) : key;
        JsonNode child = name.isEmpty() ? node : node.path(name);
        String here = name.isEmpty() ? at : at + "." + name;
        boolean last = k == keys.length - 1;
        if (each) {
            if (child.isMissingNode() || child.isNull()) {
                return; // the list's own rule says whether it may be absent
            }
            if (!child.isArray()) {
                throw problem(file, here, "is not a list");
            }
            for (int i = 0; i < child.size(); i++) {
                if (last) {
                    test(file, child.get(i), here + "[" + i + "]", rule);
                } else {
                    apply(file, child.get(i), keys, k + 1, here + "[" + i + "]", rule);
                }
            }
            return;
        }
        if (last) {
            test(file, child, here, rule);
        } else if (!child.isMissingNode() && !child.isNull()) {
            apply(file, child, keys, k + 1, here, rule);
        }
    }

    private static void test(Path file, JsonNode value, String at, Rule rule) throws InputProblem {
        if (value.isMissingNode() || value.isNull()) {
            if (rule.nullable()) {
                return;
            }
            throw problem(file, at, value.isNull() ? "is null; it must be " + rule.kind().words()
                    : "is missing; it must be " + rule.kind().words());
        }
        if (!fits(value, rule.kind())) {
            String shown = value.isContainerNode() ? (value.isArray() ? "a list" : "an object") : value.toString();
            if (shown.length() > 40) {
                shown = shown.substring(0, 40) + "…";
            }
            throw problem(file, at, "is " + shown + "; it must be " + rule.kind().words());
        }
    }

    private static boolean fits(JsonNode value, Kind kind) {
        double v = value.asDouble();
        switch (kind) {
            case TEXT: return value.isTextual();
            case BOOLEAN: return value.isBoolean();
            case NUMBER: return value.isNumber();
            case POSITIVE: return value.isNumber() && v > 0;
            case NON_NEGATIVE: return value.isNumber() && v >= 0;
            case FRACTION: return value.isNumber() && v >= 0 && v <= 1;
            case COUNT: return value.isIntegralNumber() && value.canConvertToLong() && value.asLong() >= 0;
            case INTEGER: return value.isIntegralNumber() && value.canConvertToLong();
            case OBJECT: return value.isObject();
            case LIST: return value.isArray();
            default: throw new IllegalStateException(kind.name());
        }
    }

    private static InputProblem problem(Path file, String at, String what) {
        return new InputProblem(file, 0, String.format(Locale.ROOT, "%s %s", at, what),
                "give the result.json that polebench reconcile wrote, unedited, or run reconcile again");
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Locale;
import org.polebench.reconcile.AdequacyTest;
import org.polebench.reconcile.FaultRanking;
import org.polebench.reconcile.ModelAdequacy;
import org.polebench.units.MeasuredValueFormat;

/**
 * The test report's diagnosis sections: whether the stage explains the sweep (the adequacy
 * checks, section 4.4) and the ranked hypotheses (4.5), written from the result JSON with
 * ReportHtml's formatting. Stateless.
 */
final class DiagnosisHtml {
    private DiagnosisHtml() {
    }

    /** 4.4: the adequacy test's evidence, each check with its threshold. */
    static void adequacy(JsonNode diagnosis, StringBuilder h) {
        // the statement opens with the answer: explained, not explained, or not a board of this stage
        h.append("<h3>4.4 Does the stage explain the sweep?</h3>\n<p id=\"adequacy-result\">")
                .append(ReportHtml.esc(diagnosis.path("statement").asText())).append("</p>\n");
        String alpha = ReportHtml.fraction(AdequacyTest.ALPHA);
        h.append("<table id=\"adequacy\" class=\"data compact\">\n<thead><tr><th>Check</th><th>Value</th>"
                + "<th>Alarm when</th></tr></thead>\n<tbody>\n");
        boolean stated = diagnosis.path("p_value_basis").asText().equals("stated_uncertainties");
        h.append("<tr><td>χ² of the most probable hypothesis at the point σ, over ν</td><td>")
                .append(MeasuredValueFormat.sixFigures(diagnosis.path("chi_squared").asDouble())).append(" over ν = ")
                .append(diagnosis.path("degrees_of_freedom").asInt())
                .append(stated ? ", " + ReportHtml.esc(DiagnosisText.pEquals(diagnosis.path("p_value").asDouble()))
                        : " (the sweep states no point uncertainties: not tested)")
                .append("</td><td>p &lt; ").append(alpha).append("</td></tr>\n");
        h.append("<tr><td>Stage model against a free rational fit: ratio of their χ²/ν</td><td>")
                .append(diagnosis.path("free_fit_ratio").isNumber()
                        ? DiagnosisText.ratio(diagnosis.path("free_fit_ratio").asDouble()) + ", "
                        + ReportHtml.esc(DiagnosisText.pEquals(diagnosis.path("free_fit_p_value").asDouble()))
                        : "not available for this sweep")
                .append("</td><td>p &lt; ").append(alpha).append(", with a ratio of ")
                .append(ReportHtml.fraction(AdequacyTest.FAR_WORSE_RATIO)).append(" or more or a material misfit</td></tr>\n");
        h.append("<tr><td>Residual structure along frequency (lag-1 autocorrelation)</td><td>")
                .append(ReportHtml.esc(DiagnosisText.pEquals(diagnosis.path("structure_p_value").asDouble())))
                .append("</td><td>p &lt; ").append(alpha).append(" and a material misfit</td></tr>\n");
        h.append("<tr><td>Parts held within tolerance</td><td>")
                .append(ReportHtml.esc(DiagnosisText.pEquals(diagnosis.path("tolerance_p_value").asDouble())))
                .append(diagnosis.path("parts_outside_tolerance").size() > 0 ? "; outside: "
                        + ReportHtml.esc(String.join(", ", textList(diagnosis.path("parts_outside_tolerance")))) : "")
                .append("</td><td>p &lt; ").append(alpha).append(" or one part beyond ")
                .append(ReportHtml.fraction(AdequacyTest.OUTSIDE_TOLERANCE_SIGMAS)).append(" σ</td></tr>\n");
        h.append("</tbody>\n</table>\n");
        JsonNode findings = diagnosis.path("findings");
        if (findings.size() > 0) {
            h.append("<ul id=\"adequacy-findings\" class=\"notes\">\n");
            for (JsonNode finding : findings) {
                h.append("<li>").append(ReportHtml.esc(finding(finding.asText()))).append("</li>\n");
            }
            h.append("</ul>\n");
        }
        h.append("<p class=\"note\">A misfit is material when its systematic part (the mean square residual less the "
                + "noise read from successive differences) reaches ")
                .append(ReportHtml.fraction(AdequacyTest.MATERIAL_MEAN_SQUARE)).append(" of the point σ². The sweep does not look "
                        + "like a board of this stage when the most probable hypothesis misses it by a χ²/ν of ")
                .append(MeasuredValueFormat.sixFigures(AdequacyTest.FAR_REDUCED_CHI_SQUARE))
                .append(" or more, or by ").append(ReportHtml.fraction(AdequacyTest.FAR_RATIO))
                .append(" times the free fit's χ²/ν or more, when its corner lies outside the tolerance spread's "
                        + "extremes widened ").append(ReportHtml.fraction(AdequacyTest.SPREAD_WIDENING))
                .append("×, or when its midband lies more than ").append(ReportHtml.fraction(AdequacyTest.FAR_GAIN_DB))
                .append(" dB from the stage's.</p>\n");
    }

    private static java.util.List<String> textList(JsonNode array) {
        java.util.List<String> texts = new java.util.ArrayList<>();
        for (JsonNode item : array) {
            texts.add(item.asText());
        }
        return texts;
    }

    /** One finding of the adequacy test, as the JSON names it, in the words the terminal uses. */
    private static String finding(String word) {
        try {
            return DiagnosisText.finding(ModelAdequacy.Finding.valueOf(word.toUpperCase(Locale.ROOT)));
        } catch (IllegalArgumentException unknown) {
            return word.replace('_', ' ');
        }
    }

    static void hypotheses(JsonNode root, StringBuilder h) {
        boolean relative = ReportHtml.relative(root);
        boolean pairs = root.path("pairs_ranked").asBoolean();
        h.append("<h3>4.5 Ranked ").append(pairs ? "single- and double-fault" : "single-fault").append(" hypotheses</h3>\n");
        if (relative) {
            h.append("<p id=\"probabilities-relative\" class=\"deviation\"><b>Relative probabilities:</b> no hypothesis "
                    + "below explains the sweep (4.4). The probabilities rank them against each other only; they are "
                    + "not the chance that any of them is the board's fault.</p>\n");
        }
        h.append("<table id=\"hypotheses\" class=\"data\">\n<thead><tr><th>Rank</th><th>Hypothesis</th><th>Prior</th><th>")
                .append(relative ? "Posterior, RELATIVE" : "Posterior")
                .append("</th><th>Estimate ± U (k = 2)</th><th>×nominal</th><th>Nearest preferred value</th><th>Statement</th>"
                        + "</tr></thead>\n<tbody>\n");
        int rank = 1;
        for (JsonNode y : root.path("hypotheses")) {
            h.append("<tr><td>").append(rank++).append("</td><td>").append(ReportHtml.esc(ReportHtml.label(y))).append("</td><td>")
                    .append(ReportHtml.probability(y.path("prior_probability").asDouble())).append("</td><td>")
                    .append(ReportHtml.percent(y.path("probability").asDouble())).append("</td><td>");
            if (y.path("kind").asText().equals("double")) {
                // a double's two faults, one line each, in the order its label names them
                StringBuilder estimates = new StringBuilder();
                StringBuilder factors = new StringBuilder();
                for (JsonNode fault : y.path("faults")) {
                    String separator = estimates.length() == 0 ? "" : "<br>";
                    estimates.append(separator).append(ReportHtml.esc(ReportHtml.label(fault))).append(": ")
                            .append(fault.path("estimated_value").isNumber() ? ReportHtml.estimateText(fault.path("estimated_value")
                                    .asDouble(), fault.path("u_value").asDouble(), fault.path("unit").asText("")) : ReportHtml.NONE);
                    factors.append(separator).append(fault.path("estimated_factor").isNumber()
                            ? MeasuredValueFormat.fixed(fault.path("estimated_factor").asDouble(), 3) : ReportHtml.NONE);
                }
                h.append(estimates).append("</td><td>").append(factors).append("</td><td>").append(ReportHtml.NONE);
            } else {
                String unit = y.path("unit").isTextual() ? y.path("unit").asText() : "";
                h.append(y.path("estimated_value").isNumber() ? ReportHtml.estimateText(y.path("estimated_value").asDouble(),
                                y.path("u_value").asDouble(), unit) : ReportHtml.NONE)
                        .append("</td><td>").append(y.path("estimated_factor").isNumber()
                                ? MeasuredValueFormat.fixed(y.path("estimated_factor").asDouble(), 3) : ReportHtml.NONE)
                        .append("</td><td>").append(y.path("nearest_preferred").isNumber()
                                ? ReportHtml.eng(y.path("nearest_preferred").asDouble(), unit)
                                + (y.path("decade_slip").asBoolean() ? " <b>(decade slip)</b>" : "") : ReportHtml.NONE);
            }
            // as the text summary: "no fault" is not described as agreeing with the sweep where it
            // is the less probable
            boolean quiet = y.path("kind").asText().equals("none") && y.path("probability").asDouble() < 0.5;
            h.append("</td><td>").append(quiet ? ReportHtml.NONE : ReportHtml.esc(y.path("statement").asText())).append("</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
        JsonNode noise = root.path("noise");
        h.append("<p class=\"note\">Probabilities from the Laplace evidence of each hypothesis with the priors shown (no "
                        + "fault ").append(ReportHtml.fraction(FaultRanking.NO_FAULT_PRIOR)).append("; the single faults share ")
                .append(ReportHtml.fraction(FaultRanking.SINGLE_FAULTS_PRIOR)).append(", the measuring chain ")
                .append(ReportHtml.fraction(FaultRanking.BENCH_PRIOR)).append(", the pairs ")
                .append(ReportHtml.fraction(FaultRanking.DOUBLE_FAULTS_PRIOR))
                .append(" over every pair that could be formed), normalised over the hypotheses ranked; ")
                .append(pairs ? "pairs of single faults were ranked because no single fault explains the sweep. "
                        : "pairs were not ranked, as a single fault or none explains the sweep. ");
        if (noise.path("stated_by_sweep").asBoolean()) {
            h.append("Point σ as the sweep states them, scaled by ")
                    .append(MeasuredValueFormat.fixed(noise.path("gain_scale").asDouble(), 3))
                    .append(" (the best hypothesis' residual scale)");
        } else {
            h.append("Point σ ").append(MeasuredValueFormat.sixFigures(noise.path("default_gain_sigma_db").asDouble()))
                    .append(" dB and ").append(MeasuredValueFormat.sixFigures(noise.path("default_phase_sigma_deg").asDouble()))
                    .append("° (the sweep states none), scaled by ")
                    .append(MeasuredValueFormat.fixed(noise.path("gain_scale").asDouble(), 3)).append(" for the gain and ")
                    .append(MeasuredValueFormat.fixed(noise.path("phase_scale").asDouble(), 3))
                    .append(" for the phase (two variance components from the best hypothesis' residuals)");
        }
        h.append("; χ² = ").append(MeasuredValueFormat.fixed(noise.path("chi_squared").asDouble(), 1)).append(" over ")
                .append(noise.path("data_rows").asInt()).append(" residuals. The statements quote ± the standard "
                        + "uncertainty u; the estimate column gives U = 2u.</p>\n");
    }
}

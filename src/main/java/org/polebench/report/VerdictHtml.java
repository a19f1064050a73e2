package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Locale;

/**
 * The test report's verdict section: every limit decided or not decided, with the decision rule
 * and where each checked value came from, written from the result JSON with ReportHtml's
 * formatting. Stateless.
 */
final class VerdictHtml {
    private VerdictHtml() {
    }

    /**
     * The checks that did not pass, for page 1: each failed check with its value, U, limit and
     * margin, and each limit not decided with its reason; nothing when every check passed.
     */
    static void summaryChecks(JsonNode verdict, StringBuilder h) {
        StringBuilder rows = new StringBuilder();
        for (JsonNode c : verdict.path("checks")) {
            String unit = c.path("unit").asText();
            boolean decided = c.path("decided").asBoolean(true);
            if (decided && c.path("pass").asBoolean()) {
                continue;
            }
            double expanded = c.path("expanded_uncertainty").asDouble(0);
            rows.append("<tr class=\"").append(decided ? "fail" : "undecided").append("\"><td>")
                    .append(ReportHtml.esc(c.path("quantity").asText())).append("</td><td>")
                    .append(c.path("value").isNumber() ? ReportHtml.quantity(c.path("value").asDouble(), expanded, unit)
                            : ReportHtml.NONE).append("</td><td>")
                    // U in the value's prefix and decimal place, with its own k, as section 4.6 and
                    // the terminal print it (issue 14: one number, one formatter)
                    .append(c.path("value").isNumber() ? ReportHtml.uncertaintyBeside(c.path("value").asDouble(), expanded,
                            unit) + ReportHtml.k(c.path("coverage_factor")) : ReportHtml.NONE)
                    .append("</td><td>").append(ReportHtml.limit(c.path("min"), c.path("max"), unit)).append("</td><td>")
                    .append(decided ? ReportHtml.quantity(c.path("margin").asDouble(), expanded, unit) : ReportHtml.NONE)
                    .append("</td><td><b>").append(decided ? "FAIL" : "not decided: "
                            + ReportHtml.esc(c.path("reason").asText().replace('_', ' '))).append("</b></td></tr>\n");
        }
        if (rows.length() == 0) {
            return;
        }
        h.append("<table id=\"summary-checks\" class=\"summary-checks\">\n<thead><tr><th>Check</th><th>Value</th>"
                + "<th>U (k)</th><th>Limit</th><th>Margin</th><th>Decision</th></tr></thead>\n<tbody>\n")
                .append(rows).append("</tbody>\n</table>\n");
    }

    static void verdict(JsonNode root, StringBuilder h) {
        JsonNode verdict = root.path("verdict");
        h.append("<h3>4.6 Verdict against the stage's limits</h3>\n<table id=\"verdict\" class=\"data\">\n<thead><tr>"
                + "<th>Check</th><th>Value</th><th>U (k)</th><th>Limit</th><th>Margin to limit</th><th>Guard band</th>"
                + "<th>Decision</th></tr></thead>\n<tbody>\n");
        for (JsonNode c : verdict.path("checks")) {
            String unit = c.path("unit").asText();
            if (!c.path("decided").asBoolean(true)) {
                // not decided (issue 11): a value only for information, no margin and no decision
                h.append("<tr class=\"undecided\"><td>").append(ReportHtml.esc(c.path("quantity").asText()))
                        .append("</td><td>").append(c.path("value").isNumber()
                                ? ReportHtml.quantity(c.path("value").asDouble(), c.path("expanded_uncertainty").asDouble(), unit)
                                + " <span class=\"note\">(not from the sweep)</span>" : ReportHtml.NONE)
                        .append("</td><td>").append(c.path("value").isNumber()
                                ? ReportHtml.uncertaintyBeside(c.path("value").asDouble(), c.path("expanded_uncertainty").asDouble(), unit)
                                + ReportHtml.k(c.path("coverage_factor")) : ReportHtml.NONE)
                        .append("</td><td>").append(ReportHtml.limit(c.path("min"), c.path("max"), unit))
                        .append("</td><td>").append(ReportHtml.NONE).append("</td><td>").append(ReportHtml.NONE)
                        .append("</td><td><b>not decided</b></td></tr>\n");
                continue;
            }
            boolean pass = c.path("pass").asBoolean();
            h.append("<tr class=\"").append(pass ? "pass" : "fail").append("\"><td>").append(ReportHtml.esc(c.path("quantity").asText()))
                    .append("</td><td>").append(ReportHtml.quantity(c.path("value").asDouble(), c.path("expanded_uncertainty").asDouble(), unit))
                    .append("</td><td>").append(ReportHtml.uncertaintyBeside(c.path("value").asDouble(), c.path("expanded_uncertainty").asDouble(), unit))
                    .append(ReportHtml.k(c.path("coverage_factor")))
                    .append("</td><td>").append(ReportHtml.limit(c.path("min"), c.path("max"), unit))
                    .append("</td><td>").append(ReportHtml.quantity(c.path("margin").asDouble(), c.path("expanded_uncertainty").asDouble(), unit))
                    .append("</td><td>").append(c.path("guard_band").asDouble() == 0 ? "none"
                            : ReportHtml.uncertainty(c.path("guard_band").asDouble(), unit))
                    .append("</td><td><b>").append(pass ? "pass" : "FAIL").append("</b></td></tr>\n");
        }
        if (verdict.path("checks").size() == 0) {
            h.append("<tr><td colspan=\"7\">The stage file names no limits: nothing was decided, so the result is "
                    + "incomplete.</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
        for (JsonNode line : verdict.path("not_checked")) {
            h.append("<p class=\"note\">").append(ReportHtml.esc(ReportHtml.capitalised(line.asText()))).append(".</p>\n");
        }
        h.append("<p>Rule: ").append(ReportHtml.esc(verdict.path("rule_statement").asText()))
                .append(". Margin is the distance from the value to the nearest limit, positive inside. A limit is decided "
                        + "only from a quantity the sweep itself determines; one it does not decide is never passed, "
                        + "and makes the result incomplete unless a decided check fails. Overall: <b>")
                .append(ReportHtml.esc(verdict.path("overall").asText().toUpperCase(Locale.ROOT))).append("</b>.</p>\n");
    }
}

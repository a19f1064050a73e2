package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import org.polebench.units.EngineeringValue;

/**
 * The report's paragraph on the measuring chain: the bench as a bench file declared it or as a
 * measuring-chain hypothesis inferred it, the lower corner as measured, and the board's own, on
 * which the limits are decided. Written from the result document, as the rest of the report.
 */
final class BenchHtml {
    private BenchHtml() {
    }

    /** Appends the paragraph, when the result names a bench (declared or inferred). */
    static void paragraph(JsonNode root, StringBuilder h) {
        // the bench as declared or inferred, and that the limits are the board's own
        JsonNode bench = root.path("bench");
        String basis = bench.path("basis").asText("none");
        if (!basis.equals("none")) {
            h.append("<p id=\"bench\">Measuring chain ").append(basis.equals("declared")
                    ? "declared in " + ReportHtml.esc(bench.path("file").asText("the bench file")) + ": "
                    + ReportHtml.esc(bench.path("description").asText())
                    : "inferred from the sweep: " + ReportHtml.esc(bench.path("description").asText()))
                    .append(". The lower corner as measured was ")
                    .append(ReportHtml.esc(hzText(root.path("measured").path("as_measured_lower_corner_hz").path("value"))))
                    .append("; the limits are decided on the board's own, ")
                    .append(ReportHtml.esc(hzText(root.path("measured").path("lower_corner_hz").path("value"))))
                    .append(", with the chain taken out.</p>\n");
        }
    }

    private static String hzText(JsonNode value) {
        return value.isNumber() ? EngineeringValue.format(value.asDouble(), "Hz", 4) : "not quoted";
    }
}

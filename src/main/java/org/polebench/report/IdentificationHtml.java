package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.math.BigDecimal;
import org.polebench.units.MeasuredValueFormat;

/**
 * The report's rows for the approver, the conditions and the instruments (ISO/IEC 17025:2017
 * 7.8.2.1, issue 14), on page 1 and in section 1, written from the result document's {@code run}.
 * What the result does not hold is left as a blank to fill by hand, never filled in here.
 */
final class IdentificationHtml {
    private static final String BLANK = "<span class=\"blank short\"></span>";

    private IdentificationHtml() {
    }

    /** Page 1's rows under "Who": the conditions and the instruments, each blank where not given. */
    static void summaryRows(JsonNode root, StringBuilder h) {
        JsonNode run = root.path("run");
        ReportHtml.field(h, "Conditions", "ambient " + ambient(run) + "; supply " + supply(run) + "; test level "
                + level(run), "conditions");
        ReportHtml.field(h, "With", instruments(root, true), "instruments");
    }

    /** Section 1's rows after the operator. */
    static void sectionRows(JsonNode root, StringBuilder h) {
        JsonNode run = root.path("run");
        ReportHtml.field(h, "Approved by", run.path("approved_by").isTextual()
                ? ReportHtml.esc(run.path("approved_by").asText()) : BLANK, "approved-by");
        ReportHtml.field(h, "Instruments used (identity, serial number, calibration due)", instruments(root, false),
                "instruments-used");
        ReportHtml.field(h, "Ambient temperature as measured", ambient(run), "ambient");
        ReportHtml.field(h, "Supply voltage as measured", supply(run), "supply");
        ReportHtml.field(h, "Test level", level(run), "test-level");
    }

    private static String ambient(JsonNode run) {
        return measured(run.path("ambient_celsius"), "°C", false);
    }

    private static String supply(JsonNode run) {
        return measured(run.path("supply_volts"), "V", true);
    }

    private static String level(JsonNode run) {
        String value = measured(run.path("test_level_volts"), "V", true);
        JsonNode measure = run.path("test_level_measure");
        if (!run.path("test_level_volts").isNumber()) {
            return value;
        }
        String from = run.path("test_level_from").asText("");
        return value + (measure.isTextual() ? " " + ReportHtml.esc(measure.asText()) : "")
                + (from.equals(TestLevel.CAPTURE_PLAN) ? " <span class=\"note\">(the generator level polebench capture "
                + "recorded in the sweep file)</span>" : "");
    }

    /**
     * The instruments given as options, one per line, with blanks for a serial or date not given;
     * then, with {@code withSweep}, the instrument the sweep file names, if any, marked as from the
     * sweep (section 1 has its own row for that one).
     */
    private static String instruments(JsonNode root, boolean withSweep) {
        StringBuilder s = new StringBuilder();
        for (JsonNode instrument : root.path("run").path("instruments")) {
            if (s.length() > 0) {
                s.append("<br>");
            }
            s.append(ReportHtml.esc(instrument.path("identity").asText())).append(", serial ")
                    .append(instrument.path("serial").isTextual() ? ReportHtml.esc(instrument.path("serial").asText()) : BLANK)
                    .append(", calibration due ").append(instrument.path("calibration_due").isTextual()
                            ? ReportHtml.esc(instrument.path("calibration_due").asText()) : BLANK);
        }
        String fromSweep = root.path("sweep").path("instrument").asText("");
        if (withSweep && !fromSweep.isEmpty()) {
            s.append(s.length() > 0 ? "<br>" : "").append(ReportHtml.esc(fromSweep))
                    .append(" <span class=\"note\">(as the sweep file names it)</span>");
        }
        return s.length() > 0 ? s.toString() : BLANK;
    }

    /**
     * A measured value to the digits it was given with (a 12.02 V supply is not rounded to 12.0 V),
     * with an SI prefix where {@code prefixed}; a blank when the result holds none.
     */
    private static String measured(JsonNode value, String unit, boolean prefixed) {
        if (!value.isNumber()) {
            return BLANK;
        }
        double v = value.asDouble();
        int digits = Math.max(1, Math.min(15, BigDecimal.valueOf(v).stripTrailingZeros().precision()));
        if (prefixed) {
            return ReportHtml.esc(MeasuredValueFormat.engineering(v, unit, digits));
        }
        // plain decimals for a temperature (no "m°C"); one minus sign (U+2212), no negative zero
        BigDecimal plain = BigDecimal.valueOf(v).stripTrailingZeros();
        String digitsText = plain.signum() == 0 ? "0" : plain.toPlainString().replace("-", "\u2212");
        return ReportHtml.esc(digitsText + " " + unit);
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * The capacitor back-solve table as CSV ({@code capacitors.csv}): one header line, then one row
 * per low-band capacitor in port order, with the columns {@code part, nominal_farads, tolerance,
 * tolerance_low_percent, tolerance_high_percent, min_farads, max_farads, estimated_farads,
 * u_farads, expanded_u_farads, factor, within_tolerance, identifiable, hypothesis}. The tolerance
 * is there as the stage file wrote it and as two numbers, its lower and upper deviation in
 * percent (−10 and 10 for ±10 %), so that a spreadsheet can compute with it.
 *
 * <p>Numbers are plain decimals rounded to 12 significant digits: a double carries about 16, and
 * the last few of a product such as 2.2 µF × 0.9 are binary noise (1.9800000000000002E-6) that no
 * back-solve resolves. The text starts with a UTF-8 byte-order mark so that spreadsheets read it
 * as UTF-8 and show µ and ± as written (common practice: without it, several take the file as
 * their locale's 8-bit code page).
 *
 * <p>Quoting follows RFC 4180: a field holding a comma, a double quote, CR or LF is enclosed in
 * double quotes with inner quotes doubled; lines end in CRLF. A text field that a spreadsheet
 * would read as a formula, one beginning with {@code =}, {@code +}, {@code -}, {@code @}, a tab or
 * a carriage return, is neutralised by prefixing a single quote (common practice, OWASP "CSV
 * Injection"), so a part id such as {@code =HYPERLINK("x")} is shown as text, never run. A number
 * is written by this class from a double and holds only digits, a point and a leading minus, so a
 * negative one is left as it is: a spreadsheet reads it as a number.
 */
public final class CapacitorCsv {
    /** The byte-order mark that opens the file. */
    static final String BOM = "\uFEFF";
    private static final MathContext TWELVE_FIGURES = new MathContext(12, RoundingMode.HALF_EVEN);
    private static final String[] HEADER = {"part", "nominal_farads", "tolerance", "tolerance_low_percent",
        "tolerance_high_percent", "min_farads", "max_farads", "estimated_farads", "u_farads", "expanded_u_farads",
        "factor", "within_tolerance", "identifiable", "hypothesis"};

    /** @return the CSV text, byte-order mark first, CRLF line ends, for the result's {@code capacitors} */
    public String of(JsonNode root) {
        StringBuilder out = new StringBuilder(BOM);
        List<String> header = new ArrayList<>();
        for (String name : HEADER) {
            header.add(field(name));
        }
        line(out, header);
        String hypothesis = root.path("back_solve_hypothesis").asText();
        for (JsonNode c : root.path("capacitors")) {
            double nominal = c.path("nominal_farads").asDouble();
            boolean band = c.path("min_farads").isNumber() && c.path("max_farads").isNumber() && nominal > 0;
            List<String> cells = new ArrayList<>();
            cells.add(field(c.path("id").asText()));
            cells.add(number(c.path("nominal_farads")));
            cells.add(field(c.path("tolerance").isTextual() ? c.path("tolerance").asText() : ""));
            cells.add(band ? number(100 * (c.path("min_farads").asDouble() / nominal - 1)) : "");
            cells.add(band ? number(100 * (c.path("max_farads").asDouble() / nominal - 1)) : "");
            cells.add(number(c.path("min_farads")));
            cells.add(number(c.path("max_farads")));
            cells.add(number(c.path("estimated_farads")));
            cells.add(number(c.path("u_farads")));
            cells.add(c.path("u_farads").isNumber() ? number(2 * c.path("u_farads").asDouble()) : "");
            cells.add(number(c.path("factor")));
            cells.add(c.path("within_tolerance").isBoolean() ? (c.path("within_tolerance").asBoolean() ? "yes" : "no") : "");
            cells.add(c.path("identifiable").asBoolean() ? "yes" : "no");
            cells.add(field(hypothesis));
            line(out, cells);
        }
        return out.toString();
    }

    private static void line(StringBuilder out, List<String> cells) {
        out.append(String.join(",", cells)).append("\r\n");
    }

    /** One text field, neutralised if it could start a formula, then quoted as RFC 4180 asks. */
    static String field(String text) {
        String safe = text;
        if (!safe.isEmpty() && "=+-@\t\r".indexOf(safe.charAt(0)) >= 0) {
            safe = "'" + safe;
        }
        if (safe.indexOf(',') >= 0 || safe.indexOf('"') >= 0 || safe.indexOf('\r') >= 0 || safe.indexOf('\n') >= 0) {
            return '"' + safe.replace("\"", "\"\"") + '"';
        }
        return safe;
    }

    private static String number(JsonNode value) {
        return value.isNumber() ? number(value.asDouble()) : "";
    }

    /** A finite double to 12 significant digits, plain decimal, no trailing zeros; empty otherwise. */
    static String number(double value) {
        if (!Double.isFinite(value)) {
            return "";
        }
        if (value == 0) {
            return "0";
        }
        return new BigDecimal(value).round(TWELVE_FIGURES).stripTrailingZeros().toPlainString();
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The capacitor back-solve table as CSV ({@code capacitors.csv}): one header line, then one row
 * per low-band capacitor in port order, with the columns {@code part, nominal_farads, tolerance,
 * min_farads, max_farads, estimated_farads, u_farads, expanded_u_farads, factor,
 * within_tolerance, identifiable, hypothesis}. Numbers are plain decimals (Java's shortest
 * round-trip form); every value written is positive, so no number begins with a sign.
 *
 * <p>Quoting follows RFC 4180: a field holding a comma, a double quote, CR or LF is enclosed in
 * double quotes with inner quotes doubled; lines end in CRLF. A field that a spreadsheet would
 * read as a formula, one beginning with {@code =}, {@code +}, {@code -}, {@code @}, a tab or a
 * carriage return, is neutralised by prefixing a single quote (common practice, OWASP "CSV
 * Injection"), so a part id such as {@code =HYPERLINK("x")} is shown as text, never run.
 */
public final class CapacitorCsv {
    private static final String[] HEADER = {"part", "nominal_farads", "tolerance", "min_farads", "max_farads",
        "estimated_farads", "u_farads", "expanded_u_farads", "factor", "within_tolerance", "identifiable", "hypothesis"};

    /** @return the CSV text, CRLF line ends, for the result's {@code capacitors} */
    public String of(JsonNode root) {
        StringBuilder out = new StringBuilder();
        line(out, List.of(HEADER));
        String hypothesis = root.path("back_solve_hypothesis").asText();
        for (JsonNode c : root.path("capacitors")) {
            List<String> cells = new ArrayList<>();
            cells.add(c.path("id").asText());
            cells.add(number(c.path("nominal_farads")));
            cells.add(c.path("tolerance").isTextual() ? c.path("tolerance").asText() : "");
            cells.add(number(c.path("min_farads")));
            cells.add(number(c.path("max_farads")));
            cells.add(number(c.path("estimated_farads")));
            cells.add(number(c.path("u_farads")));
            cells.add(c.path("u_farads").isNumber() ? Double.toString(2 * c.path("u_farads").asDouble()) : "");
            cells.add(number(c.path("factor")));
            cells.add(c.path("within_tolerance").isBoolean() ? (c.path("within_tolerance").asBoolean() ? "yes" : "no") : "");
            cells.add(c.path("identifiable").asBoolean() ? "yes" : "no");
            cells.add(hypothesis);
            line(out, cells);
        }
        return out.toString();
    }

    private static void line(StringBuilder out, List<String> cells) {
        for (int i = 0; i < cells.size(); i++) {
            if (i > 0) {
                out.append(',');
            }
            out.append(field(cells.get(i)));
        }
        out.append("\r\n");
    }

    /** One field, neutralised if it could start a formula, then quoted as RFC 4180 asks. */
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
        return value.isNumber() ? String.format(Locale.ROOT, "%s", Double.toString(value.asDouble())) : "";
    }
}

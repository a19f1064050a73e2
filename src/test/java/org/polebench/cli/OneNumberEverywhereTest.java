package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 14, "one source per quantity": each checked quantity of the bundled demo (invented demo
 * data) prints the same value, the same U and the same k in the terminal summary, in the HTML
 * report's page 1 and section 4.6, and agrees with the numbers result.json holds. The expected
 * text is worked here from the JSON numbers by the rule of GUM (JCGM 100:2008) 7.2.6 — U to two
 * significant digits, the value to the same decimal place — not by polebench's formatter.
 */
class OneNumberEverywhereTest {

    @Test
    void eachCheckedQuantityPrintsOneValueOneUAndOneKEverywhere(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("report");
        StringWriter text = new StringWriter();
        StringWriter err = new StringWriter();
        int exit = Main.run(new String[] {"reconcile", "--samples", "100", "--report", out.toString()},
                new PrintWriter(text, true), new PrintWriter(err, true));
        assertEquals(ExitCodes.VERDICT_FAILED, exit, err.toString());   // the demo board fails its corner limit
        JsonNode root = new ObjectMapper().readTree(out.resolve("result.json").toFile());
        String html = Files.readString(out.resolve("report.html"));
        String terminal = text.toString();

        int checked = 0;
        for (JsonNode check : root.path("verdict").path("checks")) {
            String unit = check.path("unit").asText();
            BigDecimal expanded = new BigDecimal(check.path("expanded_uncertainty").asDouble())
                    .round(new MathContext(2, RoundingMode.HALF_UP));
            BigDecimal value = new BigDecimal(check.path("value").asDouble())
                    .setScale(expanded.scale(), RoundingMode.HALF_UP);
            String k = new BigDecimal(check.path("coverage_factor").asDouble()).setScale(2, RoundingMode.HALF_UP)
                    .toPlainString();
            // both demo quantities lie between 1 and 1000 in their units: no SI prefix is due
            assertTrue(value.abs().compareTo(BigDecimal.ONE) >= 0 && value.abs().compareTo(new BigDecimal(1000)) < 0);
            String v = value.toPlainString().replace('-', '\u2212');
            String u = expanded.toPlainString();

            String line = check.path("quantity").asText() + "   " + v + " ± " + u + " " + unit + " (U, k = " + k + ")";
            assertTrue(terminal.contains(line), "terminal lacks '" + line + "':\n" + terminal);
            String row = "<td>" + v + " " + unit + "</td><td>" + u + " " + unit + " (k = " + k + ")</td>";
            assertTrue(html.contains(row), "section 4.6 lacks " + row);
            if (!check.path("pass").asBoolean()) {
                // page 1 repeats each failed check: the same cells
                int summary = html.indexOf("id=\"summary-checks\"");
                int end = html.indexOf("</table>", summary);
                assertTrue(summary > 0 && html.substring(summary, end).contains(row), "page 1 lacks " + row);
            }
            checked++;
        }
        assertEquals(2, checked, "the demo stage names a corner limit and a gain window");

        // the measured corner the verdict decides on is the fit's: U = k·u of the same number
        JsonNode corner = root.path("measured").path("lower_corner_hz");
        JsonNode check = root.path("verdict").path("checks").get(0);
        assertEquals("lower corner", check.path("quantity").asText());
        assertEquals(corner.path("value").asDouble(), check.path("value").asDouble(), 0.0);
        assertEquals(corner.path("u").asDouble() * check.path("coverage_factor").asDouble(),
                check.path("expanded_uncertainty").asDouble(), 1e-12 * check.path("expanded_uncertainty").asDouble());
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Locale;
import org.polebench.reconcile.AdequacyTest;
import org.polebench.reconcile.ModelAdequacy;
import org.polebench.reconcile.FaultRanking;
import org.polebench.units.EngineeringValue;
import org.polebench.units.MeasuredValueFormat;

/**
 * The test report as one self-contained HTML page, rendered from a result's JSON object
 * ({@link ResultJson}) alone, so that {@code reconcile --report} and {@code polebench report
 * RESULT.json} share one renderer and give the same page for the same result. It carries the
 * items of ISO/IEC 17025:2017 7.8.2.1 that polebench can know (title, unique id on every page,
 * dates of test and issue, the item, the method, the instrument, results with units and
 * expanded uncertainties, the decision rule (7.8.6), the scope statement, a clear end) and
 * leaves blanks to fill by hand for those it cannot (laboratory, customer, date of receipt,
 * signatures).
 *
 * <p>No script, no network: the CSS sits in a {@code <style>} element and the charts are inline
 * SVG. The id and the title run in a table header group and the footer in a table footer group,
 * which a browser repeats on every printed page. Every string that came from a user's file or
 * option (stage name, part ids, operator, board, notes, warnings) is HTML-escaped. For the same
 * result and stamp the page is byte-identical.
 */
public final class ReportHtml {
    static final String NONE = "—";

    private final ReportCharts charts = new ReportCharts();

    /**
     * @param root          the result, as {@link ResultJson} writes it
     * @param resultSha256  hex SHA-256 of the {@code result.json} bytes the page is rendered from
     * @param stamp         the report's id and date of issue
     */
    public String render(JsonNode root, String resultSha256, ReportStamp stamp) {
        StringBuilder h = new StringBuilder(400_000);
        String stage = root.path("predicted").path("stage").asText();
        String id = stamp.reportId();
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        h.append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        h.append("<meta name=\"generator\" content=\"polebench ").append(esc(root.path("polebench_version").asText()))
                .append("\">\n");
        h.append("<title>Test report ").append(esc(id)).append(" — ").append(esc(stage)).append("</title>\n");
        h.append("<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        h.append("<table class=\"sheet\">\n<thead><tr><td><div class=\"running-head\">")
                .append("<span>Test report <b class=\"report-id\">").append(esc(id)).append("</b></span>")
                .append("<span>").append(esc(stage)).append("</span>")
                .append("<span>issued ").append(esc(stamp.issuedText())).append("</span>")
                .append("</div></td></tr></thead>\n");
        h.append("<tfoot><tr><td><div class=\"running-foot\">")
                .append("<span>").append(esc(id)).append("</span>")
                .append("<span>polebench ").append(esc(root.path("polebench_version").asText())).append("</span>")
                .append("<span>The results relate only to the item tested.</span>")
                .append("</div></td></tr></tfoot>\n<tbody><tr><td>\n");

        h.append("<header class=\"title\">\n<h1>Test report</h1>\n<p class=\"subtitle\">Low-frequency response of an "
                + "amplifier stage: design prediction, bench sweep, capacitor back-solve and verdict</p>\n");
        h.append("<p class=\"ids\">Report <b id=\"report-id\">").append(esc(id)).append("</b> · issued <time id=\"date-of-issue\">")
                .append(esc(stamp.issuedText())).append("</time></p>\n</header>\n");
        summary(root, stamp, h);
        identification(root, stamp, h);
        method(root, h);
        instrument(root, h);
        results(root, h);
        traceability(root, resultSha256, h);
        cautions(h);
        statement(root, h);
        h.append("<p id=\"end-of-report\" class=\"end\">End of test report ").append(esc(id)).append("</p>\n");
        h.append("</td></tr></tbody>\n</table>\n</body>\n</html>\n");
        return h.toString();
    }

    /**
     * Page 1 (issue 14): who tested what and when, the verdict with every check that failed or
     * was not decided (value, U, limit, margin), and the diagnosis statement; the sections after
     * it give the detail.
     */
    private static void summary(JsonNode root, ReportStamp stamp, StringBuilder h) {
        JsonNode verdict = root.path("verdict");
        JsonNode run = root.path("run");
        JsonNode sweep = root.path("sweep");
        String overall = verdict.path("overall").asText();
        String css = overall.equals("pass") ? "pass" : overall.equals("fail") ? "fail" : "incomplete";
        h.append("<table id=\"who-what-when\" class=\"fields compact\">\n");
        field(h, "What", esc(root.path("predicted").path("stage").asText()) + ", board "
                + (run.path("board").isTextual() ? esc(run.path("board").asText()) : "not recorded"), null);
        field(h, "Who", "tested by " + (run.path("operator").isTextual() ? esc(run.path("operator").asText())
                : "<span class=\"blank short\"></span>") + "; approved by " + (run.path("approved_by").isTextual()
                ? esc(run.path("approved_by").asText()) : "<span class=\"blank short\"></span>"), null);
        field(h, "When", "tested " + (sweep.path("captured_utc").isTextual() ? esc(sweep.path("captured_utc").asText())
                : "(date not recorded in the sweep file)") + "; issued " + esc(stamp.issuedText()), null);
        IdentificationHtml.summaryRows(root, h);
        h.append("</table>\n");
        h.append("<section id=\"summary\" class=\"summary ").append(css).append("\">\n");
        h.append("<p class=\"verdict-word\">Verdict: <b id=\"verdict-overall\">").append(esc(overall.toUpperCase(Locale.ROOT)))
                .append("</b></p>\n");
        VerdictHtml.summaryChecks(verdict, h);
        diagnosis(root.path("diagnosis"), h);
        h.append("<p>").append(esc(verdict.path("rule_statement").asText())).append(".</p>\n");
        for (JsonNode line : verdict.path("not_checked")) {
            h.append("<p>").append(esc(capitalised(line.asText()))).append(".</p>\n");
        }
        JsonNode hypotheses = root.path("hypotheses");
        if (hypotheses.size() > 0) {
            JsonNode top = hypotheses.get(0);
            h.append("<p id=\"most-likely\">Most probable explanation of the sweep: ")
                    .append(esc(root.path("most_likely").asText()));
            // a probability only beside a hypothesis that is named: not beside a relative ranking,
            // nor beside "none can be named" (the most probable is not identifiable)
            if (!relative(root) && named(top)) {
                h.append(" (posterior probability ").append(percent(top.path("probability").asDouble())).append(")");
            }
            h.append(".</p>\n");
        }
        BenchHtml.paragraph(root, h);
        h.append("</section>\n");
    }

    /**
     * Whether the stage explains the sweep, first in the summary (issue 11): a yes or no line, and
     * the statement with its evidence and, when it does not, the likely causes.
     */
    private static void diagnosis(JsonNode diagnosis, StringBuilder h) {
        boolean explained = diagnosis.path("explained").asBoolean();
        boolean looksLike = diagnosis.path("looks_like_stage").asBoolean(true);
        h.append("<div id=\"diagnosis\" class=\"diagnosis ").append(explained ? "explained" : "unexplained")
                .append("\">\n<p class=\"diagnosis-word\">Does the stage explain the sweep? <b id=\"diagnosis-explained\">")
                .append(explained ? "yes" : "NO").append("</b>");
        if (!explained && !looksLike) {
            h.append(" — <b id=\"diagnosis-stranger\">this sweep does not look like a board of this stage</b>");
        }
        h.append("</p>\n<p id=\"diagnosis-statement\">").append(esc(diagnosis.path("statement").asText()))
                .append("</p>\n</div>\n");
    }

    /** @return whether the probabilities rank hypotheses none of which explains the sweep */
    static boolean relative(JsonNode root) {
        return root.path("probabilities_relative").asBoolean();
    }

    /** @return whether a hypothesis may be named as the most likely: "no fault" or an identifiable one */
    private static boolean named(JsonNode hypothesis) {
        return hypothesis.path("kind").asText().equals("none") || hypothesis.path("identifiable").asBoolean();
    }

    private static void identification(JsonNode root, ReportStamp stamp, StringBuilder h) {
        JsonNode run = root.path("run");
        JsonNode sweep = root.path("sweep");
        h.append("<section id=\"identification\">\n<h2>1 Identification</h2>\n<table class=\"fields\">\n");
        field(h, "Title", "Test report: low-frequency response of an amplifier stage", null);
        field(h, "Report id", esc(stamp.reportId()), null);
        field(h, "Date of issue (UTC)", esc(stamp.issuedText()), null);
        field(h, "Date of test (UTC)", sweep.path("captured_utc").isTextual() ? esc(sweep.path("captured_utc").asText())
                : "not recorded in the sweep file", "date-of-test");
        field(h, "Item tested: stage", esc(root.path("predicted").path("stage").asText())
                + " <span class=\"note\">(name and revision as the stage file gives them; the file's SHA-256 in "
                + "section 5 fixes the revision exactly)</span>", "item");
        String from = run.path("board_from").asText();
        field(h, "Item tested: board", run.path("board").isTextual() ? esc(run.path("board").asText())
                + " <span class=\"note\">(from the " + esc(from) + ")</span>" : "not recorded", "board");
        field(h, "Operator (tested by)", run.path("operator").isTextual() ? esc(run.path("operator").asText())
                : "not given (use --operator)", "operator");
        IdentificationHtml.sectionRows(root, h);
        field(h, "Instrument (as the sweep file names it)", sweep.path("instrument").asText().isEmpty() ? "not recorded in the sweep file"
                : esc(sweep.path("instrument").asText()), "instrument");
        field(h, "Laboratory and location", "<span class=\"blank\"></span>", null);
        field(h, "Customer", "<span class=\"blank\"></span>", null);
        field(h, "Date item received", "<span class=\"blank\"></span>", null);
        h.append("</table>\n</section>\n");
    }

    private static void method(JsonNode root, StringBuilder h) {
        JsonNode verdict = root.path("verdict");
        h.append("<section id=\"method\">\n<h2>2 Method</h2>\n<ol class=\"method\">\n");
        h.append("<li><b>Prediction.</b> The DC operating point of the stage file is solved, the stage is linearised "
                + "about it, and the low-band capacitors become ports of a state-space model. The short-circuit "
                + "time-constant (SCTC) estimate of the lower corner is Σ 1/(2πτᵢ), each τᵢ = CᵢRᵢ with every other "
                + "capacitor shorted; it is an estimate and can overstate the corner.</li>\n");
        h.append("<li><b>Exact analysis.</b> The exact lower corner is where the nominal model's gain falls 3.01 dB "
                + "below midband; poles and zeros are the eigenvalues of the state matrix. The design spread is the "
                + "exact corner of ").append(root.path("predicted").path("tolerance_spread").path("samples").asInt())
                .append(" boards drawn uniformly in ln(value) across every part tolerance (seed ")
                .append(root.path("predicted").path("tolerance_spread").path("seed").asLong()).append(").</li>\n");
        h.append("<li><b>Fit.</b> A rational model (").append(esc(root.path("fit_model").asText()))
                .append(") is fitted to the sweep by weighted least squares on complex-log residuals, started from "
                        + "the predicted poles; its uncertainties come from the fit's covariance.</li>\n");
        h.append("<li><b>Back-solve.</b> Every low-band capacitor, each transistor's bias current, each bipolar "
                + "transistor's current gain β and a flat gain calibration are estimated (maximum a posteriori) on the "
                + "stage's own exact model, each within its tolerance prior; β is a nuisance parameter of every "
                + "hypothesis (device spread), never blamed.</li>\n");
        h.append("<li><b>Hypotheses.</b> No fault; one capacitor, one resistor (the DC operating point solved again "
                + "for every value tried), one bias current or the gain calibration freed with a wide prior; the "
                + "measuring chain (an AC-coupled output channel of unknown corner, or two channels AC-coupled at "
                + "different corners); and, only "
                + "when no single fault explains the sweep, pairs: the most probable single faults with the parts "
                + "that promise the largest further improvement beside them, with one another, and every pair of "
                + "capacitors and the gain calibration. They are ranked by their Laplace evidence with prior "
                        + "probabilities ").append(fraction(FaultRanking.NO_FAULT_PRIOR)).append(" for no fault, ")
                .append(fraction(FaultRanking.SINGLE_FAULTS_PRIOR)).append(" shared by the single faults, ")
                .append(fraction(FaultRanking.BENCH_PRIOR)).append(" by the measuring chain and ")
                .append(fraction(FaultRanking.DOUBLE_FAULTS_PRIOR)).append(" by the pairs.</li>\n");
        h.append("<li><b>Adequacy.</b> Whether the most probable hypothesis explains the sweep is tested by four "
                + "checks, each at level ").append(fraction(AdequacyTest.ALPHA))
                .append(": its χ² against the χ² distribution where the sweep states its point uncertainties; the "
                        + "stage model against a free rational fit of the same sweep at the same weights; the "
                        + "lag-1 autocorrelation of its residuals along frequency; and whether the parts it does not "
                        + "free are found within their tolerances. When it does not, the "
                        + "probabilities are relative among hypotheses that do not explain the sweep, and none is "
                        + "named as the fault.</li>\n");
        h.append("<li><b>Decision rule.</b> ").append(esc(verdict.path("rule_statement").asText()))
                .append(". Each expanded uncertainty U is printed with its coverage factor k (the fit's Student-t factor, "
                        + "the back-solve's 2). The lower corner checked comes from ")
                .append(esc(verdict.path("lower_corner_source").asText())).append("; the midband gain from ")
                .append(esc(verdict.path("midband_gain_source").asText())).append(".</li>\n");
        h.append("</ol>\n");
        if (!root.path("side_by_side").path("fit_adequate").asBoolean(true)) {
            h.append("<p class=\"deviation\"><b>Deviation from the method:</b> the rational fit does not describe this "
                    + "sweep (χ²/ν above its threshold), so the values shown are the back-solved stage model's "
                    + "instead of the fit's, and no limit is decided from them.</p>\n");
        }
        h.append("</section>\n");
    }

    private static void instrument(JsonNode root, StringBuilder h) {
        JsonNode sweep = root.path("sweep");
        JsonNode points = sweep.path("points");
        h.append("<section id=\"data\">\n<h2>3 Measurement data</h2>\n<table class=\"fields\">\n");
        field(h, "Sweep file", "<code>" + esc(root.path("sweep_file").asText()) + "</code>", null);
        field(h, "Read with profile", esc(profile(root)), null);
        if (points.size() > 0) {
            field(h, "Points", points.size() + ", " + hz(points.get(0).path("frequency_hz").asDouble()) + " to "
                    + hz(points.get(points.size() - 1).path("frequency_hz").asDouble())
                    + (sweep.path("has_phase").asBoolean() ? ", gain and phase" : ", gain only"), null);
        }
        h.append("</table>\n");
        if (sweep.path("notes").size() > 0) {
            h.append("<p class=\"caption\">Notes in the sweep file</p>\n<ul class=\"notes\">\n");
            for (JsonNode note : sweep.path("notes")) {
                h.append("<li>").append(esc(note.asText())).append("</li>\n");
            }
            h.append("</ul>\n");
        }
        h.append("</section>\n");
    }

    private void results(JsonNode root, StringBuilder h) {
        h.append("<section id=\"results\">\n<h2>4 Results</h2>\n");
        sideBySide(root, h);
        h.append("<figure id=\"chart-bode\" class=\"chart\">\n")
                .append(ReportCharts.svgElement(charts.bode(root).chart(), ReportCharts.WIDTH, ReportCharts.BODE_HEIGHT,
                        "pb-bode"))
                .append("\n<figcaption>Figure 1. Measured gain and phase (open circles), the fitted model drawn over "
                        + "them, the nominal stage's exact response and the SCTC single-pole estimate D·s/(s + 2π·")
                .append(hz(root.path("curves").path("sctc_corner_hz").asDouble()))
                .append("). The shading holds, at each frequency, the central ")
                .append(Math.round(100 * root.path("curves").path("band_coverage").asDouble()))
                .append(" % of the gains of ").append(root.path("curves").path("band_boards").asInt())
                .append(" boards drawn across the part tolerances (a pointwise band, not one board's curve). "
                        + "The middle panel holds each point's gain minus the fitted model's, in dB; dashed lines mark "
                        + "the measured midband less 3.01 dB and the stage's lower-corner limit.")
                .append("</figcaption>\n</figure>\n");
        apportionment(root, h);
        capacitors(root, h);
        DiagnosisHtml.adequacy(root.path("diagnosis"), h);
        DiagnosisHtml.hypotheses(root, h);
        VerdictHtml.verdict(root, h);
        h.append("</section>\n");
    }

    private static void sideBySide(JsonNode root, StringBuilder h) {
        JsonNode side = root.path("side_by_side");
        JsonNode gain = side.path("midband_gain_db");
        JsonNode corner = side.path("lower_corner_hz");
        JsonNode spread = root.path("predicted").path("tolerance_spread");
        h.append("<h3>4.1 Predicted beside measured</h3>\n<table id=\"side-by-side\" class=\"data\">\n");
        h.append("<thead><tr><th>Quantity</th><th>SCTC estimate</th><th>Exact, nominal stage</th>"
                + "<th>Design spread 5 % / 50 % / 95 %</th><th>Measured (fit) ± U</th><th>Back-solved model ± U</th>"
                + "</tr></thead>\n<tbody>\n");
        h.append("<tr><th>Midband gain</th><td>").append(NONE).append("</td><td>")
                .append(db(gain.path("predicted"))).append("</td><td>").append(NONE).append("</td><td>")
                .append(withU(gain, "measured", "u_measured", gain.path("coverage_factor").asDouble(2), "dB"))
                .append("</td><td>").append(withU(gain, "back_solved", "u_back_solved",
                        gain.path("back_solved_coverage_factor").asDouble(2), "dB")).append("</td></tr>\n");
        h.append("<tr><th>Lower corner</th><td>").append(hzOrNone(corner.path("sctc"))).append("</td><td>")
                .append(hzOrNone(corner.path("exact"))).append("</td><td>").append(hzOrNone(spread.path("p05_hz")))
                .append(" / ").append(hzOrNone(spread.path("p50_hz"))).append(" / ").append(hzOrNone(spread.path("p95_hz")))
                .append("</td><td>").append(withU(corner, "measured", "u_measured", corner.path("coverage_factor").asDouble(2), "Hz"))
                .append("</td><td>").append(withU(corner, "back_solved", "u_back_solved",
                        corner.path("back_solved_coverage_factor").asDouble(2), "Hz")).append("</td></tr>\n");
        h.append("</tbody>\n</table>\n");
        if (corner.path("spread_percentile").isNumber()) {
            h.append("<p>The corner the verdict uses lies at the ")
                    .append(String.format(Locale.ROOT, "%.1f", 100 * corner.path("spread_percentile").asDouble()))
                    .append(" % point of the design spread: ")
                    .append(corner.path("inside_design_spread").asBoolean() ? "inside" : "<b>outside</b>")
                    .append(" its central 95 %.</p>\n");
        }
        // U beside every measured value, at the fit's own coverage factor, as the terminal shows it
        double k = root.path("measured").path("coverage_factor").asDouble(2);
        h.append("<table id=\"roots\" class=\"data compact\">\n<thead><tr><th>Root</th><th>Predicted (Hz, s/2π)</th>"
                + "<th>Measured (Hz, s/2π)</th><th>U of |root| (Hz, k = ").append(MeasuredValueFormat.coverage(k))
                .append(")</th><th>Status</th></tr></thead>\n<tbody>\n");
        for (JsonNode r : side.path("roots_hz")) {
            h.append("<tr><td>").append(esc(r.path("kind").asText())).append("</td><td>")
                    .append(root(r.path("predicted_re"), r.path("predicted_im"))).append("</td><td>")
                    .append(root(r.path("measured_re"), r.path("measured_im"))).append("</td><td>")
                    .append(r.path("measured_u").isNumber()
                            ? MeasuredValueFormat.uncertainty(k * r.path("measured_u").asDouble()) : NONE)
                    .append("</td><td>").append(r.path("measured_status").isTextual()
                            ? esc(r.path("measured_status").asText()) : "not resolved").append("</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
    }

    private void apportionment(JsonNode root, StringBuilder h) {
        h.append("<h3>4.2 The capacitors' parts in the lower corner</h3>\n");
        h.append("<table id=\"sctc-shares\" class=\"data\">\n<thead><tr><th>Capacitor</th><th>Nominal</th>"
                + "<th>SCTC resistance</th><th>τ</th><th>Share of the SCTC corner</th><th>∂ln f_L/∂ln C (exact)</th>"
                + "</tr></thead>\n<tbody>\n");
        for (JsonNode c : root.path("predicted").path("capacitors")) {
            h.append("<tr><td>").append(esc(c.path("id").asText())).append("</td><td>")
                    .append(eng(c.path("farads").asDouble(), "F")).append("</td><td>")
                    .append(eng(c.path("sctc_resistance_ohm").asDouble(), "Ω")).append("</td><td>")
                    .append(eng(c.path("sctc_time_constant_s").asDouble(), "s")).append("</td><td>")
                    .append(percent(c.path("share").asDouble())).append("</td><td>")
                    .append(c.path("corner_sensitivity").isNumber() ? MeasuredValueFormat.fixed(c.path("corner_sensitivity").asDouble(), 3) : NONE)
                    .append("</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
        h.append("<figure id=\"chart-shares\" class=\"chart bar\">\n")
                .append(ReportCharts.svgElement(charts.cornerShares(root), ReportCharts.WIDTH, ReportCharts.BAR_HEIGHT,
                        "pb-shares"))
                .append("\n<figcaption>Figure 2. Each capacitor's share (1/τᵢ)/Σ(1/τ) of the SCTC lower corner.</figcaption>\n"
                        + "</figure>\n");
        JsonNode apportionment = root.path("apportionment");
        if (apportionment.isObject()) {
            h.append("<p>The corner's change from the design to the back-solved board, shared along the path between "
                    + "them (the shares add up to the change and name the back-solve's culprit): ln(f_solved/f_predicted) = ")
                    .append(MeasuredValueFormat.fixed(apportionment.path("ln_corner_ratio").asDouble(), 4)).append(" ± ")
                    .append(MeasuredValueFormat.fixed(apportionment.path("u_ln_corner_ratio").asDouble(), 4))
                    .append(" (standard uncertainty).</p>\n");
            h.append("<table id=\"apportionment\" class=\"data compact\">\n<thead><tr><th>Part</th>"
                    + "<th>Estimate (back-solve)</th><th>Δln f contribution</th><th>Share of the change</th></tr></thead>\n<tbody>\n");
            for (JsonNode s : apportionment.path("shares")) {
                h.append("<tr><td>").append(esc(s.path("id").asText())).append("</td><td>")
                        .append(eng(s.path("estimated_farads").asDouble(), "F")).append("</td><td>")
                        .append(MeasuredValueFormat.fixed(s.path("corner_contribution").asDouble(), 4)).append("</td><td>")
                        .append(s.path("share").isNumber() ? percent(s.path("share").asDouble()) : NONE).append("</td></tr>\n");
            }
            h.append("<tr><td>bias, β, resistors</td><td>").append(NONE).append("</td><td>")
                    .append(MeasuredValueFormat.fixed(apportionment.path("other_contribution").asDouble(), 4)).append("</td><td>")
                    .append(apportionment.path("other_share").isNumber() ? percent(apportionment.path("other_share").asDouble())
                            : NONE).append("</td></tr>\n");
            h.append("</tbody>\n</table>\n");
        }
    }

    private void capacitors(JsonNode root, StringBuilder h) {
        h.append("<h3>4.3 Capacitor back-solve</h3>\n<p>Maximum a posteriori values on the stage's exact model under the "
                + "most probable hypothesis (<i>").append(esc(root.path("back_solve_hypothesis").asText()))
                .append("</i>").append(relative(root) ? ", which does not explain the sweep: see 4.4" : "")
                .append("); u is the standard uncertainty, U = 2u. Identifiable means the sweep narrows the part "
                        + "below 0.7 of its tolerance prior at these estimates; each hypothesis in 4.4 judges a part at its "
                        + "own estimates, so a part may be identifiable here and not under another hypothesis.</p>\n");
        h.append("<table id=\"capacitors\" class=\"data\">\n<thead><tr><th>Capacitor</th><th>Nominal</th><th>Tolerance</th>"
                + "<th>Band</th><th>Back-solved ± U</th><th>C/C_nom</th><th>Within tolerance</th><th>Identifiable</th>"
                + "</tr></thead>\n<tbody>\n");
        for (JsonNode c : root.path("capacitors")) {
            boolean within = c.path("within_tolerance").asBoolean(true);
            h.append("<tr").append(within ? "" : " class=\"outside\"").append("><td>").append(esc(c.path("id").asText()))
                    .append("</td><td>").append(eng(c.path("nominal_farads").asDouble(), "F")).append("</td><td>")
                    .append(c.path("tolerance").isTextual() ? esc(c.path("tolerance").asText()) : NONE).append("</td><td>")
                    .append(c.path("min_farads").isNumber() ? eng(c.path("min_farads").asDouble(), "F") + " to "
                            + eng(c.path("max_farads").asDouble(), "F") : NONE)
                    .append("</td><td>").append(eng(c.path("estimated_farads").asDouble(), "F")).append(" ± ")
                    .append(EngineeringValue.format(2 * c.path("u_farads").asDouble(), "F", 2)).append("</td><td>")
                    .append(MeasuredValueFormat.fixed(c.path("factor").asDouble(), 3)).append("</td><td>")
                    .append(c.path("within_tolerance").isBoolean() ? (within ? "yes" : "<b>no</b>") : NONE).append("</td><td>")
                    .append(c.path("identifiable").asBoolean() ? "yes" : "no (the sweep barely sees it; not blamed)")
                    .append("</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
        h.append("<figure id=\"chart-capacitors\" class=\"chart bar\">\n")
                .append(ReportCharts.svgElement(charts.capacitorBands(root), ReportCharts.WIDTH, ReportCharts.BAR_HEIGHT,
                        "pb-caps"))
                .append("\n<figcaption>Figure 3. Each back-solved capacitor over its nominal value with ± U (k = 2), "
                        + "against its tolerance band (shaded); the part the most probable hypothesis names, if a "
                        + "capacitor, in red.</figcaption>\n</figure>\n");
        resistors(root, h);
        JsonNode nuisance = root.path("nuisance");
        if (nuisance.path("bias").size() > 0 || nuisance.path("current_gain").size() > 0
                || nuisance.path("gain").isObject()) {
            h.append("<table id=\"nuisance\" class=\"data compact\">\n<thead><tr><th>Nuisance parameter</th>"
                    + "<th>Nominal</th><th>Back-solved ± U</th><th>Identifiable</th></tr></thead>\n<tbody>\n");
            for (JsonNode b : nuisance.path("bias")) {
                h.append("<tr><td>").append(esc(b.path("id").asText())).append(" bias current</td><td>")
                        .append(eng(b.path("nominal_a").asDouble(), "A")).append("</td><td>")
                        .append(eng(b.path("estimated_a").asDouble(), "A")).append(" ± ")
                        .append(EngineeringValue.format(2 * b.path("u_a").asDouble(), "A", 2)).append("</td><td>")
                        .append(b.path("identifiable").asBoolean() ? "yes" : "no").append("</td></tr>\n");
            }
            for (JsonNode b : nuisance.path("current_gain")) {
                double expanded = 2 * b.path("u_beta").asDouble();
                h.append("<tr><td>").append(esc(b.path("id").asText())).append(" current gain β (device spread)</td><td>")
                        .append(MeasuredValueFormat.sixFigures(b.path("nominal_beta").asDouble())).append("</td><td>")
                        .append(MeasuredValueFormat.value(b.path("estimated_beta").asDouble(), expanded)).append(" ± ")
                        .append(MeasuredValueFormat.uncertainty(expanded)).append("</td><td>")
                        .append(b.path("identifiable").asBoolean() ? "yes" : "no").append("</td></tr>\n");
            }
            JsonNode g = nuisance.path("gain");
            h.append("<tr><td>flat gain calibration</td><td>0 dB</td><td>")
                    .append(withU(g, "estimated_db", "u_db", 2, "dB")).append("</td><td>")
                    .append(g.path("identifiable").asBoolean() ? "yes" : "no").append("</td></tr>\n");
            h.append("</tbody>\n</table>\n");
            h.append("<p class=\"note\">Nuisance parameters are estimated under every hypothesis and never blamed: "
                    + "a bias current is blamed only under its own hypothesis (4.5), β never.</p>\n");
        }
    }

    /** The resistors the most probable hypothesis frees: a resistor is estimated only where it is freed. */
    private static void resistors(JsonNode root, StringBuilder h) {
        JsonNode resistors = root.path("resistors");
        if (resistors.size() == 0) {
            return;
        }
        h.append("<p>Resistors freed by the most probable hypothesis (every other resistor is held at its value; "
                + "the DC operating point is solved again for the value found):</p>\n");
        h.append("<table id=\"resistors\" class=\"data compact\">\n<thead><tr><th>Resistor</th><th>Nominal</th>"
                + "<th>Back-solved ± U</th><th>R/R_nom</th><th>Identifiable</th></tr></thead>\n<tbody>\n");
        for (JsonNode r : resistors) {
            double nominal = r.path("nominal_ohms").asDouble();
            double value = r.path("estimated_ohms").asDouble();
            h.append("<tr><td>").append(esc(r.path("id").asText())).append("</td><td>").append(eng(nominal, "Ω"))
                    .append("</td><td>").append(eng(value, "Ω")).append(" ± ")
                    .append(esc(EngineeringValue.format(2 * r.path("u_ohms").asDouble(), "Ω", 2))).append("</td><td>")
                    .append(nominal > 0 ? MeasuredValueFormat.fixed(value / nominal, 3) : NONE).append("</td><td>")
                    .append(r.path("identifiable").asBoolean() ? "yes" : "no (the sweep barely sees it; not blamed)")
                    .append("</td></tr>\n");
        }
        h.append("</tbody>\n</table>\n");
    }

    private static void traceability(JsonNode root, String resultSha256, StringBuilder h) {
        JsonNode run = root.path("run");
        JsonNode curves = root.path("curves");
        h.append("<section id=\"traceability\">\n<h2>5 Traceability</h2>\n<table class=\"fields\">\n");
        field(h, "Stage file", "<code>" + esc(root.path("stage_file").asText()) + "</code>", null);
        field(h, "Stage file SHA-256", "<code id=\"stage-sha256\">" + esc(root.path("stage_sha256").asText()) + "</code>", null);
        field(h, "Sweep file", "<code>" + esc(root.path("sweep_file").asText()) + "</code>", null);
        field(h, "Sweep file SHA-256", "<code id=\"sweep-sha256\">" + (root.path("sweep_sha256").asText().isEmpty()
                ? "none (no file)" : esc(root.path("sweep_sha256").asText())) + "</code>", null);
        field(h, "result.json SHA-256", "<code id=\"result-sha256\">" + esc(resultSha256) + "</code>", null);
        field(h, "polebench version", "<span id=\"polebench-version\">" + esc(root.path("polebench_version").asText())
                + "</span>", null);
        field(h, "Profile", "<span id=\"profile\">" + esc(profile(root)) + "</span>", null);
        field(h, "Decision rule", esc(root.path("verdict").path("rule").asText()), null);
        field(h, "Design spread", run.path("spread_samples").asInt() + " boards, seed " + run.path("spread_seed").asLong(), null);
        field(h, "Tolerance band of Figure 1", curves.path("band_boards").asInt() + " boards, seed "
                + curves.path("band_seed").asLong() + ", " + curves.path("band_boards_out_of_active_region").asInt()
                + " out of the active region", null);
        h.append("</table>\n<h3>Warnings</h3>\n<ul id=\"warnings\" class=\"warnings\">\n");
        int count = 0;
        count += warnings(h, "stage file", root.path("predicted").path("warnings"));
        count += warnings(h, "import", root.path("import_warnings"));
        count += warnings(h, "fit", root.path("measured").path("warnings"));
        count += warnings(h, "report", root.path("report_warnings"));
        if (count == 0) {
            h.append("<li>none from the stage file, the import or the fit</li>\n");
        }
        h.append("</ul>\n</section>\n");
    }

    /** The profile that read the sweep, and the name asked for when that was "auto". */
    private static String profile(JsonNode root) {
        String asked = root.path("profile").asText();
        String used = root.path("sweep").path("profile_used").asText("");
        if (used.isEmpty() || used.equals(asked)) {
            return asked;
        }
        return used + " (asked: " + asked + ")";
    }

    private static int warnings(StringBuilder h, String from, JsonNode list) {
        for (JsonNode w : list) {
            h.append("<li><span class=\"from\">").append(esc(from)).append(":</span> ").append(esc(w.asText())).append("</li>\n");
        }
        return list.size();
    }

    private static void cautions(StringBuilder h) {
        h.append("<section id=\"cautions\">\n<h2>6 Cautions for bench work</h2>\n<ul>\n");
        for (String caution : CAUTIONS) {
            h.append("<li>").append(caution).append("</li>\n");
        }
        h.append("</ul>\n</section>\n");
    }

    private static void statement(JsonNode root, StringBuilder h) {
        JsonNode run = root.path("run");
        h.append("<section id=\"scope-statement\" class=\"statement\">\n<h2>7 Scope of the results and sign-off</h2>\n");
        h.append("<p>The results and the verdict in this report relate only to the item identified in section 1, as "
                + "tested, with the sweep identified in section 5. They do not cover other boards of the same design, "
                + "nor this board after any repair, rework or change of conditions. Back-solved part values are "
                + "inferences from the stage's model, not measurements of the parts.</p>\n");
        h.append("<table class=\"signatures\">\n<tr><th>Tested by</th><td>")
                .append(run.path("operator").isTextual() ? esc(run.path("operator").asText()) : "")
                .append("</td><th>Signature</th><td class=\"line\"></td><th>Date</th><td class=\"line\"></td></tr>\n");
        h.append("<tr><th>Approved by</th><td>").append(run.path("approved_by").isTextual()
                ? esc(run.path("approved_by").asText()) : "").append("</td><th>Signature</th><td class=\"line\"></td><th>Date</th>"
                + "<td class=\"line\"></td></tr>\n</table>\n</section>\n");
    }

    static void field(StringBuilder h, String name, String valueHtml, String id) {
        h.append("<tr><th>").append(esc(name)).append("</th><td").append(id == null ? "" : " id=\"" + id + "\"").append(">")
                .append(valueHtml).append("</td></tr>\n");
    }

    /** The label of a hypothesis, or of one fault of a double, as the text summary gives it. */
    static String label(JsonNode y) {
        String kind = y.path("kind").asText();
        if (kind.equals("none")) {
            return "no fault";
        }
        if (kind.equals("gain")) {
            return "flat gain error";
        }
        if (kind.equals("double")) {
            StringBuilder both = new StringBuilder();
            for (JsonNode fault : y.path("faults")) {
                both.append(both.length() == 0 ? "" : " and ").append(label(fault));
            }
            return both.toString();
        }
        return y.path("part").asText("?") + (kind.equals("bias") ? " bias current" : "");
    }

    static String estimateText(double value, double u, String unit) {
        if (unit.equals("dB")) {
            String[] text = MeasuredValueFormat.withUncertainty(value, 2 * u);
            return text[0] + " ± " + text[1] + " dB";
        }
        return eng(value, unit) + " ± " + EngineeringValue.format(2 * u, unit, 2);
    }

    private static String withU(JsonNode node, String valueKey, String uKey, double k, String unit) {
        if (!node.path(valueKey).isNumber()) {
            return NONE;
        }
        double u = node.path(uKey).asDouble(0);
        return esc(MeasuredValueFormat.expanded(node.path(valueKey).asDouble(), k * u, k, unit));
    }

    /** A value rounded to its uncertainty's last digit (GUM 7.2.6), with unit. */
    static String quantity(double value, double expanded, String unit) {
        return esc(MeasuredValueFormat.rounded(value, expanded, unit).valueText());
    }

    static String capitalised(String sentence) {
        return sentence.isEmpty() ? sentence : sentence.substring(0, 1).toUpperCase(Locale.ROOT) + sentence.substring(1);
    }

    static String uncertainty(double expanded, String unit) {
        return esc(MeasuredValueFormat.rounded(0, expanded, unit).uncertaintyText());
    }

    /** U in the prefix and decimal place of the value it belongs to (GUM 7.2.6), as the text prints it. */
    static String uncertaintyBeside(double value, double expanded, String unit) {
        return esc(MeasuredValueFormat.rounded(value, expanded, unit).uncertaintyText());
    }

    /** " (k = 2.02)" beside a U, from the result's coverage_factor; nothing when the file has none. */
    static String k(JsonNode coverageFactor) {
        return coverageFactor.isNumber() ? " (k = " + MeasuredValueFormat.coverage(coverageFactor.asDouble()) + ")" : "";
    }

    static String limit(JsonNode min, JsonNode max, String unit) {
        if (min.isNumber() && max.isNumber()) {
            return MeasuredValueFormat.sixFigures(min.asDouble()) + " to " + MeasuredValueFormat.sixFigures(max.asDouble())
                    + " " + esc(unit);
        }
        return min.isNumber() ? "≥ " + MeasuredValueFormat.sixFigures(min.asDouble()) + " " + esc(unit)
                : "≤ " + MeasuredValueFormat.sixFigures(max.asDouble()) + " " + esc(unit);
    }

    private static String root(JsonNode re, JsonNode im) {
        if (!re.isNumber()) {
            return NONE;
        }
        double r = re.asDouble();
        double i = im.asDouble();
        if (r == 0 && i == 0) {
            return "0 (at DC)";
        }
        String text = String.format(Locale.ROOT, "%.4g", r);
        if (i != 0) {
            text += String.format(Locale.ROOT, " ± j%.4g", Math.abs(i));
        }
        return text.replace("-", "−");
    }

    private static String db(JsonNode value) {
        return value.isNumber() ? MeasuredValueFormat.fixed(value.asDouble(), 2) + " dB" : NONE;
    }

    private static String hzOrNone(JsonNode value) {
        return value.isNumber() ? hz(value.asDouble()) : NONE;
    }

    private static String hz(double hz) {
        return eng(hz, "Hz");
    }

    static String eng(double value, String unit) {
        return esc(EngineeringValue.format(value, unit, 4));
    }

    static String percent(double fraction) {
        return MeasuredValueFormat.percent(fraction, 1);
    }

    /** A prior probability: as a percentage, to two significant figures below 1 % (a pair's share). */
    static String probability(double fraction) {
        return fraction >= 0.01 || fraction <= 0 ? percent(fraction)
                : String.format(Locale.ROOT, "%.2g %%", 100 * fraction);
    }

    /** A stated constant (a prior, a level, a ratio) in plain digits. */
    static String fraction(double value) {
        return MeasuredValueFormat.sixFigures(value);
    }

    /** Escapes text for HTML element content and double-quoted attributes. */
    static String esc(String text) {
        StringBuilder out = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&':
                    out.append("&amp;");
                    break;
                case '<':
                    out.append("&lt;");
                    break;
                case '>':
                    out.append("&gt;");
                    break;
                case '"':
                    out.append("&quot;");
                    break;
                case '\'':
                    out.append("&#39;");
                    break;
                default:
                    // control characters other than tab and newline have no place in a report
                    out.append(c < 0x20 && c != '\t' && c != '\n' ? '\uFFFD' : c);
            }
        }
        return out.toString();
    }

    private static final String[] CAUTIONS = {
        "Check that the instrument's inputs are DC-coupled, or that their own AC-coupling corner lies well below the "
                + "stage's lower corner: an AC-coupled input adds a pole of its own to every low-frequency point.",
        "The generator's output resistance and the load on the output must be those the stage file states; a probe, "
                + "meter or cable loads the stage and moves both corners.",
        "Keep the output well inside its swing and the input well above the noise floor at every point: clipping "
                + "flattens the gain, noise biases the fit near the stopband.",
        "Give each low-frequency point time to settle (several periods, and longer after power-up while electrolytic "
                + "capacitors form and the bias warms): an unsettled point reads low and lags.",
        "Mains pickup and ground loops disturb points near the mains frequency and its harmonics; a single wild "
                + "point there is more likely pickup than the stage.",
        "Electrolytic capacitance changes with temperature and age; a back-solved value holds at the bench "
                + "temperature of this test.",
        "A back-solved value is an inference from the stage's model: confirm a suspect part out of circuit with a "
                + "capacitance meter before rework.",
        "Under simple acceptance a value close to a limit can pass with up to a 50 % chance that the true value lies "
                + "outside it (ILAC-G8:09/2019); the guarded rule bounds that risk at about 2.5 % per limit.",
    };

    private static final String CSS = String.join("\n",
            ":root { --ink: #1b2430; --muted: #5a6573; --rule: #c9d1db; --band: #e8eef6; --pass: #1f7a3e; "
                    + "--fail: #b02a2a; --accent: #2d5d9f; }",
            "* { box-sizing: border-box; }",
            "html { font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif; font-size: 10.5pt; color: var(--ink); "
                    + "background: #fff; }",
            "body { margin: 0 auto; max-width: 190mm; padding: 0 4mm; line-height: 1.4; }",
            "table.sheet { width: 100%; border-collapse: collapse; }",
            "table.sheet > thead { display: table-header-group; }",
            "table.sheet > tfoot { display: table-footer-group; }",
            "table.sheet > * > tr > td { padding: 0; }",
            ".running-head, .running-foot { display: flex; justify-content: space-between; gap: 1em; font-size: 8.5pt; "
                    + "color: var(--muted); }",
            ".running-head { border-bottom: 1px solid var(--rule); padding: 2mm 0 1.5mm; margin-bottom: 3mm; }",
            ".running-foot { border-top: 1px solid var(--rule); padding: 1.5mm 0 2mm; margin-top: 3mm; }",
            ".running-head .report-id { color: var(--ink); }",
            "h1 { font-size: 20pt; margin: 2mm 0 0; letter-spacing: 0.02em; color: var(--accent); }",
            ".subtitle { margin: 1mm 0; color: var(--muted); }",
            ".ids { margin: 1mm 0 4mm; }",
            "h2 { font-size: 13pt; border-bottom: 2px solid var(--accent); padding-bottom: 1mm; margin: 7mm 0 2.5mm; "
                    + "break-after: avoid; }",
            "h3 { font-size: 11pt; margin: 5mm 0 2mm; break-after: avoid; }",
            "section.summary { border: 2px solid var(--rule); border-left-width: 8px; padding: 2mm 4mm; margin: 3mm 0; "
                    + "break-inside: avoid; }",
            "section.summary.pass { border-color: var(--pass); }",
            "section.summary.fail { border-color: var(--fail); }",
            ".verdict-word { font-size: 14pt; margin: 1mm 0; }",
            ".diagnosis { border-top: 1px solid var(--rule); border-bottom: 1px solid var(--rule); margin: 1.5mm 0; }",
            ".diagnosis-word { font-size: 12pt; margin: 1mm 0; }",
            ".explained .diagnosis-word b { color: var(--pass); }",
            ".unexplained .diagnosis-word b { color: var(--fail); }",
            ".pass .verdict-word b, tr.pass td:last-child { color: var(--pass); }",
            ".fail .verdict-word b, tr.fail td:last-child { color: var(--fail); }",
            "section.summary.incomplete { border-color: var(--ink); border-style: dashed; }",
            "table.fields, table.data, table.signatures { border-collapse: collapse; width: 100%; break-inside: avoid; }",
            "table.fields th { text-align: left; width: 32%; font-weight: 600; vertical-align: top; }",
            "table.fields th, table.fields td { padding: 1mm 2mm; border-bottom: 1px solid var(--rule); }",
            "table.data { font-size: 9pt; margin: 2mm 0; }",
            "table.data th, table.data td { border: 1px solid var(--rule); padding: 0.8mm 1.5mm; text-align: left; "
                    + "vertical-align: top; }",
            "table.data thead th { background: var(--band); }",
            "table.data tr { break-inside: avoid; }",
            "table.data tr.outside td { background: #fbeaea; }",
            "table.compact { font-size: 8.5pt; }",
            "code { font-family: 'DejaVu Sans Mono', 'Liberation Mono', monospace; font-size: 8.5pt; word-break: break-all; }",
            ".note { color: var(--muted); font-size: 9pt; }",
            ".deviation { border-left: 4px solid var(--fail); padding-left: 3mm; }",
            ".blank { display: inline-block; min-width: 70mm; border-bottom: 1px solid var(--ink); height: 1.1em; }",
            "figure.chart { margin: 3mm 0; break-inside: avoid; }",
            "figure.chart svg { display: block; width: 100%; height: auto; }",
                        "figcaption { font-size: 9pt; color: var(--muted); margin-top: 1mm; }",
            "ol.method li, #cautions li { margin-bottom: 1.2mm; }",
            "ul.warnings .from { font-weight: 600; }",
            "table.signatures { margin-top: 4mm; }",
            "table.signatures th { text-align: left; width: 12%; padding: 4mm 2mm 1mm 0; font-weight: 600; }",
            "table.signatures td { padding: 4mm 2mm 1mm; }",
            "table.signatures td.line { border-bottom: 1px solid var(--ink); width: 22%; }",
            ".statement { break-inside: avoid; }",
            ".end { text-align: center; margin: 8mm 0 2mm; font-weight: 600; letter-spacing: 0.05em; }",
            ".end::before, .end::after { content: ' ■ '; color: var(--accent); }",
            // page n of N from the page itself (CSS Paged Media Level 3, margin boxes and the page
            // and pages counters), so any browser's print or PDF carries it on every page
            "@page { size: auto; margin: 15mm 15mm 18mm; @bottom-right { content: 'Page ' counter(page) ' of ' "
                    + "counter(pages); font-size: 8.5pt; color: #5a6573; } }",
            "table.fields.compact th, table.fields.compact td { padding: 0.5mm 2mm; font-size: 9pt; }",
            ".blank.short { min-width: 40mm; }",
            "table.summary-checks { border-collapse: collapse; width: 100%; font-size: 9pt; margin: 1mm 0 2mm; }",
            "table.summary-checks th, table.summary-checks td { border: 1px solid var(--rule); padding: 0.6mm 1.5mm; "
                    + "text-align: left; }",
            "@media print {",
            "  html { font-size: 9.5pt; }",
            "  body { max-width: none; padding: 0; }",
            "  figure, table.data, table.fields, section.summary, section.statement { break-inside: avoid; }",
            "  h2, h3 { break-after: avoid; }",
            "  a { color: inherit; text-decoration: none; }",
            // a long table may break between rows (each row stays whole, the header repeats): kept
            // whole it jumped to the next page and left the one before half empty; a figure stays
            // whole, and is capped in height so it fits in the lower half of a page instead of
            // pushing itself, blank space before it, onto the next
            "  table.data { break-inside: auto; }",
            "  figure.chart svg { max-height: 115mm; }",
            "  figure.chart.bar svg { max-height: 62mm; }",
            "}",
            "");
}

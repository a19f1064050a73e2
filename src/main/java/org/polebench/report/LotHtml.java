package org.polebench.report;

import java.util.List;
import org.polebench.lot.ApartBoard;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.Culprit;
import org.polebench.lot.GroupCounts;
import org.polebench.lot.LotFindings;
import org.polebench.lot.PartShift;
import org.polebench.lot.QuantityFindings;
import org.polebench.units.MeasuredValueFormat;

/**
 * The lot report as one self-contained HTML page: the counts and yield, the lot findings
 * (systematic shifts) apart from the single-board faults, each quantity's spread against the
 * prediction with its individuals chart and Cpk, the Pareto of culprits, the parts across the
 * lot and the board table. No script and no network: the CSS sits in a {@code <style>}
 * element and the charts are inline SVG. Every string from a user's file (lot, board, station,
 * operator, hypothesis) is HTML-escaped. For the same findings and date the page repeats byte
 * for byte.
 */
public final class LotHtml {
    private final LotCharts charts = new LotCharts();

    /** @param issued the date of issue as text, such as 2026-05-04T10:00:00Z */
    public String render(LotFindings lot, String issued) {
        StringBuilder h = new StringBuilder(200_000);
        String name = ReportHtml.esc(lot.lot());
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        h.append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        h.append("<title>Lot report — ").append(name).append("</title>\n");
        h.append("<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        h.append("<header>\n<h1>Lot report</h1>\n<p class=\"subtitle\">What the boards of lot <b id=\"lot-name\">")
                .append(name).append("</b> say together · issued ").append(ReportHtml.esc(issued)).append("</p>\n</header>\n");
        String css = lot.counts().failed() > 0 ? "fail"
                : lot.counts().boards() > 0 && lot.counts().boards() == lot.counts().passed() ? "pass" : "mixed";
        h.append("<section id=\"summary\" class=\"summary ").append(css).append("\">\n<p id=\"counts\">")
                .append(ReportHtml.esc(LotStatements.counts(lot))).append("</p>\n");
        h.append("<p class=\"yield\">Yield <b id=\"yield\">").append(percent(lot.counts().yield())).append("</b></p>\n");
        h.append("</section>\n");

        h.append("<h2>Lot findings</h2>\n<div id=\"systematic\">\n");
        if (lot.systematic().isEmpty()) {
            h.append("<p>No part reads outside its tolerance across the lot.</p>\n");
        }
        for (PartShift p : lot.systematic()) {
            h.append("<p class=\"finding\">").append(ReportHtml.esc(LotStatements.systematic(p))).append("</p>\n");
        }
        h.append("</div>\n<h3>Single-board faults</h3>\n<div id=\"single-board\">\n");
        boolean any = false;
        for (PartShift p : lot.parts()) {
            for (ApartBoard a : p.singleBoardFaults()) {
                h.append("<p>").append(ReportHtml.esc(LotStatements.singleBoard(p, a))).append("</p>\n");
                any = true;
            }
        }
        if (!any) {
            h.append("<p>No board reads a part far from the lot and outside its tolerance.</p>\n");
        }
        h.append("</div>\n");

        int figure = 1;
        for (QuantityFindings q : lot.quantities()) {
            String key = q.quantity().key().replace('_', '-');
            h.append("<h2>").append(ReportHtml.esc(LotStatements.capitalised(q.quantity().words()))).append("</h2>\n");
            h.append("<p id=\"").append(key).append("-spread\">").append(ReportHtml.esc(LotStatements.distribution(q)))
                    .append("</p>\n");
            if (q.distribution().isPresent()) {
                figure(h, ReportCharts.svgElement(charts.spread(q), ReportCharts.WIDTH, LotCharts.HEIGHT,
                        "pb-" + key + "-spread"), figure++, "The boards' " + q.quantity().words()
                        + " sorted, against the share of boards at or below; the band shaded is the stage's prediction"
                        + " over its tolerances, the dashed line its nominal value, a red line a limit of the stage.");
            }
            if (q.chart().isPresent()) {
                h.append("<p id=\"").append(key).append("-chart\">").append(ReportHtml.esc(LotStatements.chart(q.chart().get())))
                        .append("</p>\n");
                figure(h, ReportCharts.svgElement(charts.control(q.chart().get()), ReportCharts.WIDTH, LotCharts.HEIGHT,
                        "pb-" + key + "-control"), figure++, "Individuals chart in test order: centre line, ±3σ limits "
                        + "(σ = MR̄/1.128), and in red the points at which a Western Electric run rule (1956 handbook, "
                        + "rules 1 to 4) is broken.");
            }
            if (q.capability().isPresent()) {
                h.append("<p id=\"").append(key).append("-cpk\">").append(ReportHtml.esc(LotStatements.capability(
                        q.capability().get()))).append("</p>\n");
            } else if (q.chart().isPresent()) {
                h.append("<p>No Cpk: the stage gives no limit for the ").append(q.quantity().words()).append(".</p>\n");
            }
        }

        h.append("<h2>Culprits</h2>\n<p id=\"culprits\">").append(ReportHtml.esc(LotStatements.culprits(lot))).append("</p>\n");
        if (!lot.culprits().isEmpty()) {
            figure(h, ReportCharts.svgElement(charts.pareto(lot.culprits()), ReportCharts.WIDTH, LotCharts.HEIGHT,
                    "pb-pareto"), figure++, "Pareto of the most probable cause of each board that failed or was not "
                    + "explained, with the cumulative share.");
            h.append("<table class=\"data\" id=\"culprit-table\">\n<thead><tr><th>Most probable cause</th><th>Boards</th>"
                    + "<th>Cumulative</th></tr></thead>\n<tbody>\n");
            for (Culprit k : lot.culprits()) {
                h.append("<tr><td>").append(ReportHtml.esc(k.name())).append("</td><td>").append(k.boards())
                        .append("</td><td>").append(percent(k.cumulative())).append("</td></tr>\n");
            }
            h.append("</tbody></table>\n");
        }

        h.append("<h2>By station and by day</h2>\n");
        groups(h, "by-station", "Station", lot.byStation());
        groups(h, "by-day", "Date (UTC)", lot.byDay());

        h.append("<h2>Parts across the lot</h2>\n<p class=\"note\">Each part's back-solved value pooled over the boards "
                + "whose sweep identified it (DerSimonian–Laird random effects); boards far from the lot are kept apart. "
                + "Spread τ is the between-board standard deviation of ln(value).</p>\n");
        h.append("<table class=\"data\" id=\"parts\">\n<thead><tr><th>Part</th><th>Lot factor</th><th>u</th><th>Boards "
                + "pooled</th><th>Identified</th><th>Spread τ</th><th>Tolerance</th><th>Finding</th></tr></thead>\n<tbody>\n");
        for (PartShift p : lot.parts()) {
            h.append("<tr").append(p.finding() == PartShift.Finding.SYSTEMATIC ? " class=\"outside\"" : "").append("><td>")
                    .append(ReportHtml.esc(p.part())).append("</td><td>")
                    .append(p.pooled().isPresent() ? "×" + LotStatements.factor(p.factor(), p.uFactor()) : ReportHtml.NONE)
                    .append("</td><td>").append(p.pooled().isPresent() ? MeasuredValueFormat.uncertainty(p.uFactor())
                            : ReportHtml.NONE)
                    .append("</td><td>").append(p.boardsPooled()).append("</td><td>").append(p.identifiable())
                    .append("</td><td>").append(p.pooled().map(e -> MeasuredValueFormat.fixed(100 * e.tau(), 1) + " %")
                            .orElse(ReportHtml.NONE))
                    .append("</td><td>").append(ReportHtml.esc(LotStatements.band(p))).append("</td><td>")
                    .append(LotJson.finding(p.finding())).append("</td></tr>\n");
        }
        h.append("</tbody></table>\n");

        h.append("<h2>Boards</h2>\n<table class=\"data\" id=\"board-table\">\n<thead><tr><th>Test</th><th>Board</th>"
                + "<th>Tested (UTC)</th><th>Station</th><th>Outcome</th><th>Midband gain</th><th>Lower corner</th>"
                + "<th>Explained</th><th>Most probable</th></tr></thead>\n<tbody>\n");
        for (BoardOutcome b : lot.tests()) {
            h.append("<tr class=\"").append(b.outcome().word()).append("\"><td>").append(b.testOrder()).append("</td><td>")
                    .append(ReportHtml.esc(b.boardId())).append("</td><td>").append(ReportHtml.esc(b.testedAt().toString()))
                    .append("</td><td>").append(ReportHtml.esc(b.station())).append("</td><td>").append(b.outcome().word())
                    .append("</td><td>").append(b.midbandGainDb().map(v -> LotStatements.value(v, "dB")).orElse(ReportHtml.NONE))
                    .append("</td><td>").append(b.lowerCornerHz().map(v -> LotStatements.value(v, "Hz")).orElse(ReportHtml.NONE))
                    .append("</td><td>").append(b.outcome() == BoardOutcome.Outcome.INPUT_PROBLEM ? ReportHtml.NONE
                            : b.explained() ? "yes" : "no").append("</td><td>")
                    .append(ReportHtml.esc(b.problem().orElse(b.topHypothesis()))).append("</td></tr>\n");
        }
        h.append("</tbody></table>\n");
        h.append("<p class=\"note\">The predicted bands come from ").append(lot.draws())
                .append(" boards drawn within the stage's tolerances with seed ").append(lot.seed())
                .append(". Spread, control charts, Cpk, culprits and parts read each board's first test; the counts read "
                        + "its last.</p>\n");
        h.append("<p id=\"end-of-report\" class=\"end\">End of lot report ").append(name).append("</p>\n");
        h.append("</body>\n</html>\n");
        return h.toString();
    }

    private static void figure(StringBuilder h, String svg, int number, String caption) {
        h.append("<figure class=\"chart\">\n").append(svg).append("\n<figcaption>Figure ").append(number).append(". ")
                .append(ReportHtml.esc(caption)).append("</figcaption>\n</figure>\n");
    }

    private static void groups(StringBuilder h, String id, String head, List<GroupCounts> groups) {
        h.append("<table class=\"data\" id=\"").append(id).append("\">\n<thead><tr><th>").append(head)
                .append("</th><th>Boards</th><th>Passed</th><th>Failed</th><th>Incomplete</th><th>Input problem</th>"
                        + "<th>Yield</th></tr></thead>\n<tbody>\n");
        for (GroupCounts g : groups) {
            h.append("<tr><td>").append(g.key().isEmpty() ? "(not given)" : ReportHtml.esc(g.key())).append("</td><td>")
                    .append(g.counts().boards()).append("</td><td>").append(g.counts().passed()).append("</td><td>")
                    .append(g.counts().failed()).append("</td><td>").append(g.counts().incomplete()).append("</td><td>")
                    .append(g.counts().inputProblems()).append("</td><td>").append(percent(g.counts().yield()))
                    .append("</td></tr>\n");
        }
        h.append("</tbody></table>\n");
    }

    private static String percent(double fraction) {
        return Double.isFinite(fraction) ? MeasuredValueFormat.percent(fraction, 1) : ReportHtml.NONE;
    }

    private static final String CSS = String.join("\n",
            ":root { --ink: #1b2430; --muted: #5a6573; --rule: #c9d1db; --band: #e8eef6; --pass: #1f7a3e; "
                    + "--fail: #b02a2a; --accent: #2d5d9f; }",
            "html { font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif; font-size: 10.5pt; color: var(--ink); "
                    + "background: #fff; }",
            "body { margin: 0 auto; max-width: 190mm; padding: 4mm; line-height: 1.4; }",
            "h1 { font-size: 20pt; margin: 2mm 0 0; color: var(--accent); }",
            ".subtitle { margin: 1mm 0 4mm; color: var(--muted); }",
            "h2 { font-size: 13pt; border-bottom: 2px solid var(--accent); padding-bottom: 1mm; margin: 7mm 0 2.5mm; "
                    + "break-after: avoid; }",
            "h3 { font-size: 11pt; margin: 5mm 0 2mm; }",
            "section.summary { border: 2px solid var(--rule); border-left-width: 8px; padding: 2mm 4mm; margin: 3mm 0; }",
            "section.summary.pass { border-color: var(--pass); }",
            "section.summary.fail { border-color: var(--fail); }",
            ".yield { font-size: 14pt; margin: 1mm 0; }",
            ".finding { border-left: 4px solid var(--fail); padding-left: 3mm; font-weight: 600; }",
            "table.data { border-collapse: collapse; width: 100%; font-size: 9pt; margin: 2mm 0; }",
            "table.data th, table.data td { border: 1px solid var(--rule); padding: 0.8mm 1.5mm; text-align: left; }",
            "table.data thead th { background: var(--band); }",
            "table.data tr { break-inside: avoid; }",
            "table.data tr.outside td, table.data tr.fail td { background: #fbeaea; }",
            ".note { color: var(--muted); font-size: 9pt; }",
            "figure.chart { margin: 3mm 0; break-inside: avoid; }",
            "figure.chart svg { display: block; width: 100%; height: auto; }",
            "figcaption { font-size: 9pt; color: var(--muted); margin-top: 1mm; }",
            ".end { text-align: center; margin: 8mm 0 2mm; font-weight: 600; }",
            ".end::before, .end::after { content: ' ■ '; color: var(--accent); }",
            "@media print { html { font-size: 9.5pt; } body { max-width: none; padding: 0; } "
                    + "figure.chart svg { max-height: 115mm; } }",
            "");
}

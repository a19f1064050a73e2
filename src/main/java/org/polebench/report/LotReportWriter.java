package org.polebench.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.polebench.InputProblem;
import org.polebench.lot.LotFindings;
import org.polebench.lot.QuantityFindings;

/**
 * Writes a lot report folder: {@code lot.html} (self-contained), {@code lot.json} (the object
 * {@code polebench lot --json} prints), {@code boards.csv} (the board table) and each chart as
 * its own SVG ({@code lower-corner-spread.svg}, {@code lower-corner-chart.svg},
 * {@code midband-gain-spread.svg}, {@code midband-gain-chart.svg}, {@code culprits.svg}).
 *
 * <p>The folder is replaced whole (see {@link ReportFolder}), so a failure or a killed run leaves
 * the old lot report or the new one, never a mix. A folder that already holds any of these files
 * is refused unless {@code force} is set; the user's other files in it are kept.
 */
public final class LotReportWriter {
    public static final String HTML = "lot.html";
    public static final String JSON = "lot.json";
    public static final String CSV = "boards.csv";
    public static final String PARETO = "culprits.svg";
    /** Every file a lot report folder may hold. */
    public static final List<String> FILES = List.of(HTML, JSON, CSV, "lower-corner-spread.svg",
            "lower-corner-chart.svg", "midband-gain-spread.svg", "midband-gain-chart.svg", PARETO);

    private final LotJson json = new LotJson();
    private final LotHtml html = new LotHtml();
    private final LotCharts charts = new LotCharts();

    /**
     * @param dir   the report folder; created when missing
     * @param lot   the lot's findings
     * @param force replace an earlier lot report's files in {@code dir}
     * @param now   the date of issue
     * @throws InputProblem when {@code dir} is a file, or holds a lot report and {@code force} is
     *                      off (nothing is written then)
     * @throws IOException  when a file cannot be written
     */
    public void write(Path dir, LotFindings lot, boolean force, Instant now) throws InputProblem, IOException {
        ReportFolder folder = new ReportFolder(dir, FILES);
        folder.claim("lot report", force);
        folder.replaceWith(temp -> {
            Files.writeString(temp.resolve(JSON), json.text(json.of(lot)), StandardCharsets.UTF_8);
            Files.writeString(temp.resolve(HTML), html.render(lot, now.truncatedTo(ChronoUnit.SECONDS).toString()),
                    StandardCharsets.UTF_8);
            Files.write(temp.resolve(CSV), new LotCsv().of(lot).getBytes(StandardCharsets.UTF_8));
            for (QuantityFindings q : lot.quantities()) {
                String key = q.quantity().key().replace('_', '-');
                if (q.distribution().isPresent()) {
                    svg(temp, key + "-spread.svg", charts.spread(q), "pb-" + key + "-spread");
                }
                if (q.chart().isPresent()) {
                    svg(temp, key + "-chart.svg", charts.control(q.chart().get()), "pb-" + key + "-control");
                }
            }
            if (!lot.culprits().isEmpty()) {
                svg(temp, PARETO, charts.pareto(lot.culprits()), "pb-pareto");
            }
        });
    }

    private static void svg(Path folder, String name, JFreeChart chart, String prefix) throws IOException {
        Files.writeString(folder.resolve(name), ReportCharts.svgDocument(chart, ReportCharts.WIDTH, LotCharts.HEIGHT,
                prefix), StandardCharsets.UTF_8);
    }
}

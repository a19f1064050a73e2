package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.polebench.InputProblem;

/**
 * Writes a test report folder from a result's JSON object: {@code report.html} (self-contained),
 * {@code result.json} (the object as {@code reconcile --json} prints it), {@code capacitors.csv}
 * and each chart as its own SVG ({@code bode.svg}, {@code capacitor-shares.svg},
 * {@code capacitors.svg}), with PNG copies on request.
 *
 * <p>The folder is replaced whole (see {@link ReportFolder}): a failure or a killed run leaves
 * the old report or the new one, never a mix. A folder that already holds any of these files is
 * refused unless {@code force} is set; the user's other files in it are kept.
 */
public final class TestReportWriter {
    public static final String HTML = "report.html";
    public static final String RESULT = "result.json";
    public static final String CSV = "capacitors.csv";
    public static final String BODE = "bode.svg";
    public static final String SHARES = "capacitor-shares.svg";
    public static final String CAPACITORS = "capacitors.svg";
    /** Every file a report folder may hold, PNG copies included. */
    public static final List<String> FILES = List.of(HTML, RESULT, CSV, BODE, SHARES, CAPACITORS,
            png(BODE), png(SHARES), png(CAPACITORS));

    private final ResultJson json = new ResultJson();
    private final ReportHtml html = new ReportHtml();
    private final ReportCharts charts = new ReportCharts();

    /**
     * @param root  the result, as {@link ResultJson} makes it or as read back from a result.json
     * @param dir   the report folder; created when missing
     * @param force replace an earlier report's files in {@code dir}
     * @param pngs  also write each chart as PNG
     * @param now   the date of issue
     * @return the stamp the report was issued under
     * @throws InputProblem when {@code dir} is a file, or holds a report and {@code force} is off
     *                      (nothing is written then)
     * @throws IOException  when a file cannot be written
     */
    public ReportStamp write(JsonNode root, Path dir, boolean force, boolean pngs, Instant now)
            throws InputProblem, IOException {
        ReportFolder folder = new ReportFolder(dir, FILES);
        folder.claim("report", force);
        String resultText = json.text(root);
        ReportStamp stamp = ReportStamp.issue(resultText, now);
        folder.replaceWith(temp -> {
            byte[] resultBytes = resultText.getBytes(StandardCharsets.UTF_8);
            Files.write(temp.resolve(RESULT), resultBytes);
            Files.writeString(temp.resolve(HTML), html.render(root, FileDigest.sha256(resultBytes), stamp),
                    StandardCharsets.UTF_8);
            Files.write(temp.resolve(CSV), new CapacitorCsv().of(root).getBytes(StandardCharsets.UTF_8));
            chart(temp, BODE, charts.bode(root).chart(), ReportCharts.BODE_HEIGHT, "pb-bode", pngs);
            chart(temp, SHARES, charts.cornerShares(root), ReportCharts.BAR_HEIGHT, "pb-shares", pngs);
            chart(temp, CAPACITORS, charts.capacitorBands(root), ReportCharts.BAR_HEIGHT, "pb-caps", pngs);
        });
        return stamp;
    }

    private static void chart(Path folder, String name, JFreeChart chart, int height, String prefix, boolean pngs)
            throws IOException {
        Files.writeString(folder.resolve(name), ReportCharts.svgDocument(chart, ReportCharts.WIDTH, height, prefix),
                StandardCharsets.UTF_8);
        if (pngs) {
            Files.write(folder.resolve(png(name)), ReportCharts.png(chart, ReportCharts.WIDTH, height));
        }
    }

    private static String png(String svgName) {
        return svgName.substring(0, svgName.length() - 4) + ".png";
    }
}

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import org.jfree.chart.JFreeChart;
import org.polebench.InputProblem;
import org.polebench.OutputFile;

/**
 * Writes a test report folder from a result's JSON object: {@code report.html} (self-contained),
 * {@code result.json} (the object as {@code reconcile --json} prints it), {@code capacitors.csv}
 * and each chart as its own SVG ({@code bode.svg}, {@code capacitor-shares.svg},
 * {@code capacitors.svg}), with PNG copies on request.
 *
 * <p>Every file is written into a fresh temporary folder beside the target, then moved into
 * place, so a failure half-way leaves the target as it was. A folder that already holds any of
 * these files is refused unless {@code force} is set; then only these files are replaced and
 * anything else in the folder is left alone.
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
        Path target = dir.toAbsolutePath().normalize();
        if (Files.exists(target) && !Files.isDirectory(target)) {
            throw new InputProblem(dir, 0, "the report folder " + dir + " is a file, not a folder", "name a folder for --report/--out");
        }
        List<String> existing = new ArrayList<>();
        if (Files.isDirectory(target)) {
            for (String name : FILES) {
                if (Files.exists(target.resolve(name))) {
                    existing.add(name);
                }
            }
            if (!existing.isEmpty() && !force) {
                throw new InputProblem(dir, 0, "the folder " + dir + " already holds a report (" + String.join(", ", existing)
                        + "); nothing was written", "choose another folder, or add --force to replace that report");
            }
        }
        String resultText = json.text(root);
        ReportStamp stamp = ReportStamp.issue(resultText, now);
        Path parent = target.getParent();
        Files.createDirectories(parent);
        // created with default attributes, so that the report folder it becomes, and the files in
        // it, have the permissions the user's umask gives (createTempDirectory would make it 700)
        Path temp = parent.resolve(".polebench-report-"
                + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36));
        try {
            Files.createDirectory(temp);
        } catch (IOException e) {
            throw OutputFile.failure(dir, e);
        }
        try {
            byte[] resultBytes = resultText.getBytes(StandardCharsets.UTF_8);
            Files.write(temp.resolve(RESULT), resultBytes);
            Files.writeString(temp.resolve(HTML), html.render(root, FileDigest.sha256(resultBytes), stamp),
                    StandardCharsets.UTF_8);
            Files.write(temp.resolve(CSV), new CapacitorCsv().of(root).getBytes(StandardCharsets.UTF_8));
            chart(temp, BODE, charts.bode(root).chart(), ReportCharts.BODE_HEIGHT, "pb-bode", pngs);
            chart(temp, SHARES, charts.cornerShares(root), ReportCharts.BAR_HEIGHT, "pb-shares", pngs);
            chart(temp, CAPACITORS, charts.capacitorBands(root), ReportCharts.BAR_HEIGHT, "pb-caps", pngs);
            if (!Files.exists(target)) {
                move(temp, target);
            } else {
                for (String name : FILES) {
                    Path made = temp.resolve(name);
                    if (Files.exists(made)) {
                        move(made, target.resolve(name));
                    } else if (existing.contains(name)) {
                        // a PNG of the replaced report that this one does not make would be stale
                        Files.delete(target.resolve(name));
                    }
                }
            }
        } catch (IOException e) {
            throw OutputFile.failure(dir, e);
        } finally {
            removeIfPresent(temp);
        }
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

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    private static void removeIfPresent(Path folder) throws IOException {
        if (!Files.exists(folder)) {
            return;
        }
        try (DirectoryStream<Path> files = Files.newDirectoryStream(folder)) {
            for (Path file : files) {
                Files.delete(file);
            }
        }
        Files.delete(folder);
    }
}

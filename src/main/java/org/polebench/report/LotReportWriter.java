package org.polebench.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import org.jfree.chart.JFreeChart;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import org.polebench.lot.LotFindings;
import org.polebench.lot.QuantityFindings;

/**
 * Writes a lot report folder: {@code lot.html} (self-contained), {@code lot.json} (the object
 * {@code polebench lot --json} prints), {@code boards.csv} (the board table) and each chart as
 * its own SVG ({@code lower-corner-spread.svg}, {@code lower-corner-chart.svg},
 * {@code midband-gain-spread.svg}, {@code midband-gain-chart.svg}, {@code culprits.svg}).
 *
 * <p>Every file is written into a fresh folder beside the target and the folder is then moved
 * into place (docs/contributing.md, "Rules every change keeps"), so a failure half-way leaves the target as it
 * was. A folder that already holds any of these files is refused unless {@code force} is set;
 * then only these files are replaced and anything else in it is left alone.
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
        Path target = dir.toAbsolutePath().normalize();
        if (Files.exists(target) && !Files.isDirectory(target)) {
            throw new InputProblem(dir, 0, "the report folder " + dir + " is a file, not a folder",
                    "name a folder for --report");
        }
        List<String> existing = new ArrayList<>();
        if (Files.isDirectory(target)) {
            for (String name : FILES) {
                if (Files.exists(target.resolve(name))) {
                    existing.add(name);
                }
            }
            if (!existing.isEmpty() && !force) {
                throw new InputProblem(dir, 0, "the folder " + dir + " already holds a lot report ("
                        + String.join(", ", existing) + "); nothing was written",
                        "choose another folder, or add --force to replace that report");
            }
        }
        Path parent = target.getParent();
        Files.createDirectories(parent);
        // default attributes, so the folder it becomes has the permissions the umask gives
        Path temp = parent.resolve(".polebench-lot-" + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36));
        try {
            Files.createDirectory(temp);
        } catch (IOException e) {
            throw OutputFile.failure(dir, e);
        }
        try {
            Files.writeString(temp.resolve(JSON), json.text(json.of(lot)), StandardCharsets.UTF_8);
            Files.writeString(temp.resolve(HTML), html.render(lot, now.truncatedTo(ChronoUnit.SECONDS).toString()),
                    StandardCharsets.UTF_8);
            byte[] csv = new LotCsv().of(lot).getBytes(StandardCharsets.UTF_8);
            OutputFile.write(temp.resolve(CSV), false, out -> out.write(csv));
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
            if (!Files.exists(target)) {
                move(temp, target);
            } else {
                for (String name : FILES) {
                    Path made = temp.resolve(name);
                    if (Files.exists(made)) {
                        move(made, target.resolve(name));
                    } else if (existing.contains(name)) {
                        // a chart of the replaced report that this lot does not draw would be stale
                        Files.delete(target.resolve(name));
                    }
                }
            }
        } catch (IOException e) {
            throw OutputFile.failure(dir, e);
        } finally {
            removeIfPresent(temp);
        }
    }

    private static void svg(Path folder, String name, JFreeChart chart, String prefix) throws IOException {
        Files.writeString(folder.resolve(name), ReportCharts.svgDocument(chart, ReportCharts.WIDTH, LotCharts.HEIGHT,
                prefix), StandardCharsets.UTF_8);
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

package org.polebench.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import java.util.stream.Stream;
import org.jfree.chart.JFreeChart;
import org.polebench.InputProblem;
import org.polebench.OutputFile;

/**
 * Writes a test report folder from a result's JSON object: {@code report.html} (self-contained),
 * {@code result.json} (the object as {@code reconcile --json} prints it), {@code capacitors.csv}
 * and each chart as its own SVG ({@code bode.svg}, {@code capacitor-shares.svg},
 * {@code capacitors.svg}), with PNG copies on request.
 *
 * <p>The whole folder is written as a fresh temporary folder beside the target and then renamed
 * into place, so that a failure or a killed run leaves the old report or the new one, never a
 * mix of the two (issue 15). A folder that already holds any of these files is refused unless
 * {@code force} is set; then the new folder also receives everything else the old one held
 * (files hard-linked where the file system allows, else copied), the old folder is renamed
 * aside, the new one renamed in, and the old one deleted. Between those two renames, a
 * matter of microseconds, the report is under the aside name
 * ({@code .<name>.polebench-old-…}) only; a run killed there is mended by the next write to
 * the same folder, which renames the old report back before it starts.
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
        restoreAside(target);
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
                keepOthers(target, temp);
                swap(target, temp);
            }
        } catch (IOException e) {
            throw OutputFile.failure(dir, e);
        } finally {
            removeIfPresent(temp);
        }
        return stamp;
    }

    /**
     * Brings what the old folder holds besides a report into the new one, so that replacing the
     * report loses none of the user's files. A PNG of the old report that the new one does not
     * make is left out: it would be stale.
     */
    private static void keepOthers(Path target, Path temp) throws IOException {
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(target)) {
            for (Path entry : entries) {
                String name = entry.getFileName().toString();
                if (FILES.contains(name)) {
                    continue;
                }
                Path copy = temp.resolve(name);
                if (Files.isDirectory(entry, LinkOption.NOFOLLOW_LINKS)) {
                    copyTree(entry, copy);
                } else {
                    linkOrCopy(entry, copy);
                }
            }
        }
    }

    private static void linkOrCopy(Path file, Path copy) throws IOException {
        if (Files.isRegularFile(file, LinkOption.NOFOLLOW_LINKS)) {
            try {
                Files.createLink(copy, file);
                return;
            } catch (IOException | UnsupportedOperationException notHere) {
                // another file system or no hard links: copy instead
            }
        }
        Files.copy(file, copy, LinkOption.NOFOLLOW_LINKS, StandardCopyOption.COPY_ATTRIBUTES);
    }

    private static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> walk = Files.walk(from)) {
            for (Path source : (Iterable<Path>) walk::iterator) {
                Path made = to.resolve(from.relativize(source).toString());
                if (Files.isDirectory(source, LinkOption.NOFOLLOW_LINKS)) {
                    Files.createDirectories(made);
                } else {
                    linkOrCopy(source, made);
                }
            }
        }
    }

    /**
     * Puts back a report that a killed run had renamed aside just before renaming its new one
     * in: the folder is missing and exactly one aside copy of it is there.
     */
    private static void restoreAside(Path target) throws IOException {
        Path parent = target.getParent();
        if (parent == null || Files.exists(target, LinkOption.NOFOLLOW_LINKS) || !Files.isDirectory(parent)) {
            return;
        }
        String prefix = asidePrefix(target);
        List<Path> asides = new ArrayList<>();
        try (DirectoryStream<Path> siblings = Files.newDirectoryStream(parent, p -> p.getFileName().toString()
                .startsWith(prefix))) {
            siblings.forEach(asides::add);
        }
        if (asides.size() == 1) {
            move(asides.get(0), target);
        }
    }

    private static String asidePrefix(Path target) {
        return "." + target.getFileName() + ".polebench-old-";
    }

    /** Renames the old folder aside, the new one in, and deletes the old one. */
    private static void swap(Path target, Path temp) throws IOException {
        Path aside = target.resolveSibling(asidePrefix(target)
                + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36));
        move(target, aside);
        try {
            move(temp, target);
        } catch (IOException e) {
            move(aside, target);   // put the old report back before saying why
            throw e;
        }
        deleteTree(aside);
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
        if (Files.exists(folder, LinkOption.NOFOLLOW_LINKS)) {
            deleteTree(folder);
        }
    }

    /** Deletes a folder and what it holds, deepest first; links are removed, never followed. */
    private static void deleteTree(Path folder) throws IOException {
        try (Stream<Path> walk = Files.walk(folder)) {
            List<Path> all = walk.sorted(Comparator.reverseOrder()).toList();
            for (Path path : all) {
                Files.delete(path);
            }
        }
    }
}

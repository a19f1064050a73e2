package org.polebench.ledger;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Stream;
import org.polebench.InputProblem;

/**
 * The sweep files a batch takes: each file named as it is, and each folder's sweep files (its
 * regular files ending in {@code .csv}, {@code .tsv}, {@code .txt}, {@code .log} or {@code .dat},
 * not hidden; not its sub-folders), in name order, so that a batch run again takes them in the
 * same order.
 */
public final class SweepFiles {
    /** The endings a folder's sweep files have. */
    public static final Set<String> ENDINGS = Set.of(".csv", ".tsv", ".txt", ".log", ".dat");

    /**
     * @throws InputProblem when a named file or folder does not exist, or nothing is left to take
     * @throws IOException  when a folder cannot be listed
     */
    public List<Path> expand(List<Path> given) throws InputProblem, IOException {
        List<Path> files = new ArrayList<>();
        for (Path path : given) {
            if (Files.isDirectory(path)) {
                try (Stream<Path> entries = Files.list(path)) {
                    entries.filter(SweepFiles::isSweep).sorted().forEach(files::add);
                }
            } else if (Files.exists(path)) {
                files.add(path);
            } else {
                throw new InputProblem(path, 0, "no such file or folder", "check the path, or list the sweeps again");
            }
        }
        if (files.isEmpty()) {
            throw new InputProblem(given.isEmpty() ? null : given.get(0), 0, "no sweep files to take",
                    "name sweep files, or folders holding files ending in " + String.join(", ", ENDINGS.stream()
                            .sorted().toList()));
        }
        return files;
    }

    private static boolean isSweep(Path file) {
        String name = file.getFileName().toString();
        if (name.startsWith(".") || !Files.isRegularFile(file)) {
            return false;
        }
        String lower = name.toLowerCase(Locale.ROOT);
        return ENDINGS.stream().anyMatch(lower::endsWith);
    }
}

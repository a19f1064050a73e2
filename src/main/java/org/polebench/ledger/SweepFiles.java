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
 * The boards a batch takes: each file named as it is; each named folder's sweep files (its
 * regular files ending in {@code .csv}, {@code .tsv}, {@code .txt}, {@code .log} or {@code .dat},
 * not hidden), each one board; and each named folder's sub-folders (not hidden), each one board's
 * set of scope waveform records (issue 17). In name order, so that a batch run again takes them
 * in the same order. Deeper folders are not searched.
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
                    entries.filter(entry -> isSweep(entry) || isRecordFolder(entry)).sorted().forEach(files::add);
                }
            } else if (Files.exists(path)) {
                files.add(path);
            } else {
                throw new InputProblem(path, 0, "no such file or folder", "check the path, or list the sweeps again");
            }
        }
        if (files.isEmpty()) {
            throw new InputProblem(given.isEmpty() ? null : given.get(0), 0, "no sweep files or record folders to take",
                    "name sweep files, or folders holding sub-folders of scope records or files ending in " + String.join(", ", ENDINGS.stream()
                            .sorted().toList()));
        }
        return files;
    }

    /** @return whether a folder's entry is a sub-folder of records: one board's scope records */
    private static boolean isRecordFolder(Path entry) {
        return Files.isDirectory(entry) && !entry.getFileName().toString().startsWith(".");
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

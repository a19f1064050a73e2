package org.polebench.waveform;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.polebench.InputProblem;

/**
 * The record files a user named: a folder's files matching a glob, in name order, or a list of
 * files as given.
 */
public final class RecordFiles {
    private RecordFiles() {
    }

    /** @return true when the paths name a set of records rather than one sweep file: a folder, or more than one file */
    public static boolean isRecordSet(List<Path> paths) {
        return paths.size() > 1 || (paths.size() == 1 && Files.isDirectory(paths.get(0)));
    }

    /**
     * @param glob the pattern a folder's record files match, such as {@code *.csv}
     * @throws InputProblem when a folder holds no such file or a named file does not exist
     */
    public static List<Path> expand(List<Path> paths, String glob) throws InputProblem {
        List<Path> files = new ArrayList<>();
        for (Path path : paths) {
            if (Files.isDirectory(path)) {
                List<Path> found = new ArrayList<>();
                try (DirectoryStream<Path> listing = Files.newDirectoryStream(path, glob)) {
                    for (Path file : listing) {
                        if (Files.isRegularFile(file) && !file.getFileName().toString().startsWith(".")) {
                            found.add(file);
                        }
                    }
                } catch (IOException e) {
                    throw new UncheckedIOException("cannot list " + path + ": " + e.getMessage(), e);
                }
                if (found.isEmpty()) {
                    throw new InputProblem(path, 0, "the folder holds no record file matching " + glob,
                            "save the records there, or name a profile whose files pattern matches them");
                }
                found.sort(null);
                files.addAll(found);
            } else if (Files.isRegularFile(path)) {
                files.add(path);
            } else {
                throw new InputProblem(path, 0, "file not found", "check the path");
            }
        }
        return files;
    }
}

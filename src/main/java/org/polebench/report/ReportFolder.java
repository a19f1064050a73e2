package org.polebench.report;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import java.util.stream.Stream;
import org.polebench.InputProblem;
import org.polebench.OutputFile;

/**
 * One report folder replaced whole: the new report is written into a fresh folder beside the
 * target, then renamed into place, so that a failure or a killed run leaves the old report or
 * the new one, never a mix of the two (issue 15). When the target exists, the new folder first
 * receives everything else the old one held (files hard-linked where the file system allows,
 * else copied), the old folder is renamed aside, the new one renamed in, and the old one
 * deleted. Between those two renames, a matter of microseconds, the report is under the aside
 * name ({@code .<name>.polebench-old-…}) only; a run killed there is mended by the next write to
 * the same folder, which renames the old report back before it starts.
 *
 * <p>Used by the board's test report and the lot report alike, each with its own list of the
 * files it owns.
 */
final class ReportFolder {
    private final Path given;
    private final Path target;
    private final List<String> owned;

    /**
     * @param dir   the report folder as the user named it
     * @param owned every file name a report of this kind may hold
     */
    ReportFolder(Path dir, List<String> owned) {
        this.given = dir;
        this.target = dir.toAbsolutePath().normalize();
        this.owned = List.copyOf(owned);
    }

    /**
     * Mends a killed run, then checks that the folder may be written.
     *
     * @param kind  what the report is called in the message ("report", "lot report")
     * @param force replace an earlier report in the folder
     * @throws InputProblem when the folder is a file, or holds a report and {@code force} is off
     */
    void claim(String kind, boolean force) throws InputProblem, IOException {
        restoreAside();
        if (Files.exists(target) && !Files.isDirectory(target)) {
            throw new InputProblem(given, 0, "the " + kind + " folder " + given + " is a file, not a folder",
                    "name a folder");
        }
        if (Files.isDirectory(target)) {
            List<String> existing = new ArrayList<>();
            for (String name : owned) {
                if (Files.exists(target.resolve(name))) {
                    existing.add(name);
                }
            }
            if (!existing.isEmpty() && !force) {
                throw new InputProblem(given, 0, "the folder " + given + " already holds a " + kind + " ("
                        + String.join(", ", existing) + "); nothing was written",
                        "choose another folder, or add --force to replace that " + kind);
            }
        }
    }

    /** What fills the fresh folder. */
    interface Contents {
        void writeInto(Path folder) throws IOException;
    }

    /**
     * Writes the report into a fresh folder and puts it in place of the old one; the fresh
     * folder is gone on every way out.
     */
    void replaceWith(Contents contents) throws InputProblem, IOException {
        Path parent = target.getParent();
        Files.createDirectories(parent);
        // created with default attributes, so that the report folder it becomes, and the files in
        // it, have the permissions the user's umask gives (createTempDirectory would make it 700)
        Path temp = parent.resolve(".polebench-report-"
                + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36));
        try {
            Files.createDirectory(temp);
        } catch (IOException e) {
            throw OutputFile.failure(given, e);
        }
        try {
            contents.writeInto(temp);
            if (!Files.exists(target)) {
                move(temp, target);
            } else {
                keepOthers(temp);
                swap(temp);
            }
        } catch (IOException e) {
            throw OutputFile.failure(given, e);
        } finally {
            if (Files.exists(temp, LinkOption.NOFOLLOW_LINKS)) {
                deleteTree(temp);
            }
        }
    }

    /**
     * Brings what the old folder holds besides a report into the new one, so that replacing the
     * report loses none of the user's files. A file the old report had and the new one does not
     * make is left out: it would be stale.
     */
    private void keepOthers(Path temp) throws IOException {
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(target)) {
            for (Path entry : entries) {
                String name = entry.getFileName().toString();
                if (owned.contains(name)) {
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
    private void restoreAside() throws IOException {
        Path parent = target.getParent();
        if (parent == null || Files.exists(target, LinkOption.NOFOLLOW_LINKS) || !Files.isDirectory(parent)) {
            return;
        }
        String prefix = asidePrefix();
        List<Path> asides = new ArrayList<>();
        try (DirectoryStream<Path> siblings = Files.newDirectoryStream(parent, p -> p.getFileName().toString()
                .startsWith(prefix))) {
            siblings.forEach(asides::add);
        }
        if (asides.size() == 1) {
            move(asides.get(0), target);
        }
    }

    private String asidePrefix() {
        return "." + target.getFileName() + ".polebench-old-";
    }

    /** Renames the old folder aside, the new one in, and deletes the old one. */
    private void swap(Path temp) throws IOException {
        Path aside = target.resolveSibling(asidePrefix()
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

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
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

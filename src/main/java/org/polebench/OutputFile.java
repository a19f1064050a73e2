package org.polebench;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.concurrent.ThreadLocalRandom;

/**
 * A file written for the user, atomically: the content goes to a temporary file beside the
 * target, which is then renamed over it, so that a reader sees the old file or the new one and
 * never half of either. The temporary file is created with default attributes, so the file
 * that results has the permissions the user's umask gives ({@code Files.createTempFile} would
 * make it 0600). A symbolic link is followed, so that {@code --force} replaces its target and
 * the link stays; a folder, a device or a FIFO is refused, never replaced or written into.
 * Permission and disk errors name the file the user gave and the cause.
 */
public final class OutputFile {
    /** Symbolic links followed at most, as Linux's own limit (MAXSYMLINKS, 40) for a path. */
    private static final int MAX_LINKS = 40;

    /** What writes the file's bytes. */
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private OutputFile() {
    }

    /**
     * @return the regular file a write to {@code requested} lands on: itself, or the end of its
     *         chain of symbolic links (which may not exist yet)
     * @throws InputProblem when that is a folder, a device, a FIFO or another special file, or
     *                      when the links do not end
     */
    public static Path target(Path requested) throws InputProblem {
        Path path = requested.toAbsolutePath();
        for (int i = 0; Files.isSymbolicLink(path); i++) {
            if (i == MAX_LINKS) {
                throw new InputProblem(requested, 0, "the symbolic link leads through more than " + MAX_LINKS
                        + " links (a loop?)", "name a regular file");
            }
            try {
                path = path.getParent().resolve(Files.readSymbolicLink(path)).normalize();
            } catch (IOException e) {
                throw new InputProblem(requested, 0, "the symbolic link cannot be read (" + cause(e) + ")",
                        "name a regular file", e);
            }
        }
        if (Files.exists(path, LinkOption.NOFOLLOW_LINKS) && !Files.isRegularFile(path, LinkOption.NOFOLLOW_LINKS)) {
            String kind = Files.isDirectory(path, LinkOption.NOFOLLOW_LINKS) ? "a folder" : "a device or other special file";
            throw new InputProblem(requested, 0, (path.equals(requested.toAbsolutePath()) ? "" : "it leads to " + path
                    + ", which ") + "is " + kind + ", not a regular file; polebench writes only regular files",
                    "name a regular file");
        }
        return path;
    }

    /**
     * Writes the file atomically.
     *
     * @param overwrite replace an existing file (the user's {@code --force})
     * @throws InputProblem when the file exists and {@code overwrite} is off, or the target is
     *                      not a regular file ({@link #target}); nothing is written then
     * @throws IOException  when writing fails, with the file and the cause in its message
     */
    public static void write(Path requested, boolean overwrite, Content content) throws InputProblem, IOException {
        Path target = target(requested);
        if (!overwrite && Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            throw new InputProblem(requested, 0, "the file exists and is left as it is",
                    "choose another name, or ask to overwrite it (--force)");
        }
        Path directory = target.getParent();
        Path temporary = directory.resolve("." + target.getFileName() + "."
                + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36) + ".part");
        try {
            Files.createDirectories(directory);
            // CREATE_NEW with no attributes: mode 0666 less the umask, as any program's new file
            try (OutputStream out = Files.newOutputStream(temporary, StandardOpenOption.CREATE_NEW,
                    StandardOpenOption.WRITE)) {
                content.writeTo(out);
            }
            if (overwrite) {
                Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } else {
                try {
                    Files.move(temporary, target);
                } catch (FileAlreadyExistsException e) {
                    throw new InputProblem(requested, 0, "the file appeared while it was being written and is left"
                            + " as it is", "choose another name, or ask to overwrite it (--force)");
                }
            }
        } catch (IOException e) {
            throw failure(requested, e);
        } finally {
            removeQuietly(temporary);
        }
    }

    /** After a failure, the failure is what the user needs to hear, not that the cleanup failed too. */
    private static void removeQuietly(Path temporary) {
        try {
            Files.deleteIfExists(temporary);
        } catch (IOException e) {
            // the folder is unusable (the write's own error says why); a leftover .part is hidden and harmless
        }
    }

    /** @return an IOException naming the file the user gave and the cause in plain words */
    public static IOException failure(Path file, IOException e) {
        return new IOException("cannot write " + file + ": " + cause(e), e);
    }

    /**
     * @return the cause of a file-system error in plain words: the operating system's reason
     *         (such as "No space left on device"), else what the exception's type says
     */
    public static String cause(IOException e) {
        if (e instanceof FileSystemException) {
            FileSystemException fs = (FileSystemException) e;
            String where = fs.getFile() == null ? "" : " (" + fs.getFile() + ")";
            if (fs.getReason() != null) {
                return fs.getReason() + where;
            }
            if (e instanceof AccessDeniedException) {
                return "permission denied" + where;
            }
            if (e instanceof NoSuchFileException) {
                return "no such file or folder" + where;
            }
            if (e instanceof FileAlreadyExistsException) {
                return "already exists" + where;
            }
            return e.getClass().getSimpleName() + where;
        }
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }
}

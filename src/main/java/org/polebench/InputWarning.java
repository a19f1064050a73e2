package org.polebench;

import java.nio.file.Path;
import java.util.Optional;

/**
 * Something the user should know about their input that did not stop the work:
 * an implausible value accepted, points dropped or merged, a band that misses the
 * corner. Carried in results so that reports can list every one.
 *
 * @param file    the file it concerns, or null for a live port or computed result
 * @param line    1-based line, or 0 when no single line is concerned (a long: files past 2³¹ lines)
 * @param message what was noticed and what was done about it
 */
public record InputWarning(Path file, long line, String message) {
    public InputWarning {
        if (line < 0) {
            throw new IllegalArgumentException("line must be 1-based or 0, was " + line);
        }
        if (message == null || message.isBlank()) {
            throw new IllegalArgumentException("a warning needs a message");
        }
    }

    /** A warning about a result rather than a place in a file. */
    public static InputWarning general(String message) {
        return new InputWarning(null, 0, message);
    }

    public Optional<Path> fileIfAny() {
        return Optional.ofNullable(file);
    }

    /** @return "file:line: message", the form the CLI and reports print */
    public String describe() {
        if (file == null) {
            return line > 0 ? "line " + line + ": " + message : message;
        }
        return line > 0 ? file + ":" + line + ": " + message : file + ": " + message;
    }
}

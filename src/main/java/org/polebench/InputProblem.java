package org.polebench;

import java.nio.file.Path;
import java.util.Optional;

/**
 * The one checked problem the library throws when the user's input is at fault:
 * a stage file, a sweep, a profile, a command-line value or a live port. It names
 * where (file and line, when known), what is wrong, and what would fix it, so that
 * the CLI can print it without a stack trace.
 */
public final class InputProblem extends Exception {
    private static final long serialVersionUID = 1L;

    private final Path file;   // null for a live port or a command-line value
    private final long line;   // 1-based, a long so that no file is too long to count; 0 when no single line is at fault
    private final String hint; // what to change, in the user's terms; may be empty

    public InputProblem(Path file, long line, String message, String hint) {
        super(message);
        if (line < 0) {
            throw new IllegalArgumentException("line must be 1-based or 0, was " + line);
        }
        this.file = file;
        this.line = line;
        this.hint = hint == null ? "" : hint;
    }

    public InputProblem(Path file, long line, String message, String hint, Throwable cause) {
        this(file, line, message, hint);
        initCause(cause);
    }

    /** @return the file at fault, empty for a live port or a command-line value */
    public Optional<Path> file() {
        return Optional.ofNullable(file);
    }

    /** @return the 1-based line at fault, or 0 when no single line is */
    public long line() {
        return line;
    }

    /** @return what would fix it, in the user's terms; empty when nothing useful can be said */
    public String hint() {
        return hint;
    }

    /** @return "file:line: message (hint)", the form the CLI prints */
    public String describe() {
        StringBuilder text = new StringBuilder();
        if (file != null) {
            text.append(file);
            if (line > 0) {
                text.append(':').append(line);
            }
            text.append(": ");
        } else if (line > 0) {
            text.append("line ").append(line).append(": ");
        }
        text.append(getMessage());
        if (!hint.isEmpty()) {
            text.append("\n  fix: ").append(hint);
        }
        return text.toString();
    }
}

package org.polebench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Keeps a test's measured figures (rates, ratios, the cases it got wrong) in
 * {@code target/test-figures/<TestClass>.<method>.txt} instead of printing them, so that the
 * test output stays quiet and the figures can still be quoted. The file is written to a
 * temporary file beside it and moved into place, so a reader never sees half of it. Call it
 * before the assertions, so that the figures of a failing run are kept too.
 */
public final class TestFigures {
    /** Surefire runs the tests in the project's directory, so this is the build's own target/. */
    private static final Path DIRECTORY = Path.of("target", "test-figures");

    private TestFigures() {
    }

    /**
     * @param test    the test class
     * @param method  the test method's name
     * @param figures the figures, as the test's assertion messages give them
     * @return the file written
     */
    public static Path keep(Class<?> test, String method, String figures) {
        try {
            Files.createDirectories(DIRECTORY);
            Path file = DIRECTORY.resolve(test.getSimpleName() + "." + method + ".txt");
            Path temporary = Files.createTempFile(DIRECTORY, file.getFileName().toString(), ".tmp");
            try {
                Files.writeString(temporary, figures.endsWith("\n") ? figures : figures + "\n", StandardCharsets.UTF_8);
                Files.move(temporary, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } finally {
                Files.deleteIfExists(temporary);
            }
            return file;
        } catch (IOException problem) {
            throw new UncheckedIOException("could not keep the figures of " + test.getSimpleName() + "." + method,
                    problem);
        }
    }
}

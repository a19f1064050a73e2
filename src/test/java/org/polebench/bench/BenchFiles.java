package org.polebench.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/** Writes stage and bench text to a temporary directory and reads it, for tests. */
final class BenchFiles {
    private BenchFiles() {
    }

    static Path write(Path dir, String suffix, String text) {
        try {
            Path file = Files.createTempFile(dir, "test", suffix);
            Files.writeString(file, text, StandardCharsets.UTF_8);
            return file;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static Stage stage(Path dir, String... lines) throws InputProblem {
        return new StageReader().read(write(dir, ".stage.yaml", String.join("\n", lines) + "\n")).stage();
    }

    static Bench bench(Path dir, String... lines) throws InputProblem {
        return new BenchReader().read(write(dir, ".bench.yaml", String.join("\n", lines) + "\n"));
    }
}

package org.polebench.circuit;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.polebench.InputProblem;

/** Writes stage-file text to a temporary directory and reads it, for tests. */
final class StageFiles {
    /** A common-emitter stage with a divider bias and a bypassed emitter; tests edit it by replace. */
    static final String COMMON_EMITTER = String.join("\n",
            "name: test common emitter",
            "ground: gnd",
            "supplies: {vcc: 12}",
            "input: {node: in, source-resistance: 600}",
            "output: {node: out, load: 47k}",
            "parts:",
            "  R1: {resistor: 68k, between: [vcc, b]}",
            "  R2: {resistor: 15k, between: [b, gnd]}",
            "  RC: {resistor: 4.7k, between: [vcc, c]}",
            "  RE: {resistor: 1.2k, between: [e, gnd]}",
            "  C1: {capacitor: 4.7u, between: [in, b]}",
            "  C2: {capacitor: 10u, between: [c, out]}",
            "  C3: {capacitor: 470u, between: [e, gnd]}",
            "  Q1: {npn: {c: c, b: b, e: e}, beta: 150, bias: auto}",
            "");

    private StageFiles() {
    }

    static Path write(Path dir, String text) {
        try {
            Path file = Files.createTempFile(dir, "test", ".stage.yaml");
            Files.writeString(file, text, StandardCharsets.UTF_8);
            return file;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static StageFile read(Path dir, String text) throws InputProblem {
        return new StageReader().read(write(dir, text));
    }

    static Stage stage(Path dir, String text) throws InputProblem {
        return read(dir, text).stage();
    }

    /** @return the 1-based line of the first line containing {@code marker}: found in the text, not the code */
    static int lineOf(String text, String marker) {
        String[] lines = text.split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            if (lines[i].contains(marker)) {
                return i + 1;
            }
        }
        throw new IllegalArgumentException("no line contains " + marker);
    }

    static Path demo(String fileName) {
        return Path.of("sample-measurements", fileName);
    }
}

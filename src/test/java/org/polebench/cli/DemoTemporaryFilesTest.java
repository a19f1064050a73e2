package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A no-argument demo run unpacks its sample into a temporary folder and removes it on exit (issue 15). */
class DemoTemporaryFilesTest {
    @TempDir
    Path dir;

    @Test
    void theDemoLeavesNothingInTheTemporaryFolder() throws Exception {
        Path temp = Files.createDirectories(dir.resolve("tmp"));
        Path work = Files.createDirectories(dir.resolve("work"));   // no sample-measurements here: the jar's copy is used
        String classpath = DocumentCommandsTest.runtimeClasspath().stream().map(p -> p.toAbsolutePath().toString())
                .collect(Collectors.joining(File.pathSeparator));
        Process process = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Djava.io.tmpdir=" + temp, "-cp", classpath, "org.polebench.cli.Main", "predict", "--samples", "50")
                .directory(work.toFile()).redirectOutput(dir.resolve("out.txt").toFile())
                .redirectError(dir.resolve("err.txt").toFile()).start();
        assertTrue(process.waitFor(120, TimeUnit.SECONDS), "the demo did not end");
        assertEquals(0, process.exitValue(), Files.readString(dir.resolve("err.txt")));
        assertTrue(Files.readString(dir.resolve("out.txt")).contains("demo"), "the demo ran on the bundled stage");
        try (Stream<Path> left = Files.list(temp)) {
            assertEquals(List.of(), left.collect(Collectors.toList()));
        }
    }
}

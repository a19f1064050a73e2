package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * bin/polebench, the launcher, run as written by sh against a stand-in Java that prints the
 * options it was given: it passes the class-data archive when there is one, chooses the quick
 * JIT for ordinary runs and the full one for a batch, a folder or a large file (the rule its
 * header and docs/contributing.md state), and refuses a missing jar or an unknown choice with
 * the project's own two-line message.
 */
class LauncherScriptTest {
    private static final String QUICK = "-XX:TieredStopAtLevel=1";

    @TempDir
    Path home;

    private Path javaHome;

    @BeforeEach
    void installLauncherAndAStandInJava() throws IOException {
        Files.createDirectories(home.resolve("bin"));
        Files.copy(Path.of("bin", "polebench"), home.resolve("bin").resolve("polebench"));
        Files.createDirectories(home.resolve("target"));
        Files.writeString(home.resolve("target").resolve("polebench.jar"), "stand-in");
        javaHome = home.resolve("jdk");
        Files.createDirectories(javaHome.resolve("bin"));
        Path java = javaHome.resolve("bin").resolve("java");
        Files.writeString(java, "#!/bin/sh\nprintf '%s\\n' \"$@\"\n");
        assertTrue(java.toFile().setExecutable(true));
    }

    private Run launch(Map<String, String> env, String... args) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of("sh", home.resolve("bin").resolve("polebench").toString()));
        command.addAll(List.of(args));
        ProcessBuilder builder = new ProcessBuilder(command).directory(home.toFile());
        builder.environment().remove("POLEBENCH_JIT");
        builder.environment().remove("POLEBENCH_JAVA_OPTS");
        builder.environment().put("JAVA_HOME", javaHome.toString());
        builder.environment().putAll(env);
        Process process = builder.start();
        String out = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        String err = new String(process.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        return new Run(process.waitFor(), out.lines().toList(), err);
    }

    private record Run(int exit, List<String> javaArgs, String err) {
    }

    @Test
    void anOrdinaryRunGetsTheQuickJitAndTheArchiveWhenItIsThere() throws Exception {
        Run without = launch(Map.of(), "reconcile", "--json");
        assertEquals(0, without.exit(), without.err());
        assertTrue(without.javaArgs().contains(QUICK), without.javaArgs().toString());
        assertFalse(without.javaArgs().stream().anyMatch(a -> a.startsWith("-XX:SharedArchiveFile=")));
        // the jar and the user's arguments come last, unchanged
        List<String> tail = without.javaArgs().subList(without.javaArgs().size() - 4, without.javaArgs().size());
        assertEquals(List.of("-jar", home.toRealPath().resolve("target/polebench.jar").toString(), "reconcile", "--json"),
                tail);

        Files.writeString(home.resolve("target").resolve("polebench.jsa"), "stand-in");
        Run with = launch(Map.of(), "fit", "x.csv");
        assertTrue(with.javaArgs().contains("-XX:SharedArchiveFile=" + home.toRealPath().resolve("target/polebench.jsa")),
                with.javaArgs().toString());
    }

    @Test
    void aBatchAFolderALargeFileOrALongStageGetTheFullJit() throws Exception {
        assertFalse(launch(Map.of(), "batch", "--stage", "s.yaml").javaArgs().contains(QUICK));
        Files.createDirectories(home.resolve("records"));
        assertFalse(launch(Map.of(), "inspect", home.resolve("records").toString()).javaArgs().contains(QUICK));
        Path large = home.resolve("large.csv");
        try (RandomAccessFile file = new RandomAccessFile(large.toFile(), "rw")) {
            file.setLength(9L * 1024 * 1024);   // sparse: 9 MiB, over the 8 MB line
        }
        assertFalse(launch(Map.of(), "inspect", large.toString()).javaArgs().contains(QUICK));
        // a stage file over 4 KB (a long cascade; the bundled demos are 1-2 KB) and a small one
        Path cascade = home.resolve("cascade.stage.yaml");
        Files.writeString(cascade, "#".repeat(5000) + "\n");
        assertFalse(launch(Map.of(), "predict", cascade.toString()).javaArgs().contains(QUICK));
        Path demo = home.resolve("demo.stage.yaml");
        Files.writeString(demo, "#".repeat(1500) + "\n");
        assertTrue(launch(Map.of(), "predict", demo.toString()).javaArgs().contains(QUICK));
        Path small = home.resolve("small.csv");
        Files.writeString(small, "frequency_hz,gain_db\n");
        assertTrue(launch(Map.of(), "inspect", small.toString()).javaArgs().contains(QUICK));
    }

    @Test
    void theEnvironmentOverridesTheChoiceAndAddsOptions() throws Exception {
        Run full = launch(Map.of("POLEBENCH_JIT", "full", "POLEBENCH_JAVA_OPTS", "-Xmx3g"), "reconcile");
        assertFalse(full.javaArgs().contains(QUICK));
        assertTrue(full.javaArgs().contains("-Xmx3g"), full.javaArgs().toString());
        assertTrue(launch(Map.of("POLEBENCH_JIT", "quick"), "batch").javaArgs().contains(QUICK));
        Run wrong = launch(Map.of("POLEBENCH_JIT", "fast"), "reconcile");
        assertEquals(ExitCodes.BAD_INPUT, wrong.exit());
        assertTrue(wrong.err().startsWith("polebench: POLEBENCH_JIT=fast") && wrong.err().contains("  fix: "), wrong.err());
    }

    @Test
    void aMissingJarIsRefusedWithTheBuildCommand() throws Exception {
        Files.delete(home.resolve("target").resolve("polebench.jar"));
        Run run = launch(Map.of(), "reconcile");
        assertEquals(ExitCodes.BAD_INPUT, run.exit());
        assertEquals(List.of(), run.javaArgs());
        assertTrue(run.err().contains("fix: run 'mvn -q -DskipTests package'"), run.err());
    }
}

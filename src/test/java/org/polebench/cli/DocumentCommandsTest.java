package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Enumeration;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.jar.Attributes;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every {@code sh} block of the README and of docs/ runs as written (issue 12): each block is
 * run by {@code bash -e} in a fresh folder holding copies of {@code sample-measurements/} and
 * {@code instrument-profiles/} and a {@code target/polebench.jar}, and must end with the exit
 * code its document states in a comment line {@code # exits with N: why} (0 when it states
 * none). Blocks marked {@code text} (templates to fill in, and the Maven builds) are not run.
 *
 * <p>During {@code mvn test} the shaded jar is not built yet, so the {@code target/polebench.jar}
 * given to the blocks is a jar of a manifest alone: Main-Class {@link Main} and a Class-Path of
 * this test's own runtime classpath (target/classes and the dependency jars), which runs the
 * same classes the shaded jar would carry.
 *
 * <p>Each block runs in a process group of its own ({@code setsid}), and the whole group is
 * killed when the block ends or overruns its time, so a background simulator or socat never
 * outlives it. The blocks run a few at a time (they are separate processes in separate
 * folders), which keeps the test near 20 s instead of the 45 s they take one after another.
 */
class DocumentCommandsTest {
    private static final Path ROOT = Path.of("").toAbsolutePath();
    /** Generous against the slowest block (a simulated 31-point capture, about 16 s alone). */
    private static final Duration LIMIT = Duration.ofSeconds(120);
    private static final Pattern STATED_EXIT = Pattern.compile("^\\s*# exits with (\\d+)\\b.*");
    /** The end of stdout and stderr kept in a failure message: enough for a stack of errors. */
    private static final int TAIL = 4000;

    @TempDir
    static Path scratch;
    private static Path jar;
    private static ExecutorService pool;

    /** A fenced {@code sh} block of a document: where it starts, its text, its stated exit code. */
    record Block(String document, int line, String text, int expectedExit) {
        String name() {
            return document + " line " + line;
        }
    }

    /** How a block's run ended. */
    record Outcome(int exit, boolean timedOut, String stdout, String stderr) {
    }

    @BeforeAll
    static void makeTheJar() throws IOException {
        jar = manifestOnlyJar(scratch.resolve("jar"), runtimeClasspath());
        pool = Executors.newFixedThreadPool(4, runnable -> {
            Thread thread = new Thread(runnable, "document-block");
            thread.setDaemon(true);
            return thread;
        });
    }

    @AfterAll
    static void stopThePool() {
        pool.shutdownNow();
    }

    @TestFactory
    Stream<DynamicTest> everyShellBlockOfTheDocumentsRunsAsWritten() throws IOException {
        List<Block> blocks = new ArrayList<>();
        List<String> documents = new ArrayList<>();
        documents.add("README.md");
        try (Stream<Path> docs = Files.list(ROOT.resolve("docs"))) {
            docs.filter(p -> p.getFileName().toString().endsWith(".md"))
                    .map(p -> "docs/" + p.getFileName())
                    .sorted()
                    .forEach(documents::add);
        }
        for (String document : documents) {
            blocks.addAll(blocks(document, Files.readString(ROOT.resolve(document), StandardCharsets.UTF_8)));
        }
        // the README's five (the demo reconcile and the tour's four) and the user guide's six
        // (predict, fit, reconcile, synthesize, and capture against simulate over socat and over
        // TCP), batch with history and synthesize --draw-seed (issue 16), and the three of scope
        // records (synthesize and read records, synthesize clipped ones and inspect them,
        // reconcile the demo records), and live scope capture against simulate over TCP (issue 17):
        // counted, so that a block lost or turned into text in an
        // edit is noticed
        assertEquals(19, blocks.size(), blocks.stream().map(Block::name).collect(Collectors.joining("\n")));

        List<Future<Outcome>> runs = new ArrayList<>();
        for (Block block : blocks) {
            Path folder = Files.createTempDirectory(scratch, "block");
            runs.add(pool.submit(() -> run(block, folder, jar, LIMIT)));
        }
        List<DynamicTest> tests = new ArrayList<>();
        for (int i = 0; i < blocks.size(); i++) {
            Block block = blocks.get(i);
            Future<Outcome> run = runs.get(i);
            tests.add(DynamicTest.dynamicTest(block.name(), () -> {
                if (block.text().contains("socat ")) {
                    Assumptions.assumeTrue(socatInstalled(), block.name() + " needs socat, which is not "
                            + "installed: skipped (.ci/run installs it; or apt-get install socat)");
                }
                Outcome outcome = outcome(run);
                assertFalse(outcome.timedOut(), () -> block.name() + ": the block did not end within "
                        + LIMIT.toSeconds() + " s" + transcript(block, outcome));
                assertEquals(block.expectedExit(), outcome.exit(), () -> block.name() + ": the block ended "
                        + "with exit code " + outcome.exit() + ", the document says " + block.expectedExit()
                        + transcript(block, outcome));
            }));
        }
        return tests.stream();
    }

    @Test
    void blocksAreFoundWithTheirStatedExitCodesAndOtherLanguagesAreLeftOut() {
        // a made-up document whose blocks are known: two sh blocks, one stating exit code 1
        String markdown = String.join("\n",
                "# Title",
                "```sh",
                "echo one",
                "```",
                "```text",
                "capture --port /dev/ttyUSB0",
                "```",
                "```",
                "$ not run either",
                "```",
                "  ```sh",
                "  reconcile",
                "  # exits with 1: the board fails",
                "  ```",
                "");

        List<Block> blocks = blocks("made-up guide", markdown);

        assertEquals(List.of(new Block("made-up guide", 2, "echo one\n", 0),
                new Block("made-up guide", 11, "reconcile\n# exits with 1: the board fails\n", 1)), blocks);
        assertThrows(IllegalStateException.class, () -> blocks("made-up open block", "```sh\necho never closed\n"));
        assertThrows(IllegalStateException.class,
                () -> blocks("made-up two exits", "```sh\n# exits with 1: a\n# exits with 2: b\n```\n"));
    }

    @Test
    void theRunnerStopsAtAFailureKillsBackgroundJobsAndEndsAnOverrun() throws Exception {
        // bash -e ends the block at the first command that fails, with its exit code
        Outcome stopped = run(new Block("made-up", 1, "echo before\n(exit 3)\necho after\n", 0),
                Files.createTempDirectory(scratch, "t"), jar, LIMIT);
        assertEquals(3, stopped.exit());
        assertEquals("before\n", stopped.stdout());

        // a background job left running is killed with the block's process group
        Path folder = Files.createTempDirectory(scratch, "t");
        Outcome left = run(new Block("made-up", 1, "sleep 300 &\necho $! > background.pid\n", 0), folder, jar, LIMIT);
        assertEquals(0, left.exit());
        long pid = Long.parseLong(Files.readString(folder.resolve("work/background.pid")).trim());
        // SIGKILL is delivered at once but the process is reaped a moment later: 5 s, a loaded machine
        Optional<ProcessHandle> background = ProcessHandle.of(pid);
        if (background.isPresent()) {
            try {
                background.get().onExit().get(5, TimeUnit.SECONDS);
            } catch (TimeoutException e) {
                throw new AssertionError("the background sleep (pid " + pid + ") outlived its block", e);
            }
        }

        // a block that overruns is ended and reported as such
        Outcome overrun = run(new Block("made-up", 1, "sleep 300\n", 0), Files.createTempDirectory(scratch, "t"),
                jar, Duration.ofSeconds(1));
        assertTrue(overrun.timedOut());

        // the jar made for the blocks runs polebench as java -jar does
        Outcome help = run(new Block("made-up", 1, "java -jar target/polebench.jar --help\n", 0),
                Files.createTempDirectory(scratch, "t"), jar, LIMIT);
        assertEquals(0, help.exit(), help.stderr());
        assertTrue(help.stdout().contains("reconcile"), help.stdout());
    }

    /** The fenced {@code sh} blocks of a Markdown text, in order, each with the line of its fence. */
    static List<Block> blocks(String document, String markdown) {
        List<Block> blocks = new ArrayList<>();
        String[] lines = markdown.split("\n", -1);
        String language = null;
        int start = 0;
        StringBuilder text = new StringBuilder();
        for (int i = 0; i < lines.length; i++) {
            String trimmed = lines[i].trim();
            if (!trimmed.startsWith("```")) {
                if (language != null) {
                    text.append(lines[i]).append('\n');
                }
                continue;
            }
            if (language == null) {
                language = trimmed.substring(3).trim();
                start = i + 1;
                text.setLength(0);
                continue;
            }
            if (language.equals("sh")) {
                String body = indentRemoved(text.toString());
                blocks.add(new Block(document, start, body, statedExit(document, start, body)));
            }
            language = null;
        }
        if (language != null) {
            throw new IllegalStateException(document + " line " + start + ": a code block is never closed");
        }
        return blocks;
    }

    /** A block inside a list item is indented as a whole; bash is given it as a reader copies it. */
    private static String indentRemoved(String text) {
        int indent = text.lines().filter(l -> !l.isBlank())
                .mapToInt(l -> l.length() - l.stripLeading().length()).min().orElse(0);
        return text.lines().map(l -> l.length() >= indent ? l.substring(indent) : l.strip())
                .collect(Collectors.joining("\n", "", "\n"));
    }

    private static int statedExit(String document, int line, String body) {
        List<Integer> stated = new ArrayList<>();
        for (String bodyLine : body.split("\n")) {
            Matcher matcher = STATED_EXIT.matcher(bodyLine);
            if (matcher.matches()) {
                stated.add(Integer.parseInt(matcher.group(1)));
            }
        }
        if (stated.size() > 1) {
            throw new IllegalStateException(document + " line " + line + ": the block states its exit code "
                    + stated.size() + " times; a block ends once, so state it once");
        }
        return stated.isEmpty() ? 0 : stated.get(0);
    }

    /**
     * Runs one block with {@code bash -e} in {@code folder/work}, a fresh folder with copies of the
     * bundled samples and profiles and {@code target/polebench.jar}; the block's stdout and stderr
     * go to files beside it (background jobs may hold them open after bash ends), {@code TMPDIR}
     * points into {@code folder} so that {@code mktemp} leaves nothing behind, and the block's
     * process group is killed when it ends or overruns.
     */
    static Outcome run(Block block, Path folder, Path jar, Duration limit) throws IOException, InterruptedException {
        Path work = Files.createDirectories(folder.resolve("work"));
        copyTree(ROOT.resolve("sample-measurements"), work.resolve("sample-measurements"));
        copyTree(ROOT.resolve("instrument-profiles"), work.resolve("instrument-profiles"));
        Files.createDirectories(work.resolve("target"));
        Files.copy(jar, work.resolve("target/polebench.jar"));
        Path script = Files.writeString(folder.resolve("block.sh"), block.text());
        Path stdout = folder.resolve("stdout.txt");
        Path stderr = folder.resolve("stderr.txt");
        Path tmp = Files.createDirectories(folder.resolve("tmp"));

        // setsid: bash leads a process group of its own (Java's child is no group leader, so
        // setsid does not fork and the group's id is the process's id)
        ProcessBuilder builder = new ProcessBuilder("setsid", "bash", "-e", script.toString())
                .directory(work.toFile())
                .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")))
                .redirectOutput(stdout.toFile())
                .redirectError(stderr.toFile());
        Map<String, String> environment = builder.environment();
        // the blocks' java is the JVM running the tests (Java 17)
        environment.put("PATH", Path.of(System.getProperty("java.home"), "bin") + File.pathSeparator
                + environment.getOrDefault("PATH", "/usr/bin:/bin"));
        environment.put("TMPDIR", tmp.toString());
        Process process = builder.start();
        boolean ended;
        try {
            ended = process.waitFor(limit.toMillis(), TimeUnit.MILLISECONDS);
        } finally {
            killGroup(process.pid());
            process.destroyForcibly();
        }
        int exit = ended ? process.exitValue() : -1;
        return new Outcome(exit, !ended, Files.readString(stdout, StandardCharsets.UTF_8),
                Files.readString(stderr, StandardCharsets.UTF_8));
    }

    private static void killGroup(long group) throws IOException, InterruptedException {
        Process kill = new ProcessBuilder("kill", "-KILL", "--", "-" + group)
                .redirectErrorStream(true)
                .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .start();
        // kill answers 1 when the group is already empty; either way it is empty afterwards
        kill.waitFor(10, TimeUnit.SECONDS);
    }

    private static Outcome outcome(Future<Outcome> run) throws Exception {
        try {
            return run.get();
        } catch (ExecutionException e) {
            throw e.getCause() instanceof Exception cause ? cause : e;
        }
    }

    private static String transcript(Block block, Outcome outcome) {
        return "\n--- block\n" + block.text() + "--- stdout (end)\n" + tail(outcome.stdout())
                + "\n--- stderr (end)\n" + tail(outcome.stderr());
    }

    private static String tail(String text) {
        return text.length() <= TAIL ? text : "…" + text.substring(text.length() - TAIL);
    }

    private static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> walk = Files.walk(from)) {
            for (Path source : (Iterable<Path>) walk::iterator) {
                Path target = to.resolve(from.relativize(source).toString());
                if (Files.isDirectory(source)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(source, target, StandardCopyOption.COPY_ATTRIBUTES);
                }
            }
        }
    }

    static boolean socatInstalled() {
        return Stream.of("/usr/bin", "/usr/local/bin", "/bin").anyMatch(d -> Files.isExecutable(Path.of(d, "socat")));
    }

    /**
     * This JVM's runtime classpath without the test classes. Surefire may start the JVM with a
     * manifest-only booter jar as {@code java.class.path}; such a jar (one holding nothing but its
     * manifest) is replaced by the entries of its Class-Path.
     */
    static List<Path> runtimeClasspath() throws IOException {
        String listed = System.getProperty("surefire.test.class.path");
        if (listed == null || listed.isBlank()) {
            listed = System.getProperty("java.class.path");
        }
        Set<Path> entries = new LinkedHashSet<>();
        for (String entry : listed.split(File.pathSeparator)) {
            if (!entry.isBlank()) {
                entries.addAll(expanded(Path.of(entry).toAbsolutePath()));
            }
        }
        List<Path> classpath = entries.stream()
                .filter(Files::exists)
                .filter(p -> !p.endsWith("test-classes"))
                .collect(Collectors.toList());
        assertTrue(classpath.stream().anyMatch(p -> Files.isRegularFile(p.resolve("org/polebench/cli/Main.class"))),
                "target/classes is not on the test's classpath: " + classpath);
        return classpath;
    }

    private static List<Path> expanded(Path entry) throws IOException {
        if (!Files.isRegularFile(entry) || !entry.toString().endsWith(".jar")) {
            return List.of(entry);
        }
        try (JarFile file = new JarFile(entry.toFile())) {
            Manifest manifest = file.getManifest();
            String classPath = manifest == null ? null : manifest.getMainAttributes().getValue(Attributes.Name.CLASS_PATH);
            if (classPath == null || !manifestOnly(file)) {
                return List.of(entry);
            }
            List<Path> inner = new ArrayList<>();
            for (String url : classPath.trim().split("\\s+")) {
                inner.add(Path.of(entry.getParent().toUri().resolve(url)));
            }
            return inner;
        }
    }

    private static boolean manifestOnly(JarFile file) {
        Enumeration<JarEntry> entries = file.entries();
        while (entries.hasMoreElements()) {
            String name = entries.nextElement().getName();
            if (!name.equals("META-INF/") && !name.equals(JarFile.MANIFEST_NAME)) {
                return false;
            }
        }
        return true;
    }

    /** A jar of a manifest alone: Main-Class {@link Main}, Class-Path the entries as file: URLs. */
    static Path manifestOnlyJar(Path folder, List<Path> classpath) throws IOException {
        Manifest manifest = new Manifest();
        Attributes attributes = manifest.getMainAttributes();
        attributes.put(Attributes.Name.MANIFEST_VERSION, "1.0");
        attributes.put(Attributes.Name.MAIN_CLASS, Main.class.getName());
        // a directory's URL ends with '/' (Path.toUri adds it for an existing directory), which
        // the Class-Path attribute needs to read it as a folder of classes
        attributes.put(Attributes.Name.CLASS_PATH,
                classpath.stream().map(p -> p.toUri().toString()).collect(Collectors.joining(" ")));
        Path jar = Files.createDirectories(folder).resolve("polebench.jar");
        try (OutputStream out = Files.newOutputStream(jar); JarOutputStream ignored = new JarOutputStream(out, manifest)) {
            // the manifest is the whole jar
        }
        return jar;
    }
}

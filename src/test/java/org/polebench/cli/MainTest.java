package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The top-level command builds only the subcommand a command line names (a start-up saving),
 * while usage, help and a misspelt name still see every subcommand.
 */
class MainTest {
    private static final List<String> NAMES = List.of("help", "predict", "inspect", "profiles", "fit",
            "reconcile", "report", "synthesize", "capture", "simulate", "batch", "lot", "history");

    @Test
    void theUsageListsEverySubcommandInOrder() {
        StringWriter out = new StringWriter();
        int exit = Main.run(new String[] {"--help"}, new PrintWriter(out, true), new PrintWriter(new StringWriter(), true));
        assertEquals(ExitCodes.OK, exit);
        int from = 0;
        for (String name : NAMES) {
            int at = out.toString().indexOf("\n  " + name + " ", from);
            assertTrue(at > from, name + " missing or out of order in\n" + out);
            from = at;
        }
    }

    @Test
    void aNamedSubcommandIsTheOnlyOneBuilt() {
        assertEquals(List.of(ReconcileCommand.class), Main.subcommandsFor(new String[] {"reconcile", "--json"}));
        assertEquals(NAMES.size(), Main.subcommandsFor(new String[] {"help", "fit"}).size());
        assertEquals(NAMES.size(), Main.subcommandsFor(new String[] {"recon"}).size());
        assertEquals(NAMES.size(), Main.subcommandsFor(new String[0]).size());
    }

    @Test
    void eachSubcommandsListedNameIsTheNameItsClassDeclares() {
        // the list keeps names beside class names (so that naming one loads no other); the
        // names must be the @Command names picocli matches, in the usage's order
        List<String> declared = new java.util.ArrayList<>();
        for (Class<?> type : Main.subcommandsFor(new String[0])) {
            declared.add(type.getAnnotation(picocli.CommandLine.Command.class).name());
        }
        assertEquals(NAMES, declared);
        for (String name : NAMES) {
            if (!name.equals("help")) {
                Class<?> only = Main.subcommandsFor(new String[] {name}).get(0);
                assertEquals(name, only.getAnnotation(picocli.CommandLine.Command.class).name());
            }
        }
    }

    @Test
    void theVersionIsTheSameWhetherAnsweredEarlyOrThroughPicocli() {
        // the early answer to --version must print what picocli's own version option prints
        StringWriter early = new StringWriter();
        assertEquals(ExitCodes.OK, Main.run(new String[] {"--version"}, new PrintWriter(early, true),
                new PrintWriter(new StringWriter(), true)));
        StringWriter viaPicocli = new StringWriter();
        new picocli.CommandLine(new Main()).setOut(new PrintWriter(viaPicocli, true)).execute("--version");
        assertEquals(viaPicocli.toString(), early.toString());
        assertTrue(early.toString().startsWith("polebench "), early.toString());
    }

    @Test
    void aMisspeltSubcommandIsAnsweredWithTheNearOnes() {
        StringWriter err = new StringWriter();
        int exit = Main.run(new String[] {"recon"}, new PrintWriter(new StringWriter(), true), new PrintWriter(err, true));
        assertEquals(ExitCodes.BAD_INPUT, exit);
        assertTrue(err.toString().contains("polebench reconcile"), err.toString());
    }

    @Test
    void helpForOneSubcommandShowsItsOptions() {
        StringWriter out = new StringWriter();
        int exit = Main.run(new String[] {"help", "fit"}, new PrintWriter(out, true), new PrintWriter(new StringWriter(), true));
        assertEquals(ExitCodes.OK, exit);
        assertTrue(out.toString().contains("Usage: polebench fit"), out.toString());
    }

    @Test
    void everySubcommandsHelpFormatsWithoutAPicocliWarning() {
        // picocli formats descriptions with String.format: a lone '%' (as in "1 %") fails, and
        // picocli then warns on System.err and shows the raw text (its documented behaviour)
        java.io.PrintStream saved = System.err;
        java.io.ByteArrayOutputStream caught = new java.io.ByteArrayOutputStream();
        try {
            System.setErr(new java.io.PrintStream(caught, true, java.nio.charset.StandardCharsets.UTF_8));
            for (String name : NAMES) {
                Main.run(new String[] {"help", name}, new PrintWriter(new StringWriter(), true),
                        new PrintWriter(new StringWriter(), true));
            }
        } finally {
            System.setErr(saved);
        }
        String warnings = caught.toString(java.nio.charset.StandardCharsets.UTF_8);
        assertTrue(!warnings.contains("WARN"), warnings);
    }

    @Test
    void examplesAreSetWholeOnTheirOwnLinesAndNoQuotedArgumentIsSplit() {
        // issue 14: the expected lines are the @Command footers themselves, not the rendered help
        for (Class<?> type : Main.subcommandsFor(new String[0])) {
            picocli.CommandLine.Command command = type.getAnnotation(picocli.CommandLine.Command.class);
            StringWriter out = new StringWriter();
            Main.run(new String[] {"help", command.name()}, new PrintWriter(out, true), new PrintWriter(new StringWriter(), true));
            List<String> lines = out.toString().lines().toList();
            for (String example : command.footer()) {
                assertTrue(lines.contains(example.replace("%%", "%")), command.name() + ": '" + example + "' is not a line of\n" + out);
            }
            for (String line : lines) {
                // a quoted argument broken across lines leaves an odd number of quotes on a line
                assertEquals(0, line.chars().filter(c -> c == '"').count() % 2, command.name() + ": " + line);
            }
        }
    }

    @Test
    void anUnknownOptionIsAUsageErrorInTheProjectsOwnForm() {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int exit = Main.run(new String[] {"fit", "x.csv", "--max-pole"}, new PrintWriter(out, true), new PrintWriter(err, true));
        assertEquals(ExitCodes.BAD_INPUT, exit);
        List<String> lines = err.toString().lines().toList();
        assertEquals(2, lines.size(), err.toString());
        assertTrue(lines.get(0).startsWith("polebench: Unknown option: '--max-pole'"), err.toString());
        // picocli's suggestion of the near option, and where the options are listed
        assertTrue(lines.get(1).startsWith("  fix: did you mean --max-poles?"), err.toString());
        assertTrue(lines.get(1).endsWith("see 'polebench fit --help'"), err.toString());
        assertEquals("", out.toString());
    }

    @Test
    void aMissingParameterIsAUsageErrorInTheProjectsOwnForm() {
        StringWriter err = new StringWriter();
        int exit = Main.run(new String[] {"fit"}, new PrintWriter(new StringWriter(), true), new PrintWriter(err, true));
        assertEquals(ExitCodes.BAD_INPUT, exit);
        assertEquals("polebench: Missing required parameter: 'SWEEP'" + System.lineSeparator()
                + "  fix: see 'polebench fit --help'" + System.lineSeparator(), err.toString().replace("\n", System.lineSeparator()));
    }

    @Test
    void runningOutOfMemoryIsAMessageAndExitThreeNotAStackTrace(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws Exception {
        // a JVM of its own with a 32 MB heap, asked for 99,999,999 tolerance draws (issue 15), past
        // the stated limit raised on purpose so that the heap, not the limit, stops it
        String classpath = DocumentCommandsTest.runtimeClasspath().stream().map(Object::toString)
                .collect(java.util.stream.Collectors.joining(java.io.File.pathSeparator));
        Process process = new ProcessBuilder(java.nio.file.Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Xmx32m", "-Dpolebench.max-samples=999999999", "-cp", classpath, "org.polebench.cli.Main", "predict",
                "--samples", "99999999",
                java.nio.file.Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml").toAbsolutePath().toString())
                .redirectError(dir.resolve("err.txt").toFile()).redirectOutput(dir.resolve("out.txt").toFile()).start();
        assertTrue(process.waitFor(120, java.util.concurrent.TimeUnit.SECONDS), "the run did not end");
        String err = java.nio.file.Files.readString(dir.resolve("err.txt"));
        assertEquals(ExitCodes.INSTRUMENT_OR_IO, process.exitValue(), err);
        assertTrue(err.startsWith("polebench: out of memory"), err);
        assertTrue(!err.contains("at org.") && !err.contains("Exception in thread"), err);
    }
}

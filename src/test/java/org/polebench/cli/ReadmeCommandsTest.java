package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The README's command blocks run as written (issue 12): every {@code java -jar
 * target/polebench.jar …} line of a {@code sh} block, continuation lines joined, is run in-process
 * through {@link Main#run} and must exit as the README says: 1 for the two reconcile runs on
 * demo boards that fail their lower-corner limit (the README states it for both), 0 for the rest.
 */
class ReadmeCommandsTest {
    private static final String JAR = "java -jar target/polebench.jar";

    @Test
    void everyCommandOfTheReadmeExitsAsItSays() throws IOException {
        List<String> commands = commands(Files.readString(Path.of("README.md"), StandardCharsets.UTF_8));
        // the set-up command and the tour's four: the README has these five, so a block lost in
        // an edit is noticed
        assertEquals(5, commands.size(), String.join("\n", commands));

        for (String command : commands) {
            String[] args = command.substring(JAR.length()).trim().split("\\s+");
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();

            int exit = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));

            // README: the bundled demo board and hp12-decade-slip-c3 both fail their lower-corner
            // limit, "so the command ends with exit code 1"
            int documented = args[0].equals("reconcile") ? ExitCodes.VERDICT_FAILED : ExitCodes.OK;
            assertEquals(documented, exit, command + "\n" + err);
            assertFalse(out.toString().isBlank(), command + " printed nothing");
        }
    }

    /** The polebench command lines of the README's sh blocks, with backslash continuations joined. */
    private static List<String> commands(String markdown) {
        List<String> commands = new ArrayList<>();
        boolean inShell = false;
        StringBuilder pending = new StringBuilder();
        for (String line : markdown.split("\n")) {
            if (line.startsWith("```")) {
                inShell = !inShell && line.trim().equals("```sh");
                continue;
            }
            if (!inShell) {
                continue;
            }
            String trimmed = line.trim();
            boolean continues = trimmed.endsWith("\\");
            pending.append(continues ? trimmed.substring(0, trimmed.length() - 1) : trimmed).append(' ');
            if (continues) {
                continue;
            }
            String whole = pending.toString().trim();
            pending.setLength(0);
            int at = whole.indexOf(JAR);
            if (at >= 0) {
                commands.add(whole.substring(at));
            }
        }
        return commands;
    }
}

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
            "reconcile", "report", "synthesize", "capture", "simulate");

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
}

package org.polebench.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.cli.Main;
import org.polebench.lot.BoardOutcome;

/**
 * A batch killed part-way (the JVM destroyed, as a power cut or {@code kill -9} would) and run
 * again ends with every board recorded exactly once: each board is committed alone, and a run
 * counts what the ledger already holds instead of recording it again (issue 16).
 */
class BatchKillTest {
    private static final String STAGE = "sample-measurements/hydrophone-preamp-ce.stage.yaml";
    private static final int BOARDS = 8;

    @TempDir
    Path folder;

    @Test
    void aKilledBatchRunAgainRecordsEveryBoardOnce() throws Exception {
        Path sweeps = folder.resolve("sweeps");
        for (int i = 1; i <= BOARDS; i++) {
            // invented demo boards: the synthesizer's healthy hydrophone board, each with its own noise
            StringWriter err = new StringWriter();
            int made = Main.run(new String[] {"synthesize", "--stage", STAGE, "--seed", Integer.toString(i), "--out",
                    sweeps.resolve(String.format(java.util.Locale.ROOT, "hp-%03d.csv", i)).toString()},
                    new PrintWriter(new StringWriter()), new PrintWriter(err));
            assertEquals(0, made, err.toString());
        }
        String ledgerFile = folder.resolve("ledger.db").toString();
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process batch = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"), Main.class.getName(),
                "batch", "--stage", STAGE, "--ledger", ledgerFile, "--threads", "1", sweeps.toString())
                .redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        long atKill;
        try {
            atKill = waitForFirstBoard(ledgerFile, batch);
        } finally {
            batch.destroyForcibly();
            assertTrue(batch.waitFor(60, TimeUnit.SECONDS));
        }
        // killed part-way: some boards recorded, not all
        assertTrue(atKill >= 1 && atKill < BOARDS, "recorded when killed: " + atKill);

        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"batch", "--stage", STAGE, "--ledger", ledgerFile, sweeps.toString()},
                new PrintWriter(out), new PrintWriter(err));
        // the hydrophone's healthy boards are incomplete (BatchCommandTest): exit 4
        assertEquals(4, code, err.toString());
        try (Ledger ledger = Ledger.open(LedgerLocation.parse(Optional.of(ledgerFile), Map.of()))) {
            List<BoardOutcome> lot = ledger.lot("hydrophone-preamp-ce");
            assertEquals(BOARDS, lot.size());
            Set<String> boards = new HashSet<>();
            lot.forEach(o -> boards.add(o.boardId()));
            assertEquals(BOARDS, boards.size());
        }
        assertTrue(out.toString().contains(atKill + (atKill == 1 ? " board was" : " boards were")
                + " already in the ledger"), out.toString());
    }

    /** @return the tests recorded once the first is there (polled through a ledger of its own) */
    private static long waitForFirstBoard(String ledgerFile, Process batch) throws Exception {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (System.nanoTime() < deadline && batch.isAlive()) {
            if (Files.exists(Path.of(ledgerFile))) {
                try (Ledger ledger = Ledger.open(LedgerLocation.parse(Optional.of(ledgerFile), Map.of()))) {
                    long recorded = ledger.size();
                    if (recorded >= 1) {
                        return recorded;
                    }
                } catch (java.io.IOException stillCreating) {
                    // the batch is creating the schema at this moment: look again
                }
            }
            Thread.sleep(20);
        }
        return 0;
    }
}

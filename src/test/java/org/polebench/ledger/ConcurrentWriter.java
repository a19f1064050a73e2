package org.polebench.ledger;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.polebench.lot.BoardOutcome.Outcome;

/**
 * One of the processes of the concurrency test: records boards {@code board-0} to
 * {@code board-(N−1)} into a ledger (lot {@code concurrent}, or the lot given), in an order
 * shuffled by its own seed, and prints how many of them it was the one to record. Run as
 * {@code java -cp <test classpath> org.polebench.ledger.ConcurrentWriter LEDGER N SEED [LOT]},
 * with PGUSER and PGPASSWORD (or PGPASSFILE) in the environment for PostgreSQL.
 */
public final class ConcurrentWriter {
    private ConcurrentWriter() {
    }

    public static void main(String[] args) throws Exception {
        int boards = Integer.parseInt(args[1]);
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < boards; i++) {
            order.add(i);
        }
        Collections.shuffle(order, new Random(Long.parseLong(args[2])));
        String lot = args.length > 3 ? args[3] : "concurrent";
        int mine = 0;
        try (Ledger ledger = Ledger.open(LedgerLocation.parse(Optional.of(args[0]), System.getenv()))) {
            for (int i : order) {
                Recording done = ledger.record(LedgerSamples.test("board-" + i, lot, lot + "-board-" + i,
                        Outcome.PASS, 0.0, Instant.now()));
                if (done == Recording.RECORDED) {
                    mine++;
                }
            }
        }
        System.out.println(mine);
    }
}

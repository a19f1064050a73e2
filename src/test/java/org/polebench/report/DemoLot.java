package org.polebench.report;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import org.polebench.InputProblem;
import org.polebench.circuit.StageReader;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;
import org.polebench.lot.LotAnalysis;
import org.polebench.lot.LotFindings;

/**
 * An invented lot of 40 boards of the demo hydrophone stage, made in code (seed 40): C2 reads
 * about ×0.68 on boards 1 to 37 (a wrong reel, invented), board 12 has C3 at a tenth (a decade
 * slip), board 20's file was bad, and one board is named as a spreadsheet formula to test the
 * CSV guard. Two stations over two days.
 */
final class DemoLot {
    static final int BOARDS = 40;
    static final String FORMULA_BOARD = "=HYPERLINK(\"x\")";

    private DemoLot() {
    }

    static List<BoardOutcome> boards() {
        SplittableRandom r = new SplittableRandom(40);
        List<BoardOutcome> out = new ArrayList<>();
        for (int b = 1; b <= BOARDS; b++) {
            String id = b == 7 ? FORMULA_BOARD : String.format(java.util.Locale.ROOT, "HP-%03d", b);
            Instant at = Instant.parse("2026-05-04T08:00:00Z").plusSeconds(1200L * b);
            String station = b % 2 == 0 ? "bench-east" : "bench-west";
            if (b == 20) {
                out.add(new BoardOutcome(id, "HP-lot-7", station, "A. Tester", at, b, Outcome.INPUT_PROBLEM,
                        Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), 2, false, "", 0,
                        List.of(), Optional.of("line 14: the gain cell is empty")));
                continue;
            }
            double c2 = Math.log(0.8) + Math.log(1.5) * r.nextDouble() + (b <= 37 ? Math.log(0.68) : 0);
            double c3 = b == 12 ? Math.log(0.1) : Math.log(0.8) + Math.log(2.25) * r.nextDouble();
            double corner = 21.3 / Math.exp(0.6 * c2) * (b == 12 ? 3.2 : 1) * (1 + 0.02 * r.nextGaussian());
            boolean fail = corner > 40;
            String top = b == 12 ? "C3" : b <= 37 ? "C2" : "no fault";
            out.add(new BoardOutcome(id, "HP-lot-7", station, "A. Tester", at, b, fail ? Outcome.FAIL : Outcome.PASS,
                    Optional.of(43.2 + 0.15 * r.nextGaussian()), Optional.of(0.08), Optional.of(corner),
                    Optional.of(0.6), 2, true, top, 0.93,
                    List.of(new PartFactor("C1", 0.05 * r.nextGaussian(), 0.04, true),
                            new PartFactor("C2", c2 + 0.03 * r.nextGaussian(), 0.03, true),
                            new PartFactor("C3", c3 + 0.05 * r.nextGaussian(), 0.05, true),
                            new PartFactor("RC", 0, 0.006, false)),
                    Optional.empty()));
        }
        return out;
    }

    static LotFindings findings() {
        try {
            return LotAnalysis.of("HP-lot-7", boards(),
                    new StageReader().read(Path.of("sample-measurements/hydrophone-preamp-ce.stage.yaml")).stage(),
                    11, 200);
        } catch (InputProblem e) {
            throw new IllegalStateException(e.getMessage(), e);
        }
    }
}

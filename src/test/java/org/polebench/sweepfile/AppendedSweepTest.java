package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.SweepPoint;

/** The canonical sweep file that a live capture fills row by row. */
class AppendedSweepTest {
    @TempDir
    Path dir;

    @Test
    void aReopenedSweepReadsBackExactlyAndDropsARowCutShort() throws Exception {
        Path file = dir.resolve("cut.sweep.csv");
        SweepPoint a = new SweepPoint(2.0, -20.123456789012345, OptionalDouble.of(84.2987654321), OptionalDouble.of(0.0577),
                OptionalDouble.of(0.2887));
        SweepPoint b = new SweepPoint(3.17, -16.1, OptionalDouble.of(80.5), OptionalDouble.of(0.0577),
                OptionalDouble.of(0.2887));
        try (AppendedSweep sweep = AppendedSweep.create(file, Provenance.inMemory("test"), true, true, true)) {
            sweep.append(a);
            sweep.append(b);
        }
        Files.writeString(file, "5.02,-12.", java.nio.file.StandardOpenOption.APPEND);
        try (AppendedSweep again = AppendedSweep.reopen(file)) {
            assertEquals(List.of(a, b), again.points());
        }
        assertTrue(Files.readString(file).endsWith("\n"), "the cut row is gone");
        assertThrows(InputProblem.class, () -> AppendedSweep.create(file, Provenance.inMemory("test"), true, true, true));
    }

    @Test
    void theFinalShiftBringsTheMidbandPhaseIntoOneTurnByWholeTurns() throws Exception {
        Path file = dir.resolve("shift.sweep.csv");
        try (AppendedSweep sweep = AppendedSweep.create(file, Provenance.inMemory("test"), true, false, false)) {
            sweep.append(SweepPoint.of(10, 3, -150));
            sweep.append(SweepPoint.of(100, 20, -185));   // the midband, unwrapped past −180°
            sweep.append(SweepPoint.of(1000, 19, -200));
            assertEquals(360, sweep.settlePhaseTurns(), 0);
        }
        try (AppendedSweep shifted = AppendedSweep.reopen(file)) {
            assertEquals(List.of(210.0, 175.0, 160.0),
                    shifted.points().stream().map(p -> p.phaseDeg().getAsDouble()).toList());
        }
    }
}

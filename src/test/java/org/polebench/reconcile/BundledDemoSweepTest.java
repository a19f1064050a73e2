package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.synth.Fault;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;
import org.polebench.sweepfile.SweepReader;
import org.polebench.sweepfile.SweepWriter;

/**
 * The bundled faulty-board sweep that {@code polebench reconcile} runs on with no arguments:
 * invented demo data, made here by the board synthesizer from the Ostrova demo stage with C2
 * fitted as 220 nF instead of 2.2 µF, the other parts drawn within tolerance (seed below).
 * The test proves the committed file is this generator's output; set POLEBENCH_WRITE_DEMO=1 to
 * write it again.
 */
class BundledDemoSweepTest {
    static final Path FILE = Path.of("sample-measurements", "geophone-gf2-board-0417.sweep.csv");
    private static final long SEED = 417L;

    static Sweep demoSweep() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        SplittableRandom random = new SplittableRandom(SEED);
        List<Fault> faults = demo.boardWith(new Fault.CapacitorValue("C2", 220e-9), random);
        Sweep sweep = demo.sweep(faults, SweepNoise.BENCH,
                org.polebench.synth.BoardSynthesizer.logSpaced(0.5, 5000, 81), random.nextLong());
        List<String> notes = new ArrayList<>();
        notes.add("demo data, invented: board GF2-0417 of the made-up Ostrova geophone front end, as if swept at "
                + "the invented Kellmarra field station");
        notes.addAll(sweep.source().notes());
        Provenance source = new Provenance(Optional.empty(), "", sweep.source().instrument(), "canonical",
                Optional.empty(), Optional.of("GF2-0417 (demo, invented)"), notes);
        return new Sweep(source, sweep.points());
    }

    @Test
    void theCommittedDemoSweepIsTheSynthesizersOutput() throws InputProblem, IOException {
        Sweep expected = demoSweep();
        if ("1".equals(System.getenv("POLEBENCH_WRITE_DEMO"))) {
            new SweepWriter().writeCanonical(expected, FILE, true);
        }
        assertTrue(Files.isRegularFile(FILE), FILE + " is missing");
        Sweep read = new SweepReader(ProfileLibrary.bundled()).read(FILE, SweepWriter.CANONICAL).sweep();
        // the canonical writer prints shortest round-trip decimals (Double.toString), so every
        // value reads back bit for bit
        assertEquals(expected.points(), read.points());
        assertTrue(Files.readString(FILE).contains("demo data, invented"));
    }
}

package org.polebench.ledger;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.Band;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.synth.SweepNoise;
import org.polebench.sweepfile.SweepWriter;

/**
 * Writes the sweeps of the batch benchmark (invented demo data): N boards of the Ostrova
 * geophone demo stage, each with its low-band capacitors drawn within ±5 % of nominal and its
 * own bench noise, one in 25 with C2 a decade low, as 100-point canonical files. Synthesizing in
 * one JVM takes seconds where N runs of {@code polebench synthesize} would take minutes.
 *
 * <pre>
 * java -cp target/benchmarks.jar org.polebench.ledger.DemoLotSweeps /tmp/lot-1000 1000
 * </pre>
 */
public final class DemoLotSweeps {
    private DemoLotSweeps() {
    }

    public static void main(String[] args) throws Exception {
        Path folder = Path.of(args[0]);
        int boards = Integer.parseInt(args[1]);
        Files.createDirectories(folder);
        Stage stage = new StageReader().read(Path.of("sample-measurements", "geophone-two-stage.stage.yaml")).stage();
        List<Capacitor> capacitors = stage.capacitors(Band.LOW);
        SplittableRandom random = new SplittableRandom(20_261_202L);
        BoardSynthesizer synthesizer = new BoardSynthesizer();
        SweepWriter writer = new SweepWriter();
        for (int i = 1; i <= boards; i++) {
            List<Fault> faults = new ArrayList<>();
            for (Capacitor c : capacitors) {
                double factor = i % 25 == 0 && c.name().equals("C2") ? 0.1 : 1 + 0.05 * (2 * random.nextDouble() - 1);
                faults.add(new Fault.CapacitorValue(c.name(), c.farads() * factor));
            }
            writer.writeCanonical(synthesizer.synthesize(stage, faults, SweepNoise.BENCH,
                    BoardSynthesizer.logSpaced(0.5, 5000, 100), true, i),
                    folder.resolve(String.format(Locale.ROOT, "gf2-%04d.csv", i)), true);
        }
    }
}

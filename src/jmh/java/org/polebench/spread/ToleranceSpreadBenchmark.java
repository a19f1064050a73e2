package org.polebench.spread;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/**
 * The 10,000-draw tolerance spread of the bundled two-stage demo
 * ({@code sample-measurements/geophone-two-stage.stage.yaml}, five low-band capacitors, two
 * auto-biased BJTs), on one thread, with the default seed. Target (issue 2): under 0.5 s per
 * spread. Run from the checkout root so that the stage file is found.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Threads(1)
public class ToleranceSpreadBenchmark {
    private final ToleranceSpread spread = new ToleranceSpread().withThreads(1);
    private Stage demo;

    @Setup
    public void read() throws InputProblem {
        demo = new StageReader().read(Path.of("sample-measurements", "geophone-two-stage.stage.yaml")).stage();
    }

    @Benchmark
    public CornerSpread tenThousandDraws() {
        return spread.lowerCorner(demo);
    }
}

package org.polebench.ledger;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.polebench.InputProblem;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/**
 * Issue 16's speed target for the ledger: recording one board in SQLite within 5 ms — one
 * transaction with its row (a 70 kB result document, about what {@code reconcile --json} writes
 * for the five-capacitor demo stage, and a 6 kB canonical sweep) and 18 part factors, committed
 * to a write-ahead log with synchronous=NORMAL. Every call records a new sweep, so every call
 * writes.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class RecordBenchmark {
    private Path folder;
    private Ledger ledger;
    private String resultJson;
    private String sweepText;
    private List<PartFactor> parts;
    private long sweeps;

    @Setup
    public void open() throws IOException, InputProblem {
        folder = Files.createTempDirectory("polebench-record");
        ledger = Ledger.open(LedgerLocation.parse(Optional.of(folder.resolve("bench.db").toString()), Map.of()));
        resultJson = "{\"padding\": \"" + "x".repeat(70_000) + "\"}";
        sweepText = "# polebench sweep\n" + "100.0,40.0,-12.5\n".repeat(360);
        parts = new ArrayList<>();
        for (int i = 0; i < 18; i++) {
            parts.add(new PartFactor("P" + i, 0.01 * i, 0.05, true));
        }
    }

    @TearDown
    public void close() throws IOException {
        ledger.close();
        try (Stream<Path> all = Files.walk(folder)) {
            for (Path path : all.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(path);
            }
        }
    }

    @Benchmark
    public Recording recordOneBoard() throws IOException {
        long n = sweeps++;
        BoardOutcome outcome = new BoardOutcome("board-" + n, "bench", "station", "operator", Instant.now(), 0,
                Outcome.PASS, Optional.of(55.4), Optional.of(0.12), Optional.of(16.2), Optional.of(0.16), 2.02, true,
                "no fault", 0.89, parts, Optional.empty());
        return ledger.record(new TestRecord(outcome, "bench", "stage-sha", "name: stage\n",
                Sha256.of(("sweep " + n).getBytes(StandardCharsets.UTF_8)), "board-" + n + ".csv",
                Optional.of(sweepText), Optional.empty(), Optional.of(resultJson)));
    }
}

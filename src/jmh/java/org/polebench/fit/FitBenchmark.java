package org.polebench.fit;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.polebench.InputProblem;
import org.polebench.measure.Sweep;

/**
 * One fit of a 100-point sweep with order selection up to four poles (issue 4 target: under
 * 5 ms on one core). 64 different sweeps (seed 4) are cycled so no fit sees the data of the one
 * before. Run: {@code java -jar target/benchmarks.jar FitBenchmark -f 1 -wi 3 -i 5 -w 1 -r 1},
 * with {@code -prof gc} for the allocation per fit. Besides wall time per fit, the auxiliary
 * counters {@code cpuMicros} and {@code fits} give the benchmark thread's own CPU time, which
 * stays meaningful on a machine other jobs share (cpuMicros / fits = CPU µs per fit).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-XX:ActiveProcessorCount=1"})
public class FitBenchmark {
    private Sweep[] sweeps;
    private SweepFitter fitter;
    private int next;

    @Setup
    public void makeSweeps() {
        Random random = new Random(4);
        sweeps = new Sweep[64];
        for (int i = 0; i < sweeps.length; i++) {
            sweeps[i] = BenchmarkSweeps.next(random);
        }
        fitter = new SweepFitter(FitSettings.defaults().withMaxPoles(4));
    }

    /** CPU time of the benchmark thread, summed per iteration. */
    @State(Scope.Thread)
    @AuxCounters(AuxCounters.Type.EVENTS)
    public static class CpuTime {
        private final ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        private long start;
        public long cpuMicros;
        public long fits;

        @Setup(Level.Iteration)
        public void clear() {
            cpuMicros = 0;
            fits = 0;
        }

        @Setup(Level.Invocation)
        public void begin() {
            start = threads.getCurrentThreadCpuTime();
        }

        @TearDown(Level.Invocation)
        public void end() {
            cpuMicros += (threads.getCurrentThreadCpuTime() - start) / 1000;
            fits++;
        }
    }

    @Benchmark
    public FitResult fitWithOrderSelectionUpToFourPoles(CpuTime cpu) throws InputProblem {
        return fitter.fit(sweeps[next++ & 63]);
    }
}

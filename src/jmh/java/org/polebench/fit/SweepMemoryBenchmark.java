package org.polebench.fit;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;
import org.polebench.InputProblem;

/**
 * 10,000 fits of different sweeps in one process, and the heap retained across them (issue 4:
 * memory must not grow). Heap in use is read after three full collections before the first fit
 * (after 200 warm-up fits, so classes and JIT code are in place) and after the last; the
 * difference is reported as the auxiliary counter {@code heapGrowthKiB}. A single shot, since the
 * 10,000 fits are the measurement: {@code java -jar target/benchmarks.jar SweepMemory -f 1}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 0)
@Measurement(iterations = 1)
@Fork(value = 1, jvmArgsAppend = {"-Xmx256m", "-XX:ActiveProcessorCount=1"})
public class SweepMemoryBenchmark {
    private static final int FITS = 10_000;

    /** Heap figures of the single shot, in KiB. */
    @State(Scope.Thread)
    @AuxCounters(AuxCounters.Type.EVENTS)
    public static class Heap {
        public long heapBeforeKiB;
        public long heapAfterKiB;
        public long heapGrowthKiB;

        @Setup(Level.Iteration)
        public void clear() {
            heapBeforeKiB = 0;
            heapAfterKiB = 0;
            heapGrowthKiB = 0;
        }
    }

    @Benchmark
    public void tenThousandDifferentSweeps(Heap heap, Blackhole sink) throws InputProblem, InterruptedException {
        Random random = new Random(10_000);
        SweepFitter fitter = new SweepFitter(FitSettings.defaults());
        for (int i = 0; i < 200; i++) {
            sink.consume(fitter.fit(BenchmarkSweeps.next(random)));
        }
        long before = usedAfterCollection();
        for (int i = 0; i < FITS; i++) {
            sink.consume(fitter.fit(BenchmarkSweeps.next(random)));
        }
        long after = usedAfterCollection();
        heap.heapBeforeKiB = before / 1024;
        heap.heapAfterKiB = after / 1024;
        heap.heapGrowthKiB = (after - before) / 1024;
    }

    private static long usedAfterCollection() throws InterruptedException {
        MemoryMXBean memory = ManagementFactory.getMemoryMXBean();
        for (int i = 0; i < 3; i++) {
            System.gc();
            Thread.sleep(100);
        }
        return memory.getHeapMemoryUsage().getUsed();
    }
}

package org.polebench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;

/**
 * The benchmark thread's own CPU time, summed per iteration, as JMH auxiliary counters:
 * {@code cpuMicros / calls} is CPU µs per call, which stays meaningful on a machine that other
 * jobs share (wall time does not). Take it as a parameter of a {@code @Benchmark} method.
 */
@State(Scope.Thread)
@AuxCounters(AuxCounters.Type.EVENTS)
public class ThreadCpuTime {
    private final ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    private long start;
    public long cpuMicros;
    public long calls;

    @Setup(Level.Iteration)
    public void clear() {
        cpuMicros = 0;
        calls = 0;
    }

    @Setup(Level.Invocation)
    public void begin() {
        start = threads.getCurrentThreadCpuTime();
    }

    @TearDown(Level.Invocation)
    public void end() {
        cpuMicros += (threads.getCurrentThreadCpuTime() - start) / 1000;
        calls++;
    }
}

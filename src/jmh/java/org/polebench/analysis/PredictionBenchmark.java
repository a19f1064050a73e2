package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.polebench.circuit.Band;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;

/**
 * One prediction of a two-stage common-emitter network with five low-band capacitors (input
 * coupling, two emitter bypasses, interstage and output coupling), values drawn with a fixed
 * seed; optionally with each transistor's Cπ and Cμ and a load capacitance in the high band.
 * Target: well under 1 ms per predict, so that a 10,000-draw tolerance spread takes under
 * 0.5 s on the light path.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class PredictionBenchmark {
    private final StagePredictor predictor = new StagePredictor();
    private SmallSignalNetwork fiveCapacitors;
    private SmallSignalNetwork withDeviceCapacitances;

    @Setup
    public void build() {
        fiveCapacitors = twoStage(new Random(20261201L), false);
        withDeviceCapacitances = twoStage(new Random(20261201L), true);
    }

    static SmallSignalNetwork twoStage(Random random, boolean deviceCapacitances) {
        List<String> nodes = new ArrayList<>(List.of("gnd", "src", "in", "b1", "c1", "e1", "b2", "c2", "e2", "out"));
        List<NetworkElement> e = new ArrayList<>();
        e.add(new NetworkElement.Conductance("RS", 1, 2, 1 / 600.0));
        e.add(new NetworkElement.Capacitance("C1", 2, 3, vary(random, 1e-6), Band.LOW));
        e.add(new NetworkElement.Conductance("RB1", 3, 0, 1 / vary(random, 18e3)));
        stage(e, "Q1", 4, 3, 5, random, deviceCapacitances);
        e.add(new NetworkElement.Conductance("RC1", 4, 0, 1 / vary(random, 4.7e3)));
        e.add(new NetworkElement.Conductance("RE1", 5, 0, 1 / vary(random, 1e3)));
        e.add(new NetworkElement.Capacitance("CE1", 5, 0, vary(random, 100e-6), Band.LOW));
        e.add(new NetworkElement.Capacitance("C2", 4, 6, vary(random, 2.2e-6), Band.LOW));
        e.add(new NetworkElement.Conductance("RB2", 6, 0, 1 / vary(random, 15e3)));
        stage(e, "Q2", 7, 6, 8, random, deviceCapacitances);
        e.add(new NetworkElement.Conductance("RC2", 7, 0, 1 / vary(random, 3.3e3)));
        e.add(new NetworkElement.Conductance("RE2", 8, 0, 1 / vary(random, 680)));
        e.add(new NetworkElement.Capacitance("CE2", 8, 0, vary(random, 220e-6), Band.LOW));
        e.add(new NetworkElement.Capacitance("C3", 7, 9, vary(random, 10e-6), Band.LOW));
        e.add(new NetworkElement.Conductance("RL", 9, 0, 1 / 47e3));
        if (deviceCapacitances) {
            e.add(new NetworkElement.Capacitance("CL", 9, 0, 100e-12, Band.HIGH));
        }
        return new SmallSignalNetwork(nodes, e, 1, 9);
    }

    private static void stage(List<NetworkElement> e, String name, int c, int b, int em, Random random, boolean caps) {
        double gm = vary(random, 0.04);
        double rpi = vary(random, 200) / gm;
        e.add(new NetworkElement.Conductance(name + ".rpi", b, em, 1 / rpi));
        e.add(new NetworkElement.Transconductance(name + ".gm", c, em, b, em, gm));
        e.add(new NetworkElement.Conductance(name + ".ro", c, em, 1 / vary(random, 100e3)));
        if (caps) {
            e.add(new NetworkElement.Capacitance(name + ".cpi", b, em, 20e-12, Band.HIGH));
            e.add(new NetworkElement.Capacitance(name + ".cmu", b, c, 3e-12, Band.HIGH));
        }
    }

    private static double vary(Random random, double nominal) {
        return nominal * (1 + 0.1 * (2 * random.nextDouble() - 1));
    }

    @Benchmark
    public PredictionOutcome predictFiveCapacitors() {
        return predictor.predict(fiveCapacitors);
    }

    @Benchmark
    public OptionalDouble exactLowerCornerOnly() {
        return predictor.exactLowerCornerHz(fiveCapacitors);
    }

    @Benchmark
    public PredictionOutcome predictWithDeviceCapacitances() {
        return predictor.predict(withDeviceCapacitances);
    }
}

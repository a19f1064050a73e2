package org.polebench.synth;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.SplittableRandom;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.MeasuringChain;
import org.polebench.circuit.Stage;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.units.Decibels;

/**
 * Makes the sweep a board built from a stage would give, with stated faults and seeded
 * Gaussian noise: invented demo and test data, labelled so in its provenance.
 *
 * <p>The response is the complex MNA solve of the whole small-signal network with every
 * capacitor of both bands in place ({@link org.polebench.analysis.FullResponse}), not the port-reduced model the
 * back-solve uses, so that a test of the back-solve against these sweeps compares two
 * different computations. The board is {@link StageBoard#asBuilt}: capacitor, resistor and β
 * faults change the parts, the bias is solved for the board as built (a resistor or β fault
 * moves it, a capacitor fault does not), then each bias fault scales its transistor's current
 * and each gain fault multiplies the response. Gain is V(out)/V(in) in the stage's own gain
 * convention; the phase is arg H wrapped to (−180°, 180°]. Noise draws come from one
 * {@link SplittableRandom} with the given seed, gain then phase per point, ascending in
 * frequency. Stateless; one instance serves any thread.
 */
public final class BoardSynthesizer {
    /**
     * @param frequenciesHz strictly ascending, positive, at least two
     * @param withPhase     false for a magnitude-only instrument
     * @throws InputProblem when the board as built cannot be biased (a resistor or β fault drove a
     *                      transistor out of its amplifying region: the problem names the fault)
     */
    public Sweep synthesize(Stage stage, List<Fault> faults, SweepNoise noise, List<Double> frequenciesHz,
                            boolean withPhase, long seed) throws InputProblem {
        return synthesize(stage, faults, noise, frequenciesHz, withPhase, seed, Optional.empty());
    }

    /**
     * As {@link #synthesize(Stage, List, SweepNoise, List, boolean, long)}, as the given bench
     * would record it ({@link MeasuredBoard}); the provenance notes name the bench.
     */
    public Sweep synthesize(Stage stage, List<Fault> faults, SweepNoise noise, List<Double> frequenciesHz,
                            boolean withPhase, long seed, Optional<MeasuringChain> bench) throws InputProblem {
        BoardResponse board = bench.isPresent() ? MeasuredBoard.asBuilt(stage, faults, bench.get())
                : StageBoard.asBuilt(stage, faults);
        SplittableRandom random = new SplittableRandom(seed);
        int n = frequenciesHz.size();
        double[] truePhaseDeg = new double[n];
        double[] trueGainDb = new double[n];
        for (int i = 0; i < n; i++) {
            Complex value = board.atHz(frequenciesHz.get(i));
            trueGainDb[i] = Decibels.fromRatio(value.abs());
            truePhaseDeg[i] = Math.toDegrees(value.getArgument());
        }
        unwrapFromTop(truePhaseDeg);
        List<SweepPoint> sweepPoints = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            double gainDb = trueGainDb[i] + noise.gainSigmaDb() * random.nextGaussian();
            double phaseDeg = truePhaseDeg[i] + noise.phaseSigmaDeg() * random.nextGaussian();
            OptionalDouble phase = withPhase ? OptionalDouble.of(phaseDeg) : OptionalDouble.empty();
            sweepPoints.add(new SweepPoint(frequenciesHz.get(i), gainDb, phase, OptionalDouble.empty(),
                    OptionalDouble.empty()));
        }
        return new Sweep(provenance(stage, faults, noise, seed, bench.map(MeasuringChain::bench)), sweepPoints);
    }

    /** One fault, with phase: the common case. */
    public Sweep synthesize(Stage stage, Fault fault, SweepNoise noise, List<Double> frequenciesHz, long seed)
            throws InputProblem {
        return synthesize(stage, List.of(fault), noise, frequenciesHz, true, seed);
    }

    /**
     * @return {@code points} frequencies from {@code fromHz} to {@code toHz}, both included,
     *         equally spaced in log frequency
     */
    public static List<Double> logSpaced(double fromHz, double toHz, int points) {
        if (!(fromHz > 0) || !(toHz > fromHz) || points < 2) {
            throw new IllegalArgumentException("a log-spaced sweep needs 0 < from < to and two points");
        }
        List<Double> result = new ArrayList<>(points);
        double step = Math.log(toHz / fromHz) / (points - 1);
        for (int n = 0; n < points; n++) {
            result.add(n == points - 1 ? toHz : fromHz * Math.exp(step * n));
        }
        return result;
    }

    private static Provenance provenance(Stage stage, List<Fault> faults, SweepNoise noise, long seed,
                                         Optional<Bench> bench) {
        List<String> notes = new ArrayList<>();
        notes.add("demo data, invented: synthesized by polebench from the stage \"" + stage.name()
                + "\", not measured on any board");
        StringBuilder faultText = new StringBuilder();
        for (Fault fault : faults) {
            faultText.append(faultText.length() == 0 ? "" : "; ").append(fault.describe());
        }
        notes.add("as built (differences from the stage file): "
                + (faults.isEmpty() ? new Fault.None().describe() : faultText));
        notes.add("noise: " + noise.describe());
        notes.add(String.format(Locale.ROOT, "seed: %d", seed));
        bench.ifPresent(b -> notes.add(b.provenanceNote()));
        return new Provenance(Optional.empty(), "", "polebench board synthesizer (no instrument)", "synthesized",
                Optional.empty(), Optional.empty(), notes);
    }

    // Continuous phase, as analysers show it: the highest frequency keeps its value in
    // (−180°, 180°], each lower point is moved by whole turns to lie within 180° of its neighbour.
    private static void unwrapFromTop(double[] phaseDeg) {
        for (int i = phaseDeg.length - 2; i >= 0; i--) {
            double step = phaseDeg[i] - phaseDeg[i + 1];
            phaseDeg[i] -= 360 * Math.rint(step / 360);
        }
    }
}

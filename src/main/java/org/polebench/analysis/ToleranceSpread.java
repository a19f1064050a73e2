package org.polebench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.polebench.InputProblem;
import org.polebench.circuit.Bias;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;

/**
 * Monte Carlo spread of the exact lower corner over the stage's part tolerances, β spreads and
 * given bias currents (DESIGN.md "Tolerance spread").
 *
 * <p>Each value is drawn uniformly in ln(value) across its tolerance band: the same rectangular
 * reading of a band that the back-solve's priors use (GUM, JCGM 100:2008, 4.3.7), so the spread
 * and the priors describe the same population. Resistors and β change the bias, which is solved
 * again for every sample; a sample whose bias leaves the active region is counted, not used.
 * Draws come from one {@link SplittableRandom} with the given seed, in part order, so a run is
 * repeatable: every board is drawn before any is analysed, and each draw takes its values in
 * the same order whether or not its bias then solves, so the spread does not depend on the
 * number of threads that analyse the draws.
 */
public final class ToleranceSpread {
    /** Samples when the user does not say (issue 2). */
    public static final int DEFAULT_SAMPLES = 10_000;
    /** Seed when the user does not say, so that two runs of a report agree. */
    public static final long DEFAULT_SEED = 20_261_201L;

    private final int samples;
    private final long seed;
    private final int threads;
    private final BiasSolver biasSolver = new BiasSolver();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final StagePredictor predictor = new StagePredictor();

    public ToleranceSpread() {
        this(DEFAULT_SAMPLES, DEFAULT_SEED);
    }

    /**
     * Analyses the draws on every available processor; the result does not depend on how many.
     *
     * @param samples at least 20, so that the 5 % and 95 % points are not the extremes
     */
    public ToleranceSpread(int samples, long seed) {
        this(samples, seed, Runtime.getRuntime().availableProcessors());
    }

    private ToleranceSpread(int samples, long seed, int threads) {
        if (samples < 20) {
            throw new IllegalArgumentException("a tolerance spread needs at least 20 samples, was " + samples);
        }
        if (threads < 1) {
            throw new IllegalArgumentException("a tolerance spread needs at least one thread, was " + threads);
        }
        this.samples = samples;
        this.seed = seed;
        this.threads = threads;
    }

    public ToleranceSpread withSamples(int newSamples) {
        return new ToleranceSpread(newSamples, seed, threads);
    }

    public ToleranceSpread withSeed(long newSeed) {
        return new ToleranceSpread(samples, newSeed, threads);
    }

    /** @param newThreads how many threads analyse the draws (1 for the single-core benchmark) */
    public ToleranceSpread withThreads(int newThreads) {
        return new ToleranceSpread(samples, seed, newThreads);
    }

    /**
     * @return the percentiles of the exact lower corner; empty of corners when no sample could
     *         be analysed (every draw left the active region or had no corner)
     */
    public CornerSpread lowerCorner(Stage nominal) {
        BiasSolver.Prepared bias;
        try {
            bias = biasSolver.prepare(nominal);
        } catch (InputProblem noDcPath) {
            // a node without a DC path is one in every draw: each draw's bias solve would fail
            return new CornerSpread(samples, seed, samples, List.of());
        }
        SmallSignalExpansion.Prepared small = expansion.prepare(nominal);
        // Every draw is made first, in order, from one generator, so the boards drawn do not
        // depend on how many threads then analyse them: the spread is the same on any machine.
        SplittableRandom random = new SplittableRandom(seed);
        List<Transistor> given = givenBiasTransistors(nominal);
        Stage[] stages = new Stage[samples];
        double[][] biasFactors = new double[samples][];
        for (int n = 0; n < samples; n++) {
            stages[n] = draw(nominal, random);
            biasFactors[n] = drawGivenBias(given, random);
        }
        double[] corners = new double[samples];
        IntStream draws = IntStream.range(0, samples);
        if (threads > 1) {
            ForkJoinPool pool = new ForkJoinPool(threads);
            try {
                pool.submit(() -> draws.parallel().forEach(n ->
                        corners[n] = cornerOfOneDraw(stages[n], given, biasFactors[n], bias, small))).get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("the tolerance spread was interrupted", e);
            } catch (ExecutionException e) {
                throw new IllegalStateException("a tolerance draw failed", e.getCause());
            } finally {
                pool.shutdown();
            }
        } else {
            draws.forEach(n -> corners[n] = cornerOfOneDraw(stages[n], given, biasFactors[n], bias, small));
        }
        int biasFailures = 0;
        double[] usable = new double[samples];
        int used = 0;
        for (double cornerHz : corners) {
            if (Double.isNaN(cornerHz)) {
                biasFailures++;
            } else if (cornerHz > 0) {
                usable[used++] = cornerHz;
            }
        }
        double[] sorted = Arrays.copyOf(usable, used);
        Arrays.sort(sorted);
        List<Double> values = new ArrayList<>(used);
        for (double corner : sorted) {
            values.add(corner);
        }
        return new CornerSpread(samples, seed, biasFailures, values);
    }

    /**
     * @return the exact lower corner of one draw in Hz; 0 when the draw has none; NaN when its
     *         bias left the active region
     */
    private double cornerOfOneDraw(Stage drawn, List<Transistor> given, double[] biasFactors,
                                   BiasSolver.Prepared bias, SmallSignalExpansion.Prepared small) {
        OperatingPoints points;
        try {
            points = bias.solve(drawn);
        } catch (InputProblem outOfRegion) {
            return Double.NaN;
        }
        for (int t = 0; t < given.size(); t++) {
            points = points.withCurrentScaled(given.get(t).name(), biasFactors[t]);
        }
        OptionalDouble corner = predictor.exactLowerCornerHz(small.expand(drawn, points));
        return corner.isPresent() ? corner.getAsDouble() : 0;
    }

    /** One board drawn across the tolerances (shared with {@link ResponseSpread}, so both draw alike). */
    static Stage draw(Stage nominal, SplittableRandom random) {
        List<Part> drawn = new ArrayList<>(nominal.parts().size());
        for (Part part : nominal.parts()) {
            if (part instanceof Resistor) {
                Resistor resistor = (Resistor) part;
                drawn.add(resistor.withOhms(resistor.ohms() * factor(resistor.tolerance(), random)));
            } else if (part instanceof Capacitor) {
                Capacitor capacitor = (Capacitor) part;
                drawn.add(capacitor.withFarads(capacitor.farads() * factor(capacitor.tolerance(), random)));
            } else if (part instanceof Bjt) {
                Bjt bjt = (Bjt) part;
                drawn.add(bjt.withBeta(bjt.beta() * factor(bjt.betaTolerance(), random)));
            } else {
                drawn.add(part);
            }
        }
        return nominal.withParts(drawn);
    }

    static List<Transistor> givenBiasTransistors(Stage stage) {
        List<Transistor> given = new ArrayList<>();
        for (Transistor transistor : stage.transistors()) {
            if (transistor.bias() instanceof Bias.Given) {
                given.add(transistor);
            }
        }
        return given;
    }

    static double[] drawGivenBias(List<Transistor> given, SplittableRandom random) {
        double[] factors = new double[given.size()];
        for (int t = 0; t < factors.length; t++) {
            factors[t] = factor(given.get(t).biasTolerance(), random);
        }
        return factors;
    }

    private static double factor(Tolerance tolerance, SplittableRandom random) {
        double lower = tolerance.lnLower();
        double upper = tolerance.lnUpper();
        if (upper == lower) {
            return Math.exp(lower);
        }
        return Math.exp(lower + (upper - lower) * random.nextDouble());
    }
}

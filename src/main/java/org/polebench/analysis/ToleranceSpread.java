package org.polebench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.SplittableRandom;
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
 * repeatable.
 */
public final class ToleranceSpread {
    /** Samples when the user does not say (issue 2). */
    public static final int DEFAULT_SAMPLES = 10_000;
    /** Seed when the user does not say, so that two runs of a report agree. */
    public static final long DEFAULT_SEED = 20_261_201L;

    private final int samples;
    private final long seed;
    private final BiasSolver biasSolver = new BiasSolver();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final StagePredictor predictor = new StagePredictor();

    public ToleranceSpread() {
        this(DEFAULT_SAMPLES, DEFAULT_SEED);
    }

    /** @param samples at least 20, so that the 5 % and 95 % points are not the extremes */
    public ToleranceSpread(int samples, long seed) {
        if (samples < 20) {
            throw new IllegalArgumentException("a tolerance spread needs at least 20 samples, was " + samples);
        }
        this.samples = samples;
        this.seed = seed;
    }

    public ToleranceSpread withSamples(int newSamples) {
        return new ToleranceSpread(newSamples, seed);
    }

    public ToleranceSpread withSeed(long newSeed) {
        return new ToleranceSpread(samples, newSeed);
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
        SplittableRandom random = new SplittableRandom(seed);
        double[] corners = new double[samples];
        int used = 0;
        int biasFailures = 0;
        for (int n = 0; n < samples; n++) {
            // one call per draw, so that the JIT compiles a draw as a method of its own rather
            // than only as an on-stack replacement of this loop
            double cornerHz = cornerOfOneDraw(nominal, bias, small, random);
            if (Double.isNaN(cornerHz)) {
                biasFailures++;
            } else if (cornerHz > 0) {
                corners[used++] = cornerHz;
            }
        }
        double[] sorted = Arrays.copyOf(corners, used);
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
    private double cornerOfOneDraw(Stage nominal, BiasSolver.Prepared bias, SmallSignalExpansion.Prepared small,
                                   SplittableRandom random) {
        Stage drawn = draw(nominal, random);
        OperatingPoints points;
        try {
            points = bias.solve(drawn);
        } catch (InputProblem outOfRegion) {
            return Double.NaN;
        }
        points = drawGivenBias(drawn, points, random);
        OptionalDouble corner = predictor.exactLowerCornerHz(small.expand(drawn, points));
        return corner.isPresent() ? corner.getAsDouble() : 0;
    }

    private static Stage draw(Stage nominal, SplittableRandom random) {
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

    private static OperatingPoints drawGivenBias(Stage stage, OperatingPoints points, SplittableRandom random) {
        OperatingPoints drawn = points;
        for (Transistor transistor : stage.transistors()) {
            if (transistor.bias() instanceof Bias.Given) {
                drawn = drawn.withCurrentScaled(transistor.name(), factor(transistor.biasTolerance(), random));
            }
        }
        return drawn;
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

package org.polebench.spread;

import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import org.polebench.circuit.Part;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;

/**
 * A stage's tolerance bands in ln(value), read once for all its drawn boards (docs/method.md,
 * "Tolerance spread"). A board takes, in part order, each resistor's, capacitor's and BJT's β
 * factor uniform in ln across its band (one {@link SplittableRandom#nextDouble()} each, none
 * for a band of zero width), then one factor per transistor with a given bias current, in
 * transistor order. {@link ToleranceSpread} and {@link ResponseSpread} draw through this one
 * class, so with the same seed they draw the same boards. Immutable; the generator is the
 * caller's.
 */
final class ToleranceBands {
    private static final double[] NONE = new double[0];

    private final double[] nominal;
    private final boolean[] drawn;
    private final double[] lnLower;
    private final double[] lnUpper;
    private final double[] biasLnLower;
    private final double[] biasLnUpper;

    ToleranceBands(Stage stage) {
        nominal = stage.partValues();
        List<Part> parts = stage.parts();
        drawn = new boolean[nominal.length];
        lnLower = new double[nominal.length];
        lnUpper = new double[nominal.length];
        for (int p = 0; p < nominal.length; p++) {
            Optional<Tolerance> band = parts.get(p).drawnTolerance();
            if (band.isPresent()) {
                drawn[p] = true;
                lnLower[p] = band.get().lnLower();
                lnUpper[p] = band.get().lnUpper();
            }
        }
        List<Transistor> given = givenBias(stage);
        biasLnLower = new double[given.size()];
        biasLnUpper = new double[given.size()];
        for (int t = 0; t < biasLnLower.length; t++) {
            biasLnLower[t] = given.get(t).biasTolerance().lnLower();
            biasLnUpper[t] = given.get(t).biasTolerance().lnUpper();
        }
    }

    /** @return the transistors whose bias current the stage file gives, in transistor order */
    static List<Transistor> givenBias(Stage stage) {
        return stage.transistors().stream().filter(t -> t.bias().givenAmps().isPresent()).toList();
    }

    /** @return one board's part values ({@link Stage#partValues()} order): each nominal times its drawn factor */
    double[] board(SplittableRandom random) {
        double[] values = nominal.clone();
        for (int p = 0; p < values.length; p++) {
            if (drawn[p]) {
                values[p] *= factor(lnLower[p], lnUpper[p], random);
            }
        }
        return values;
    }

    /** @return the factors on the given bias currents of the board drawn just before, in transistor order */
    double[] biasFactors(SplittableRandom random) {
        if (biasLnLower.length == 0) {
            return NONE;
        }
        double[] factors = new double[biasLnLower.length];
        for (int t = 0; t < factors.length; t++) {
            factors[t] = factor(biasLnLower[t], biasLnUpper[t], random);
        }
        return factors;
    }

    private static double factor(double lower, double upper, SplittableRandom random) {
        if (upper == lower) {
            return Math.exp(lower);
        }
        return Math.exp(lower + (upper - lower) * random.nextDouble());
    }
}

package org.polebench.spread;

import java.util.List;
import java.util.SplittableRandom;
import org.polebench.circuit.Bias;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
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
            Tolerance band = band(parts.get(p));
            if (band != null) {
                drawn[p] = true;
                lnLower[p] = band.lnLower();
                lnUpper[p] = band.lnUpper();
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

    /** @return the band a part's drawn value spreads over; null for a MOSFET, of which nothing is drawn */
    private static Tolerance band(Part part) {
        if (part instanceof Resistor) {
            return ((Resistor) part).tolerance();
        }
        if (part instanceof Capacitor) {
            return ((Capacitor) part).tolerance();
        }
        return part instanceof Bjt ? ((Bjt) part).betaTolerance() : null;
    }

    /** @return the transistors whose bias current the stage file gives, in transistor order */
    static List<Transistor> givenBias(Stage stage) {
        return stage.transistors().stream().filter(t -> t.bias() instanceof Bias.Given).toList();
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

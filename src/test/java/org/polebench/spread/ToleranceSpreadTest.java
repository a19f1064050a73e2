package org.polebench.spread;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.polebench.InputProblem;
import org.polebench.analysis.CornerFinder;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.Bias;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;

/**
 * The tolerance spread's prepared fast path (bias and expansion prepared once, Hessenberg
 * response in the corner scan) against the straightforward computation of every draw: the
 * full bias solve with its structural check, the plain expansion, and the corner found by a
 * scan and bisection on the dense complex solve of H(jω) ({@link StateModel#responseAt}).
 */
class ToleranceSpreadTest {
    // the same draw order as ToleranceSpread documents: one SplittableRandom, parts in file order
    // (resistors, capacitors and β uniform in ln across the band), then given bias currents
    private static final double TOLERANCE = 1e-9;

    @ParameterizedTest
    @ValueSource(strings = {"geophone-two-stage.stage.yaml", "hydrophone-preamp-ce.stage.yaml",
            "vibration-buffer-cs.stage.yaml"})
    void preparedSpreadOfADemoStageEqualsThePerDrawComputation(String fileName) throws InputProblem {
        Stage stage = demo(fileName);
        int samples = fileName.startsWith("geophone") ? 10_000 : 2_000;

        CornerSpread fast = new ToleranceSpread(samples, ToleranceSpread.DEFAULT_SEED).withPrecision(0).lowerCorner(stage);
        Reference slow = reference(stage, samples, ToleranceSpread.DEFAULT_SEED);

        assertSameSpread(slow, fast);
    }

    @Test
    void theSpreadDoesNotDependOnTheNumberOfThreads() throws InputProblem {
        // every board is drawn before analysis, so one thread and three give the same order
        // statistics bit for bit (a property of the method, docs/method.md, "Tolerance spread")
        Stage stage = demo("geophone-two-stage.stage.yaml").withResistance("RC1", 8.1e3);
        CornerSpread one = new ToleranceSpread(1_000, 99L).withThreads(1).lowerCorner(stage);
        CornerSpread three = new ToleranceSpread(1_000, 99L).withThreads(3).lowerCorner(stage);
        assertEquals(one, three);
    }

    @Test
    void preparedSpreadCountsTheSameSaturatedDrawsAsThePerDrawComputation() throws InputProblem {
        // RC1 raised from 5.6k until Q1 sits near VCE(sat): a share of the draws saturate
        Stage stage = demo("geophone-two-stage.stage.yaml").withResistance("RC1", 8.1e3);
        long seed = 4_711L;

        CornerSpread fast = new ToleranceSpread(2_000, seed).withPrecision(0).lowerCorner(stage);
        Reference slow = reference(stage, 2_000, seed);

        assertTrue(slow.biasFailures > 0 && slow.biasFailures < 2_000, "failures: " + slow.biasFailures);
        assertSameSpread(slow, fast);
    }

    private static void assertSameSpread(Reference slow, CornerSpread fast) {
        assertEquals(slow.biasFailures, fast.biasFailures());
        assertEquals(slow.cornersHz.size(), fast.analysed());
        CornerSpread reference = new CornerSpread(fast.samplesDrawn(), fast.seed(), slow.biasFailures,
                sorted(slow.cornersHz));
        // 1e-9 relative: the bisection below stops at 1e-13 in ln ω and Brent at 1e-12, and the
        // two evaluations of H differ by round-off; a changed draw or bracket would differ by far more
        for (int percent = 0; percent <= 100; percent++) {
            double expected = reference.percentileHz(percent / 100.0).getAsDouble();
            double actual = fast.percentileHz(percent / 100.0).getAsDouble();
            assertEquals(expected, actual, TOLERANCE * expected, "percentile " + percent);
        }
        for (int i = 0; i < fast.analysed(); i++) {
            double expected = reference.cornersHz().get(i);
            assertEquals(expected, fast.cornersHz().get(i), TOLERANCE * expected, "order statistic " + i);
        }
    }

    private record Reference(int biasFailures, List<Double> cornersHz) {
    }

    private static Reference reference(Stage nominal, int samples, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        BiasSolver biasSolver = new BiasSolver();
        SmallSignalExpansion expansion = new SmallSignalExpansion();
        PortReduction reduction = new PortReduction();
        List<Double> corners = new ArrayList<>();
        int failures = 0;
        for (int n = 0; n < samples; n++) {
            List<Part> parts = new ArrayList<>();
            for (Part part : nominal.parts()) {
                if (part instanceof Resistor) {
                    Resistor r = (Resistor) part;
                    parts.add(r.withOhms(r.ohms() * factor(r.tolerance(), random)));
                } else if (part instanceof Capacitor) {
                    Capacitor c = (Capacitor) part;
                    parts.add(c.withFarads(c.farads() * factor(c.tolerance(), random)));
                } else if (part instanceof Bjt) {
                    Bjt q = (Bjt) part;
                    parts.add(q.withBeta(q.beta() * factor(q.betaTolerance(), random)));
                } else {
                    parts.add(part);
                }
            }
            Stage drawn = nominal.withParts(parts);
            OperatingPoints points;
            try {
                points = biasSolver.solve(drawn);
            } catch (InputProblem outOfRegion) {
                failures++;
                continue;
            }
            for (Transistor transistor : drawn.transistors()) {
                if (transistor.bias() instanceof Bias.Given) {
                    points = points.withCurrentScaled(transistor.name(), factor(transistor.biasTolerance(), random));
                }
            }
            SmallSignalNetwork network = expansion.expand(drawn, points);
            Reduction low = reduction.reduce(network, Band.LOW);
            if (low instanceof Reduction.StateSpace) {
                double cornerRadPerS = denseCorner(((Reduction.StateSpace) low).model());
                if (cornerRadPerS > 0) {
                    corners.add(cornerRadPerS / (2 * Math.PI));
                }
            }
        }
        return new Reference(failures, corners);
    }

    private static double factor(Tolerance tolerance, SplittableRandom random) {
        double lower = tolerance.lnLower();
        double upper = tolerance.lnUpper();
        return upper == lower ? Math.exp(lower) : Math.exp(lower + (upper - lower) * random.nextDouble());
    }

    /**
     * The highest −3 dB crossing below midband (docs/method.md, "Exact corners"): a scan
     * down from 10 times the pole bound in CornerFinder's steps, then bisection in ln ω, all on
     * the dense complex solve; −1 when there is none within 6 decades.
     */
    private static double denseCorner(StateModel model) {
        double d = model.directGain();
        double step = Math.pow(10, 1.0 / CornerFinder.STEPS_PER_DECADE);
        double hi = 10 * model.largestPoleBound();
        for (int n = 0; n < 6 * CornerFinder.STEPS_PER_DECADE; n++) {
            double lo = hi / step;
            if (excess(model, lo, d) <= 0) {
                double a = Math.log(lo);
                double b = Math.log(hi);
                while (b - a > 1e-13) {
                    double mid = 0.5 * (a + b);
                    if (excess(model, Math.exp(mid), d) <= 0) {
                        a = mid;
                    } else {
                        b = mid;
                    }
                }
                return Math.exp(0.5 * (a + b));
            }
            hi = lo;
        }
        return -1;
    }

    private static double excess(StateModel model, double omegaRadPerS, double d) {
        Complex h = model.responseAt(omegaRadPerS);
        return (h.getReal() * h.getReal() + h.getImaginary() * h.getImaginary()) / (d * d / 2) - 1;
    }

    private static Stage demo(String fileName) throws InputProblem {
        return new StageReader().read(Path.of("sample-measurements", fileName)).stage();
    }

    private static List<Double> sorted(List<Double> values) {
        List<Double> copy = new ArrayList<>(values);
        copy.sort(null);
        return copy;
    }
}

package org.polebench.spread;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.SplittableRandom;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.polebench.InputProblem;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.PredictionOutcome;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.Band;
import org.polebench.circuit.Bias;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.GainReference;
import org.polebench.circuit.Limits;
import org.polebench.circuit.NodePair;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageInput;
import org.polebench.circuit.StageOutput;
import org.polebench.circuit.StageReader;
import org.polebench.circuit.Supply;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;

/**
 * The tolerance spread's kernel, which takes a board as numbers through layouts made once from
 * the nominal stage, against the plain analysis of the same board built as a stage of records:
 * the full bias solve with its structural checks, the expansion into network records, and
 * {@link StagePredictor#predict}'s exact lower corner, with every graph check made again.
 */
class BoardCornersTest {
    // 1e-9 relative, as ToleranceSpreadTest: both sides stop Brent at 1e-12 in ln ω on the
    // same model, so they agree to round-off; a wrong value, port or current in the kernel's
    // restamp moves the corner by far more (a 1 % tolerance step moves it by about 1e-3)
    private static final double TOLERANCE = 1e-9;

    private final StagePredictor predictor = new StagePredictor();

    @ParameterizedTest
    @ValueSource(strings = {"geophone-two-stage.stage.yaml", "hydrophone-preamp-ce.stage.yaml",
            "vibration-buffer-cs.stage.yaml"})
    void kernelCornerOfADemoBoardIsThePredictedCornerOfThatBoard(String fileName) throws InputProblem {
        Stage stage = new StageReader().read(Path.of("sample-measurements", fileName)).stage();

        Tally tally = compare(stage, 300, 20_261_202L);

        // the demo stages are designed well inside their active regions: every board analyses
        assertEquals(300, tally.analysed, "boards with a corner");
    }

    @Test
    void boardsOutOfTheActiveRegionAreFlaggedWhereThePlainBiasSolveRejectsThem() throws InputProblem {
        // RC1 raised from 5.6k until Q1 sits near VCE(sat): a share of the draws saturate
        Stage stage = new StageReader().read(Path.of("sample-measurements", "geophone-two-stage.stage.yaml"))
                .stage().withResistance("RC1", 8.1e3);

        Tally tally = compare(stage, 300, 4_711L);

        assertTrue(tally.outOfRegion > 0 && tally.analysed > 0,
                "out of region " + tally.outOfRegion + ", analysed " + tally.analysed);
    }

    @Property(tries = 60, seed = "20261204")
    void kernelCornerOfRandomCommonEmitterBoardsIsThePredictedCorner(@ForAll @LongRange long seed) {
        compare(randomCommonEmitter(seed), 20, seed);
    }

    private record Tally(int analysed, int outOfRegion) {
    }

    /**
     * Draws boards as the spread draws them and checks each one's kernel corner against the
     * plain prediction; a board whose bias the plain solve rejects must be NaN in the kernel.
     */
    private Tally compare(Stage nominal, int boards, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        ToleranceBands bands = new ToleranceBands(nominal);
        List<Transistor> given = ToleranceBands.givenBias(nominal);
        double[][] values = new double[boards][];
        double[][] factors = new double[boards][];
        for (int n = 0; n < boards; n++) {
            values[n] = bands.board(random);
            factors[n] = bands.biasFactors(random);
        }
        Optional<BoardCorners> kernel = BoardCorners.prepare(nominal, values, predictor);
        int analysed = 0;
        int outOfRegion = 0;
        for (int n = 0; n < boards; n++) {
            Stage board = nominal.withPartValues(values[n]);
            double cornerHz = kernel.isPresent() ? kernel.get().cornerHz(values[n], factors[n]) : Double.NaN;
            OperatingPoints points;
            try {
                points = new BiasSolver().solve(board);
            } catch (InputProblem rejected) {
                assertTrue(Double.isNaN(cornerHz), "board " + n + " is out of region: " + rejected.getMessage());
                outOfRegion++;
                continue;
            }
            for (int t = 0; t < given.size(); t++) {
                points = points.withCurrentScaled(given.get(t).name(), factors[n][t]);
            }
            PredictionOutcome outcome = predictor.predict(new SmallSignalExpansion().expand(board, points));
            OptionalDouble expected = outcome instanceof Prediction
                    ? ((Prediction) outcome).exactLowerCornerHz() : OptionalDouble.empty();
            if (expected.isPresent()) {
                assertEquals(expected.getAsDouble(), cornerHz, TOLERANCE * expected.getAsDouble(), "board " + n);
                analysed++;
            } else {
                assertEquals(0, cornerHz, "board " + n + " has no corner");
            }
        }
        return new Tally(analysed, outOfRegion);
    }

    private static double logUniform(Random random, double low, double high) {
        return low * Math.pow(high / low, random.nextDouble());
    }

    /**
     * A divider-biased common-emitter stage with a partly bypassed emitter and random values,
     * wide tolerances (so that some boards leave the active region), sometimes rx, sometimes
     * an Early voltage, sometimes a given collector current instead of a solved one.
     */
    static Stage randomCommonEmitter(long seed) {
        Random random = new Random(seed);
        Tolerance resistor = Tolerance.symmetric(0.05);
        Tolerance capacitor = Tolerance.symmetric(0.2);
        double vcc = logUniform(random, 6, 24);
        List<Part> parts = new ArrayList<>();
        parts.add(new Resistor("R1", new NodePair("vcc", "b"), logUniform(random, 20e3, 200e3), resistor, 0));
        parts.add(new Resistor("R2", new NodePair("b", "gnd"), logUniform(random, 5e3, 50e3), resistor, 0));
        parts.add(new Resistor("RC", new NodePair("vcc", "c"), logUniform(random, 1e3, 10e3), resistor, 0));
        parts.add(new Resistor("REa", new NodePair("e", "x"), logUniform(random, 10, 500), resistor, 0));
        parts.add(new Resistor("REb", new NodePair("x", "gnd"), logUniform(random, 300, 3e3), resistor, 0));
        parts.add(new Capacitor("C1", new NodePair("in", "b"), logUniform(random, 0.1e-6, 10e-6), capacitor, Band.LOW, 0));
        parts.add(new Capacitor("CE", new NodePair("x", "gnd"), logUniform(random, 10e-6, 1e-3),
                new Tolerance(-0.2, 0.8), Band.LOW, 0));
        parts.add(new Capacitor("C2", new NodePair("c", "out"), logUniform(random, 0.1e-6, 10e-6), capacitor, Band.LOW, 0));
        Bias bias = random.nextInt(4) == 0 ? new Bias.Given(logUniform(random, 0.2e-3, 2e-3)) : new Bias.Auto();
        parts.add(new Bjt("Q1", Bjt.Polarity.NPN, "c", "b", "e", logUniform(random, 80, 400), Tolerance.symmetric(0.5),
                Bjt.DEFAULT_VBE_ON_VOLTS,
                random.nextBoolean() ? OptionalDouble.of(logUniform(random, 30, 150)) : OptionalDouble.empty(),
                random.nextBoolean() ? logUniform(random, 10, 300) : 0, 0, 0, bias, Tolerance.symmetric(0.2), 0));
        return new Stage("random common emitter " + seed, null, "gnd", List.of(new Supply("vcc", vcc, 0)),
                new StageInput("in", logUniform(random, 50, 5e3), GainReference.SOURCE_EMF, 0),
                new StageOutput("out", OptionalDouble.of(logUniform(random, 5e3, 100e3)), 0), Limits.none(),
                Stage.DEFAULT_TEMPERATURE_KELVIN, Stage.DEFAULT_GAIN_CALIBRATION_DB, parts);
    }
}

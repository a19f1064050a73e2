package org.polebench.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;

class MeasuringChainTest {
    @TempDir
    Path dir;

    /** A 10 kΩ series resistor into 100 kΩ to ground: with a load on the output, a plain divider. */
    private Stage seriesResistor(String sourceOhms) throws InputProblem {
        return BenchFiles.stage(dir, "name: series resistor", "ground: gnd",
                "input: {node: in, source-resistance: " + sourceOhms + "}", "output: {node: out}", "parts:",
                "  R1: {resistor: 10k, between: [in, out]}", "  R2: {resistor: 100k, between: [out, gnd]}");
    }

    /** 10 kΩ from the input node to ground, read through 1 kΩ into an unloaded output. */
    private Stage shuntResistor(String sourceOhms) throws InputProblem {
        return BenchFiles.stage(dir, "name: shunt resistor", "ground: gnd",
                "input: {node: in, source-resistance: " + sourceOhms + "}", "output: {node: out}", "parts:",
                "  R1: {resistor: 10k, between: [in, gnd]}", "  R2: {resistor: 1k, between: [in, out]}");
    }

    /** A 1 µF coupling capacitor into a 10 kΩ load from a 600 Ω source: a first-order high-pass. */
    private Stage couplingCapacitor() throws InputProblem {
        return BenchFiles.stage(dir, "name: coupling", "ground: gnd", "input: {node: in, source-resistance: 600}",
                "output: {node: out}", "parts:", "  C1: {capacitor: 1u, between: [in, out]}",
                "  R1: {resistor: 10k, between: [out, gnd]}");
    }

    private static Complex highPass(double f, double fc) {
        // jf/(jf + fc), written out here apart from Channel.highPass
        return new Complex(f * f, f * fc).divide(f * f + fc * fc);
    }

    @Test
    void highPassIsMinusThreeDecibelsAndPlus45DegreesAtItsCorner() {
        Complex h = Channel.highPass(3.3, 3.3);

        // first-order high-pass jω/(jω + ωc) at ω = ωc is (1 + j)/2: |H| = 1/√2 = −3.0103 dB, +45°
        // (any circuits text; from memory). 1e-12: round-off of a few operations
        assertEquals(20 * Math.log10(Math.sqrt(0.5)), 20 * Math.log10(h.abs()), 1e-12);
        assertEquals(-3.0103, 20 * Math.log10(h.abs()), 1e-4);
        assertEquals(45, Math.toDegrees(h.getArgument()), 1e-12);
    }

    @Test
    void highPassElsewhereFollowsItsClosedForm() {
        for (double ratio : List.of(0.01, 0.1, 0.5, 2.0, 10.0, 100.0)) {
            Complex h = Channel.highPass(ratio * 5, 5);

            // |H| = (f/fc)/√(1 + (f/fc)²), arg H = 90° − atan(f/fc) (from memory); 1e-12: round-off
            assertEquals(ratio / Math.sqrt(1 + ratio * ratio), h.abs(), 1e-12);
            assertEquals(90 - Math.toDegrees(Math.atan(ratio)), Math.toDegrees(h.getArgument()), 1e-10);
        }
    }

    @Test
    void idealBenchShowsTheBoardsOwnResponse() throws InputProblem {
        Stage stage = couplingCapacitor();
        AsMeasuredResponse measured = MeasuringChain.of(Bench.IDEAL, "test").response(stage);
        FullResponse own = new FullResponse(new SmallSignalExpansion().expand(stage));
        Prediction prediction = (Prediction) new StagePredictor().predict(new SmallSignalExpansion().expand(stage));

        // an ideal bench adds nothing: the same MNA solve, to round-off; the corner and midband
        // from the same low-band model (corner: both found to 1e-12 in ln f, so 1e-9 relative)
        for (double f : List.of(1.0, 15.0, 100.0, 1e4)) {
            Complex a = measured.atHz(f).orElseThrow();
            Complex b = own.atHz(f).orElseThrow();
            assertEquals(0, a.subtract(b).abs(), 1e-14 * b.abs());
        }
        assertEquals(prediction.midbandGain(), measured.midbandGain(), 1e-14);
        double corner = prediction.exactLowerCornerHz().getAsDouble();
        assertEquals(corner, measured.lowerCornerHz().getAsDouble(), 1e-9 * corner);
    }

    @Test
    void channelLoadIsTheDividerOfItsRParallelCOnTheSourceResistance() throws InputProblem {
        Stage stage = seriesResistor("0");
        Bench bench = BenchFiles.bench(dir, "output-channel:", "  resistance: 1M", "  capacitance: 15p");
        AsMeasuredResponse measured = MeasuringChain.of(bench, "test").response(stage);

        for (double f : List.of(10.0, 1e3, 1e5, 1e6, 1e7)) {
            // loading divider H = Z/(Z + Rs), Z = R ∥ 1/(jωC) ∥ R2, Rs the 10 kΩ before the
            // channel (Ohm's law; from memory). 1e-12 relative: one complex LU of a 3-node network
            Complex y = new Complex(1 / 1e6 + 1 / 100e3, 2 * Math.PI * f * 15e-12);
            Complex z = y.reciprocal();
            Complex expected = z.divide(z.add(10e3));
            Complex h = measured.atHz(f).orElseThrow();
            assertEquals(0, h.subtract(expected).abs(), 1e-12 * expected.abs(), "at " + f + " Hz");
        }
    }

    @Test
    void generatorResistanceIsInSeriesWithTheSourceResistance() throws InputProblem {
        Stage stage = shuntResistor("600");
        Bench bench = BenchFiles.bench(dir, "generator:", "  output-resistance: 50 ohm");

        AsMeasuredResponse measured = MeasuringChain.of(bench, "test").response(stage);
        AsMeasuredResponse own = MeasuringChain.of(Bench.IDEAL, "test").response(stage);

        // resistive divider Rin/(Rin + Rs + Rg), Rin = 10 kΩ, Rs = 600 Ω, Rg = 50 Ω (Ohm's law);
        // 1e-13: round-off of a small LU
        assertEquals(10e3 / (10e3 + 650), measured.atHz(1e3).orElseThrow().getReal(), 1e-13);
        assertEquals(10e3 / (10e3 + 650), measured.midbandGain(), 1e-13);
        assertEquals(10e3 / (10e3 + 600), own.midbandGain(), 1e-13);
    }

    @Test
    void inputChannelAtTheGeneratorReadsAheadOfTheSourceResistance() throws InputProblem {
        Stage stage = shuntResistor("600");
        Bench bench = BenchFiles.bench(dir, "generator:", "  output-resistance: 50 ohm", "reference: input-channel",
                "input-channel:", "  at: generator", "  resistance: 1M");

        AsMeasuredResponse measured = MeasuringChain.of(bench, "test").response(stage);

        // V(out)/V(terminal) = Rin/(Rin + Rs): the terminal drives Rs into Rin, whatever loads the
        // terminal and whatever Rg is (Ohm's law). 1e-13: round-off
        assertEquals(10e3 / 10.6e3, measured.atHz(1e3).orElseThrow().getReal(), 1e-13);
        assertEquals(10e3 / 10.6e3, measured.midbandGain(), 1e-13);
        assertTrue(MeasuringChain.of(bench, "test").asMeasured(stage).part(MeasuringChain.STAGE_SOURCE_PART)
                .isPresent());
    }

    @Test
    void unequalChannelCouplingsMakeAPoleZeroDoublet() throws InputProblem {
        Stage stage = shuntResistor("0");
        Bench bench = BenchFiles.bench(dir, "reference: input-channel", "output-channel:", "  coupling: ac",
                "  corner: 3.3 Hz", "input-channel:", "  at: stage-input", "  coupling: ac", "  corner: 5 Hz");

        AsMeasuredResponse measured = MeasuringChain.of(bench, "test").response(stage);

        for (double f : List.of(0.5, 3.3, 5.0, 20.0, 1e3)) {
            // the board is flat (V(out) = V(in)); the ratio is HP(3.3 Hz)/HP(5 Hz), a zero at
            // 5 Hz over a pole at 3.3 Hz (from the definition of the ratio). 1e-12: round-off
            Complex expected = highPass(f, 3.3).divide(highPass(f, 5));
            assertEquals(0, measured.atHz(f).orElseThrow().subtract(expected).abs(), 1e-12, "at " + f + " Hz");
        }
    }

    @Test
    void acCoupledOutputChannelMovesTheCornerToTheTwoPoleClosedForm() throws InputProblem {
        Stage stage = couplingCapacitor();
        Bench bench = BenchFiles.bench(dir, "output-channel:", "  coupling: ac", "  corner: 3.3 Hz");

        OptionalDouble corner = MeasuringChain.of(bench, "test").response(stage).lowerCornerHz();

        // two first-order high-passes at f1 = 1/(2π·10.6 kΩ·1 µF) and f2 = 3.3 Hz: |H|² = 1/2 where
        // x = f² solves x² − (a + b)x − ab = 0, a = f1², b = f2² (algebra on the product of two
        // first-order magnitudes). 1e-9 relative: the bisection stops at 1e-12 in ln f
        double a = Math.pow(1 / (2 * Math.PI * 10.6e3 * 1e-6), 2);
        double b = 3.3 * 3.3;
        double expected = Math.sqrt(((a + b) + Math.sqrt((a + b) * (a + b) + 4 * a * b)) / 2);
        assertEquals(expected, corner.getAsDouble(), 1e-9 * expected);
    }

    @Test
    void unknownCornerIsRefusedWhereItsValueIsNeeded() throws InputProblem {
        Bench bench = BenchFiles.bench(dir, "output-channel:", "  coupling: ac", "  corner: unknown");

        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                () -> MeasuringChain.of(bench, "predict"));

        // the section's line in the file written above
        assertEquals(1, problem.line());
        assertTrue(problem.getMessage().contains("unknown"), problem.getMessage());
    }
}

package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoint;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/**
 * Issue 15: a ten-stage cascade of high-gain common-emitter stages (about 27 dB each, test data,
 * invented) is biased and predicted, where a relative pivot test once called its regular MNA
 * matrix and port admittance singular (the pivots shrank by the cascade's gain) and the eigen
 * iteration did not converge on its unbalanced state matrix.
 */
class HighGainCascadeTest {
    private static final int STAGES = 10;

    @TempDir
    Path folder;

    @Test
    void tenHighGainStagesAreBiasedAndPredicted() throws InputProblem, IOException {
        Path file = folder.resolve("high-gain.stage.yaml");
        Files.writeString(file, cascade(), StandardCharsets.UTF_8);
        Stage stage = new StageReader().read(file).stage();

        OperatingPoints points = new BiasSolver().solve(stage);
        // each stage is AC-coupled, so each bias is its own divider's: the Thevenin closed form
        // IC = β·(V_Th − VBE)/(R_Th + (β + 1)·RE) with V_Th = 12·22/90 V, R_Th = 68k ∥ 22k,
        // RE = 100 + 1k (common practice)
        double vth = 12.0 * 22 / 90;
        double rth = 68e3 * 22e3 / 90e3;
        double expectedIc = 200 * (vth - 0.65) / (rth + 201 * 1100);
        for (OperatingPoint point : points.transistors()) {
            double ic = point.match(new OperatingPoint.Cases<Double>() {
                @Override
                public Double bjt(OperatingPoint.BjtPoint bjt) {
                    return bjt.collectorAmps();
                }

                @Override
                public Double mosfet(OperatingPoint.MosfetPoint mosfet) {
                    throw new AssertionError("no MOSFET in this stage");
                }
            });
            // 1e-9 relative: one LU solve of a linear DC network
            assertEquals(expectedIc, ic, 1e-9 * expectedIc, point.transistor());
        }

        PredictionOutcome outcome = new StagePredictor().predict(new SmallSignalExpansion().expand(stage, points));
        assertTrue(outcome.prediction().isPresent(), () -> "refused: " + outcome.singular());
        Prediction prediction = outcome.prediction().get();
        assertEquals(2 * STAGES + 1, prediction.poles().roots().size());
        // the exact identity Σ 1/τ_i = trace(−A) = −Σ poles (docs/method.md, "Exact identities");
        // 1e-9: both sides are sums of 21 numbers from the same reduction
        double sumOfPoles = 0;
        for (ComplexFrequency pole : prediction.poles().roots()) {
            sumOfPoles -= pole.realRadPerS();
            assertTrue(pole.realRadPerS() < 0, "a pole in the right half-plane: " + pole);
        }
        double sctc = 0;
        for (SctcTerm term : prediction.sctc().terms()) {
            sctc += 1 / term.seconds();
        }
        assertEquals(sctc, sumOfPoles, 1e-9 * sctc);
        assertTrue(prediction.exactLowerCornerHz().isPresent());
        // the lower corner of a high-pass lies above its largest pole magnitude's share and
        // below the SCTC sum, which over-estimates it when the poles are close (common practice)
        assertTrue(prediction.exactLowerCornerHz().getAsDouble() < sctc / (2 * Math.PI));
        assertEquals(STAGES + 1, prediction.zeros().orElseThrow().atDc());
    }

    private static String cascade() {
        StringBuilder yaml = new StringBuilder("name: ten high-gain stages (test data, invented)\nground: gnd\n"
                + "supplies: {vcc: 12}\ninput:  {node: in, source-resistance: 600}\noutput: {node: out, load: 47k}\n"
                + "parts:\n");
        String previous = "in";
        for (int i = 1; i <= STAGES; i++) {
            yaml.append(String.format(Locale.ROOT,
                    "  C%1$d: {capacitor: 2.2u, between: [%2$s, b%1$d], tolerance: 10%%}%n"
                            + "  RA%1$d: {resistor: 68k, between: [vcc, b%1$d], tolerance: 1%%}%n"
                            + "  RB%1$d: {resistor: 22k, between: [b%1$d, gnd], tolerance: 1%%}%n"
                            + "  RC%1$d: {resistor: 3.3k, between: [vcc, c%1$d], tolerance: 1%%}%n"
                            + "  REA%1$d: {resistor: 100, between: [e%1$d, x%1$d], tolerance: 1%%}%n"
                            + "  REB%1$d: {resistor: 1k, between: [x%1$d, gnd], tolerance: 1%%}%n"
                            + "  CE%1$d: {capacitor: 100u, between: [x%1$d, gnd], tolerance: -20%%/+80%%}%n"
                            + "  Q%1$d: {npn: {c: c%1$d, b: b%1$d, e: e%1$d}, beta: 200, early-voltage: 100, bias: auto}%n",
                    i, previous));
            previous = "c" + i;
        }
        yaml.append("  CO: {capacitor: 1u, between: [").append(previous).append(", out], tolerance: 10%}\n");
        return yaml.toString();
    }
}

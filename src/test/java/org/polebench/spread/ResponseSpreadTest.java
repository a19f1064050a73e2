package org.polebench.spread;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

class ResponseSpreadTest {
    private static final double RS = 600;
    private static final double R = 10_000;
    private static final double C = 1e-6;

    // One RC high-pass, only C1 toleranced (±10 %): |H| rises with C at every frequency, so the
    // p-quantile of the drawn gains is the gain at the p-quantile of C, and C is drawn uniform in
    // ln C over [ln 0.9, ln 1.1] (GUM 4.3.7 rectangular reading): ln C_p = ln 0.9 + p·ln(1.1/0.9).
    @Test
    void bandEdgesAreTheGainsAtTheCapacitorsQuantiles(@TempDir Path dir) throws Exception {
        Stage stage = rcStage(dir);
        List<Double> frequencies = List.of(1.0, 5.0, 15.0, 50.0, 1000.0);
        int boards = 1000;
        GainSpread band = new ResponseSpread(boards, 7, 0.95).gain(stage, frequencies);
        assertEquals(0, band.biasFailures());
        // the empirical 2.5 % point of n uniform draws has sd √(p(1−p)/n) ≈ 0.005 of the range;
        // ±0.02 is four of those
        double slack = 0.02;
        for (int i = 0; i < frequencies.size(); i++) {
            double f = frequencies.get(i);
            double low = band.lowDb().get(i);
            double high = band.highDb().get(i);
            assertTrue(low >= gainDb(f, quantileFarads(0.025 - slack)) - 1e-9
                    && low <= gainDb(f, quantileFarads(0.025 + slack)) + 1e-9, "low edge at " + f + " Hz: " + low);
            assertTrue(high >= gainDb(f, quantileFarads(0.975 - slack)) - 1e-9
                    && high <= gainDb(f, quantileFarads(0.975 + slack)) + 1e-9, "high edge at " + f + " Hz: " + high);
        }
        // far above the corner C no longer matters: the band closes onto 20·log10(R/(Rs+R));
        // 0.01 dB is (f_L/f)² of the ±10 % corner change, about 0.0002 at 1 kHz, with room
        assertEquals(20 * Math.log10(R / (RS + R)), band.highDb().get(4), 0.01);
        assertEquals(band.highDb().get(4), band.lowDb().get(4), 0.01);
    }

    // same seed, same boards: the band does not change between runs
    @Test
    void sameSeedGivesTheSameBand(@TempDir Path dir) throws Exception {
        Stage stage = rcStage(dir);
        List<Double> frequencies = List.of(3.0, 30.0);
        assertEquals(new ResponseSpread(50, 11, 0.95).gain(stage, frequencies),
                new ResponseSpread(50, 11, 0.95).gain(stage, frequencies));
    }

    private static double quantileFarads(double p) {
        double q = Math.min(1, Math.max(0, p));
        return C * Math.exp(Math.log(0.9) + q * Math.log(1.1 / 0.9));
    }

    // first-order high-pass from a source of resistance Rs into R: closed form
    private static double gainDb(double frequencyHz, double farads) {
        double wt = 2 * Math.PI * frequencyHz * (RS + R) * farads;
        return 20 * Math.log10(R / (RS + R) * wt / Math.hypot(1, wt));
    }

    private static Stage rcStage(Path dir) throws Exception, InputProblem {
        Path file = dir.resolve("rc.stage.yaml");
        Files.writeString(file, String.join("\n",
                "# test stage: one RC high-pass, no transistor",
                "name: RC high-pass (test)",
                "ground: gnd",
                "supplies: {vcc: 15}",
                "input:  {node: in, source-resistance: 600}",
                "output: {node: out, load: 1T}",
                "parts:",
                "  C1: {capacitor: 1u, between: [in, out], tolerance: 10%}",
                "  R1: {resistor: 10k, between: [out, gnd], tolerance: 0%}",
                "  R2: {resistor: 10k, between: [vcc, gnd], tolerance: 0%}",
                ""));
        return new StageReader().read(file).stage();
    }
}

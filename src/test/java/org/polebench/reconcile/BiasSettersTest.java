package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

/**
 * Which resistors set a transistor's bias current, against the four-resistor bias formula
 * (common practice: the divider's Thévenin equivalent driving the base, I_E = (V_Th − V_BE) /
 * (R_E + R_Th/(β+1)), V_BE taken as 0.65 V), whose sensitivities are worked here by hand from
 * the stage file's values, not by polebench's DC solver.
 */
class BiasSettersTest {
    @Test
    void theDividerAndTheEmitterResistorSetTheHydrophoneStagesCurrentAndTheCollectorResistorDoesNot()
            throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.HYDROPHONE);
        // hydrophone-preamp-ce.stage.yaml: R1 68k to 12 V, R2 15k, RE 1.2k, RC 4.7k, β 150
        double vcc = 12;
        double[] r = {68e3, 15e3, 1.2e3};   // R1, R2, RE
        double beta = 150;
        List<String> expected = new ArrayList<>();
        String[] names = {"R1", "R2", "RE"};
        for (int k = 0; k < 3; k++) {
            double[] up = r.clone();
            double[] down = r.clone();
            up[k] *= 1.1;
            down[k] /= 1.1;
            double sensitivity = Math.abs(Math.log(emitterCurrent(vcc, up, beta) / emitterCurrent(vcc, down, beta)))
                    / (2 * Math.log(1.1));
            // |d ln I / d ln R|: about 1.2 for each divider resistor and 0.95 for RE by this formula
            if (sensitivity >= BoardNetwork.BIAS_SETTER_SENSITIVITY) {
                expected.add(names[k]);
            }
        }
        assertEquals(List.of("R1", "R2", "RE"), expected, "the hand formula's own reading");
        BoardNetwork network = new BoardNetwork(demo.stage, demo.points, List.of());
        // RC moves only V_CE, not the current (the Early effect is second order): not a setter
        assertEquals(List.of(new BiasSetters("Q1", expected)), network.biasSetters());
    }

    @Test
    void eachResistorOfTheTwoStageBoardSetsAtMostOneTransistor() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        List<BiasSetters> setters = new BoardNetwork(demo.stage, demo.points, List.of()).biasSetters();
        assertEquals(List.of("Q1", "Q2"), setters.stream().map(BiasSetters::transistor).toList());
        List<String> all = new ArrayList<>();
        setters.forEach(s -> all.addAll(s.resistors()));
        // each resistor is given to the one transistor whose current it moves most
        assertEquals(all.size(), all.stream().distinct().count(), all.toString());
    }

    private static double emitterCurrent(double vcc, double[] r, double beta) {
        double thevenin = vcc * r[1] / (r[0] + r[1]);
        double rth = r[0] * r[1] / (r[0] + r[1]);
        return (thevenin - 0.65) / (r[2] + rth / (beta + 1));
    }
}

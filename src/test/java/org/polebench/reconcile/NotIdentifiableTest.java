package org.polebench.reconcile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/** Parameters a sweep cannot see are flagged and never blamed (issue 5, item 3). */
class NotIdentifiableTest {

    private static ParameterEstimate estimate(Hypothesis hypothesis, String part) {
        return hypothesis.backSolve().parameters().stream()
                .filter(p -> p.parameter().part().orElse("").equals(part)).findFirst().orElseThrow();
    }

    @Test
    void aCapacitorWhoseCornerLiesBelowTheSweptBandIsNotIdentifiable() throws InputProblem {
        // Larkfield buffer (demo): the output coupling C2 = 1 µF into 5.6 kΩ + 100 kΩ has its pole
        // at 1/(2π·105.6 kΩ·1 µF) ≈ 1.5 Hz (first-order RC, closed form). A sweep from 300 Hz
        // starts over two decades above it: its phase lead there is 1.5/300 rad ≈ 0.3°, below the
        // 0.5° noise, and it is one of three tails that add up to one Σ 1/τ term.
        DemoBoards demo = new DemoBoards(DemoBoards.VIBRATION);
        Sweep sweep = demo.sweep(List.of(new Fault.None()), SweepNoise.BENCH,
                BoardSynthesizer.logSpaced(300, 20_000, 100), 11);
        Hypothesis top = demo.rank(sweep).top();
        assertFalse(estimate(top, "C2").identifiable());
        // not blamed: the healthy board's top hypothesis stays "no fault"
        assertEquals(HypothesisKind.NONE, top.kind());
    }

    @Test
    void theSameCapacitorIsIdentifiableWhenTheSweepCoversItsCorner() throws InputProblem {
        DemoBoards demo = new DemoBoards(DemoBoards.VIBRATION);
        Sweep sweep = demo.sweep(List.of(new Fault.None()), SweepNoise.BENCH,
                BoardSynthesizer.logSpaced(0.2, 20_000, 100), 11);
        assertTrue(estimate(demo.rank(sweep).top(), "C2").identifiable());
    }

    @Test
    void aBiasFaultMaskedByEmitterDegenerationIsFlaggedAndNoPartIsBlamed() throws InputProblem {
        // Ostrova front end (demo): 220 Ω of unbypassed emitter resistance against
        // re = VT/IC ≈ 16 Ω makes the midband gain nearly independent of IC (Sedra and Smith,
        // emitter degeneration, from memory), so a ×0.6 bias current moves the response by
        // about what the part tolerances allow.
        DemoBoards demo = new DemoBoards(DemoBoards.GEOPHONE);
        Sweep sweep = demo.sweep(List.of(new Fault.BiasCurrent("Q1", 0.6)), SweepNoise.BENCH, demo.band(100), 3);
        Diagnosis diagnosis = demo.rank(sweep);
        Hypothesis top = diagnosis.top();
        assertNotEquals(HypothesisKind.CAPACITOR, top.kind());
        assertNotEquals(HypothesisKind.GAIN, top.kind());
        Hypothesis bias = diagnosis.hypotheses().stream()
                .filter(h -> h.kind() == HypothesisKind.BIAS && h.part().orElse("").equals("Q1")).findFirst().orElseThrow();
        assertFalse(bias.culprit().get().identifiable());
        assertFalse(bias.identifiable());
    }
}

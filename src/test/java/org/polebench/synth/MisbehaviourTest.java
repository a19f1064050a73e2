package org.polebench.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

/** The simulator's misbehaviour option read from text. */
class MisbehaviourTest {
    @Test
    void misbehavioursReadFromText() throws InputProblem {
        assertEquals(new Misbehaviour(Misbehaviour.Kind.STALL, 12, 4000), Misbehaviour.parse("stall@12=4s"));
        assertEquals(new Misbehaviour(Misbehaviour.Kind.STALL, 3, 500), Misbehaviour.parse("stall@3=500ms"));
        assertEquals(new Misbehaviour(Misbehaviour.Kind.CLOSE, 20, 0), Misbehaviour.parse("close@20"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("stall@3"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("drop@0"));
        assertThrows(InputProblem.class, () -> Misbehaviour.parse("drop@2=1s"));
    }
}

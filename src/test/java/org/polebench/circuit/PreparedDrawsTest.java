package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

/** The prepared bias solve and expansion give for draws exactly what the plain calls give. */
class PreparedDrawsTest {

    @Test
    void preparedBiasAndExpansionOfADrawEqualThePlainOnes() throws InputProblem {
        Stage nominal = new StageReader().read(StageFiles.demo("geophone-two-stage.stage.yaml")).stage();
        // a draw as a tolerance spread makes one: every resistor 1 % up, β halved
        List<Part> parts = new ArrayList<>();
        for (Part part : nominal.parts()) {
            if (part instanceof Resistor) {
                parts.add(((Resistor) part).withOhms(((Resistor) part).ohms() * 1.01));
            } else if (part instanceof Bjt) {
                parts.add(((Bjt) part).withBeta(((Bjt) part).beta() / 2));
            } else {
                parts.add(part);
            }
        }
        Stage draw = nominal.withParts(parts);

        OperatingPoints plain = new BiasSolver().solve(draw);
        OperatingPoints prepared = new BiasSolver().prepare(nominal).solve(draw);
        SmallSignalNetwork plainNetwork = new SmallSignalExpansion().expand(draw, plain);
        SmallSignalNetwork preparedNetwork = new SmallSignalExpansion().prepare(nominal).expand(draw, prepared);

        // the same arithmetic on the same numbers: equal records, not merely close values
        assertEquals(plain, prepared);
        assertEquals(plainNetwork, preparedNetwork);
    }

    @Test
    void aStageWiredDifferentlyIsNoDrawOfThePreparedOne() throws InputProblem {
        Stage nominal = new StageReader().read(StageFiles.demo("geophone-two-stage.stage.yaml")).stage();
        Resistor r4 = nominal.resistor("R4");
        Stage rewired = nominal.withPart(new Resistor("R4", new NodePair("b2", "x2"), r4.ohms(), r4.tolerance(),
                r4.line()));

        assertThrows(IllegalArgumentException.class, () -> new BiasSolver().prepare(nominal).solve(rewired));
        OperatingPoints points = new BiasSolver().solve(nominal);
        assertThrows(IllegalArgumentException.class,
                () -> new SmallSignalExpansion().prepare(nominal).expand(rewired, points));
    }
}

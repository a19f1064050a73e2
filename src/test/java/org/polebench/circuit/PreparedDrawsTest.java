package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
    void partValuesOfAStageBuiltFromValuesAreThoseValues() throws InputProblem {
        Stage nominal = new StageReader().read(StageFiles.demo("vibration-buffer-cs.stage.yaml")).stage();
        double[] values = nominal.partValues();
        for (int p = 0; p < values.length; p++) {
            values[p] *= 1 + 0.01 * (p + 1);
        }

        Stage drawn = nominal.withPartValues(values);

        // an exact identity: the values go into the records and come out unchanged, one per part
        // in part order (the MOSFET's entry is NaN, nothing of it being drawn)
        double[] back = drawn.partValues();
        for (int p = 0; p < values.length; p++) {
            assertEquals(values[p], back[p], 0, nominal.parts().get(p).name());
        }
        assertEquals(values[nominal.parts().indexOf(nominal.resistor("RD"))], drawn.resistor("RD").ohms(), 0);
        assertEquals(values[nominal.parts().indexOf(nominal.capacitor("C3"))], drawn.capacitor("C3").farads(), 0);
        assertEquals(nominal.mosfet("M1"), drawn.mosfet("M1"));
    }

    @Test
    void preparedBiasOfValuesGivesThePlainCurrents() throws InputProblem {
        Stage nominal = new StageReader().read(StageFiles.demo("vibration-buffer-cs.stage.yaml")).stage();
        double[] values = nominal.partValues();
        values[nominal.parts().indexOf(nominal.resistor("RS"))] *= 1.05;
        OperatingPoints plain = new BiasSolver().solve(nominal.withPartValues(values));
        double[] currentAmps = new double[1];
        double[] sourceBodyVolts = new double[1];

        boolean inRegion = new BiasSolver().prepare(nominal).solveInRegion(values, currentAmps, sourceBodyVolts);

        // the same Newton iteration on the same numbers: equal to the last bit
        assertTrue(inRegion);
        assertEquals(plain.mosfet("M1").drainAmps(), currentAmps[0], 0);
        assertEquals(plain.mosfet("M1").vsbVolts(), sourceBodyVolts[0], 0);
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

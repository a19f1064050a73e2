package org.polebench.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/** The command-line fault syntax: resistor values and current gain factors beside the older kinds (issue 11). */
class FaultTextTest {
    private static Stage demo(String fileName) throws InputProblem {
        return new StageReader().read(Path.of("sample-measurements", fileName)).stage();
    }

    @Test
    void aResistorDesignatorTakesOhmsInEngineeringNotation() throws InputProblem {
        Stage geophone = demo("geophone-two-stage.stage.yaml");
        // the example: the 220 Ω emitter resistor fitted as 22 Ω (RE1a in the demo stage)
        assertEquals(new Fault.ResistorValue("RE1a", 22), FaultText.parse("RE1a=22", geophone));
        // engineering notation as for capacitors: k is 10³, M is 10⁶ (SI prefixes); Ω and R are units
        assertResistor("R2", 47e3, FaultText.parse("R2=47k", geophone));
        assertResistor("R1", 1.5e6, FaultText.parse(" R1 = 1.5MΩ ", geophone));
        assertResistor("RC2", 4.7e3, FaultText.parse("RC2=4.7kohm", geophone));
        // capacitors keep reading farads
        Fault.CapacitorValue capacitor = (Fault.CapacitorValue) FaultText.parse("CE1=10u", geophone);
        assertEquals("CE1", capacitor.capacitor());
        assertEquals(10e-6, capacitor.farads(), 1e-15 * 10e-6);
    }

    @Test
    void aCapacitorFaultWithoutPrefixOrUnitIsRefused() throws InputProblem {
        Stage geophone = demo("geophone-two-stage.stage.yaml");
        // issue 14: CE1=47 would be 47 F; the scale must be written
        InputProblem problem = assertThrows(InputProblem.class, () -> FaultText.parse("CE1=47", geophone));
        assertTrue(problem.getMessage().contains("neither a prefix nor the unit F"), problem.getMessage());
        assertTrue(problem.hint().contains("CE1=47u") && problem.hint().contains("CE1=47F"), problem.hint());
        // with the unit written, farads are meant and read as such
        assertEquals(47, ((Fault.CapacitorValue) FaultText.parse("CE1=47F", geophone)).farads());
        assertTrue(FaultText.caution("CE1=47F", geophone).isEmpty());
    }

    @Test
    void aMilliFaradFaultIsReadAsMilliWithACaution() throws InputProblem {
        Stage geophone = demo("geophone-two-stage.stage.yaml");
        // SI: m is milli (BIPM SI Brochure, table 7)
        assertEquals(4.7e-3, ((Fault.CapacitorValue) FaultText.parse("CE1=4.7mF", geophone)).farads(), 1e-18);
        String caution = FaultText.caution("CE1=4.7mF", geophone).orElseThrow();
        assertTrue(caution.contains("m is milli") && caution.contains("write u or µ"), caution);
        // a resistor's m is milliohm and no slip of µ; no caution there
        assertTrue(FaultText.caution("R2=10m", geophone).isEmpty());
    }

    private static void assertResistor(String name, double ohms, Fault parsed) {
        Fault.ResistorValue resistor = (Fault.ResistorValue) parsed;
        assertEquals(name, resistor.resistor());
        // the prefix multiplies in binary floating point: a few ulps, so 1e-15 relative
        assertEquals(ohms, resistor.ohms(), 1e-15 * ohms);
    }

    @Test
    void aCurrentGainFactorMirrorsTheBiasSyntax() throws InputProblem {
        Stage geophone = demo("geophone-two-stage.stage.yaml");
        assertEquals(new Fault.CurrentGain("Q1", 1.7), FaultText.parse("beta:Q1=1.7", geophone));
        assertEquals(new Fault.CurrentGain("Q2", 0.5), FaultText.parse("BETA: Q2 = 0.5", geophone));
        assertEquals(new Fault.BiasCurrent("Q1", 0.6), FaultText.parse("bias:Q1=0.6", geophone));
    }

    @Test
    void aMisspeltDesignatorIsRefusedWithTheClosestOnesAndTheStagesParts() throws InputProblem {
        Stage hydrophone = demo("hydrophone-preamp-ce.stage.yaml");
        // the hydrophone's emitter resistor is RE: RE1 is one edit from both R1 and RE (Levenshtein)
        InputProblem problem = assertThrows(InputProblem.class, () -> FaultText.parse("RE1=22", hydrophone));
        assertTrue(problem.getMessage().contains("'RE1=22'"), problem.getMessage());
        assertTrue(problem.getMessage().contains("did you mean R1 or RE?"), problem.getMessage());
        assertTrue(problem.hint().contains("resistors (R1, R2, RC, RE)"), problem.hint());
        assertTrue(problem.hint().contains("capacitors (C1, C2, C3)"), problem.hint());
        assertTrue(problem.hint().contains("beta:Q1=1.7"), problem.hint());
        assertTrue(problem.file().isEmpty(), "a command-line value has no file");

        InputProblem transistor = assertThrows(InputProblem.class,
                () -> FaultText.parse("beta:Q3=1.7", demo("geophone-two-stage.stage.yaml")));
        assertTrue(transistor.getMessage().contains("did you mean Q1 or Q2?"), transistor.getMessage());
        assertTrue(transistor.hint().contains("(Q1, Q2)"), transistor.hint());

        InputProblem kind = assertThrows(InputProblem.class, () -> FaultText.parse("betta:Q1=1.7", hydrophone));
        assertTrue(kind.getMessage().contains("did you mean beta:?"), kind.getMessage());
    }

    @Test
    void otherWrongFaultsNameWhatWasWrittenAndWhatWouldFixIt() throws InputProblem {
        Stage hydrophone = demo("hydrophone-preamp-ce.stage.yaml");
        InputProblem noEquals = assertThrows(InputProblem.class, () -> FaultText.parse("RE 22", hydrophone));
        assertTrue(noEquals.getMessage().contains("'RE 22' is not PART=VALUE"), noEquals.getMessage());
        assertTrue(noEquals.hint().contains("RE=22") && noEquals.hint().contains("beta:Q1=1.7")
                && noEquals.hint().contains("bias:Q1=0.6") && noEquals.hint().contains("gain=10"), noEquals.hint());

        InputProblem plain = assertThrows(InputProblem.class, () -> FaultText.parse("Q1=1.7", hydrophone));
        assertTrue(plain.getMessage().contains("names a transistor"), plain.getMessage());
        assertTrue(plain.hint().contains("beta:Q1=1.7"), plain.hint());

        InputProblem zero = assertThrows(InputProblem.class, () -> FaultText.parse("RE=0", hydrophone));
        assertTrue(zero.getMessage().contains("positive"), zero.getMessage());
        assertTrue(zero.hint().contains("RE=22"), zero.hint());

        // a farad unit on a resistor is no number of ohms
        InputProblem unit = assertThrows(InputProblem.class, () -> FaultText.parse("RE=4.7uF", hydrophone));
        assertTrue(unit.getMessage().contains("'RE=4.7uF'"), unit.getMessage());

        InputProblem mosfet = assertThrows(InputProblem.class,
                () -> FaultText.parse("beta:M1=1.7", demo("vibration-buffer-cs.stage.yaml")));
        assertTrue(mosfet.getMessage().contains("MOSFET"), mosfet.getMessage());
        assertTrue(mosfet.hint().contains("bias:M1=0.6"), mosfet.hint());

        InputProblem notAResistor = assertThrows(InputProblem.class, () -> FaultText.parse("beta:RE=1.7", hydrophone));
        assertTrue(notAResistor.getMessage().contains("no bipolar transistor"), notAResistor.getMessage());
    }
}

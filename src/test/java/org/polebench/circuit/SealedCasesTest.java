package org.polebench.circuit;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.SealedCases;

/**
 * Every closed set of the circuit model that code tells apart through a {@code Cases} visitor
 * has one case per permitted type, and each type's {@code match} calls its own (issue 12: a
 * new part type must be found by the compiler, not run the code of another). The samples
 * come from the two demo stages, a BJT stage and a MOSFET stage, which between them hold one
 * of every type.
 */
class SealedCasesTest {

    private static List<Stage> demoStages() throws InputProblem {
        return List.of(new StageReader().read(StageFiles.demo("hydrophone-preamp-ce.stage.yaml")).stage(),
                new StageReader().read(StageFiles.demo("vibration-buffer-cs.stage.yaml")).stage());
    }

    @SuppressWarnings("unchecked")
    @Test
    void everyPartTypeHasItsOwnCase() throws InputProblem {
        List<Part> parts = new ArrayList<>();
        for (Stage stage : demoStages()) {
            parts.addAll(stage.parts());
        }
        SealedCases.assertEveryTypeHasItsOwnCase(Part.class, Part.Cases.class, parts,
                (part, cases) -> part.match((Part.Cases<Object>) cases));
    }

    @SuppressWarnings("unchecked")
    @Test
    void everyTransistorTypeHasItsOwnCase() throws InputProblem {
        List<Transistor> transistors = new ArrayList<>();
        for (Stage stage : demoStages()) {
            transistors.addAll(stage.transistors());
        }
        SealedCases.assertEveryTypeHasItsOwnCase(Transistor.class, Transistor.Cases.class, transistors,
                (transistor, cases) -> transistor.match((Transistor.Cases<Object>) cases));
    }

    @SuppressWarnings("unchecked")
    @Test
    void everyKindOfOperatingPointHasItsOwnCase() throws InputProblem {
        List<OperatingPoint> points = new ArrayList<>();
        for (Stage stage : demoStages()) {
            points.addAll(new BiasSolver().solve(stage).transistors());
        }
        SealedCases.assertEveryTypeHasItsOwnCase(OperatingPoint.class, OperatingPoint.Cases.class, points,
                (point, cases) -> point.match((OperatingPoint.Cases<Object>) cases));
    }

    @SuppressWarnings("unchecked")
    @Test
    void everyKindOfNetworkElementHasItsOwnCase() throws InputProblem {
        List<NetworkElement> elements = new ArrayList<>();
        for (Stage stage : demoStages()) {
            elements.addAll(new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage)).elements());
        }
        SealedCases.assertEveryTypeHasItsOwnCase(NetworkElement.class, NetworkElement.Cases.class, elements,
                (element, cases) -> element.match((NetworkElement.Cases<Object>) cases));
    }
}

package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.polebench.InputProblem;

class DemoStagesTest {

    @ParameterizedTest
    @ValueSource(strings = {"hydrophone-preamp-ce.stage.yaml", "vibration-buffer-cs.stage.yaml",
            "geophone-two-stage.stage.yaml"})
    void demoStageReadsBiasesWellInsideTheActiveRegionAndExpands(String fileName) throws InputProblem, IOException {
        assertTrue(Files.readString(StageFiles.demo(fileName)).toLowerCase().contains("demo data, invented"));

        StageFile file = new StageReader().read(StageFiles.demo(fileName));
        OperatingPoints points = new BiasSolver().solve(file.stage());
        SmallSignalNetwork network = new SmallSignalExpansion().expand(file.stage(), points);

        assertEquals(0, file.warnings().size(), file.warnings().toString());
        for (Transistor transistor : file.stage().transistors()) {
            OperatingPoint point = points.point(transistor.name());
            // "well inside": at least 1 V of headroom beyond the region's edge (common practice, so that
            // a ±20 % bias change keeps the stage active)
            if (point instanceof OperatingPoint.BjtPoint) {
                assertTrue(((OperatingPoint.BjtPoint) point).vceVolts() > BiasSolver.VCE_SAT_VOLTS + 1, point.toString());
            } else {
                OperatingPoint.MosfetPoint m = (OperatingPoint.MosfetPoint) point;
                assertTrue(m.vdsVolts() > m.vgsVolts() - m.thresholdVolts() + 1, point.toString());
            }
            assertTrue(point.currentAmps() > 0.1e-3 && point.currentAmps() < 10e-3, point.toString());
        }
        assertTrue(network.capacitances(Band.LOW).size() >= 3);
        double gainDb = 20 * Math.log10(Math.abs(MidbandByEjml.gain(network)));
        Limits limits = file.stage().limits();
        if (limits.midbandGainMinDb().isPresent()) {
            // the demo's midband gain (EJML solve of the expanded network) sits inside its own limits
            assertTrue(gainDb > limits.midbandGainMinDb().getAsDouble()
                    && gainDb < limits.midbandGainMaxDb().getAsDouble(), "gain " + gainDb + " dB");
        }
    }

    @org.junit.jupiter.api.Test
    void twoStageDemoHasFiveLowBandCapacitorsAndLimits() throws InputProblem {
        Stage stage = new StageReader().read(StageFiles.demo("geophone-two-stage.stage.yaml")).stage();

        assertEquals(5, stage.capacitors(Band.LOW).size());
        assertTrue(stage.limits().lowerCornerMaxHz().isPresent());
        assertTrue(stage.limits().midbandGainMinDb().isPresent() && stage.limits().midbandGainMaxDb().isPresent());
        assertEquals(4, new SmallSignalExpansion().expand(stage).capacitances(Band.HIGH).size());
    }
}

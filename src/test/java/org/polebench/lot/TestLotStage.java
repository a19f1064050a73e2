package org.polebench.lot;

import java.nio.file.Path;
import org.polebench.InputProblem;
import org.polebench.circuit.Limits;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/** The shipped demo hydrophone stage (invented), read once per call, with limits of the test's choosing. */
final class TestLotStage {
    static final Path FILE = Path.of("sample-measurements/hydrophone-preamp-ce.stage.yaml");

    private TestLotStage() {
    }

    static Stage read() {
        try {
            return new StageReader().read(FILE).stage();
        } catch (InputProblem e) {
            throw new IllegalStateException(e.getMessage(), e);
        }
    }

    static Stage withLimits(Limits limits) {
        Stage s = read();
        return new Stage(s.name(), s.sourceFile(), s.ground(), s.supplies(), s.input(), s.output(), limits,
                s.temperatureKelvin(), s.gainCalibrationDb(), s.parts());
    }
}

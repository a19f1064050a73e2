package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import org.polebench.InputProblem;

/** Picks the stage file from a positional argument or {@code --stage}, else the bundled demo. */
final class StageChoice {
    private StageChoice() {
    }

    static Path resolve(Path positional, Path option) throws InputProblem, IOException {
        if (positional != null && option != null && !positional.equals(option)) {
            throw new InputProblem(null, 0, "two different stage files given: " + positional + " and " + option,
                    "give the stage once, either as the argument or with --stage");
        }
        if (positional != null) {
            return positional;
        }
        if (option != null) {
            return option;
        }
        return BundledSamples.locate(BundledSamples.DEMO_STAGE);
    }
}

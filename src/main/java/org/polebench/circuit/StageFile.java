package org.polebench.circuit;

import java.util.List;
import org.polebench.InputWarning;

/** A stage as read from its file, with what the reader noticed but accepted. */
public record StageFile(Stage stage, List<InputWarning> warnings) {
    public StageFile {
        warnings = List.copyOf(warnings);
    }
}

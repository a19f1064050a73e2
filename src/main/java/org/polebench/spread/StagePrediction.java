package org.polebench.spread;

import java.util.List;
import org.polebench.InputWarning;
import org.polebench.analysis.Prediction;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;

/**
 * A stage's nominal prediction with everything that led to it.
 *
 * @param stage           the stage as read
 * @param warnings        what the stage reader noticed
 * @param operatingPoints the solved or given DC operating points
 * @param network         the small-signal network at those points
 * @param prediction      both bands' analysis of the network
 * @param spread          the exact lower corner over the part tolerances
 */
public record StagePrediction(Stage stage, List<InputWarning> warnings, OperatingPoints operatingPoints,
                              SmallSignalNetwork network, Prediction prediction, CornerSpread spread) {
    public StagePrediction {
        warnings = List.copyOf(warnings);
    }
}

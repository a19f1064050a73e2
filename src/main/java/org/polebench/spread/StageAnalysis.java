package org.polebench.spread;

import java.util.List;
import org.polebench.InputProblem;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.PredictionOutcome;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageFile;

/**
 * From a read stage file to everything its prediction shows: operating points, the
 * small-signal network, the prediction of both bands and the tolerance spread of the lower
 * corner. A singular network (a capacitor loop, a node with no DC path, a pole at zero) is the
 * user's input at fault, so it becomes an {@link InputProblem} naming the stage file and parts.
 */
public final class StageAnalysis {
    private final BiasSolver biasSolver = new BiasSolver();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final StagePredictor predictor;
    private final ToleranceSpread spread;

    public StageAnalysis() {
        this(new StagePredictor(), new ToleranceSpread());
    }

    public StageAnalysis(StagePredictor predictor, ToleranceSpread spread) {
        this.predictor = predictor;
        this.spread = spread;
    }

    public StageAnalysis withSpread(ToleranceSpread newSpread) {
        return new StageAnalysis(predictor, newSpread);
    }

    /** @return the nominal stage's prediction with its tolerance spread */
    public StagePrediction analyse(StageFile file) throws InputProblem {
        return analyse(file, SpreadProgress.NONE);
    }

    /**
     * @param progress told how far the tolerance spread has got
     * @return the nominal stage's prediction with its tolerance spread
     */
    public StagePrediction analyse(StageFile file, SpreadProgress progress) throws InputProblem {
        Stage stage = file.stage();
        OperatingPoints points = biasSolver.solve(stage);
        SmallSignalNetwork network = expansion.expand(stage, points);
        Prediction prediction = predictNetwork(stage, network);
        CornerSpread corners = spread.lowerCorner(stage, progress);
        return new StagePrediction(stage, file.warnings(), points, network, prediction, corners);
    }

    /**
     * @return the prediction of one network of this stage
     * @throws InputProblem naming the stage file and the parts when the network is singular
     */
    public Prediction predictNetwork(Stage stage, SmallSignalNetwork network) throws InputProblem {
        PredictionOutcome outcome = predictor.predict(network);
        if (outcome.singular().isPresent()) {
            Reduction.Singular singular = outcome.singular().get();
            throw new InputProblem(stage.sourceFile(), lineOf(stage, singular.parts()),
                    singular.detail(), hintFor(singular));
        }
        return outcome.prediction().orElseThrow();
    }

    private static int lineOf(Stage stage, List<String> parts) {
        for (String name : parts) {
            if (stage.part(name).isPresent()) {
                return stage.part(name).get().line();
            }
        }
        return 0;
    }

    private static String hintFor(Reduction.Singular singular) {
        switch (singular.kind()) {
            case CAPACITOR_LOOP:
                return "remove one capacitor of the loop or put a resistor in series with it";
            case NO_DC_PATH:
                return "give the node a resistor path to ground or to a supply rail";
            case POLE_AT_ZERO:
                return "add a resistor that gives the node between the capacitors a DC path";
            default:
                return "check the stage's values; this stage's state matrix could not be decomposed";
        }
    }
}

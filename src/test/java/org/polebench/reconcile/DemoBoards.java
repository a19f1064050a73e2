package org.polebench.reconcile;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.polebench.InputProblem;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StagePredictor;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.sweep.Sweep;
import org.polebench.synth.SweepNoise;

/**
 * One demo stage (sample-measurements/, invented demo data) with what a back-solve needs, and
 * synthetic boards built from it with known faults: the truth the tests compare against.
 */
final class DemoBoards {
    static final String GEOPHONE = "geophone-two-stage.stage.yaml";
    static final String HYDROPHONE = "hydrophone-preamp-ce.stage.yaml";
    static final String VIBRATION = "vibration-buffer-cs.stage.yaml";

    final Stage stage;
    final OperatingPoints points;
    final StateModel model;
    final Prediction prediction;
    private final BoardSynthesizer synthesizer = new BoardSynthesizer();

    DemoBoards(String fileName) throws InputProblem {
        this(new StageReader().read(Path.of("sample-measurements", fileName)).stage());
    }

    DemoBoards(Stage stage) throws InputProblem {
        this.stage = stage;
        this.points = new BiasSolver().solve(stage);
        SmallSignalNetwork network = new SmallSignalExpansion().expand(stage, points);
        this.model = ((Reduction.StateSpace) new PortReduction().reduce(network, Band.LOW)).model();
        this.prediction = (Prediction) new StagePredictor().predict(network);
    }

    /** @return 100 points from a thirtieth of the exact lower corner to 300 times it */
    List<Double> band(int points) {
        double corner = prediction.exactLowerCornerHz().getAsDouble();
        return BoardSynthesizer.logSpaced(corner / 30, corner * 300, points);
    }

    Sweep sweep(List<Fault> faults, SweepNoise noise, List<Double> frequencies, long seed) throws InputProblem {
        return synthesizer.synthesize(stage, faults, noise, frequencies, true, seed);
    }

    Diagnosis rank(Sweep sweep) {
        return new FaultRanking().rank(stage, points, model, sweep);
    }

    /**
     * A board within tolerance except for {@code fault}: every other low-band capacitor drawn
     * uniformly in ln value across its band, every other bias current across ±20 % (its
     * {@code bias-tolerance}), and the gain calibration across ±{@code gain-calibration} dB
     * unless the fault is the gain: the same rectangular reading as the priors (GUM 4.3.7).
     */
    List<Fault> boardWith(Fault fault, SplittableRandom random) {
        List<Fault> faults = new ArrayList<>();
        for (String name : model.capacitorNames()) {
            Capacitor capacitor = stage.capacitor(name);
            if (fault instanceof Fault.CapacitorValue && ((Fault.CapacitorValue) fault).capacitor().equals(name)) {
                continue;
            }
            faults.add(new Fault.CapacitorValue(name, capacitor.farads() * draw(capacitor.tolerance(), random)));
        }
        for (Transistor transistor : stage.transistors()) {
            if (fault instanceof Fault.BiasCurrent && ((Fault.BiasCurrent) fault).transistor().equals(transistor.name())) {
                continue;
            }
            faults.add(new Fault.BiasCurrent(transistor.name(), draw(transistor.biasTolerance(), random)));
        }
        if (!(fault instanceof Fault.FlatGain)) {
            double db = stage.gainCalibrationDb() * (2 * random.nextDouble() - 1);
            faults.add(new Fault.FlatGain(Math.pow(10, db / 20)));
        }
        faults.add(fault);
        return faults;
    }

    /** @return the low-band capacitors whose band is that of an aluminium electrolytic, −20 %/+80 % */
    List<String> electrolytics() {
        List<String> names = new ArrayList<>();
        for (String name : model.capacitorNames()) {
            Tolerance tolerance = stage.capacitor(name).tolerance();
            if (tolerance.lowerFraction() == -0.2 && tolerance.upperFraction() == 0.8) {
                names.add(name);
            }
        }
        return names;
    }

    static double draw(Tolerance tolerance, SplittableRandom random) {
        return Math.exp(tolerance.lnLower() + (tolerance.lnUpper() - tolerance.lnLower()) * random.nextDouble());
    }

}

package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.polebench.InputProblem;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;

/**
 * The board's small-signal network as a function of the back-solve's network parameters, on
 * the log scale, in this order: ln(I/I_nom) per transistor (the bias-current nuisance), ln(β/β_nom)
 * per BJT (device spread), ln(R/R_nom) per resistor. Capacitors may be scaled too.
 *
 * <p>A resistor or a β moves the DC point, so away from their nominal values the bias is solved
 * again for the board with those values ({@link BiasSolver.Prepared#solveInRegion}), and the
 * bias-current nuisance then scales the solved current: I = I_solved(R, β)·e^θ. At nominal
 * resistors and β the stage's own operating points are used as given, so the model is
 * continuous at the priors' means. A board whose transistors leave their amplifying region has
 * no small-signal model here: {@link #network} returns null, which the back-solve treats as an
 * undefined point. Holds no per-call state; one instance serves any thread.
 */
final class BoardNetwork {
    private final Stage stage;
    private final OperatingPoints nominalPoints;
    private final List<String> transistors;
    private final List<String> bjts;
    private final List<String> resistors;
    /** Index into {@link Stage#partValues()} of each BJT and each resistor. */
    private final int[] bjtParts;
    private final int[] resistorParts;
    private final int[] capacitorParts;
    private final double[] nominalValues;
    private final double[] nominalSourceBody;
    private final BiasSolver.Prepared bias;
    private final SmallSignalExpansion.Prepared expansion;

    /**
     * @param capacitors the capacitors the caller scales, in its order (the low-band ports)
     * @throws IllegalArgumentException when the stage, already solved once, has no DC path (a defect)
     */
    BoardNetwork(Stage stage, OperatingPoints nominalPoints, List<String> capacitors) {
        this.stage = stage;
        this.nominalPoints = nominalPoints;
        List<String> transistorNames = new ArrayList<>();
        List<String> bjtNames = new ArrayList<>();
        for (Transistor transistor : stage.transistors()) {
            transistorNames.add(transistor.name());
        }
        for (Bjt bjt : stage.bjts()) {
            bjtNames.add(bjt.name());
        }
        this.transistors = List.copyOf(transistorNames);
        this.bjts = List.copyOf(bjtNames);
        List<String> resistorNames = new ArrayList<>();
        for (Resistor resistor : stage.resistors()) {
            resistorNames.add(resistor.name());
        }
        this.resistors = List.copyOf(resistorNames);
        this.bjtParts = partIndices(stage, bjts);
        this.resistorParts = partIndices(stage, resistors);
        this.capacitorParts = partIndices(stage, capacitors);
        this.nominalValues = stage.partValues();
        this.nominalSourceBody = new double[transistors.size()];
        for (int t = 0; t < transistors.size(); t++) {
            nominalSourceBody[t] = nominalPoints.point(transistors.get(t)).sourceBodyVolts();
        }
        try {
            this.bias = new BiasSolver().prepare(stage);
        } catch (InputProblem problem) {
            throw new IllegalArgumentException("the stage's bias was solved before, yet it has no DC path: "
                    + problem.getMessage(), problem);
        }
        this.expansion = new SmallSignalExpansion().prepare(stage);
    }

    private static int[] partIndices(Stage stage, List<String> names) {
        int[] indices = new int[names.size()];
        for (int i = 0; i < indices.length; i++) {
            indices[i] = -1;
            for (int p = 0; p < stage.parts().size(); p++) {
                Part part = stage.parts().get(p);
                if (part.name().equals(names.get(i))) {
                    indices[i] = p;
                }
            }
        }
        return indices;
    }

    /** @return whether the stage has a part of this name */
    boolean hasPart(String name) {
        return stage.part(name).isPresent();
    }

    List<String> transistors() {
        return transistors;
    }

    List<String> bjts() {
        return bjts;
    }

    List<String> resistors() {
        return resistors;
    }

    /** @return how many network parameters there are: transistors, BJTs, resistors */
    int size() {
        return transistors.size() + bjts.size() + resistors.size();
    }

    /**
     * @param lnCapacitor ln(C/C_nom) per capacitor of the constructor's list, or null for nominal
     * @param lnNetwork   the network parameters in this class's order ({@link #size()} long)
     * @return the small-signal network, or null when a transistor leaves its amplifying region
     */
    SmallSignalNetwork network(double[] lnCapacitor, double[] lnNetwork) {
        if (!moved(lnCapacitor, lnNetwork)) {
            return expansion.expand(stage, scaled(nominalPoints, lnNetwork));
        }
        Drawn drawn = drawn(lnCapacitor, lnNetwork);
        return drawn == null ? null : expansion.network(drawn.values, drawn.currents, drawn.sourceBody);
    }

    /**
     * The numbers of {@link #network}'s network alone, in its element order, with the capacitors
     * nominal: what a prepared port reduction restamps ({@link SmallSignalExpansion.Prepared#elementValues}),
     * without the records.
     *
     * @return per element, siemens or farads; null when a transistor leaves its amplifying region
     */
    double[] elementValues(double[] lnNetwork) {
        if (!moved(null, lnNetwork)) {
            return expansion.expand(stage, scaled(nominalPoints, lnNetwork)).elementValues();
        }
        Drawn drawn = drawn(null, lnNetwork);
        return drawn == null ? null : expansion.elementValues(drawn.values, drawn.currents, drawn.sourceBody);
    }

    // whether a β, a resistor or a capacitor is off nominal (a bias current alone keeps the
    // stage's own operating points, scaled)
    private boolean moved(double[] lnCapacitor, double[] lnNetwork) {
        boolean moved = lnCapacitor != null;
        for (int j = transistors.size(); j < lnNetwork.length && !moved; j++) {
            moved = lnNetwork[j] != 0;
        }
        return moved;
    }

    // the part values and the bias solved again for them, each current times its nuisance
    // factor; null out of region
    private Drawn drawn(double[] lnCapacitor, double[] lnNetwork) {
        int m = transistors.size();
        int nb = bjts.size();
        double[] values = nominalValues.clone();
        for (int b = 0; b < nb; b++) {
            values[bjtParts[b]] *= Math.exp(lnNetwork[m + b]);
        }
        for (int r = 0; r < resistors.size(); r++) {
            values[resistorParts[r]] *= Math.exp(lnNetwork[m + nb + r]);
        }
        if (lnCapacitor != null) {
            for (int c = 0; c < capacitorParts.length; c++) {
                values[capacitorParts[c]] *= Math.exp(lnCapacitor[c]);
            }
        }
        double[] currents = new double[m];
        double[] sourceBody = nominalSourceBody.clone();
        boolean resolve = false;
        for (int j = m; j < lnNetwork.length && !resolve; j++) {
            resolve = lnNetwork[j] != 0;
        }
        if (resolve) {
            if (!bias.solveInRegion(values, currents, sourceBody)) {
                return null;
            }
        } else {
            for (int t = 0; t < m; t++) {
                currents[t] = nominalPoints.point(transistors.get(t)).currentAmps();
            }
        }
        for (int t = 0; t < m; t++) {
            currents[t] *= Math.exp(lnNetwork[t]);
        }
        return new Drawn(values, currents, sourceBody);
    }

    /** One board's part values, collector or drain currents and source–body voltages. */
    private static final class Drawn {
        final double[] values;
        final double[] currents;
        final double[] sourceBody;

        Drawn(double[] values, double[] currents, double[] sourceBody) {
            this.values = values;
            this.currents = currents;
            this.sourceBody = sourceBody;
        }
    }

    private OperatingPoints scaled(OperatingPoints points, double[] lnNetwork) {
        OperatingPoints result = points;
        for (int t = 0; t < transistors.size(); t++) {
            if (lnNetwork[t] != 0) {
                result = result.withCurrentScaled(transistors.get(t), Math.exp(lnNetwork[t]));
            }
        }
        return result;
    }

    /** |d ln I / d ln R| from which a resistor counts as setting a transistor's bias current. */
    static final double BIAS_SETTER_SENSITIVITY = 0.3;
    /** The ± step of the central difference, on ln R: 10 %. */
    private static final double SENSITIVITY_STEP = Math.log(1.1);

    /**
     * Which resistors set each transistor's bias current: each resistor goes to the transistor
     * whose current it moves most, when |d ln I / d ln R| (a central difference over ±10 % at the
     * nominal parts, the bias solved again for each) is at least {@value #BIAS_SETTER_SENSITIVITY}:
     * a divider or emitter resistor moves the current about one for one or more, a collector or
     * load resistor hardly at all. A sweep shows the current, not which of these set it.
     *
     * @return per transistor in the stage's order, the resistors in the stage's order; a
     *         transistor no resistor sets has an empty list
     */
    List<BiasSetters> biasSetters() {
        int m = transistors.size();
        List<List<String>> setters = new ArrayList<>();
        for (int t = 0; t < m; t++) {
            setters.add(new ArrayList<>());
        }
        double[] up = new double[m];
        double[] down = new double[m];
        double[] sourceBody = new double[m];
        for (int r = 0; r < resistors.size(); r++) {
            double[] values = nominalValues.clone();
            values[resistorParts[r]] *= Math.exp(SENSITIVITY_STEP);
            boolean upSolved = bias.solveInRegion(values, up, sourceBody);
            values[resistorParts[r]] = nominalValues[resistorParts[r]] * Math.exp(-SENSITIVITY_STEP);
            if (!upSolved || !bias.solveInRegion(values, down, sourceBody)) {
                continue;   // a step of 10 % leaves the amplifying region: no sensitivity to speak of
            }
            int most = -1;
            double largest = 0;
            for (int t = 0; t < m; t++) {
                double sensitivity = Math.abs(Math.log(up[t] / down[t])) / (2 * SENSITIVITY_STEP);
                if (sensitivity > largest) {
                    largest = sensitivity;
                    most = t;
                }
            }
            if (most >= 0 && largest >= BIAS_SETTER_SENSITIVITY) {
                setters.get(most).add(resistors.get(r));
            }
        }
        List<BiasSetters> out = new ArrayList<>();
        for (int t = 0; t < m; t++) {
            out.add(new BiasSetters(transistors.get(t), setters.get(t)));
        }
        return out;
    }

    /** @return the network parameters all at their nominal values (zeros) */
    double[] nominal() {
        double[] zeros = new double[size()];
        Arrays.fill(zeros, 0);
        return zeros;
    }
}

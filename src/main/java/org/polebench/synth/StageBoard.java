package org.polebench.synth;

import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;
import java.util.Optional;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;

/**
 * A board built from a stage file: its response is the complex MNA solve of the stage's
 * whole small-signal network at its solved operating point, every capacitor of both bands in
 * place ({@link FullResponse}), times a flat gain factor (a probe or level mistake). Gain is in
 * the stage's own convention (against the source EMF, or the input node with
 * {@code reference: node}). Immutable; safe to share between threads.
 */
public final class StageBoard implements BoardResponse {
    private final FullResponse response;
    private final double gainFactor;
    private final String description;

    private StageBoard(FullResponse response, double gainFactor, String description) {
        this.response = response;
        this.gainFactor = gainFactor;
        this.description = description;
    }

    /**
     * @param built       the stage as built (any wrong part already in it)
     * @param points      its operating points (possibly with a scaled bias current)
     * @param gainFactor  measured over true gain, V/V, positive
     * @param description what differs from the stage as designed, for the notes
     */
    public static StageBoard of(Stage built, OperatingPoints points, double gainFactor, String description) {
        if (!(gainFactor > 0) || !Double.isFinite(gainFactor)) {
            throw new IllegalArgumentException("a gain factor must be positive, was " + gainFactor);
        }
        return new StageBoard(new FullResponse(new SmallSignalExpansion().expand(built, points)), gainFactor,
                "stage \"" + built.name() + "\"" + (description.isEmpty() ? "" : ", " + description));
    }

    /**
     * Solves the bias of the stage as built and makes the board.
     *
     * @throws InputProblem when the stage as built cannot be biased
     */
    public static StageBoard of(Stage built, String description) throws InputProblem {
        return of(built, new BiasSolver().solve(built), 1, description);
    }

    /**
     * The board as built from the stage as designed and its faults, in the order of
     * {@link Fault}: capacitor, resistor and β faults change the parts; the bias is solved for
     * the board as built (a resistor or β fault moves it, a capacitor does not); then bias
     * faults scale their transistors' currents and gain faults multiply the response.
     *
     * @throws InputProblem when the board as built cannot be biased: when the stage as designed
     *                      can, the problem names the faults that changed it (they drove a
     *                      transistor out of its amplifying region) and points at no file line,
     *                      since the stage file is not at fault
     */
    public static StageBoard asBuilt(Stage designed, List<Fault> faults) throws InputProblem {
        Built board = build(designed, faults, UnaryOperator.identity());
        return of(board.stage(), board.points(), board.gainFactor(), board.faults());
    }

    /**
     * A board as built, before it is measured: its parts, its operating points with the bias
     * faults applied, the gain faults' product, and what differs from the design in words.
     */
    record Built(Stage stage, OperatingPoints points, double gainFactor, String faults) {
    }

    /**
     * The faults applied in the order of {@link #asBuilt}, the bias solved on
     * {@code forBias(stage)} (a bench's DC loads added, or the stage itself).
     *
     * @throws InputProblem as {@link #asBuilt}
     */
    static Built build(Stage designed, List<Fault> faults, UnaryOperator<Stage> forBias) throws InputProblem {
        Stage built = designed;
        List<Fault> changingParts = new ArrayList<>();
        for (Fault fault : faults) {
            Stage next = fault.applyTo(built);
            if (next != built) {
                changingParts.add(fault);
            }
            built = next;
        }
        OperatingPoints points = biasAsBuilt(forBias.apply(designed), forBias.apply(built), changingParts);
        double gainFactor = 1;
        List<String> described = new ArrayList<>();
        for (Fault fault : faults) {
            points = fault.applyTo(points);
            gainFactor *= fault.gainFactor();
            described.add(fault.describe());
        }
        return new Built(built, points, gainFactor,
                described.isEmpty() ? new Fault.None().describe() : String.join("; ", described));
    }

    static OperatingPoints biasAsBuilt(Stage designed, Stage built, List<Fault> changingParts)
            throws InputProblem {
        BiasSolver solver = new BiasSolver();
        try {
            return solver.solve(built);
        } catch (InputProblem asBuilt) {
            if (changingParts.isEmpty()) {
                throw asBuilt;
            }
            try {
                solver.solve(designed);
            } catch (InputProblem asDesigned) {
                // the stage file itself cannot be biased: that is what the user must fix first
                throw asDesigned;
            }
            List<String> described = new ArrayList<>();
            List<String> designedValues = new ArrayList<>();
            for (Fault fault : changingParts) {
                described.add(fault.describe());
                designedValues.add(fault.designedValue(designed));
            }
            throw new InputProblem(null, 0, "the board as built (" + String.join("; ", described) + ") cannot be"
                    + " biased, though the stage file's own values can: " + asBuilt.getMessage(),
                    "choose a value nearer the stage file's (" + String.join(", ", designedValues) + "), one that"
                            + " keeps every transistor in its amplifying region, or drop that fault", asBuilt);
        }
    }

    @Override
    public Complex atHz(double frequencyHz) {
        Optional<Complex> h = response.atHz(frequencyHz);
        if (h.isEmpty()) {
            throw new IllegalStateException("the board's MNA matrix is singular at " + frequencyHz + " Hz");
        }
        return h.get().multiply(gainFactor);
    }

    @Override
    public String describe() {
        return description;
    }
}

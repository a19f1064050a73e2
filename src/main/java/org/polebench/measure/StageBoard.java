package org.polebench.measure;

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

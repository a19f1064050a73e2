package org.polebench.synth;

import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.bench.AsMeasuredResponse;
import org.polebench.bench.MeasuringChain;
import org.polebench.circuit.Stage;

/**
 * A board built from a stage, as a bench measures it: the board as {@link StageBoard#asBuilt}
 * makes it (faults in the parts, the bias solved again, bias and gain faults applied), seen
 * through a {@link MeasuringChain} (docs/method.md, "The bench in the model"): the bias is solved
 * with the bench's DC loads in place and the response is the as-measured ratio. Immutable; safe
 * to share between threads.
 */
public final class MeasuredBoard implements BoardResponse {
    private final AsMeasuredResponse response;
    private final double gainFactor;
    private final String description;

    private MeasuredBoard(AsMeasuredResponse response, double gainFactor, String description) {
        this.response = response;
        this.gainFactor = gainFactor;
        this.description = description;
    }

    /**
     * @throws InputProblem when the board as built, with the bench, cannot be biased (see
     *                      {@link StageBoard#asBuilt}) or its low band is singular
     */
    public static MeasuredBoard asBuilt(Stage designed, List<Fault> faults, MeasuringChain chain)
            throws InputProblem {
        StageBoard.Built board = StageBoard.build(designed, faults, chain::forBias);
        return new MeasuredBoard(chain.response(board.stage(), board.points()), board.gainFactor(),
                "stage \"" + board.stage().name() + "\", " + board.faults() + ", through the bench: "
                        + chain.bench().describe());
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

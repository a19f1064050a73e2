package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.bench.Bench;
import org.polebench.bench.Channel;
import org.polebench.bench.Coupling;
import org.polebench.bench.Reference;
import org.polebench.circuit.Stage;

/**
 * The channel couplings a bench file declares, as the back-solve's priors on their corners: a
 * stated corner held at its value (σ = {@value #STATED_CORNER_SIGMA} in ln f, a data sheet's
 * figure taken as exact), a corner given as {@code unknown} a nuisance with the measuring-chain
 * prior (FaultRanking), a DC-coupled channel none. The input channel's coupling counts only
 * where the gain is the ratio of the two channels.
 *
 * @param output the output channel's corner prior; empty when it is DC-coupled or no bench is declared
 * @param input  the input channel's, likewise
 * @param stated whether a bench was declared at all (the measuring-chain hypotheses are then not ranked)
 */
public record DeclaredChain(Optional<Prior> output, Optional<Prior> input, boolean stated) {
    /** A data sheet's corner taken as exact: 0.1 % in ln f. */
    static final double STATED_CORNER_SIGMA = 1e-3;

    /** No bench declared: the chain is inferred, if at all, by the measuring-chain hypotheses. */
    public static final DeclaredChain NONE = new DeclaredChain(Optional.empty(), Optional.empty(), false);

    /** @return the couplings of a declared bench measuring this stage */
    public static DeclaredChain of(Bench bench, Stage board) {
        Optional<Prior> input = bench.referenceFor(board) == Reference.INPUT_CHANNEL
                ? prior(bench.inputChannel().channel()) : Optional.empty();
        return new DeclaredChain(prior(bench.output()), input, true);
    }

    private static Optional<Prior> prior(Channel channel) {
        if (channel.coupling() != Coupling.AC) {
            return Optional.empty();
        }
        if (channel.cornerUnknown()) {
            return Optional.of(new Prior(Math.log(FaultRanking.CHANNEL_CORNER_HZ), FaultRanking.CHANNEL_CORNER_SIGMA));
        }
        return Optional.of(new Prior(Math.log(channel.cornerHz().getAsDouble()), STATED_CORNER_SIGMA));
    }

    /** @return the declared prior of coupling {@code c} (0 output, 1 input) */
    Optional<Prior> coupling(int c) {
        return c == 0 ? output : input;
    }
}

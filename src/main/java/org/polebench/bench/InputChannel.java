package org.polebench.bench;

/**
 * The input channel of a two-channel measurement and where it is connected.
 *
 * @param at      the generator's terminal or the stage's input node
 * @param channel its coupling and loading
 */
public record InputChannel(ProbePoint at, Channel channel) {
    public InputChannel {
        if (at == null || channel == null) {
            throw new IllegalArgumentException("an input channel needs its point and its channel");
        }
    }

    /** @return for people and provenance notes */
    public String describe() {
        return "at the " + (at == ProbePoint.GENERATOR ? "generator's terminal" : "stage's input node") + ", "
                + channel.describe();
    }
}

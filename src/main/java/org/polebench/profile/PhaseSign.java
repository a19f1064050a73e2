package org.polebench.profile;

import java.util.Optional;

/**
 * The sign convention of an instrument's phase. polebench stores phase with output leading
 * input positive (a non-inverting high-pass stage tends to +90° per pole far below its
 * corner); an instrument that reports lag as positive is flipped on import.
 */
public enum PhaseSign {
    LEAD_POSITIVE("lead-positive", 1.0),
    LAG_POSITIVE("lag-positive", -1.0);

    private final String word;
    private final double factor;

    PhaseSign(String word, double factor) {
        this.word = word;
        this.factor = factor;
    }

    public String word() {
        return word;
    }

    /** @return +1 or −1: the factor that turns the instrument's phase into lead-positive */
    public double toLeadPositive() {
        return factor;
    }

    public static Optional<PhaseSign> parse(String text) {
        return ProfileWords.lookup(values(), PhaseSign::word, text);
    }
}

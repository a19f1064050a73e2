package org.polebench.bench;

/** What the bench's gain is taken against (the bench file's {@code reference}). */
public enum Reference {
    /** The output channel over the generator's open-circuit level (its set amplitude). */
    GENERATOR,
    /** The output channel over the input channel, as a two-channel ratio measurement. */
    INPUT_CHANNEL;

    /** @return the word the bench file uses: {@code generator} or {@code input-channel} */
    public String word() {
        return this == GENERATOR ? "generator" : "input-channel";
    }
}

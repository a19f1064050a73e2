package org.polebench.bench;

/** Where the input channel is connected (the bench file's {@code input-channel.at}). */
public enum ProbePoint {
    /** The generator's output terminal: behind its output resistance, ahead of the stage's source resistance. */
    GENERATOR,
    /** The stage's input node. */
    STAGE_INPUT;

    /** @return the word the bench file uses: {@code generator} or {@code stage-input} */
    public String word() {
        return this == GENERATOR ? "generator" : "stage-input";
    }
}

package org.polebench.bench;

/** How a measuring channel is coupled to its node. */
public enum Coupling {
    /** Direct: the reading follows the node down to DC. */
    DC,
    /** Through the channel's coupling capacitor: a first-order high-pass on the reading. */
    AC;

    /** @return the word the bench file uses: {@code dc} or {@code ac} */
    public String word() {
        return this == DC ? "dc" : "ac";
    }
}

package org.polebench.circuit;

/**
 * A DC supply rail: an ideal source from its node to ground in the DC solve, AC ground in the
 * small-signal network.
 *
 * @param volts DC value against the stage's ground; may be negative (a split supply)
 * @param line  1-based line in the stage file, 0 when built in code
 */
public record Supply(String node, double volts, int line) {
    public Supply {
        if (node == null || node.isBlank() || !Double.isFinite(volts)) {
            throw new IllegalArgumentException("a supply needs a node and a finite voltage");
        }
    }
}

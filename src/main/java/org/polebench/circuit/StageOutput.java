package org.polebench.circuit;

import java.util.OptionalDouble;

/**
 * The node whose voltage is the output, and the load on it.
 *
 * @param loadOhms a resistor from the output node to ground; empty when unloaded
 * @param line     1-based line of {@code output:} in the stage file, 0 when built in code
 */
public record StageOutput(String node, OptionalDouble loadOhms, int line) {
    public StageOutput {
        if (node == null || node.isBlank()) {
            throw new IllegalArgumentException("the output needs a node");
        }
        if (loadOhms.isPresent() && !(loadOhms.getAsDouble() > 0 && Double.isFinite(loadOhms.getAsDouble()))) {
            throw new IllegalArgumentException("a load must be positive and finite");
        }
    }
}

package org.polebench.circuit;

/**
 * Where the generator drives the stage: an ideal source of EMF behind {@code sourceOhms} into
 * {@code node}. In the DC solve the EMF is 0 V.
 *
 * @param sourceOhms the generator's source resistance, >= 0
 * @param reference  what the gain is taken against
 * @param line       1-based line of {@code input:} in the stage file, 0 when built in code
 */
public record StageInput(String node, double sourceOhms, GainReference reference, int line) {
    public StageInput {
        if (node == null || node.isBlank()) {
            throw new IllegalArgumentException("the input needs a node");
        }
        if (!(sourceOhms >= 0) || !Double.isFinite(sourceOhms)) {
            throw new IllegalArgumentException("source resistance must be finite and >= 0, was " + sourceOhms);
        }
    }
}

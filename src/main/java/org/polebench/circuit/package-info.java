/**
 * The stage model: nodes, parts, transistors, bias and the small-signal expansion, and the
 * stage-file reader. Produces a {@link org.polebench.circuit.SmallSignalNetwork} for analysis.
 * Uses units and yaml.
 */
package org.polebench.circuit;

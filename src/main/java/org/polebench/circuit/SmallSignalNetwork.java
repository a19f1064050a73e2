package org.polebench.circuit;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The linear small-signal equivalent of a stage at its operating point: supplies are AC
 * ground, transistors are expanded (hybrid-π or MOSFET model) and the stimulus is an ideal
 * 1 V source on {@link #drivenNode()}.
 *
 * <p>For gain against the source EMF (the default) the driven node is an internal node
 * behind a {@code source-resistance} conductance to the input node; for {@code reference:}
 * gain against the input node, the input node itself is driven, and the source resistance
 * drops out of V(out)/V(in) exactly.
 *
 * @param nodes       node names; index 0 is ground
 * @param elements    every element; capacitances carry their band
 * @param drivenNode  the node held at the stimulus voltage (never 0)
 * @param outputNode  the node whose voltage is the output (never 0)
 */
public record SmallSignalNetwork(List<String> nodes, List<NetworkElement> elements, int drivenNode, int outputNode) {
    public SmallSignalNetwork {
        nodes = List.copyOf(nodes);
        elements = List.copyOf(elements);
        if (nodes.isEmpty()) {
            throw new IllegalArgumentException("a network needs at least the ground node");
        }
        if (drivenNode <= 0 || drivenNode >= nodes.size() || outputNode <= 0 || outputNode >= nodes.size()) {
            throw new IllegalArgumentException("driven and output nodes must be non-ground nodes of the network");
        }
    }

    /** @return the capacitances of the given band, in element order */
    public List<NetworkElement.Capacitance> capacitances(Band band) {
        List<NetworkElement.Capacitance> result = new ArrayList<>();
        for (NetworkElement element : elements) {
            element.asCapacitance().filter(c -> c.band() == band).ifPresent(result::add);
        }
        return result;
    }

    /**
     * @return every element's value in element order: siemens for a conductance or a
     *         transconductance, farads for a capacitance (the numbers a kernel restamps, see
     *         {@link SmallSignalExpansion.Prepared#elementValues})
     */
    public double[] elementValues() {
        double[] values = new double[elements.size()];
        for (int i = 0; i < values.length; i++) {
            values[i] = elements.get(i).value();
        }
        return values;
    }

    /** @return a copy with the named capacitor at a new value; the name must exist */
    public SmallSignalNetwork withCapacitance(String name, double farads) {
        List<NetworkElement> changed = new ArrayList<>(elements.size());
        boolean found = false;
        for (NetworkElement element : elements) {
            Optional<NetworkElement.Capacitance> capacitance =
                    element.asCapacitance().filter(c -> c.name().equals(name));
            if (capacitance.isPresent()) {
                changed.add(capacitance.get().withFarads(farads));
                found = true;
            } else {
                changed.add(element);
            }
        }
        if (!found) {
            throw new IllegalArgumentException("no capacitance named " + name);
        }
        return new SmallSignalNetwork(nodes, changed, drivenNode, outputNode);
    }

    public int nodeCount() {
        return nodes.size();
    }
}

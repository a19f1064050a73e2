package org.polebench.analysis;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;

/**
 * The real modified-nodal-analysis matrix of a network's resistive part (Ho, Ruehli and
 * Brennan, "The modified nodal approach to network analysis", IEEE Trans. Circuits and Systems
 * 22(6), 1975): conductances, voltage-controlled current sources, and ideal voltage sources for
 * the stimulus and for each capacitor that is a port or a short. Capacitors in neither list are
 * open.
 *
 * <p>Unknowns: the voltages of nodes 1…n−1, then one current per source. Source 0 is the
 * stimulus (driven node to ground), sources 1…k the ports in the given order, then the
 * shorts. A source's current is the current leaving its + node into the source; for a
 * capacitor port that is the capacitor's own current C·dv/dt, with v = V(a) − V(b).
 *
 * <p>Source rows and columns are scaled by a reference conductance (the largest one in the
 * network) so that every entry is in siemens of similar size; this keeps the singularity
 * test of the LU relative, and {@link #sourceCurrentAmps} undoes the scaling.
 */
public final class MnaSystem {
    /** The name under which the stimulus source appears in singular-case reports. */
    public static final String STIMULUS = "stimulus";

    private final int nodeCount;
    private final int outputNode;
    private final double[][] matrix;
    private final double referenceSiemens;
    private final List<String> sourceNames;
    private final List<String> nodeNames;

    private MnaSystem(int nodeCount, int outputNode, double[][] matrix, double referenceSiemens,
                      List<String> sourceNames, List<String> nodeNames) {
        this.nodeCount = nodeCount;
        this.outputNode = outputNode;
        this.matrix = matrix;
        this.referenceSiemens = referenceSiemens;
        this.sourceNames = sourceNames;
        this.nodeNames = nodeNames;
    }

    /**
     * @param ports   capacitors replaced by ideal voltage sources that will be driven
     * @param shorted capacitors replaced by ideal 0 V sources (never driven)
     */
    public static MnaSystem withPorts(SmallSignalNetwork network, List<NetworkElement.Capacitance> ports,
                                      List<NetworkElement.Capacitance> shorted) {
        return new Layout(network, ports, shorted).stamp(network.elementValues());
    }

    /**
     * Where every element and source of one network goes in its MNA matrix, found once, so that
     * a draw of the network (the same elements with other values) costs only the stamping of its
     * numbers. Immutable; one instance serves any thread.
     */
    static final class Layout {
        private static final int OPEN = 0;
        private static final int CONDUCTANCE = 1;
        private static final int TRANSCONDUCTANCE = 2;

        private final int nodeCount;
        private final int outputNode;
        private final int size;
        /** per element: OPEN for a capacitance (its port or short is a source below), else its form */
        private final int[] form;
        /** per element: a and b, or from, to, control + and control − */
        private final int[][] terminals;
        private final int[] sourcePlus;
        private final int[] sourceMinus;
        private final List<String> sourceNames;
        private final List<String> nodeNames;

        Layout(SmallSignalNetwork network, List<NetworkElement.Capacitance> ports,
               List<NetworkElement.Capacitance> shorted) {
            nodeCount = network.nodeCount();
            outputNode = network.outputNode();
            nodeNames = network.nodes();
            List<NetworkElement> elements = network.elements();
            form = new int[elements.size()];
            terminals = new int[elements.size()][];
            NetworkElement.Cases<Integer> formOf = new NetworkElement.Cases<>() {
                @Override
                public Integer conductance(NetworkElement.Conductance g) {
                    return CONDUCTANCE;
                }

                @Override
                public Integer capacitance(NetworkElement.Capacitance c) {
                    return OPEN;   // a port, a short, or open in the resistive system
                }

                @Override
                public Integer transconductance(NetworkElement.Transconductance t) {
                    return TRANSCONDUCTANCE;
                }
            };
            for (int i = 0; i < form.length; i++) {
                NetworkElement element = elements.get(i);
                form[i] = element.match(formOf);
                if (form[i] != OPEN) {
                    terminals[i] = element.terminals();
                }
            }
            int sources = 1 + ports.size() + shorted.size();
            size = nodeCount - 1 + sources;
            sourcePlus = new int[sources];
            sourceMinus = new int[sources];
            List<String> names = new ArrayList<>(sources);
            names.add(STIMULUS);
            sourcePlus[0] = network.drivenNode();
            int s = 1;
            for (List<NetworkElement.Capacitance> group : List.of(ports, shorted)) {
                for (NetworkElement.Capacitance c : group) {
                    names.add(c.name());
                    sourcePlus[s] = c.a();
                    sourceMinus[s++] = c.b();
                }
            }
            sourceNames = Collections.unmodifiableList(names);
        }

        /** @param elementValues one per element of the laid-out network ({@link SmallSignalNetwork#elementValues()}) */
        MnaSystem stamp(double[] elementValues) {
            if (elementValues.length != form.length) {
                throw new IllegalArgumentException(elementValues.length + " values for " + form.length + " elements");
            }
            double[][] m = new double[size][size];
            double reference = 0;
            for (int i = 0; i < form.length; i++) {
                int[] n = terminals[i];
                if (form[i] == CONDUCTANCE) {
                    stampConductance(m, n[0], n[1], elementValues[i]);
                    reference = Math.max(reference, elementValues[i]);
                } else if (form[i] == TRANSCONDUCTANCE) {
                    stampTransconductance(m, n[0], n[1], n[2], n[3], elementValues[i]);
                    reference = Math.max(reference, Math.abs(elementValues[i]));
                }
            }
            if (reference == 0) {
                reference = 1;
            }
            for (int s = 0; s < sourcePlus.length; s++) {
                stampSource(m, nodeCount - 1 + s, sourcePlus[s], sourceMinus[s], reference);
            }
            return new MnaSystem(nodeCount, outputNode, m, reference, sourceNames, nodeNames);
        }
    }

    static void stampConductance(double[][] m, int a, int b, double siemens) {
        if (a != 0) {
            m[a - 1][a - 1] += siemens;
        }
        if (b != 0) {
            m[b - 1][b - 1] += siemens;
        }
        if (a != 0 && b != 0) {
            m[a - 1][b - 1] -= siemens;
            m[b - 1][a - 1] -= siemens;
        }
    }

    // KCL rows count currents leaving a node: gm·(v+ − v−) leaves 'from' and enters 'to'.
    private static void stampTransconductance(double[][] m, int from, int to, int plus, int minus, double siemens) {
        stampControlled(m, from, plus, minus, siemens);
        stampControlled(m, to, plus, minus, -siemens);
    }

    private static void stampControlled(double[][] m, int row, int plus, int minus, double siemens) {
        if (row == 0) {
            return;
        }
        if (plus != 0) {
            m[row - 1][plus - 1] += siemens;
        }
        if (minus != 0) {
            m[row - 1][minus - 1] -= siemens;
        }
    }

    static void stampSource(double[][] m, int index, int plus, int minus, double reference) {
        if (plus != 0) {
            m[plus - 1][index] += reference;
            m[index][plus - 1] += reference;
        }
        if (minus != 0) {
            m[minus - 1][index] -= reference;
            m[index][minus - 1] -= reference;
        }
    }

    /** @return the number of unknowns */
    public int size() {
        return matrix.length;
    }

    /** @return a copy of the matrix (source rows and columns scaled, see the class comment) */
    public double[][] matrix() {
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < matrix.length; i++) {
            copy[i] = matrix[i].clone();
        }
        return copy;
    }

    double[][] matrixView() {
        return matrix;
    }

    /** @return the right-hand side that sets source {@code source} to {@code volts}, all others to 0 */
    public double[] sourceExcitation(int source, double volts) {
        double[] rhs = new double[matrix.length];
        rhs[sourceUnknown(source)] = volts * referenceSiemens;
        return rhs;
    }

    /** @return source 0 is the stimulus, 1…k the ports, then the shorts */
    public List<String> sourceNames() {
        return sourceNames;
    }

    public int sourceCount() {
        return sourceNames.size();
    }

    public int nodeCount() {
        return nodeCount;
    }

    List<String> nodeNames() {
        return nodeNames;
    }

    int sourceUnknown(int source) {
        return nodeCount - 1 + source;
    }

    /** @return the current leaving the source's + node into the source, in amperes */
    public double sourceCurrentAmps(double[] solution, int source) {
        return solution[sourceUnknown(source)] * referenceSiemens;
    }

    /** @return V(output) in volts */
    public double outputVolts(double[] solution) {
        return solution[outputNode - 1];
    }
}

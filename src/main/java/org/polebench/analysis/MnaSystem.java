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
        int nodes = network.nodeCount();
        int sources = 1 + ports.size() + shorted.size();
        int size = nodes - 1 + sources;
        double[][] m = new double[size][size];
        double reference = 0;
        for (NetworkElement element : network.elements()) {
            if (element instanceof NetworkElement.Conductance) {
                NetworkElement.Conductance g = (NetworkElement.Conductance) element;
                stampConductance(m, g.a(), g.b(), g.siemens());
                reference = Math.max(reference, g.siemens());
            } else if (element instanceof NetworkElement.Transconductance) {
                NetworkElement.Transconductance t = (NetworkElement.Transconductance) element;
                stampTransconductance(m, t);
                reference = Math.max(reference, Math.abs(t.siemens()));
            }
        }
        if (reference == 0) {
            reference = 1;
        }
        List<String> names = new ArrayList<>(sources);
        names.add(STIMULUS);
        stampSource(m, nodes - 1, network.drivenNode(), 0, reference);
        int s = 1;
        for (NetworkElement.Capacitance c : ports) {
            names.add(c.name());
            stampSource(m, nodes - 1 + s++, c.a(), c.b(), reference);
        }
        for (NetworkElement.Capacitance c : shorted) {
            names.add(c.name());
            stampSource(m, nodes - 1 + s++, c.a(), c.b(), reference);
        }
        return new MnaSystem(nodes, network.outputNode(), m, reference, Collections.unmodifiableList(names),
                network.nodes());
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
    static void stampTransconductance(double[][] m, NetworkElement.Transconductance t) {
        int[] rows = {t.from(), t.to()};
        double[] signs = {1, -1};
        for (int r = 0; r < 2; r++) {
            int row = rows[r];
            if (row == 0) {
                continue;
            }
            if (t.controlPlus() != 0) {
                m[row - 1][t.controlPlus() - 1] += signs[r] * t.siemens();
            }
            if (t.controlMinus() != 0) {
                m[row - 1][t.controlMinus() - 1] -= signs[r] * t.siemens();
            }
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

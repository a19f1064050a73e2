package org.polebench.analysis;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.polebench.circuit.Band;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.linalg.RealLu;

/**
 * Reduces the resistive network around one band's capacitors to the state-space model
 * A = −Cd⁻¹·Y, B = −Cd⁻¹·b, C = cᵀ, D (docs/method.md, "Port reduction"), with one real LU and
 * k + 1 solves; nothing is inverted but diag(C) and the k×k matrix Y.
 *
 * <p>Low band: the low-band capacitors are ports and the high-band ones open; a loop of them is
 * a named singular case. High band: the high-band capacitors are ports and the low-band ones
 * shorted (ideal 0 V sources). Device capacitances often form loops there (Cπ, Cμ and a load
 * capacitance through the shorted bypass and coupling capacitors), so a high-band capacitor
 * that closes a loop becomes a link: its voltage is a fixed combination of the ports' (and the
 * stimulus'), it is no state, and its charge enters the capacitance matrix of the ports
 * ({@link StateModel}). A link across the stimulus and shorts alone (Cπ of a stage driven at
 * its base with a bypassed emitter) sets no pole at all ({@link StateModel#capacitorsAcrossSources()}).
 *
 * <p>Singular cases, checked in this order: a loop of ports and sources
 * ({@link SingularCase#CAPACITOR_LOOP}, naming the loop's parts), nodes no resistor or source
 * ties to ground ({@link SingularCase#NO_DC_PATH}, naming the nodes and the parts on them),
 * a singular MNA matrix for any other reason (also NO_DC_PATH, named from its null vector),
 * and a singular Y ({@link SingularCase#POLE_AT_ZERO}, naming the capacitors in Y's right
 * null vector). Immutable; one instance serves any thread.
 */
public final class PortReduction {
    /** Pivot threshold of the row-equilibrated Y below which Y counts as singular. */
    public static final double DEFAULT_ADMITTANCE_PIVOT = 1e-11;
    /** A null-vector entry above this share of the largest names its part in a singular case. */
    private static final double NULL_VECTOR_SHARE = 0.1;

    private final MnaSolver solver;
    private final double admittancePivot;

    public PortReduction() {
        this(new MnaSolver(), DEFAULT_ADMITTANCE_PIVOT);
    }

    public PortReduction(MnaSolver solver, double admittancePivot) {
        this.solver = solver;
        this.admittancePivot = admittancePivot;
    }

    /** @return the band's model (A in 1/s, D as a voltage ratio), or the named singular case */
    public Reduction reduce(SmallSignalNetwork network, Band band) {
        return prepare(network, band).reduce(network.elementValues());
    }

    /**
     * Lays one band's reduction out once for many value sets of one network (the draws of a
     * tolerance spread): which capacitors are ports, shorts and links, the graph checks (loops,
     * nodes without a DC path) and where every element sits in the MNA matrix. Those depend on
     * the elements and their nodes only, and on which conductances are zero; a draw whose
     * conductances are all positive and transconductances non-zero, as every in-region bias
     * gives, has the same layout.
     *
     * @return the layout; its {@link Prepared#reduce} gives the graph's singular case for any values
     */
    public Prepared prepare(SmallSignalNetwork network, Band band) {
        List<NetworkElement.Capacitance> candidates = network.capacitances(band);
        List<NetworkElement.Capacitance> shorted =
                band == Band.HIGH ? network.capacitances(Band.LOW) : List.of();

        NetworkTopology topology = new NetworkTopology(network);
        topology.addVoltageBranch(new NetworkTopology.Branch(MnaSystem.STIMULUS, network.drivenNode(), 0, -1, true));
        for (NetworkElement.Capacitance c : shorted) {
            Optional<List<NetworkTopology.Step>> loop =
                    topology.addVoltageBranch(new NetworkTopology.Branch(c.name(), c.a(), c.b(), -1, false));
            if (loop.isPresent()) {
                return new Prepared(this, loopCase(network, band, loop.get(), c.name()));
            }
        }
        List<NetworkElement.Capacitance> ports = new ArrayList<>(candidates.size());
        List<LinkCapacitor> links = new ArrayList<>();
        List<NetworkElement.Capacitance> linked = new ArrayList<>();
        for (NetworkElement.Capacitance c : candidates) {
            Optional<List<NetworkTopology.Step>> loop = topology.addVoltageBranch(
                    new NetworkTopology.Branch(c.name(), c.a(), c.b(), ports.size(), false));
            if (loop.isEmpty()) {
                ports.add(c);
            } else if (band == Band.HIGH) {
                links.add(new LinkCapacitor(c.name(), c.farads(), loop.get()));
                linked.add(c);
            } else {
                return new Prepared(this, loopCase(network, band, loop.get(), c.name()));
            }
        }
        List<Integer> floating = topology.nodesWithoutDcPath();
        if (!floating.isEmpty()) {
            List<String> nodes = topology.nodeNames(floating);
            List<String> parts = topology.elementsTouching(floating);
            return new Prepared(this, new Reduction.Singular(SingularCase.NO_DC_PATH, band, parts, nodes,
                    "no resistor or source ties node(s) " + nodes + " to ground in the "
                            + band.name().toLowerCase(Locale.ROOT) + "-band network; parts there: " + parts));
        }
        return new Prepared(this, band, network, ports, shorted, links, linked);
    }

    /**
     * One band's reduction of one network, laid out by {@link PortReduction#prepare}: per value
     * set, one MNA stamping, one real LU and k + 1 solves. Immutable; one instance serves any
     * thread.
     */
    public static final class Prepared {
        private final PortReduction reduction;
        private final Reduction.Singular singular;
        private final Band band;
        private final MnaSystem.Layout layout;
        private final List<String> names;
        /** element index of each port, then of each link */
        private final int[] portElements;
        private final int[] linkElements;
        private final List<LinkCapacitor> links;

        private Prepared(PortReduction reduction, Reduction.Singular singular) {
            this.reduction = reduction;
            this.singular = singular;
            this.band = singular.band();
            this.layout = null;
            this.names = List.of();
            this.portElements = new int[0];
            this.linkElements = new int[0];
            this.links = List.of();
        }

        private Prepared(PortReduction reduction, Band band, SmallSignalNetwork network,
                         List<NetworkElement.Capacitance> ports, List<NetworkElement.Capacitance> shorted,
                         List<LinkCapacitor> links, List<NetworkElement.Capacitance> linked) {
            this.reduction = reduction;
            this.singular = null;
            this.band = band;
            this.layout = new MnaSystem.Layout(network, ports, shorted);
            List<String> portNames = new ArrayList<>(ports.size());
            for (NetworkElement.Capacitance c : ports) {
                portNames.add(c.name());
            }
            this.names = List.copyOf(portNames);
            this.portElements = elementIndices(network, ports);
            this.links = List.copyOf(links);
            this.linkElements = elementIndices(network, linked);
        }

        // by identity: the capacitances are the network's own records
        private static int[] elementIndices(SmallSignalNetwork network, List<NetworkElement.Capacitance> chosen) {
            List<NetworkElement> elements = network.elements();
            int[] indices = new int[chosen.size()];
            for (int j = 0; j < indices.length; j++) {
                int i = 0;
                while (elements.get(i) != chosen.get(j)) {
                    i++;
                }
                indices[j] = i;
            }
            return indices;
        }

        /**
         * @param elementValues one per element of the prepared network, as
         *                      {@link SmallSignalNetwork#elementValues()} gives them
         * @return the model for these values, or the named singular case
         */
        public Reduction reduce(double[] elementValues) {
            if (singular != null) {
                return singular;
            }
            MnaSystem system = layout.stamp(elementValues);
            Optional<MnaSolver.Factored> factored = reduction.solver.factor(system);
            if (factored.isEmpty()) {
                return singularMna(system, band);
            }
            int k = portElements.length;
            double[][] y = new double[k][k];
            double[] b = new double[k];
            double[] c = new double[k];
            double[] farads = new double[k];
            for (int j = 0; j < k; j++) {
                double[] solution = factored.get().solveUnitSource(j + 1);
                for (int i = 0; i < k; i++) {
                    // Y counts current out of the port into the network: minus the source current.
                    y[i][j] = -system.sourceCurrentAmps(solution, i + 1);
                }
                c[j] = system.outputVolts(solution);
                farads[j] = elementValues[portElements[j]];
            }
            double[] stimulus = factored.get().solveUnitSource(0);
            for (int i = 0; i < k; i++) {
                b[i] = -system.sourceCurrentAmps(stimulus, i + 1);
            }
            double d = system.outputVolts(stimulus);

            AdmittanceInverse yInverse = reduction.equilibratedInverse(y);
            if (yInverse == null) {
                return poleAtZero(y, names, band);
            }
            List<LinkCapacitor> drawnLinks = new ArrayList<>(links.size());
            for (int l = 0; l < links.size(); l++) {
                LinkCapacitor link = links.get(l);
                drawnLinks.add(new LinkCapacitor(link.name, elementValues[linkElements[l]], link.path));
            }
            return new Reduction.StateSpace(new StateModel(band, names, farads, drawnLinks, y, yInverse, b, c, d));
        }
    }

    private static Reduction.Singular loopCase(SmallSignalNetwork network, Band band, List<NetworkTopology.Step> loop,
                                               String closing) {
        List<String> parts = new ArrayList<>();
        Set<String> nodes = new LinkedHashSet<>();
        for (NetworkTopology.Step step : loop) {
            parts.add(step.branch().name());
            nodes.add(network.nodes().get(step.branch().a()));
            nodes.add(network.nodes().get(step.branch().b()));
        }
        parts.add(closing);
        return new Reduction.Singular(SingularCase.CAPACITOR_LOOP, band, parts, new ArrayList<>(nodes),
                "capacitors " + parts + " form a loop of voltage-defined branches in the "
                        + band.name().toLowerCase(Locale.ROOT)
                        + "-band analysis, so their voltages are not independent");
    }

    // Each row scaled by its own diagonal, the port's self-admittance 1/R_i (SCTC), makes the
    // pivot test relative to the port's own size: a port seen through a large resistance is not
    // singular, a dependent combination of ports (series capacitors around a node without a DC
    // path) leaves a pivot of round-off size. Threshold pivoting keeps the diagonal as the pivot
    // (RealLu): in a cascade of amplifying stages a port drives the later ports' currents with
    // the cascade's gain, and a row scaled by its largest entry, or partial pivoting, would
    // shrink the diagonal by that gain (1e-18 after eight stages of 35 dB) and call a regular Y
    // singular (docs/method.md, "Port reduction").
    /** @return Y⁻¹ to be formed on request, or null when Y is singular */
    private AdmittanceInverse equilibratedInverse(double[][] y) {
        int k = y.length;
        double[] rowScale = new double[k];
        double[][] scaled = new double[k][];
        for (int i = 0; i < k; i++) {
            double size = Math.abs(y[i][i]) > 0 ? Math.abs(y[i][i]) : MnaSolver.largestMagnitude(y[i]);
            rowScale[i] = size > 0 ? 1 / size : 1;
            scaled[i] = scaledRow(y[i], rowScale[i]);
        }
        RealLu lu = new RealLu(scaled, admittancePivot, MnaSolver.DIAGONAL_PREFERENCE);
        return lu.isNonSingular() ? new AdmittanceInverse(lu, rowScale) : null;
    }

    // one row per call: see RealLu on loops in methods that a cold spread calls thousands of times
    private static double[] scaledRow(double[] row, double scale) {
        double[] scaled = new double[row.length];
        for (int j = 0; j < row.length; j++) {
            scaled[j] = row[j] * scale;
        }
        return scaled;
    }

    private static Reduction.Singular poleAtZero(double[][] y, List<String> names, Band band) {
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(y));
        int last = y.length - 1;
        // the right null vector is the pattern of port voltages that draws no current: the mode
        // that drifts at DC
        double[] right = svd.getV().getColumn(last);
        List<String> parts = new ArrayList<>();
        for (int i = 0; i < y.length; i++) {
            if (significant(right, i)) {
                parts.add(names.get(i));
            }
        }
        return new Reduction.Singular(SingularCase.POLE_AT_ZERO, band, parts, List.of(),
                "the short-circuit admittance seen by " + parts + " is singular: no DC current can flow "
                        + "through that combination of capacitors, which gives a pole at s = 0");
    }

    private static Reduction.Singular singularMna(MnaSystem system, Band band) {
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(system.matrixView()));
        double[] nullVector = svd.getV().getColumn(system.size() - 1);
        List<String> nodes = new ArrayList<>();
        List<String> parts = new ArrayList<>();
        for (int i = 0; i < nullVector.length; i++) {
            if (significant(nullVector, i)) {
                if (i < system.nodeCount() - 1) {
                    nodes.add(system.nodeNames().get(i + 1));
                } else {
                    parts.add(system.sourceNames().get(i - system.nodeCount() + 1));
                }
            }
        }
        return new Reduction.Singular(SingularCase.NO_DC_PATH, band, parts, nodes,
                "the " + band.name().toLowerCase(Locale.ROOT) + "-band network does not fix the DC voltage of node(s) "
                        + nodes + (parts.isEmpty() ? "" : " (sources involved: " + parts + ")"));
    }

    private static boolean significant(double[] vector, int i) {
        double max = 0;
        for (double v : vector) {
            max = Math.max(max, Math.abs(v));
        }
        return Math.abs(vector[i]) > NULL_VECTOR_SHARE * max;
    }
}

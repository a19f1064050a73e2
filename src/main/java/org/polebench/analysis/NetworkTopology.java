package org.polebench.analysis;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Deque;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;

/**
 * Graph facts that make an MNA matrix singular whatever the element values: a loop of ideal
 * voltage-defined branches, and nodes that nothing ties to ground. Found with a union–find
 * forest over the network's nodes (Tarjan, "Efficiency of a good but not linear set union
 * algorithm", J. ACM 22(2), 1975). One instance per reduction.
 */
final class NetworkTopology {
    /**
     * A voltage-defined branch from a (+) to b (−): the stimulus, a short, or a port.
     *
     * @param port the port's state index, or −1 for the stimulus and shorts
     */
    record Branch(String name, int a, int b, int port, boolean stimulus) {
        boolean isPort() {
            return port >= 0;
        }
    }

    /** A branch on a path, with +1 when the path runs from its a to its b. */
    record Step(Branch branch, int sign) {
    }

    private final SmallSignalNetwork network;
    private final int[] parent;
    private final List<Branch> forest = new ArrayList<>();

    NetworkTopology(SmallSignalNetwork network) {
        this.network = network;
        this.parent = new int[network.nodeCount()];
        for (int i = 0; i < parent.length; i++) {
            parent[i] = i;
        }
    }

    private int root(int node) {
        int r = node;
        while (parent[r] != r) {
            r = parent[r];
        }
        while (parent[node] != r) {
            int next = parent[node];
            parent[node] = r;
            node = next;
        }
        return r;
    }

    private boolean join(int a, int b) {
        int ra = root(a);
        int rb = root(b);
        if (ra == rb) {
            return false;
        }
        parent[ra] = rb;
        return true;
    }

    /**
     * Adds a voltage-defined branch to the forest.
     *
     * @return empty when the branch joins two separate trees; otherwise the forest path from its
     * a to its b (itself empty for a branch with both ends on one node), which with the branch
     * closes a loop; the branch is then not added
     */
    Optional<List<Step>> addVoltageBranch(Branch branch) {
        if (join(branch.a(), branch.b())) {
            forest.add(branch);
            return Optional.empty();
        }
        return Optional.of(pathInForest(branch.a(), branch.b()));
    }

    private List<Step> pathInForest(int from, int to) {
        int n = parent.length;
        Branch[] via = new Branch[n];
        int[] previous = new int[n];
        Arrays.fill(previous, -1);
        previous[from] = from;
        Deque<Integer> queue = new ArrayDeque<>();
        queue.add(from);
        while (!queue.isEmpty()) {
            int node = queue.poll();
            if (node == to) {
                break;
            }
            for (Branch b : forest) {
                int other = b.a() == node ? b.b() : b.b() == node ? b.a() : -1;
                if (other >= 0 && previous[other] < 0) {
                    previous[other] = node;
                    via[other] = b;
                    queue.add(other);
                }
            }
        }
        List<Step> path = new ArrayList<>();
        for (int node = to; node != from && previous[node] >= 0; node = previous[node]) {
            // stepping from previous[node] to node: along the branch when node is its b
            path.add(0, new Step(via[node], via[node].b() == node ? 1 : -1));
        }
        return path;
    }

    /**
     * After all voltage branches are added: joins every resistive path (conductances above zero,
     * and transconductances whose control pair is their own terminal pair, which act as
     * conductances) and returns the nodes left apart from ground, in index order.
     */
    List<Integer> nodesWithoutDcPath() {
        NetworkElement.Cases<Void> joinResistive = new NetworkElement.Cases<>() {
            @Override
            public Void conductance(NetworkElement.Conductance g) {
                if (g.siemens() > 0) {
                    join(g.a(), g.b());
                }
                return null;
            }

            @Override
            public Void capacitance(NetworkElement.Capacitance c) {
                return null;   // open at DC
            }

            @Override
            public Void transconductance(NetworkElement.Transconductance t) {
                boolean sameTerminals = (t.from() == t.controlPlus() && t.to() == t.controlMinus())
                        || (t.from() == t.controlMinus() && t.to() == t.controlPlus());
                if (sameTerminals && t.siemens() != 0) {
                    join(t.from(), t.to());
                }
                return null;
            }
        };
        for (NetworkElement element : network.elements()) {
            element.match(joinResistive);
        }
        List<Integer> floating = new ArrayList<>();
        for (int node = 1; node < parent.length; node++) {
            if (root(node) != root(0)) {
                floating.add(node);
            }
        }
        return floating;
    }

    /** @return the names of the elements with a terminal on any of the nodes */
    List<String> elementsTouching(List<Integer> nodes) {
        Set<String> names = new LinkedHashSet<>();
        for (NetworkElement element : network.elements()) {
            for (int terminal : element.terminals()) {
                if (nodes.contains(terminal)) {
                    names.add(element.name());
                }
            }
        }
        return new ArrayList<>(names);
    }

    List<String> nodeNames(List<Integer> nodes) {
        List<String> names = new ArrayList<>(nodes.size());
        for (int node : nodes) {
            names.add(network.nodes().get(node));
        }
        return names;
    }
}

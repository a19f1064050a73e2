package org.polebench.circuit;

import java.util.HashMap;
import java.util.Map;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * An independent midband solve of a small-signal network with EJML (test scope): low-band
 * capacitors are ideal shorts (their nodes merged), high-band ones open, the driven node held at
 * 1 V by one extra MNA row. Returns V(output).
 */
final class MidbandByEjml {
    private MidbandByEjml() {
    }

    static double gain(SmallSignalNetwork network) {
        int n = network.nodeCount();
        int[] parent = new int[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
        }
        for (NetworkElement.Capacitance c : network.capacitances(Band.LOW)) {
            int a = root(parent, c.a());
            int b = root(parent, c.b());
            // ground stays the root of its class
            if (a != b) {
                if (a == 0) {
                    parent[b] = a;
                } else {
                    parent[a] = b;
                }
            }
        }
        Map<Integer, Integer> unknown = new HashMap<>();
        for (int i = 1; i < n; i++) {
            int r = root(parent, i);
            if (r != 0 && !unknown.containsKey(r)) {
                unknown.put(r, unknown.size());
            }
        }
        int size = unknown.size() + 1;
        DMatrixRMaj m = new DMatrixRMaj(size, size);
        DMatrixRMaj rhs = new DMatrixRMaj(size, 1);
        java.util.function.IntUnaryOperator at = node -> {
            int r = root(parent, node);
            return r == 0 ? -1 : unknown.get(r);
        };
        for (NetworkElement e : network.elements()) {
            if (e instanceof NetworkElement.Conductance) {
                NetworkElement.Conductance g = (NetworkElement.Conductance) e;
                int a = at.applyAsInt(g.a());
                int b = at.applyAsInt(g.b());
                add(m, a, a, g.siemens());
                add(m, b, b, g.siemens());
                add(m, a, b, -g.siemens());
                add(m, b, a, -g.siemens());
            } else if (e instanceof NetworkElement.Transconductance) {
                NetworkElement.Transconductance t = (NetworkElement.Transconductance) e;
                int from = at.applyAsInt(t.from());
                int to = at.applyAsInt(t.to());
                int p = at.applyAsInt(t.controlPlus());
                int q = at.applyAsInt(t.controlMinus());
                add(m, from, p, t.siemens());
                add(m, from, q, -t.siemens());
                add(m, to, p, -t.siemens());
                add(m, to, q, t.siemens());
            }
        }
        int driven = at.applyAsInt(network.drivenNode());
        int row = size - 1;
        add(m, driven, row, 1);
        add(m, row, driven, 1);
        rhs.set(row, 0, 1);
        DMatrixRMaj x = new DMatrixRMaj(size, 1);
        if (!CommonOps_DDRM.solve(m, rhs, x)) {
            throw new IllegalStateException("singular midband network");
        }
        int out = at.applyAsInt(network.outputNode());
        return out < 0 ? 0 : x.get(out, 0);
    }

    private static void add(DMatrixRMaj m, int i, int j, double value) {
        if (i >= 0 && j >= 0) {
            m.add(i, j, value);
        }
    }

    private static int root(int[] parent, int i) {
        while (parent[i] != i) {
            i = parent[i];
        }
        return i;
    }
}

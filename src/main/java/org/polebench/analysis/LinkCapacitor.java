package org.polebench.analysis;

import java.util.List;

/**
 * A high-band capacitor that closes a loop of ports, shorts and the stimulus: its voltage is
 * v_l = Σ_t q_t·v_t + q_u·u over the loop's ports t and the stimulus u (Kirchhoff's voltage law
 * around the loop). Kernel type for {@link StateModel}.
 */
final class LinkCapacitor {
    final String name;
    final double farads;
    final List<NetworkTopology.Step> path;

    LinkCapacitor(String name, double farads, List<NetworkTopology.Step> path) {
        this.name = name;
        this.farads = farads;
        this.path = List.copyOf(path);
    }

    /** @return q over the k ports: +1 or −1 where the loop runs through a port, else 0 */
    double[] portCoefficients(int k) {
        double[] q = new double[k];
        for (NetworkTopology.Step step : path) {
            if (step.branch().isPort()) {
                q[step.branch().port()] += step.sign();
            }
        }
        return q;
    }

    /** @return q_u: ±1 when the loop runs through the stimulus, else 0 (shorts are 0 V) */
    double stimulusCoefficient() {
        double q = 0;
        for (NetworkTopology.Step step : path) {
            if (step.branch().stimulus()) {
                q += step.sign();
            }
        }
        return q;
    }
}

package org.polebench.analysis;

/** Why a network has no finite state-space model in one band (docs/method.md, "Port reduction"). */
public enum SingularCase {
    /**
     * Ports and ideal sources form a loop (for example two coupling capacitors in parallel, or a
     * capacitor straight across the stimulus): the MNA with ports as voltage sources is singular.
     */
    CAPACITOR_LOOP,
    /** A node is connected to nothing that fixes its DC voltage: it floats in the resistive network. */
    NO_DC_PATH,
    /**
     * The short-circuit admittance matrix Y of the ports is singular, so A has an eigenvalue at
     * s = 0 (for example capacitors in series through a node with no resistor, or a coupling
     * capacitor fed by an ideal current source).
     */
    POLE_AT_ZERO,
    /** Commons Math's eigenvalue iteration did not converge on A (not seen on real stages). */
    EIGENVALUES_NOT_FOUND
}

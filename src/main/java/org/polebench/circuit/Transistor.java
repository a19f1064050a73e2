package org.polebench.circuit;

import java.util.List;

/**
 * A BJT or a MOSFET: a part with a bias point and a bias-current tolerance. What the two have
 * in common in another's words is a method here; code that treats them differently calls
 * {@link #match} with a {@link Cases}, so a new transistor type fails to compile until every
 * such place handles it.
 */
public sealed interface Transistor permits Bjt, Mosfet {
    String name();

    int line();

    /** @return how the DC operating point is found: solved, or a given current */
    Bias bias();

    /**
     * @return the tolerance of the bias current, a nuisance parameter in the back-solve
     *         (default ±20 %, docs/method.md, "The small-signal network")
     */
    Tolerance biasTolerance();

    /** @return the nodes of the terminals, as {@link Part#terminalNodes()} gives them */
    List<String> terminalNodes();

    /** @return +1 for an NPN or an NMOS, −1 for a PNP or a PMOS: the sign into the device's own sense */
    int sign();

    /** @return the node of the controlling terminal: a BJT's base, a MOSFET's gate */
    String controlNode();

    /** @return the node of the common terminal: a BJT's emitter, a MOSFET's source */
    String commonNode();

    /** @return the word for the controlling terminal: {@code base} or {@code gate} */
    String controlTerminal();

    /** @return the word for the common terminal: {@code emitter} or {@code source} */
    String commonTerminal();

    /**
     * @param node one of {@link #terminalNodes()}
     * @return the word for the first terminal on that node, in terminal order ({@code collector},
     *         {@code base}, {@code emitter}; {@code drain}, {@code gate}, {@code source}, {@code body})
     */
    String terminalRole(String node);

    /** @return what {@code cases} gives for this transistor's type */
    <R> R match(Cases<R> cases);

    /** One method per transistor type: adding one breaks every implementation until it handles it. */
    interface Cases<R> {
        R bjt(Bjt bjt);

        R mosfet(Mosfet mosfet);
    }
}

package org.polebench.circuit;

import java.util.List;

/** One part of a stage, as the stage file lists it under {@code parts}. */
public sealed interface Part permits Resistor, Capacitor, Bjt, Mosfet {
    /** @return the reference designator from the stage file, such as {@code C3} */
    String name();

    /** @return the 1-based line of the part in its stage file, 0 when built in code */
    int line();

    /** @return the nodes the part's terminals connect to, one entry per terminal */
    List<String> terminalNodes();
}

package org.polebench.circuit;

import java.util.List;
import java.util.Optional;

/**
 * One part of a stage, as the stage file lists it under {@code parts}. Code that treats the
 * part types differently calls a method below or {@link #match} with a {@link Cases}, never
 * {@code instanceof}: a new part type then fails to compile until every such place handles it.
 */
public sealed interface Part permits Resistor, Capacitor, Bjt, Mosfet {
    /** @return the reference designator from the stage file, such as {@code C3} */
    String name();

    /** @return the 1-based line of the part in its stage file, 0 when built in code */
    int line();

    /** @return the nodes the part's terminals connect to, one entry per terminal */
    List<String> terminalNodes();

    /** @return this part as a transistor (a part with a bias point), empty for a passive part */
    Optional<Transistor> asTransistor();

    /**
     * @return the value a tolerance spread draws for this part: a resistor's ohms, a
     *         capacitor's farads, a BJT's β; NaN for a part of which nothing is drawn (a MOSFET);
     *         see docs/method.md, "Tolerance spread"
     */
    double drawnValue();

    /** @return the band {@link #drawnValue()} spreads over, empty when nothing is drawn */
    Optional<Tolerance> drawnTolerance();

    /** @return a copy with {@link #drawnValue()} replaced by {@code value}; this part when nothing is drawn */
    Part withDrawnValue(double value);

    /** @return what {@code cases} gives for this part's type */
    <R> R match(Cases<R> cases);

    /**
     * One method per part type, for code that treats them differently: adding a part type
     * adds a method here, and every implementation fails to compile until it handles it.
     */
    interface Cases<R> {
        R resistor(Resistor resistor);

        R capacitor(Capacitor capacitor);

        R bjt(Bjt bjt);

        R mosfet(Mosfet mosfet);
    }
}

package org.polebench.circuit;

/** A BJT or a MOSFET: a part with a bias point and a bias-current tolerance. */
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
}

package org.polebench.circuit;

/**
 * One linear element of the small-signal network. Node 0 is ground; other indices point into
 * {@link SmallSignalNetwork#nodes()}.
 */
public sealed interface NetworkElement
        permits NetworkElement.Conductance, NetworkElement.Capacitance, NetworkElement.Transconductance {

    /** @return a name the user recognises: a part id such as {@code C3}, or {@code Q1.rpi} */
    String name();

    /** A resistor, written as its conductance in siemens (finite, non-negative). */
    record Conductance(String name, int a, int b, double siemens) implements NetworkElement {
        public Conductance {
            if (!(siemens >= 0) || !Double.isFinite(siemens)) {
                throw new IllegalArgumentException(name + ": conductance must be finite and >= 0, was " + siemens);
            }
        }
    }

    /**
     * A capacitor. For a part capacitor {@link #name()} is its reference designator.
     *
     * @param farads positive
     */
    record Capacitance(String name, int a, int b, double farads, Band band) implements NetworkElement {
        public Capacitance {
            if (!(farads > 0) || !Double.isFinite(farads)) {
                throw new IllegalArgumentException(name + ": capacitance must be positive and finite, was " + farads);
            }
        }

        public Capacitance withFarads(double newFarads) {
            return new Capacitance(name, a, b, newFarads, band);
        }
    }

    /**
     * A voltage-controlled current source: a current {@code siemens·(v(controlPlus) − v(controlMinus))}
     * flows through the element from node {@code from} to node {@code to} (for a BJT's gm: from
     * the collector to the emitter, controlled by base minus emitter).
     */
    record Transconductance(String name, int from, int to, int controlPlus, int controlMinus, double siemens)
            implements NetworkElement {
        public Transconductance {
            if (!Double.isFinite(siemens)) {
                throw new IllegalArgumentException(name + ": transconductance must be finite, was " + siemens);
            }
        }
    }
}

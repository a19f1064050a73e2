package org.polebench.circuit;

import java.util.Optional;

/**
 * One linear element of the small-signal network. Node 0 is ground; other indices point into
 * {@link SmallSignalNetwork#nodes()}. Code that stamps the kinds differently calls
 * {@link #match} with a {@link Cases}, so a new kind fails to compile until every such place
 * handles it.
 */
public sealed interface NetworkElement
        permits NetworkElement.Conductance, NetworkElement.Capacitance, NetworkElement.Transconductance {

    /** @return a name the user recognises: a part id such as {@code C3}, or {@code Q1.rpi} */
    String name();

    /** @return siemens for a conductance or a transconductance, farads for a capacitance */
    double value();

    /**
     * @return a new array of the element's node indices: a and b of a two-terminal element;
     *         from, to, control plus and control minus of a transconductance
     */
    int[] terminals();

    /** @return this element as a capacitance, empty for the other kinds */
    Optional<Capacitance> asCapacitance();

    /** @return what {@code cases} gives for this element's kind */
    <R> R match(Cases<R> cases);

    /** One method per kind of element: adding one breaks every implementation until it handles it. */
    interface Cases<R> {
        R conductance(Conductance conductance);

        R capacitance(Capacitance capacitance);

        R transconductance(Transconductance transconductance);
    }

    /** A resistor, written as its conductance in siemens (finite, non-negative). */
    record Conductance(String name, int a, int b, double siemens) implements NetworkElement {
        public Conductance {
            if (!(siemens >= 0) || !Double.isFinite(siemens)) {
                throw new IllegalArgumentException(name + ": conductance must be finite and >= 0, was " + siemens);
            }
        }

        @Override
        public double value() {
            return siemens;
        }

        @Override
        public int[] terminals() {
            return new int[] {a, b};
        }

        @Override
        public Optional<Capacitance> asCapacitance() {
            return Optional.empty();
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.conductance(this);
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

        @Override
        public double value() {
            return farads;
        }

        @Override
        public int[] terminals() {
            return new int[] {a, b};
        }

        @Override
        public Optional<Capacitance> asCapacitance() {
            return Optional.of(this);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.capacitance(this);
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

        @Override
        public double value() {
            return siemens;
        }

        @Override
        public int[] terminals() {
            return new int[] {from, to, controlPlus, controlMinus};
        }

        @Override
        public Optional<Capacitance> asCapacitance() {
            return Optional.empty();
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.transconductance(this);
        }
    }
}

package org.polebench.circuit;

import java.util.List;
import java.util.Optional;

/**
 * @param ohms      nominal resistance, positive
 * @param tolerance the stage file's {@code tolerance}, ±5 % when not given
 * @param line      1-based line in the stage file, 0 when built in code
 */
public record Resistor(String name, NodePair between, double ohms, Tolerance tolerance, int line) implements Part {
    public Resistor {
        if (!(ohms > 0) || !Double.isFinite(ohms)) {
            throw new IllegalArgumentException(name + ": resistance must be positive and finite, was " + ohms);
        }
    }

    public Resistor withOhms(double newOhms) {
        return new Resistor(name, between, newOhms, tolerance, line);
    }

    @Override
    public List<String> terminalNodes() {
        return between.asList();
    }

    @Override
    public Optional<Transistor> asTransistor() {
        return Optional.empty();
    }

    @Override
    public double drawnValue() {
        return ohms;
    }

    @Override
    public Optional<Tolerance> drawnTolerance() {
        return Optional.of(tolerance);
    }

    @Override
    public Resistor withDrawnValue(double value) {
        return withOhms(value);
    }

    @Override
    public <R> R match(Cases<R> cases) {
        return cases.resistor(this);
    }
}

package org.polebench.circuit;

import java.util.List;
import java.util.Optional;

/**
 * A part capacitor.
 *
 * @param farads    nominal value, positive
 * @param tolerance the stage file's {@code tolerance}, ±20 % when not given
 * @param band      {@code LOW} for coupling and bypass parts, which become ports of the
 *                  low-frequency analysis; by default parts of 1 nF or more are LOW
 * @param line      1-based line in the stage file, 0 when built in code
 */
public record Capacitor(String name, NodePair between, double farads, Tolerance tolerance, Band band, int line)
        implements Part {
    /** Parts at or above this value are LOW band unless {@code band:} says otherwise (docs/user-guide.md, "Bands"). */
    public static final double LOW_BAND_THRESHOLD_FARADS = 1e-9;

    public Capacitor {
        if (!(farads > 0) || !Double.isFinite(farads)) {
            throw new IllegalArgumentException(name + ": capacitance must be positive and finite, was " + farads);
        }
    }

    /** @return the band a capacitor of this value gets when the stage file does not say */
    public static Band defaultBand(double farads) {
        return farads >= LOW_BAND_THRESHOLD_FARADS ? Band.LOW : Band.HIGH;
    }

    public Capacitor withFarads(double newFarads) {
        return new Capacitor(name, between, newFarads, tolerance, band, line);
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
        return farads;
    }

    @Override
    public Optional<Tolerance> drawnTolerance() {
        return Optional.of(tolerance);
    }

    @Override
    public Capacitor withDrawnValue(double value) {
        return withFarads(value);
    }

    @Override
    public <R> R match(Cases<R> cases) {
        return cases.capacitor(this);
    }
}

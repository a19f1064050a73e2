package org.polebench.circuit;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * One amplifier stage as designed: its parts, supplies, input, output, limits and the
 * back-solve's top-level priors (docs/user-guide.md, "Top-level keys"; docs/method.md, "The back-solve").
 *
 * @param name                the stage file's {@code name}
 * @param sourceFile          the stage file it was read from; null when built in code
 * @param ground              the ground node's name
 * @param supplies            DC rails, each an ideal source to ground (AC ground)
 * @param input               where the generator drives the stage
 * @param output              the output node and its load
 * @param limits              acceptance limits, possibly none
 * @param temperatureKelvin   device temperature for VT = kT/q, positive (default 300 K)
 * @param gainCalibrationDb   half-width of the prior on a flat gain error, in dB, positive
 *                            (default 1 dB: ±1 dB)
 * @param parts               every part, in file order; names are unique
 */
public record Stage(String name, Path sourceFile, String ground, List<Supply> supplies, StageInput input,
                    StageOutput output, Limits limits, double temperatureKelvin, double gainCalibrationDb,
                    List<Part> parts) {

    public static final double DEFAULT_TEMPERATURE_KELVIN = 300;
    public static final double DEFAULT_GAIN_CALIBRATION_DB = 1;

    public Stage {
        supplies = List.copyOf(supplies);
        parts = List.copyOf(parts);
        if (!(temperatureKelvin > 0) || !Double.isFinite(temperatureKelvin)) {
            throw new IllegalArgumentException("temperature must be positive, was " + temperatureKelvin);
        }
        if (!(gainCalibrationDb > 0) || !Double.isFinite(gainCalibrationDb)) {
            throw new IllegalArgumentException("gain calibration must be positive, was " + gainCalibrationDb);
        }
        Set<String> names = new LinkedHashSet<>();
        for (Part part : parts) {
            if (!names.add(part.name())) {
                throw new IllegalArgumentException("part " + part.name() + " appears twice");
            }
        }
    }

    /** @return the part with this reference designator */
    public Optional<Part> part(String id) {
        for (Part part : parts) {
            if (part.name().equals(id)) {
                return Optional.of(part);
            }
        }
        return Optional.empty();
    }

    /** @throws IllegalArgumentException when no capacitor has this id */
    public Capacitor capacitor(String id) {
        return partOf(id, Capacitor.class);
    }

    /** @throws IllegalArgumentException when no resistor has this id */
    public Resistor resistor(String id) {
        return partOf(id, Resistor.class);
    }

    /** @throws IllegalArgumentException when no BJT has this id */
    public Bjt bjt(String id) {
        return partOf(id, Bjt.class);
    }

    /** @throws IllegalArgumentException when no MOSFET has this id */
    public Mosfet mosfet(String id) {
        return partOf(id, Mosfet.class);
    }

    /** @throws IllegalArgumentException when no transistor has this id */
    public Transistor transistor(String id) {
        Part part = part(id).orElseThrow(() -> new IllegalArgumentException("no part " + id + " in " + name));
        return part.asTransistor().orElseThrow(() -> new IllegalArgumentException(id + " is not a transistor"));
    }

    public List<Capacitor> capacitors() {
        return partsOf(Capacitor.class);
    }

    /** @return the part capacitors of one band, in file order */
    public List<Capacitor> capacitors(Band band) {
        List<Capacitor> result = new ArrayList<>();
        for (Capacitor capacitor : capacitors()) {
            if (capacitor.band() == band) {
                result.add(capacitor);
            }
        }
        return result;
    }

    public List<Resistor> resistors() {
        return partsOf(Resistor.class);
    }

    /** @return the BJTs, in file order */
    public List<Bjt> bjts() {
        return partsOf(Bjt.class);
    }

    /** @return the BJTs and MOSFETs, in file order */
    public List<Transistor> transistors() {
        List<Transistor> result = new ArrayList<>();
        for (Part part : parts) {
            part.asTransistor().ifPresent(result::add);
        }
        return result;
    }

    /** @return the supply on this node, if it is a rail */
    public Optional<Supply> supply(String node) {
        for (Supply supply : supplies) {
            if (supply.node().equals(node)) {
                return Optional.of(supply);
            }
        }
        return Optional.empty();
    }

    /** @return true for the ground node and every supply rail: the nodes at AC ground */
    public boolean isAcGround(String node) {
        return node.equals(ground) || supply(node).isPresent();
    }

    /** @return every node name: ground first, then in order of first appearance in the parts */
    public List<String> nodes() {
        Set<String> seen = new LinkedHashSet<>();
        seen.add(ground);
        for (Part part : parts) {
            seen.addAll(part.terminalNodes());
        }
        for (Supply supply : supplies) {
            seen.add(supply.node());
        }
        seen.add(input.node());
        seen.add(output.node());
        return List.copyOf(seen);
    }

    /**
     * @return a copy with capacitor {@code id} at {@code farads} (positive), keeping its band, so
     *         that the set of low-band ports does not change; the id must name a capacitor
     */
    public Stage withCapacitance(String id, double farads) {
        return withPart(capacitor(id).withFarads(farads));
    }

    /** @return a copy with resistor {@code id} at {@code ohms}; the id must name a resistor */
    public Stage withResistance(String id, double ohms) {
        return withPart(resistor(id).withOhms(ohms));
    }

    /** @return a copy with BJT {@code id} at current gain {@code beta}; the id must name a BJT */
    public Stage withBeta(String id, double beta) {
        return withPart(bjt(id).withBeta(beta));
    }

    /** @return a copy driven through another input (a generator's resistance, another gain reference) */
    public Stage withInput(StageInput newInput) {
        return new Stage(name, sourceFile, ground, supplies, newInput, output, limits, temperatureKelvin,
                gainCalibrationDb, parts);
    }

    /**
     * @return a copy with a whole new part list (same names expected, as a Monte Carlo draw
     *         makes); one copy instead of one per part
     */
    public Stage withParts(List<Part> newParts) {
        return new Stage(name, sourceFile, ground, supplies, input, output, limits, temperatureKelvin,
                gainCalibrationDb, newParts);
    }

    /**
     * The values a tolerance spread draws, one per part in part order ({@link Part#drawnValue()}):
     * a resistor's ohms, a capacitor's farads, a BJT's β; NaN for a MOSFET, of which nothing is
     * drawn. A draw of a
     * stage is this array with other numbers: the kernels that solve many draws take it instead
     * of a copied stage.
     */
    public double[] partValues() {
        double[] values = new double[parts.size()];
        for (int p = 0; p < values.length; p++) {
            values[p] = parts.get(p).drawnValue();
        }
        return values;
    }

    /**
     * @param values one per part, as {@link #partValues()} orders them (a MOSFET's entry is ignored)
     * @return a copy whose resistors, capacitors and BJTs take those values ({@link Part#withDrawnValue})
     */
    public Stage withPartValues(double[] values) {
        if (values.length != parts.size()) {
            throw new IllegalArgumentException(values.length + " values for the " + parts.size() + " parts of " + name);
        }
        List<Part> changed = new ArrayList<>(parts.size());
        for (int p = 0; p < values.length; p++) {
            changed.add(parts.get(p).withDrawnValue(values[p]));
        }
        return withParts(changed);
    }

    /** @return a copy with the part of the same name replaced; the name must exist */
    public Stage withPart(Part replacement) {
        List<Part> changed = new ArrayList<>(parts.size());
        boolean found = false;
        for (Part part : parts) {
            if (part.name().equals(replacement.name())) {
                changed.add(replacement);
                found = true;
            } else {
                changed.add(part);
            }
        }
        if (!found) {
            throw new IllegalArgumentException("no part " + replacement.name() + " in " + name);
        }
        return new Stage(name, sourceFile, ground, supplies, input, output, limits, temperatureKelvin,
                gainCalibrationDb, changed);
    }

    private <T extends Part> T partOf(String id, Class<T> kind) {
        Part part = part(id).orElseThrow(() -> new IllegalArgumentException("no part " + id + " in " + name));
        if (!kind.isInstance(part)) {
            throw new IllegalArgumentException(id + " is not a " + kind.getSimpleName().toLowerCase(Locale.ROOT));
        }
        return kind.cast(part);
    }

    private <T extends Part> List<T> partsOf(Class<T> kind) {
        List<T> result = new ArrayList<>();
        for (Part part : parts) {
            if (kind.isInstance(part)) {
                result.add(kind.cast(part));
            }
        }
        return result;
    }
}

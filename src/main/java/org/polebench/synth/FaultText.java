package org.polebench.synth;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.polebench.InputProblem;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.Mosfet;
import org.polebench.circuit.Part;
import org.polebench.circuit.Resistor;
import org.polebench.circuit.Spelling;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;

/**
 * Reads a fault as a user writes it on the command line: {@code C3=4.7u} (a capacitor fitted
 * at another value), {@code RE=22} or {@code R2=47k} (a resistor fitted at another value, in
 * ohms, engineering notation as for capacitors), {@code bias:Q1=0.6} (a transistor's bias
 * current times 0.6), {@code beta:Q1=1.7} (a bipolar transistor's current gain β times 1.7, as
 * built over the stage file's), {@code gain=10} (a flat gain error of ×10, as a ×10 probe read
 * as ×1), and the synthesizer's noise as {@code 0.05dB,0.5deg}. Every refusal names what was
 * written and what would fix it; a designator that is not in the stage gets the closest one
 * that is (Levenshtein distance, as the stage reader does) and the stage's designators of the
 * kind the text asks for.
 */
public final class FaultText {
    /** The accepted forms, for hints. */
    public static final String FORMS = "C3=4.7u (a capacitor's value), RE=22 or R2=47k (a resistor's value in Ω),"
            + " bias:Q1=0.6 (a bias current factor), beta:Q1=1.7 (a current gain factor) or gain=10"
            + " (a flat gain factor)";

    private static final String BIAS = "bias:";
    private static final String BETA = "beta:";

    private FaultText() {
    }

    /** @throws InputProblem when the text names no part of the stage or its value is no number */
    public static Fault parse(String text, Stage stage) throws InputProblem {
        String trimmed = text.strip();
        int equals = trimmed.indexOf('=');
        if (equals <= 0 || equals == trimmed.length() - 1) {
            throw problem(trimmed, "is not PART=VALUE", "write " + FORMS);
        }
        String key = trimmed.substring(0, equals).strip();
        String value = trimmed.substring(equals + 1).strip();
        String lowered = key.toLowerCase(Locale.ROOT);
        if (lowered.equals("gain")) {
            return new Fault.FlatGain(positive(trimmed, value, Quantity.DIMENSIONLESS, "a gain factor such as gain=10"));
        }
        if (lowered.startsWith(BIAS)) {
            String name = key.substring(BIAS.length()).strip();
            List<String> transistors = stage.transistors().stream().map(Transistor::name).toList();
            if (stage.part(name).flatMap(Part::asTransistor).isEmpty()) {
                throw problem(trimmed, "names no transistor of the stage" + didYouMean(name, transistors),
                        transistors.isEmpty() ? "the stage has no transistor; write " + FORMS
                                : "use one of the stage's transistors (" + String.join(", ", transistors) + "), e.g. bias:"
                                + transistors.get(0) + "=0.6");
            }
            return new Fault.BiasCurrent(name, positive(trimmed, value, Quantity.DIMENSIONLESS,
                    "a factor such as bias:" + name + "=0.6"));
        }
        if (lowered.startsWith(BETA)) {
            String name = key.substring(BETA.length()).strip();
            List<String> bipolar = stage.bjts().stream().map(Bjt::name).toList();
            Reading notBipolar = () -> {
                throw problem(trimmed, "names no bipolar transistor of the stage" + didYouMean(name, bipolar),
                        bipolar.isEmpty() ? "the stage has no bipolar transistor; write " + FORMS
                                : "use one of the stage's bipolar transistors (" + String.join(", ", bipolar)
                                + "), e.g. beta:" + bipolar.get(0) + "=1.7");
            };
            Optional<Part> part = stage.part(name);
            if (part.isEmpty()) {
                return notBipolar.fault();
            }
            return part.get().match(new Part.Cases<Reading>() {
                @Override
                public Reading resistor(Resistor resistor) {
                    return notBipolar;
                }

                @Override
                public Reading capacitor(Capacitor capacitor) {
                    return notBipolar;
                }

                @Override
                public Reading bjt(Bjt bjt) {
                    return () -> new Fault.CurrentGain(name, positive(trimmed, value, Quantity.DIMENSIONLESS,
                            "a factor such as beta:" + name + "=1.7 (β as built over the stage file's β)"));
                }

                @Override
                public Reading mosfet(Mosfet mosfet) {
                    return () -> {
                        throw problem(trimmed, "names a MOSFET, which has no current gain β",
                                "a MOSFET's spread shows in its bias current: write bias:" + name + "=0.6");
                    };
                }
            }).fault();
        }
        int colon = key.indexOf(':');
        if (colon >= 0) {
            String kind = key.substring(0, colon + 1);
            throw problem(trimmed, "has no kind of fault '" + kind + "'" + didYouMean(kind, List.of(BIAS, BETA)),
                    "write " + FORMS);
        }
        Optional<Part> part = stage.part(key);
        if (part.isPresent()) {
            return part.get().match(new Part.Cases<Reading>() {
                @Override
                public Reading resistor(Resistor resistor) {
                    return () -> new Fault.ResistorValue(key, positive(trimmed, value, Quantity.OHMS,
                            "a value in ohms such as " + key + "=22 or " + key + "=4.7k"));
                }

                @Override
                public Reading capacitor(Capacitor capacitor) {
                    return () -> new Fault.CapacitorValue(key, capacitance(trimmed, value, key));
                }

                @Override
                public Reading bjt(Bjt bjt) {
                    return noValueOfItsOwn(trimmed, key, " or beta:" + key + "=1.7 (a current gain factor)");
                }

                @Override
                public Reading mosfet(Mosfet mosfet) {
                    return noValueOfItsOwn(trimmed, key, "");
                }
            }).fault();
        }
        List<String> capacitors = stage.capacitors().stream().map(Capacitor::name).toList();
        List<String> resistors = stage.resistors().stream().map(Resistor::name).toList();
        List<String> candidates = new ArrayList<>(capacitors);
        candidates.addAll(resistors);
        candidates.add("gain");
        List<String> offered = new ArrayList<>();
        if (!capacitors.isEmpty()) {
            offered.add("capacitors (" + String.join(", ", capacitors) + ")");
        }
        if (!resistors.isEmpty()) {
            offered.add("resistors (" + String.join(", ", resistors) + ")");
        }
        throw problem(trimmed, "names no capacitor or resistor of the stage" + didYouMean(key, candidates),
                (offered.isEmpty() ? "" : "use one of the stage's " + String.join(" or ", offered) + "; ")
                        + "forms: " + FORMS);
    }

    /** Reads {@code 0.05dB,0.5deg} (either order; a bare number in the first place is dB). */
    public static SweepNoise noise(String text) throws InputProblem {
        String[] parts = text.split(",");
        if (parts.length != 2) {
            throw problem(text, "is not GAIN,PHASE", "write --noise 0.05dB,0.5deg");
        }
        double db = Double.NaN;
        double deg = Double.NaN;
        for (int i = 0; i < 2; i++) {
            String piece = parts[i].strip();
            try {
                if (piece.endsWith("deg") || piece.endsWith("°")) {
                    deg = EngineeringValue.parseNumber(piece.replace("deg", "").replace("°", "").strip());
                } else {
                    db = EngineeringValue.parse(piece, Quantity.DECIBELS);
                }
            } catch (IllegalArgumentException e) {
                throw problem(text, "has no number in '" + piece + "'", "write --noise 0.05dB,0.5deg");
            }
        }
        if (!(db >= 0) || !(deg >= 0)) {
            throw problem(text, "needs one gain σ in dB and one phase σ in degrees, both at least 0",
                    "write --noise 0.05dB,0.5deg");
        }
        return new SweepNoise(db, deg);
    }

    /**
     * @return a caution about the text when it is read as written but may not mean what the user
     *         meant: a capacitor fault in millifarads ({@code C3=4.7mF}), which some write for µF
     */
    public static Optional<String> caution(String text, Stage stage) {
        String trimmed = text.strip();
        int equals = trimmed.indexOf('=');
        if (equals <= 0) {
            return Optional.empty();
        }
        String key = trimmed.substring(0, equals).strip();
        if (stage.capacitors().stream().noneMatch(c -> c.name().equals(key))) {
            return Optional.empty();
        }
        String value = trimmed.substring(equals + 1).strip();
        try {
            EngineeringValue.Written written = EngineeringValue.capacitance(value);
            if (written.milli()) {
                return Optional.of("--fault " + trimmed + ": '" + value + "' is read as "
                        + EngineeringValue.format(written.value(), "F")
                        + " (m is milli, 1 mF = 1000 µF); if microfarads are meant, write u or µ");
            }
        } catch (IllegalArgumentException e) {
            // parse refuses it with its own message
        }
        return Optional.empty();
    }

    /** A capacitor's value must state its scale (EngineeringValue.capacitance): C3=47 is refused. */
    private static double capacitance(String whole, String value, String key) throws InputProblem {
        String example = "a value with an SI prefix such as " + key + "=4.7u or " + key + "=47u, or with the unit F"
                + " when farads are meant (" + key + "=47F)";
        double number;
        try {
            number = EngineeringValue.capacitance(value).value();
        } catch (IllegalArgumentException e) {
            throw problem(whole, "has no capacitance after '=' (" + e.getMessage() + ")", "write " + example);
        }
        if (!(number > 0)) {
            throw problem(whole, "needs a positive value", "write " + example);
        }
        return number;
    }

    private static double positive(String whole, String value, Quantity quantity, String example) throws InputProblem {
        double number;
        try {
            number = EngineeringValue.parse(value, quantity);
        } catch (IllegalArgumentException e) {
            throw problem(whole, "has no number after '=' (" + e.getMessage() + ")", "write " + example);
        }
        if (!(number > 0)) {
            throw problem(whole, "needs a positive value", "write " + example);
        }
        return number;
    }

    /** @return the refusal of a value for a transistor; {@code betaHint} offers β when it has one */
    private static Reading noValueOfItsOwn(String whole, String key, String betaHint) {
        return () -> {
            throw problem(whole, "names a transistor, which has no value of its own",
                    "write bias:" + key + "=0.6 (a bias current factor)" + betaHint);
        };
    }

    /** @return " (did you mean RE?)" for the closest designators, or an empty text */
    private static String didYouMean(String written, List<String> candidates) {
        List<String> close = Spelling.closestAll(written, candidates);
        return close.isEmpty() ? "" : " (did you mean " + String.join(" or ", close) + "?)";
    }

    private static InputProblem problem(String text, String what, String hint) {
        return new InputProblem(null, 0, "'" + text + "' " + what, hint);
    }

    /**
     * What a part's type makes of the text: the fault, or the refusal. A {@link Part.Cases}
     * gives one per part type (a visitor cannot throw the checked {@link InputProblem} itself),
     * so a new part type fails to compile here until its faults are read.
     */
    @FunctionalInterface
    private interface Reading {
        Fault fault() throws InputProblem;
    }
}

package org.polebench.measure;

import java.util.Locale;
import org.polebench.InputProblem;
import org.polebench.circuit.Capacitor;
import org.polebench.circuit.Part;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;

/**
 * Reads a fault as a user writes it on the command line: {@code C3=4.7u} (a capacitor fitted
 * at another value), {@code bias:Q1=0.6} (a transistor's bias current times 0.6),
 * {@code gain=10} (a flat gain error of ×10, as a ×10 probe read as ×1), and the synthesizer's
 * noise as {@code 0.05dB,0.5deg}. Every refusal names what was written and what would fix it.
 */
public final class FaultText {
    private FaultText() {
    }

    /** @throws InputProblem when the text names no part of the stage or its value is no number */
    public static Fault parse(String text, Stage stage) throws InputProblem {
        String trimmed = text.strip();
        int equals = trimmed.indexOf('=');
        if (equals <= 0 || equals == trimmed.length() - 1) {
            throw problem(trimmed, "is not PART=VALUE", "write C3=4.7u, bias:Q1=0.6 or gain=10");
        }
        String key = trimmed.substring(0, equals).strip();
        String value = trimmed.substring(equals + 1).strip();
        if (key.equalsIgnoreCase("gain")) {
            return new Fault.FlatGain(positive(trimmed, value, Quantity.DIMENSIONLESS, "a gain factor such as 10"));
        }
        if (key.toLowerCase(Locale.ROOT).startsWith("bias:")) {
            String name = key.substring(5).strip();
            Part part = stage.part(name).orElse(null);
            if (!(part instanceof Transistor)) {
                throw problem(trimmed, "names no transistor of the stage", "use a transistor's designator, e.g. bias:Q1=0.6");
            }
            return new Fault.BiasCurrent(name, positive(trimmed, value, Quantity.DIMENSIONLESS, "a factor such as 0.6"));
        }
        Part part = stage.part(key).orElse(null);
        if (!(part instanceof Capacitor)) {
            throw problem(trimmed, "names no capacitor of the stage",
                    "use a capacitor's designator (C3=4.7u), bias:Q1=0.6 or gain=10");
        }
        return new Fault.CapacitorValue(key, positive(trimmed, value, Quantity.FARADS, "a value such as 4.7u"));
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

    private static InputProblem problem(String text, String what, String hint) {
        return new InputProblem(null, 0, "'" + text + "' " + what, hint);
    }
}

package org.polebench.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.polebench.units.EngineeringValue;

/**
 * One measuring channel: its coupling and its input resistance and capacitance (with a probe,
 * the probe's). The R ∥ C loads the node the channel is connected to; an AC coupling is a
 * first-order high-pass jω/(jω + ωc) on the channel's reading, ωc = 2π·cornerHz.
 *
 * @param coupling {@link Coupling#DC} by default
 * @param cornerHz the AC coupling's −3 dB frequency in Hz, positive; empty for a DC channel, and
 *                 for an AC channel whose corner the bench file gives as {@code unknown}
 * @param ohms     the channel's input resistance in Ω, positive; empty when not given (no load)
 * @param farads   the channel's input capacitance in F, positive; empty when not given
 * @param line     1-based line of the channel's section in its file, 0 when built in code
 */
public record Channel(Coupling coupling, OptionalDouble cornerHz, OptionalDouble ohms, OptionalDouble farads,
                      int line) {
    /** A DC-coupled channel that loads nothing: an ideal one. */
    public static final Channel IDEAL = new Channel(Coupling.DC, OptionalDouble.empty(), OptionalDouble.empty(),
            OptionalDouble.empty(), 0);

    public Channel {
        if (coupling == Coupling.DC && cornerHz.isPresent()) {
            throw new IllegalArgumentException("a DC-coupled channel has no corner");
        }
        positiveIfPresent(cornerHz, "corner");
        positiveIfPresent(ohms, "resistance");
        positiveIfPresent(farads, "capacitance");
    }

    /** @return true for an AC channel whose corner the file gives as {@code unknown} */
    public boolean cornerUnknown() {
        return coupling == Coupling.AC && cornerHz.isEmpty();
    }

    /** @return true when the channel puts a resistance or a capacitance on its node */
    public boolean loads() {
        return ohms.isPresent() || farads.isPresent();
    }

    /**
     * @param frequencyHz positive
     * @return the factor the coupling multiplies the reading by: 1 for DC, jω/(jω + ωc) for AC
     * @throws IllegalArgumentException for an AC channel whose corner is unknown (check
     *                                  {@link #cornerUnknown()} first)
     */
    public Complex readingFactor(double frequencyHz) {
        if (coupling == Coupling.DC) {
            return Complex.ONE;
        }
        if (cornerHz.isEmpty()) {
            throw new IllegalArgumentException("the channel's AC-coupling corner is unknown");
        }
        return highPass(frequencyHz, cornerHz.getAsDouble());
    }

    /**
     * The first-order high-pass jω/(jω + ωc) = jf/(jf + fc), its value at f = fc being
     * (1 + j)/2: −3.01 dB, +45° (any circuits text; from memory).
     *
     * @param frequencyHz positive
     * @param cornerHz    positive
     */
    public static Complex highPass(double frequencyHz, double cornerHz) {
        Complex jf = new Complex(0, frequencyHz);
        return jf.divide(jf.add(cornerHz));
    }

    /** @return for people and provenance notes: {@code AC at 3.3 Hz, 1 MΩ ∥ 15 pF} */
    public String describe() {
        List<String> parts = new ArrayList<>();
        if (coupling == Coupling.DC) {
            parts.add("DC");
        } else {
            parts.add(cornerHz.isPresent() ? "AC at " + EngineeringValue.format(cornerHz.getAsDouble(), "Hz")
                    : "AC at an unknown corner");
        }
        List<String> load = new ArrayList<>();
        ohms.ifPresent(r -> load.add(EngineeringValue.format(r, "Ω")));
        farads.ifPresent(c -> load.add(EngineeringValue.format(c, "F")));
        String text = String.join(", ", parts);
        return load.isEmpty() ? text : String.format(Locale.ROOT, "%s, %s", text, String.join(" ∥ ", load));
    }

    private static void positiveIfPresent(OptionalDouble value, String what) {
        if (value.isPresent() && !(value.getAsDouble() > 0 && Double.isFinite(value.getAsDouble()))) {
            throw new IllegalArgumentException("a channel's " + what + " must be positive and finite, was "
                    + value.getAsDouble());
        }
    }
}

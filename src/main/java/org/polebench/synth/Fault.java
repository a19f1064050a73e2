package org.polebench.synth;

import java.util.Locale;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Stage;
import org.polebench.units.EngineeringValue;

/**
 * One way a synthesized board differs from its stage as designed: nothing, a capacitor or a
 * resistor of another value, a bipolar transistor whose current gain β differs from the stage
 * file's, a transistor whose bias current is off by a factor, or a flat gain error (a ×10 probe
 * read as ×1, a generator level mistake). The behaviour sits on each kind, so the synthesizer
 * applies any list of them without asking which is which.
 *
 * <p>Order, as {@link StageBoard#asBuilt} applies them: first every fault's
 * {@link #applyTo(Stage)} (capacitor, resistor and β faults change the stage's parts), then the
 * bias of the stage as built is solved, so that a resistor or β fault moves the operating point
 * as it does on a real board; then every {@link #applyTo(OperatingPoints)} (a bias fault scales
 * the solved current) and {@link #gainFactor()}.
 */
public sealed interface Fault
        permits Fault.None, Fault.CapacitorValue, Fault.ResistorValue, Fault.CurrentGain, Fault.BiasCurrent,
        Fault.FlatGain {

    /**
     * @return the stage as built: a capacitor, resistor or β fault returns a new stage with its
     *         part changed; the other kinds return {@code stage} itself
     */
    default Stage applyTo(Stage stage) {
        return stage;
    }

    /** @return the operating points as built: a bias fault scales one transistor's current */
    default OperatingPoints applyTo(OperatingPoints points) {
        return points;
    }

    /** @return the flat factor (V/V, positive) by which the measured gain is off; 1 for no gain fault */
    default double gainFactor() {
        return 1;
    }

    /** @return the fault in words for a sweep's provenance notes */
    String describe();

    /**
     * @param designed the stage as designed, holding this fault's part
     * @return the part's value in the stage file, such as "RE = 1.2 kΩ", for a hint; empty for
     *         the kinds that change no part
     */
    default String designedValue(Stage designed) {
        return "";
    }

    /** The healthy board: nothing differs from the stage file. */
    record None() implements Fault {
        @Override
        public String describe() {
            return "none (healthy board)";
        }
    }

    /**
     * @param capacitor the capacitor's reference designator
     * @param farads    its value as built, positive
     */
    record CapacitorValue(String capacitor, double farads) implements Fault {
        public CapacitorValue {
            if (!(farads > 0) || !Double.isFinite(farads)) {
                throw new IllegalArgumentException(capacitor + ": a capacitor value must be positive, was " + farads);
            }
        }

        @Override
        public Stage applyTo(Stage stage) {
            return stage.withCapacitance(capacitor, farads);
        }

        @Override
        public String describe() {
            return capacitor + " fitted as " + EngineeringValue.format(farads, "F");
        }

        @Override
        public String designedValue(Stage designed) {
            return capacitor + " = " + EngineeringValue.format(designed.capacitor(capacitor).farads(), "F");
        }
    }

    /**
     * A resistor of another value: it moves the DC operating point as well as the small-signal
     * network, so the bias is solved again for the board as built (a transistor whose stage file
     * gives its current, {@code bias: {ic: ..}}, keeps that current).
     *
     * @param resistor the resistor's reference designator
     * @param ohms     its value as built, positive and finite
     */
    record ResistorValue(String resistor, double ohms) implements Fault {
        public ResistorValue {
            if (!(ohms > 0) || !Double.isFinite(ohms)) {
                throw new IllegalArgumentException(resistor + ": a resistor value must be positive and finite, was "
                        + ohms);
            }
        }

        @Override
        public Stage applyTo(Stage stage) {
            return stage.withResistance(resistor, ohms);
        }

        @Override
        public String describe() {
            return resistor + " fitted as " + EngineeringValue.format(ohms, "Ω");
        }

        @Override
        public String designedValue(Stage designed) {
            return resistor + " = " + EngineeringValue.format(designed.resistor(resistor).ohms(), "Ω");
        }
    }

    /**
     * A bipolar transistor whose current gain β differs from the stage file's (parts of one type
     * spread by a factor of two or more either way: common practice). β sets rπ = β/gm in small
     * signal, and with
     * {@code bias: auto} the base current the divider must supply, so the bias is solved again; a
     * given current ({@code bias: {ic: ..}}) stays, and only rπ and the base current move.
     *
     * @param transistor the bipolar transistor's reference designator
     * @param factor     β as built over the stage file's β, positive and finite
     */
    record CurrentGain(String transistor, double factor) implements Fault {
        public CurrentGain {
            if (!(factor > 0) || !Double.isFinite(factor)) {
                throw new IllegalArgumentException(transistor + ": a current gain factor must be positive, was "
                        + factor);
            }
        }

        /** @throws IllegalArgumentException when the stage has no bipolar transistor of this name */
        @Override
        public Stage applyTo(Stage stage) {
            return stage.withBeta(transistor, stage.bjt(transistor).beta() * factor);
        }

        @Override
        public String describe() {
            return transistor + " current gain β ×" + String.format(Locale.ROOT, "%.4g", factor)
                    + " of the stage file's";
        }

        @Override
        public String designedValue(Stage designed) {
            double beta = designed.bjt(transistor).beta();
            // a β as a stage file writes it: 150, not 150.0
            return transistor + " β = " + (beta == Math.rint(beta) && beta < 1e15 ? Long.toString((long) beta)
                    : String.format(Locale.ROOT, "%.4g", beta));
        }
    }

    /**
     * @param transistor the transistor's reference designator
     * @param factor     the bias current as built over the designed one, positive
     */
    record BiasCurrent(String transistor, double factor) implements Fault {
        public BiasCurrent {
            if (!(factor > 0) || !Double.isFinite(factor)) {
                throw new IllegalArgumentException(transistor + ": a bias factor must be positive, was " + factor);
            }
        }

        @Override
        public OperatingPoints applyTo(OperatingPoints points) {
            return points.withCurrentScaled(transistor, factor);
        }

        @Override
        public String describe() {
            return transistor + " bias current ×" + String.format(Locale.ROOT, "%.4g", factor);
        }
    }

    /** @param factor measured gain over true gain, V/V, positive (10 for a ×10 probe read as ×1) */
    record FlatGain(double factor) implements Fault {
        public FlatGain {
            if (!(factor > 0) || !Double.isFinite(factor)) {
                throw new IllegalArgumentException("a gain factor must be positive, was " + factor);
            }
        }

        @Override
        public double gainFactor() {
            return factor;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "flat gain ×%.4g (%+.2f dB)", factor, 20 * Math.log10(factor));
        }
    }
}

package org.polebench.measure;

import java.util.Locale;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Stage;
import org.polebench.units.EngineeringValue;

/**
 * One way a synthesized board differs from its stage as designed: nothing, a capacitor of
 * another value, a transistor whose bias current is off by a factor, or a flat gain error
 * (a ×10 probe read as ×1, a generator level mistake). The behaviour sits on each kind, so
 * the synthesizer applies any list of them without asking which is which.
 */
public sealed interface Fault permits Fault.None, Fault.CapacitorValue, Fault.BiasCurrent, Fault.FlatGain {

    /** @return the stage as built: a capacitor fault changes its part, the others leave it */
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

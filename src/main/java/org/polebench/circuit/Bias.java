package org.polebench.circuit;

import java.util.OptionalDouble;

/**
 * How a transistor's DC operating point is found. Code asks {@link #givenAmps()} rather than
 * testing the type, so a new kind of bias must say what it gives before anything compiles.
 */
public sealed interface Bias permits Bias.Auto, Bias.Given {

    /** @return the given collector or drain current in amperes, empty when the bias is solved */
    OptionalDouble givenAmps();

    /** {@code bias: auto}: solved from the DC network (VBE(on) and β; square law for MOSFETs). */
    record Auto() implements Bias {
        @Override
        public OptionalDouble givenAmps() {
            return OptionalDouble.empty();
        }
    }

    /**
     * {@code bias: {ic: 1.1m}} or {@code {id: 1m}}: a measured or known current.
     *
     * @param amps collector current (BJT) or drain current (MOSFET), a positive magnitude
     *             for either polarity
     */
    record Given(double amps) implements Bias {
        public Given {
            if (!(amps > 0) || !Double.isFinite(amps)) {
                throw new IllegalArgumentException("a given bias current must be positive and finite, was " + amps);
            }
        }

        @Override
        public OptionalDouble givenAmps() {
            return OptionalDouble.of(amps);
        }
    }
}

package org.polebench.circuit;

/** How a transistor's DC operating point is found. */
public sealed interface Bias permits Bias.Auto, Bias.Given {

    /** {@code bias: auto}: solved from the DC network (VBE(on) and β; square law for MOSFETs). */
    record Auto() implements Bias {
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
    }
}

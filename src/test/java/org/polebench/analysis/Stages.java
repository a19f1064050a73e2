package org.polebench.analysis;

import org.polebench.circuit.SmallSignalNetwork;

/** Hand-built hybrid-π stages with the parameter names the textbook formulas use. */
final class Stages {
    private Stages() {
    }

    /** Common-emitter parameters; ro may be infinite. */
    record CommonEmitter(double rs, double rb, double rpi, double gm, double ro, double rc, double rl, double re,
                         double c1, double c2, double ce) {
        double beta() {
            return gm * rpi;
        }

        SmallSignalNetwork network() {
            return new NetworkBuilder()
                    .resistor("RS", "src", "in", rs)
                    .capacitor("C1", "in", "b", c1)
                    .resistor("RB", "b", "gnd", rb)
                    .bjt("Q1", "c", "b", "e", gm, rpi, ro)
                    .resistor("RC", "c", "gnd", rc)
                    .capacitor("C2", "c", "out", c2)
                    .resistor("RL", "out", "gnd", rl)
                    .resistor("RE", "e", "gnd", re)
                    .capacitor("CE", "e", "gnd", ce)
                    .build("src", "out");
        }
    }

    /** A typical 1 mA common-emitter stage: gm = 40 mS, β = 200, VA = 100 V. */
    static CommonEmitter typicalCommonEmitter() {
        return new CommonEmitter(600, 18e3, 5e3, 0.04, 100e3, 4.7e3, 47e3, 1e3, 1e-6, 10e-6, 100e-6);
    }

    static double parallel(double a, double b) {
        return a * b / (a + b);
    }
}

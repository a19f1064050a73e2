package org.polebench.circuit;

/** The operating region of a transistor that {@link BiasSolver} accepts: the amplifying one. */
public enum Region {
    /** BJT: base–emitter forward biased, base–collector reverse biased, IC = β·IB. */
    FORWARD_ACTIVE,
    /** MOSFET: saturation (pinch-off), VDS ≥ VGS − Vth, ID = (k/2)(VGS − Vth)². */
    SATURATION
}

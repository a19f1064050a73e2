package org.polebench.circuit;

import java.util.List;
import java.util.Optional;

/**
 * A MOSFET in the square-law model ID = (k/2)·(VGS − Vth)² in saturation (docs/method.md,
 * "The small-signal network"; Sedra and Smith, Microelectronic Circuits, the MOSFET chapter, from memory).
 *
 * @param channel               NMOS or PMOS
 * @param drain                 node of the drain
 * @param gate                  node of the gate
 * @param source                node of the source
 * @param body                  node of the body (bulk); empty means tied to the source (gmb = 0)
 * @param vthVolts              zero-bias threshold as written: positive for an enhancement NMOS,
 *                              negative for a PMOS (its magnitude is used)
 * @param kAmpsPerVoltSquared   k of ID = (k/2)(VGS − Vth)², positive
 * @param lambdaPerVolt         channel-length modulation λ, small-signal only; 0 means ro infinite
 * @param gammaRootVolts        body-effect coefficient γ in √V; 0 means no body effect
 * @param surfacePotentialVolts 2φF of the body effect, positive (default 0.6 V)
 * @param cgsFarads             gate–source capacitance (high band); 0 when absent
 * @param cgdFarads             gate–drain capacitance (high band); 0 when absent
 * @param bias                  solved or given drain current
 * @param biasTolerance         prior tolerance of the bias current (default ±20 %)
 * @param line                  1-based line in the stage file, 0 when built in code
 */
public record Mosfet(String name, Channel channel, String drain, String gate, String source, Optional<String> body,
                     double vthVolts, double kAmpsPerVoltSquared, double lambdaPerVolt, double gammaRootVolts,
                     double surfacePotentialVolts, double cgsFarads, double cgdFarads, Bias bias,
                     Tolerance biasTolerance, int line) implements Part, Transistor {

    /**
     * 2φF when {@code surface-potential} is not given: 0.6 V, the typical value quoted by Sedra and
     * Smith, Microelectronic Circuits, body-effect section (from memory).
     */
    public static final double DEFAULT_SURFACE_POTENTIAL_VOLTS = 0.6;

    public enum Channel {
        NMOS, PMOS;

        /** @return +1 for NMOS, −1 for PMOS */
        public int sign() {
            return this == NMOS ? 1 : -1;
        }

        public String word() {
            return this == NMOS ? "nmos" : "pmos";
        }
    }

    public Mosfet {
        if (!(kAmpsPerVoltSquared > 0) || !Double.isFinite(kAmpsPerVoltSquared)) {
            throw new IllegalArgumentException(name + ": k must be positive and finite, was " + kAmpsPerVoltSquared);
        }
        if (!Double.isFinite(vthVolts)) {
            throw new IllegalArgumentException(name + ": vth must be finite");
        }
        if (!(lambdaPerVolt >= 0) || !(gammaRootVolts >= 0) || !(cgsFarads >= 0) || !(cgdFarads >= 0)
                || !Double.isFinite(lambdaPerVolt + gammaRootVolts + cgsFarads + cgdFarads)) {
            throw new IllegalArgumentException(name + ": lambda, gamma, cgs and cgd must be finite and >= 0");
        }
        if (!(surfacePotentialVolts > 0) || !Double.isFinite(surfacePotentialVolts)) {
            throw new IllegalArgumentException(name + ": surface potential must be positive");
        }
    }

    /** @return |Vth| at zero source–body voltage, in volts (the magnitude in the device's own sense) */
    public double thresholdMagnitudeVolts() {
        return channel.sign() * vthVolts;
    }

    /** @return true when a body terminal is given on a node other than the source and γ > 0 */
    public boolean hasBodyEffect() {
        return body.isPresent() && !body.get().equals(source) && gammaRootVolts > 0;
    }

    /** @return drain, gate, source, and the body when given */
    @Override
    public List<String> terminalNodes() {
        return body.isPresent() ? List.of(drain, gate, source, body.get()) : List.of(drain, gate, source);
    }

    @Override
    public Optional<Transistor> asTransistor() {
        return Optional.of(this);
    }

    /** @return NaN: a tolerance spread draws nothing of a MOSFET */
    @Override
    public double drawnValue() {
        return Double.NaN;
    }

    @Override
    public Optional<Tolerance> drawnTolerance() {
        return Optional.empty();
    }

    @Override
    public Mosfet withDrawnValue(double value) {
        return this;
    }

    @Override
    public <R> R match(Part.Cases<R> cases) {
        return cases.mosfet(this);
    }

    @Override
    public int sign() {
        return channel.sign();
    }

    @Override
    public String controlNode() {
        return gate;
    }

    @Override
    public String commonNode() {
        return source;
    }

    @Override
    public String controlTerminal() {
        return "gate";
    }

    @Override
    public String commonTerminal() {
        return "source";
    }

    @Override
    public String terminalRole(String node) {
        return node.equals(drain) ? "drain" : node.equals(gate) ? "gate" : node.equals(source) ? "source" : "body";
    }

    @Override
    public <R> R match(Transistor.Cases<R> cases) {
        return cases.mosfet(this);
    }
}

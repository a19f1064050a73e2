package org.polebench.circuit;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * A bipolar transistor with its DC and small-signal parameters (docs/method.md, "The small-signal network").
 *
 * @param polarity          NPN or PNP
 * @param collector         node of the collector
 * @param base              node of the base
 * @param emitter           node of the emitter
 * @param beta              DC and small-signal current gain β = IC/IB, positive
 * @param betaTolerance     the spread of β ({@code beta-tolerance}, ±50 % when not given)
 * @param vbeOnVolts        |VBE| in forward-active operation, positive (default 0.65 V)
 * @param earlyVolts        Early voltage VA, positive; empty means ro is infinite
 * @param rxOhms            base spreading resistance, small-signal only; 0 when absent
 * @param cpiFarads         base–emitter capacitance Cπ (high band); 0 when absent
 * @param cmuFarads         base–collector capacitance Cμ (high band); 0 when absent
 * @param bias              solved or given collector current
 * @param biasTolerance     prior tolerance of the bias current (default ±20 %)
 * @param line              1-based line in the stage file, 0 when built in code
 */
public record Bjt(String name, Polarity polarity, String collector, String base, String emitter,
                  double beta, Tolerance betaTolerance, double vbeOnVolts, OptionalDouble earlyVolts,
                  double rxOhms, double cpiFarads, double cmuFarads, Bias bias, Tolerance biasTolerance, int line)
        implements Part, Transistor {

    /** VBE(on) when the stage file does not give {@code vbe-on} (docs/method.md, "The small-signal network"; common practice 0.6–0.7 V). */
    public static final double DEFAULT_VBE_ON_VOLTS = 0.65;

    public enum Polarity {
        NPN, PNP;

        /** @return +1 for NPN, −1 for PNP: the sign that turns VBE, VCE into the device's own sense */
        public int sign() {
            return this == NPN ? 1 : -1;
        }

        public String word() {
            return this == NPN ? "npn" : "pnp";
        }
    }

    public Bjt {
        if (!(beta > 0) || !Double.isFinite(beta)) {
            throw new IllegalArgumentException(name + ": beta must be positive and finite, was " + beta);
        }
        if (!(vbeOnVolts > 0) || !Double.isFinite(vbeOnVolts)) {
            throw new IllegalArgumentException(name + ": vbe-on must be positive, was " + vbeOnVolts);
        }
        if (earlyVolts.isPresent() && !(earlyVolts.getAsDouble() > 0 && Double.isFinite(earlyVolts.getAsDouble()))) {
            throw new IllegalArgumentException(name + ": early voltage must be positive and finite");
        }
        if (!(rxOhms >= 0) || !(cpiFarads >= 0) || !(cmuFarads >= 0)
                || !Double.isFinite(rxOhms + cpiFarads + cmuFarads)) {
            throw new IllegalArgumentException(name + ": rx, cpi and cmu must be finite and >= 0");
        }
    }

    public Bjt withBeta(double newBeta) {
        return new Bjt(name, polarity, collector, base, emitter, newBeta, betaTolerance, vbeOnVolts, earlyVolts,
                rxOhms, cpiFarads, cmuFarads, bias, biasTolerance, line);
    }

    /** @return collector, base, emitter */
    @Override
    public List<String> terminalNodes() {
        return List.of(collector, base, emitter);
    }

    @Override
    public Optional<Transistor> asTransistor() {
        return Optional.of(this);
    }

    /** @return β: a BJT's current gain is drawn over its {@code beta-tolerance} */
    @Override
    public double drawnValue() {
        return beta;
    }

    @Override
    public Optional<Tolerance> drawnTolerance() {
        return Optional.of(betaTolerance);
    }

    @Override
    public Bjt withDrawnValue(double value) {
        return withBeta(value);
    }

    @Override
    public <R> R match(Part.Cases<R> cases) {
        return cases.bjt(this);
    }

    @Override
    public int sign() {
        return polarity.sign();
    }

    @Override
    public String controlNode() {
        return base;
    }

    @Override
    public String commonNode() {
        return emitter;
    }

    @Override
    public String controlTerminal() {
        return "base";
    }

    @Override
    public String commonTerminal() {
        return "emitter";
    }

    @Override
    public String terminalRole(String node) {
        return node.equals(collector) ? "collector" : node.equals(base) ? "base" : "emitter";
    }

    @Override
    public <R> R match(Transistor.Cases<R> cases) {
        return cases.bjt(this);
    }
}

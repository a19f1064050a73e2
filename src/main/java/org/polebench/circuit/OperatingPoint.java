package org.polebench.circuit;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * One transistor's DC operating point. Voltages and currents are in the device's own sense:
 * for an NPN VCE and VBE, for a PNP VEC and VEB; for an NMOS VDS and VGS, for a PMOS VSD and
 * VSG; currents are magnitudes. In the accepted regions all of them are positive. Code that
 * treats the two kinds differently calls {@link #match} with a {@link Cases}, so a new kind
 * fails to compile until every such place handles it.
 */
public sealed interface OperatingPoint permits OperatingPoint.BjtPoint, OperatingPoint.MosfetPoint {

    /** @return the transistor's reference designator */
    String transistor();

    Region region();

    /** @return the collector current (BJT) or drain current (MOSFET) in amperes, positive */
    double currentAmps();

    /** @return true when the stage file gave the current ({@code bias: {ic: ..}}), false when solved */
    boolean currentGiven();

    /** @return each terminal's node voltage against ground, in volts, keyed by terminal letter */
    Map<String, Double> terminalVolts();

    /**
     * @param factor positive; the back-solve's bias-current nuisance parameter
     * @return this point with the current (and a BJT's base current) times {@code factor}; the
     *         voltages are left as solved, since only the small-signal parameters follow the current
     */
    OperatingPoint withCurrentScaled(double factor);

    /** @return VSB (VBS for a PMOS) in volts; 0 for a BJT and for a MOSFET whose body is its source */
    double sourceBodyVolts();

    /** @return what {@code cases} gives for this point's kind */
    <R> R match(Cases<R> cases);

    /** One method per kind of point: adding one breaks every implementation until it handles it. */
    interface Cases<R> {
        R bjt(BjtPoint point);

        R mosfet(MosfetPoint point);
    }

    /**
     * @param collectorAmps IC, positive
     * @param baseAmps      IB = IC/β, positive
     * @param vceVolts      VCE (NPN) or VEC (PNP)
     * @param vbeVolts      VBE (NPN) or VEB (PNP): VBE(on) when solved, the network's value when
     *                      the current is given
     */
    record BjtPoint(String transistor, Region region, double collectorAmps, double baseAmps, double vceVolts,
                    double vbeVolts, boolean currentGiven, Map<String, Double> terminalVolts)
            implements OperatingPoint {
        public BjtPoint {
            terminalVolts = Collections.unmodifiableMap(new LinkedHashMap<>(terminalVolts));
        }

        @Override
        public double currentAmps() {
            return collectorAmps;
        }

        @Override
        public BjtPoint withCurrentScaled(double factor) {
            checkFactor(factor);
            return new BjtPoint(transistor, region, collectorAmps * factor, baseAmps * factor, vceVolts, vbeVolts,
                    currentGiven, terminalVolts);
        }

        @Override
        public double sourceBodyVolts() {
            return 0;
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.bjt(this);
        }
    }

    /**
     * @param drainAmps      ID, positive
     * @param vdsVolts       VDS (NMOS) or VSD (PMOS)
     * @param vgsVolts       VGS (NMOS) or VSG (PMOS)
     * @param vsbVolts       VSB (NMOS) or VBS (PMOS); 0 without a body terminal (body tied to source)
     * @param thresholdVolts the threshold in the device's own sense at this VSB (|Vth| for a PMOS),
     *                       body effect included
     */
    record MosfetPoint(String transistor, Region region, double drainAmps, double vdsVolts, double vgsVolts,
                       double vsbVolts, double thresholdVolts, boolean currentGiven,
                       Map<String, Double> terminalVolts) implements OperatingPoint {
        public MosfetPoint {
            terminalVolts = Collections.unmodifiableMap(new LinkedHashMap<>(terminalVolts));
        }

        @Override
        public double currentAmps() {
            return drainAmps;
        }

        @Override
        public MosfetPoint withCurrentScaled(double factor) {
            checkFactor(factor);
            return new MosfetPoint(transistor, region, drainAmps * factor, vdsVolts, vgsVolts, vsbVolts,
                    thresholdVolts, currentGiven, terminalVolts);
        }

        @Override
        public double sourceBodyVolts() {
            return vsbVolts;
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.mosfet(this);
        }
    }

    private static void checkFactor(double factor) {
        if (!(factor > 0) || !Double.isFinite(factor)) {
            throw new IllegalArgumentException("a current scale factor must be positive and finite, was " + factor);
        }
    }
}

package org.polebench.circuit;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The DC operating point of a whole stage: every node voltage and every transistor's point.
 *
 * @param nodeVolts   node name to DC voltage against ground, in volts (ground included, at 0)
 * @param transistors one point per transistor, in stage-file order
 */
public record OperatingPoints(Map<String, Double> nodeVolts, List<OperatingPoint> transistors) {
    public OperatingPoints {
        nodeVolts = Collections.unmodifiableMap(new LinkedHashMap<>(nodeVolts));
        transistors = List.copyOf(transistors);
    }

    /** @throws IllegalArgumentException when no transistor has this name */
    public OperatingPoint point(String transistor) {
        for (OperatingPoint point : transistors) {
            if (point.transistor().equals(transistor)) {
                return point;
            }
        }
        throw new IllegalArgumentException("no operating point for " + transistor);
    }

    /** @throws IllegalArgumentException when the name is no BJT's */
    public OperatingPoint.BjtPoint bjt(String transistor) {
        return point(transistor).match(new OperatingPoint.Cases<OperatingPoint.BjtPoint>() {
            @Override
            public OperatingPoint.BjtPoint bjt(OperatingPoint.BjtPoint point) {
                return point;
            }

            @Override
            public OperatingPoint.BjtPoint mosfet(OperatingPoint.MosfetPoint point) {
                throw new IllegalArgumentException(transistor + " is not a BJT");
            }
        });
    }

    /** @throws IllegalArgumentException when the name is no MOSFET's */
    public OperatingPoint.MosfetPoint mosfet(String transistor) {
        return point(transistor).match(new OperatingPoint.Cases<OperatingPoint.MosfetPoint>() {
            @Override
            public OperatingPoint.MosfetPoint bjt(OperatingPoint.BjtPoint point) {
                throw new IllegalArgumentException(transistor + " is not a MOSFET");
            }

            @Override
            public OperatingPoint.MosfetPoint mosfet(OperatingPoint.MosfetPoint point) {
                return point;
            }
        });
    }

    /** @return the node's DC voltage in volts; the node must exist */
    public double volts(String node) {
        Double volts = nodeVolts.get(node);
        if (volts == null) {
            throw new IllegalArgumentException("no node " + node);
        }
        return volts;
    }

    /**
     * @return a copy with one transistor's bias current times {@code factor} (positive), for the
     *         back-solve's bias nuisance parameter; node voltages are left as solved
     */
    public OperatingPoints withCurrentScaled(String transistor, double factor) {
        point(transistor);
        List<OperatingPoint> changed = new ArrayList<>(transistors.size());
        for (OperatingPoint point : transistors) {
            changed.add(point.transistor().equals(transistor) ? point.withCurrentScaled(factor) : point);
        }
        return new OperatingPoints(nodeVolts, changed);
    }
}

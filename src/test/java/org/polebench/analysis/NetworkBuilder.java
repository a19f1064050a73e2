package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;
import org.polebench.circuit.Band;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;

/** Builds small-signal networks by hand for tests: named nodes, ground is "gnd". */
final class NetworkBuilder {
    private final List<String> nodes = new ArrayList<>(List.of("gnd"));
    private final List<NetworkElement> elements = new ArrayList<>();

    int node(String name) {
        int index = nodes.indexOf(name);
        if (index >= 0) {
            return index;
        }
        nodes.add(name);
        return nodes.size() - 1;
    }

    NetworkBuilder resistor(String name, String a, String b, double ohms) {
        elements.add(new NetworkElement.Conductance(name, node(a), node(b), 1 / ohms));
        return this;
    }

    NetworkBuilder capacitor(String name, String a, String b, double farads) {
        return capacitor(name, a, b, farads, Band.LOW);
    }

    NetworkBuilder capacitor(String name, String a, String b, double farads, Band band) {
        elements.add(new NetworkElement.Capacitance(name, node(a), node(b), farads, band));
        return this;
    }

    /** gm·(v(cp) − v(cm)) flows from 'from' to 'to' through the source. */
    NetworkBuilder transconductance(String name, String from, String to, String cp, String cm, double siemens) {
        elements.add(new NetworkElement.Transconductance(name, node(from), node(to), node(cp), node(cm), siemens));
        return this;
    }

    /** Hybrid-π BJT: rπ base–emitter, gm collector→emitter, ro collector–emitter (infinite: left out). */
    NetworkBuilder bjt(String name, String c, String b, String e, double gm, double rpi, double ro) {
        resistor(name + ".rpi", b, e, rpi);
        transconductance(name + ".gm", c, e, b, e, gm);
        if (Double.isFinite(ro)) {
            resistor(name + ".ro", c, e, ro);
        }
        return this;
    }

    /** Square-law MOSFET small-signal model without body effect: gm drain→source, ro drain–source. */
    NetworkBuilder mosfet(String name, String d, String g, String s, double gm, double ro) {
        transconductance(name + ".gm", d, s, g, s, gm);
        if (Double.isFinite(ro)) {
            resistor(name + ".ro", d, s, ro);
        }
        return this;
    }

    SmallSignalNetwork build(String driven, String output) {
        return new SmallSignalNetwork(nodes, elements, node(driven), node(output));
    }
}

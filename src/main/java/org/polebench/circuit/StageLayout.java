package org.polebench.circuit;

import java.util.List;

/**
 * Whether one stage is a draw of another: the same parts in the same order on the same nodes,
 * the same ground, supplies, input and output, the same kind of bias per transistor and the
 * same internal base nodes (rx given or not); only part values such as ohms, farads and β may
 * differ. What a Monte Carlo draw changes leaves the DC paths, the node numbering and the
 * small-signal element list as they were, so checks and numbering made once hold for it.
 */
final class StageLayout {
    private StageLayout() {
    }

    static boolean isDrawOf(Stage draw, Stage nominal) {
        if (draw == nominal) {
            return true;
        }
        List<Part> parts = draw.parts();
        List<Part> reference = nominal.parts();
        // identity first: a draw made with Stage.withParts shares these values with its nominal
        if (parts.size() != reference.size() || !draw.ground().equals(nominal.ground())
                || !same(draw.supplies(), nominal.supplies()) || !same(draw.input(), nominal.input())
                || !same(draw.output(), nominal.output())) {
            return false;
        }
        for (int i = 0; i < parts.size(); i++) {
            if (!sameLayout(parts.get(i), reference.get(i))) {
                return false;
            }
        }
        return true;
    }

    private static boolean same(Object a, Object b) {
        return a == b || a.equals(b);
    }

    // typed comparisons: terminalNodes() would build a list per part and draw
    private static boolean sameLayout(Part part, Part was) {
        if (part == was) {
            return true;
        }
        if (part.getClass() != was.getClass() || !part.name().equals(was.name())) {
            return false;
        }
        // the classes are equal, so each case may cast the nominal part to its own type
        return part.match(new Part.Cases<Boolean>() {
            @Override
            public Boolean resistor(Resistor r) {
                return same(r.between(), ((Resistor) was).between());
            }

            @Override
            public Boolean capacitor(Capacitor c) {
                Capacitor w = (Capacitor) was;
                return same(c.between(), w.between()) && c.band() == w.band();
            }

            @Override
            public Boolean bjt(Bjt q) {
                Bjt w = (Bjt) was;
                return q.polarity() == w.polarity() && q.collector().equals(w.collector())
                        && q.base().equals(w.base()) && q.emitter().equals(w.emitter())
                        && (q.rxOhms() > 0) == (w.rxOhms() > 0) && q.bias().getClass() == w.bias().getClass();
            }

            @Override
            public Boolean mosfet(Mosfet m) {
                Mosfet w = (Mosfet) was;
                return m.channel() == w.channel() && m.drain().equals(w.drain()) && m.gate().equals(w.gate())
                        && m.source().equals(w.source()) && m.body().equals(w.body())
                        && m.hasBodyEffect() == w.hasBodyEffect() && m.bias().getClass() == w.bias().getClass();
            }
        });
    }
}

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
        if (parts.size() != reference.size() || !draw.ground().equals(nominal.ground())
                || !draw.supplies().equals(nominal.supplies()) || !draw.input().equals(nominal.input())
                || !draw.output().equals(nominal.output())) {
            return false;
        }
        for (int i = 0; i < parts.size(); i++) {
            if (!sameLayout(parts.get(i), reference.get(i))) {
                return false;
            }
        }
        return true;
    }

    private static boolean sameLayout(Part part, Part was) {
        if (part.getClass() != was.getClass() || !part.name().equals(was.name())
                || !part.terminalNodes().equals(was.terminalNodes())) {
            return false;
        }
        if (part instanceof Transistor
                && ((Transistor) part).bias().getClass() != ((Transistor) was).bias().getClass()) {
            return false;
        }
        if (part instanceof Bjt) {
            return (((Bjt) part).rxOhms() > 0) == (((Bjt) was).rxOhms() > 0);
        }
        if (part instanceof Capacitor) {
            return ((Capacitor) part).band() == ((Capacitor) was).band();
        }
        return true;
    }
}

package org.polebench.spread;

import java.util.SplittableRandom;
import org.polebench.circuit.Stage;

/**
 * One board drawn within the stage's tolerances, as the tolerance spread draws each of its
 * boards ({@link ToleranceBands}: every resistor, capacitor and BJT β uniform in ln across its
 * band, in part order, from one {@link SplittableRandom} with the given seed), for invented
 * boards of a lot. Given bias currents are not drawn: the board's bias is solved from its parts.
 */
public final class BoardDraw {
    private BoardDraw() {
    }

    /**
     * @return the stage with its part values replaced by one draw; with the same seed, the first
     *         board {@link ToleranceSpread} draws
     */
    public static Stage draw(Stage nominal, long seed) {
        return nominal.withPartValues(new ToleranceBands(nominal).board(new SplittableRandom(seed)));
    }
}

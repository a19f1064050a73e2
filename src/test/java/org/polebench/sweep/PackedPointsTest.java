package org.polebench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Packed points are the same list as the records they were made from (the List contract). */
class PackedPointsTest {
    private static List<SweepPoint> records(Random random, boolean phase, boolean uncertainties) {
        List<SweepPoint> points = new ArrayList<>();
        for (int i = 0; i < 50; i++) {
            OptionalDouble u = uncertainties && random.nextBoolean() ? OptionalDouble.of(random.nextDouble())
                    : OptionalDouble.empty();
            points.add(new SweepPoint(1 + i, random.nextGaussian(),
                    phase ? OptionalDouble.of(random.nextGaussian()) : OptionalDouble.empty(), u,
                    phase ? u : OptionalDouble.empty()));
        }
        return points;
    }

    @Test
    void packingKeepsEveryPointAndTheListContract() {
        Random random = new Random(15);   // stated seed
        for (boolean phase : new boolean[] {true, false}) {
            for (boolean uncertainties : new boolean[] {true, false}) {
                List<SweepPoint> records = records(random, phase, uncertainties);
                PackedPoints packed = PackedPoints.of(records);
                // java.util.List: equal element by element, and equal hash codes (List.hashCode's formula)
                assertEquals(records, packed);
                assertEquals(packed, records);
                assertEquals(records.hashCode(), packed.hashCode());
                assertEquals(List.copyOf(records), new Sweep(Provenance.inMemory("test"), records).points());
                assertEquals(phase, packed.hasPhase());
            }
        }
    }

    @Test
    void packedPointsCannotBeChanged() {
        PackedPoints packed = PackedPoints.of(records(new Random(16), true, false));
        assertThrows(UnsupportedOperationException.class, () -> packed.set(0, packed.get(1)));
        assertThrows(UnsupportedOperationException.class, () -> packed.add(packed.get(1)));
    }

    @Test
    void adoptedColumnsAreCheckedAsRecordsAre() {
        // the same rules SweepPoint's constructor keeps: positive finite frequency, finite gain and phase
        assertThrows(IllegalArgumentException.class,
                () -> PackedPoints.adopt(new double[] {1, -2}, new double[] {0, 0}, null, null, null));
        assertThrows(IllegalArgumentException.class,
                () -> PackedPoints.adopt(new double[] {1, 2}, new double[] {0, Double.NaN}, null, null, null));
        assertThrows(IllegalArgumentException.class,
                () -> PackedPoints.adopt(new double[] {1, 2}, new double[] {0}, null, null, null));
        PackedPoints ok = PackedPoints.adopt(new double[] {1, 2}, new double[] {0, 1}, null,
                new double[] {Double.NaN, 0.1}, null);
        assertFalse(ok.get(0).gainUncertaintyDb().isPresent());
        assertTrue(ok.get(1).gainUncertaintyDb().isPresent());
    }
}

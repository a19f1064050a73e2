package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;

/**
 * Imports that cross the column blocks (16384 readings each): shuffled rows with repeats come
 * out sorted and merged as a plain sort and average of the same rows says (issue 15).
 */
class LargeImportTest {
    @TempDir
    Path dir;

    @Test
    void shuffledRowsWithRepeatsAcrossBlocksAreSortedAndMerged() throws Exception {
        int distinct = 20_000;
        List<String> rows = new ArrayList<>();
        for (int i = 0; i < distinct; i++) {
            // whole-number gains, so that the mean of two is exact in binary
            rows.add(String.format(Locale.ROOT, "%d,%d,10", 10 + i, -(i % 7)));
            if (i % 3 == 0) {
                rows.add(String.format(Locale.ROOT, "%d,%d,10", 10 + i, -(i % 7) - 2));
            }
        }
        Collections.shuffle(rows, new Random(15));   // stated seed
        List<String> lines = new ArrayList<>();
        lines.add("Freq,Gain,Phase");
        lines.addAll(rows);
        Path file = Files.write(dir.resolve("shuffled.csv"), lines);

        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(file, "auto").sweep();

        // expected: frequencies 10 … 20009 in order; gain −(i mod 7), one dB lower where the row repeats
        // (the mean of −g and −g − 2), by construction above
        assertEquals(distinct, sweep.size());
        for (int i = 0; i < distinct; i++) {
            assertEquals(10 + i, sweep.points().get(i).frequencyHz(), 0.0);
            assertEquals(-(i % 7) - (i % 3 == 0 ? 1 : 0), sweep.points().get(i).gainDb(), 0.0, "point " + i);
        }
    }

    @Test
    void aColumnThatGainsItsFirstNumberLateKeepsNaNBeforeIt() {
        DoubleColumn column = new DoubleColumn();
        for (int i = 0; i < 40_000; i++) {
            column.add(Double.NaN);
        }
        assertNull(new DoubleColumn().release());   // never a number: no array at all
        column.add(2.5);
        column.set(20_000, 1.5);
        double[] values = column.release();
        assertEquals(40_001, values.length);
        assertTrue(Double.isNaN(values[0]) && Double.isNaN(values[16_384]) && Double.isNaN(values[39_999]));
        assertEquals(1.5, values[20_000], 0.0);
        assertEquals(2.5, values[40_000], 0.0);
    }
}

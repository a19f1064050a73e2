package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class SpellingAndToleranceTest {

    @Test
    void editDistanceCountsInsertionsDeletionsAndSubstitutions() {
        // kitten → sitting needs two substitutions and one insertion: 3 (the standard example of
        // Levenshtein distance, from memory); identical words are 0 apart
        assertEquals(3, Spelling.distance("kitten", "sitting"));
        assertEquals(0, Spelling.distance("beta", "beta"));
        assertEquals(1, Spelling.distance("tolerence", "tolerance"));
    }

    @Test
    void suggestsOnlyCloseWords() {
        assertEquals(Optional.of("tolerance"), Spelling.closest("tolerence", List.of("between", "tolerance")));
        assertEquals(Optional.empty(), Spelling.closest("foo", List.of("between", "tolerance")));
    }

    @Test
    void toleranceBandInLnValue() {
        // ln(1 ± 0.1) by definition; symmetric in value is not symmetric in ln-value
        Tolerance tenPercent = Tolerance.symmetric(0.10);
        assertEquals(Math.log(0.9), tenPercent.lnLower(), 1e-15);
        assertEquals(Math.log(1.1), tenPercent.lnUpper(), 1e-15);
        assertEquals("±10%", tenPercent.describe());
        assertEquals("-20%/+80%", new Tolerance(-0.2, 0.8).describe());
        assertThrows(IllegalArgumentException.class, () -> new Tolerance(-1.0, 0.5));
        assertThrows(IllegalArgumentException.class, () -> new Tolerance(0.3, 0.1));
    }
}

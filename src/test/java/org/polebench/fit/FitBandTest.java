package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.polebench.InputProblem;

class FitBandTest {

    // SI prefixes (BIPM SI Brochure, 9th ed., table 7): k = 10³
    @Test
    void readsABandInEngineeringNotation() throws InputProblem {
        FitBand band = FitBand.parse("20:20k");
        assertEquals(20, band.lowHz());
        assertEquals(20_000, band.highHz());
        assertEquals(new FitBand(5, 1.5e3), FitBand.parse("5 Hz : 1.5 kHz"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"20", "20:10", "0:10", "a:b", "20:20k:30k", ":20k"})
    void refusesWhatIsNotABandWithAHint(String text) {
        InputProblem problem = assertThrows(InputProblem.class, () -> FitBand.parse(text));
        assertTrue(problem.hint().contains("F1:F2"));
    }
}

package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Test;

class PolynomialRootsTest {

    // (v − 2)(v − 3)(v² + 2v + 5) = (v² − 5v + 6)(v² + 2v + 5) = v⁴ − 3v³ + v² − 13v + 30,
    // expanded by hand; roots 2, 3 and −1 ± 2j (closed form)
    @Test
    void sortsRealRootsAndConjugatePairs() {
        PolynomialRoots roots = PolynomialRoots.of(new double[]{30, -13, 1, -3, 1});
        List<Double> real = roots.real.stream().sorted().collect(java.util.stream.Collectors.toList());
        assertEquals(2, real.size());
        // 1e-12: Laguerre's method converges to round-off for simple roots
        assertEquals(2, real.get(0), 1e-12);
        assertEquals(3, real.get(1), 1e-12);
        assertEquals(1, roots.pairs.size());
        assertEquals(-1, roots.pairs.get(0).getReal(), 1e-12);
        assertEquals(2, roots.pairs.get(0).getImaginary(), 1e-12);
    }

    // regression, found while fitting a sweep with a high-band pole: a linearised numerator came
    // out with a leading coefficient of exactly 0, and Commons Math's Laguerre solver, whose
    // default evaluation count is unbounded, never returned. It must be refused at once.
    @Test
    void degenerateLeadingCoefficientIsRefusedNotSpunOn() {
        double[] degenerate = {-5.3920067196895455E-18, -2.4033497540066158E-15, 1341.640786499873, 0.0};
        assertTimeoutPreemptively(Duration.ofSeconds(5), () -> assertNull(PolynomialRoots.of(degenerate)));
    }
}

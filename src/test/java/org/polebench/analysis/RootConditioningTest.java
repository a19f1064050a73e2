package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;

/**
 * Issue 15: each root's condition number, the warning when it is not determined to the digits
 * printed, and a many-fold zero at DC counted as such (not a ring of roots, half in the right
 * half-plane).
 */
class RootConditioningTest {
    @TempDir
    Path folder;

    @Test
    void aPassiveLadderHasItsManyFoldZeroAtDcAndRealDeterminedPoles() throws InputProblem, IOException {
        // n series capacitors with shunt resistors: each series capacitor blocks DC, so the
        // transfer function is s^n times a polynomial with no root at 0 (common practice); and an
        // RC network's poles are simple and on the negative real axis (Guillemin, Synthesis of
        // Passive Networks, 1957; from memory)
        int n = 8;
        StringBuilder yaml = new StringBuilder("name: passive RC ladder (test data, invented)\nground: gnd\n"
                + "input: {node: n0, source-resistance: 100}\noutput: {node: n" + n + "}\nparts:\n");
        for (int i = 1; i <= n; i++) {
            yaml.append(String.format(Locale.ROOT, "  C%d: {capacitor: 1u, between: [n%d, n%d], tolerance: 10%%}%n"
                    + "  R%d: {resistor: 10k, between: [n%d, gnd], tolerance: 1%%}%n", i, i - 1, i, i, i));
        }
        Prediction prediction = predict(yaml.toString());

        Spectrum zeros = prediction.zeros().orElseThrow();
        assertEquals(n, zeros.atDc());
        assertEquals(n, zeros.roots().size());
        Spectrum poles = prediction.poles();
        for (int i = 0; i < poles.roots().size(); i++) {
            ComplexFrequency pole = poles.roots().get(i);
            assertTrue(pole.realRadPerS() < 0 && pole.imaginaryRadPerS() == 0, "pole " + i + ": " + pole);
            assertTrue(poles.determined(i), "pole " + i + " condition " + poles.conditions().get(i));
        }
    }

    @Test
    void theConditionNumberBoundsTheMoveOfASimpleRootUnderAnEntrywiseChange() throws InputProblem, IOException {
        // first-order perturbation theory: a relative change ε of every entry moves a simple
        // root by at most κ·ε relative (Wilkinson 1965, 2.8), κ the componentwise condition,
        // which the reported figure is at least; 1e-10 keeps the eigen solver's own rounding
        // (about 1e-13 relative here) out of the move, and second-order terms are 1e-10 of it
        Prediction prediction = predict(Files.readString(Path.of("sample-measurements",
                "geophone-two-stage.stage.yaml"), StandardCharsets.UTF_8));
        double[][] a = prediction.lowBand().a();
        Spectrum poles = prediction.poles();
        SplittableRandom random = new SplittableRandom(2026_1202L);
        double epsilon = 1e-10;
        for (int trial = 0; trial < 20; trial++) {
            double[][] changed = new double[a.length][];
            for (int i = 0; i < a.length; i++) {
                changed[i] = a[i].clone();
                for (int j = 0; j < a.length; j++) {
                    changed[i][j] *= 1 + epsilon * random.nextDouble(-1, 1);
                }
            }
            Spectrum moved = new PoleFinder().spectrum(changed).orElseThrow();
            for (int m = 0; m < poles.roots().size(); m++) {
                ComplexFrequency root = poles.roots().get(m);
                ComplexFrequency after = moved.roots().get(m);
                double move = Math.hypot(after.realRadPerS() - root.realRadPerS(),
                        after.imaginaryRadPerS() - root.imaginaryRadPerS()) / root.magnitudeRadPerS();
                assertTrue(move <= 1.01 * poles.conditions().get(m) * epsilon,
                        "trial " + trial + ", pole " + m + ": moved " + move + ", condition " + poles.conditions().get(m));
            }
        }
        assertEquals(0, poles.undetermined());
    }

    @Test
    void aDefectiveRootIsNotDeterminedToTheDigitsPrinted() {
        // the companion matrix of (s + 1)⁵: a five-fold root at −1 with a single Jordan block
        // (a companion matrix is nonderogatory), so a relative change ε of its coefficients moves
        // the roots by about ε^(1/5) (Wilkinson 1965, 2.11), 1e-3 for ε = 1e-15, far beyond the
        // fourth digit. (An upper triangular Jordan block would not do: an entrywise change keeps
        // it triangular, and its roots then move by ε only.)
        double[][] companion = {{-5, -10, -10, -5, -1}, {1, 0, 0, 0, 0}, {0, 1, 0, 0, 0}, {0, 0, 1, 0, 0},
                {0, 0, 0, 1, 0}};
        Spectrum spectrum = new PoleFinder().spectrum(companion).orElseThrow();
        for (int i = 0; i < 5; i++) {
            assertFalse(spectrum.determined(i), "root " + i + " condition " + spectrum.conditions().get(i));
        }
        assertEquals(5, spectrum.undetermined());
        // and a diagonal matrix's roots are each exactly as sensitive as their entry: κ = 1
        // (closed form: the eigenvalues are the diagonal entries), so all are determined
        Spectrum diagonal = new PoleFinder().spectrum(new double[][] {{-1, 0}, {0, -30}}).orElseThrow();
        assertEquals(0, diagonal.undetermined());
        // 0.25: the measured move of 1e-15 carries the solver's own rounding, about u = 1.1e-16
        assertEquals(1, diagonal.conditions().get(0), 0.25);
    }

    private Prediction predict(String yaml) throws InputProblem, IOException {
        Path file = folder.resolve("stage-" + yaml.hashCode() + ".stage.yaml");
        Files.writeString(file, yaml, StandardCharsets.UTF_8);
        Stage stage = new StageReader().read(file).stage();
        SmallSignalNetwork network = new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage));
        return (Prediction) new StagePredictor().predict(network);
    }
}

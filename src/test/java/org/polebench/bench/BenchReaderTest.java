package org.polebench.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

class BenchReaderTest {
    @TempDir
    Path dir;

    @Test
    void readsTheIssuesExampleInEngineeringNotation() throws InputProblem {
        // the keys and values of issue 13's example bench file
        Bench bench = BenchFiles.bench(dir, "generator:", "  output-resistance: 50 ohm", "reference: generator",
                "output-channel:", "  coupling: ac", "  corner: 3.3 Hz", "  resistance: 1M", "  capacitance: 15p",
                "input-channel:", "  at: generator", "  coupling: ac", "  corner: 5 Hz", "  resistance: 1M",
                "  capacitance: 15p");

        // the values as written, in SI base units: exact decimal scalings (1e-12 relative: one rounding)
        assertEquals(50, bench.generatorOhms(), 0);
        assertEquals(Optional.of(Reference.GENERATOR), bench.reference());
        assertEquals(Coupling.AC, bench.output().coupling());
        assertEquals(3.3, bench.output().cornerHz().getAsDouble(), 1e-12 * 3.3);
        assertEquals(1e6, bench.output().ohms().getAsDouble(), 1e-12 * 1e6);
        assertEquals(15e-12, bench.output().farads().getAsDouble(), 1e-12 * 15e-12);
        assertEquals(4, bench.output().line());
        InputChannel input = bench.input().orElseThrow();
        assertEquals(ProbePoint.GENERATOR, input.at());
        assertEquals(5, input.channel().cornerHz().getAsDouble(), 1e-12 * 5);
    }

    @Test
    void anEmptyFileIsTheIdealBench() throws InputProblem {
        Bench bench = BenchFiles.bench(dir, "");

        // the defaults the user guide states: 0 Ω, DC, no load, the stage's own reference
        assertEquals(0, bench.generatorOhms(), 0);
        assertEquals(Optional.empty(), bench.reference());
        assertEquals(Channel.IDEAL, bench.output());
        assertEquals(Optional.empty(), bench.input());
    }

    @Test
    void unknownCornerReadsAsAnAcChannelWithoutACorner() throws InputProblem {
        Bench bench = BenchFiles.bench(dir, "output-channel:", "  coupling: ac", "  corner: unknown");

        assertTrue(bench.output().cornerUnknown());
        assertTrue(bench.hasUnknownCorner());
    }

    @Test
    void aMisspeltKeyIsRefusedWithItsLineAndTheKnownKeys() {
        InputProblem problem = assertThrows(InputProblem.class, () -> BenchFiles.bench(dir,
                "output-channel:", "  coupling: ac", "  coner: 3.3 Hz"));

        // line 3 of the text above; the hint lists the section's keys, as the stage reader's does
        assertEquals(3, problem.line());
        assertTrue(problem.getMessage().contains("'coner'") && problem.getMessage().contains("Did you mean 'corner'"),
                problem.getMessage());
        assertTrue(problem.hint().contains("coupling, corner, resistance, capacitance"), problem.hint());
    }

    @Test
    void aChannelCapacitanceWithoutPrefixOrUnitIsRefused() {
        // issue 14: a bare 15 would be 15 F; the scale must be written (15p)
        InputProblem problem = assertThrows(InputProblem.class, () -> BenchFiles.bench(dir,
                "output-channel:", "  coupling: dc", "  capacitance: 15"));
        assertEquals(3, problem.line());
        assertTrue(problem.getMessage().contains("neither a prefix nor the unit F"), problem.getMessage());
        assertTrue(problem.hint().contains("15p") && problem.hint().contains("unit F"), problem.hint());
    }

    @Test
    void aMisspeltTopLevelKeyIsRefused() {
        InputProblem problem = assertThrows(InputProblem.class, () -> BenchFiles.bench(dir,
                "reference: generator", "output-chanel:", "  coupling: dc"));

        assertEquals(2, problem.line());
        assertTrue(problem.getMessage().contains("Did you mean 'output-channel'"), problem.getMessage());
    }

    @Test
    void badValuesAreRefusedWithTheirLines() {
        // each case: the text and the line at fault in it
        assertEquals(2, lineOf("generator:", "  output-resistance: fifty"));
        assertEquals(2, lineOf("output-channel:", "  corner: 3.3 Hz"));           // corner on a DC channel
        assertEquals(2, lineOf("output-channel:", "  coupling: ac"));              // AC without a corner
        assertEquals(3, lineOf("output-channel:", "  coupling: ac", "  corner: 0 Hz"));
        assertEquals(1, lineOf("reference: channel"));
        assertEquals(1, lineOf("input-channel:", "  coupling: dc"));               // no 'at'
        assertEquals(2, lineOf("input-channel:", "  at: probe"));
        assertEquals(2, lineOf("output-channel:", "  resistance: -1M"));
        assertEquals(2, lineOf("output-channel:", "  coupling: AC-ish"));
        assertEquals(1, lineOf("output-channel: ac"));                            // a value, not a map
    }

    private long lineOf(String... lines) {
        return assertThrows(InputProblem.class, () -> BenchFiles.bench(dir, lines)).line();
    }
}

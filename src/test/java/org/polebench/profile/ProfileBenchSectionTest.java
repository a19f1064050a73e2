package org.polebench.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

/** A profile's {@code bench:} section: the bench file's keys, read by the bench package's reader. */
class ProfileBenchSectionTest {
    @Test
    void aTableProfileCarriesABenchSection() throws InputProblem {
        String text = String.join("\n", "kind: table", "name: scope-export", "description: demo", "columns:", "  frequency: 1",
                "  gain: 2", "layout: {header: false}", "bench:", "  output-channel:", "    coupling: ac",
                "    corner: 3.3 Hz", "");

        InstrumentProfile profile = new ProfileReader().read(Path.of("p.yaml"), new StringReader(text));

        assertEquals(3.3, profile.bench().orElseThrow().output().cornerHz().getAsDouble(), 1e-12 * 3.3);
    }

    @Test
    void aProfilesBenchSectionRefusesAMisspeltKeyWithItsLine() {
        String text = String.join("\n", "kind: table", "name: scope-export", "description: demo", "columns:", "  frequency: 1",
                "  gain: 2", "layout: {header: false}", "bench:", "  output-channel:", "    coupling: ac",
                "    cornr: 3.3 Hz", "");

        InputProblem problem = assertThrows(InputProblem.class,
                () -> new ProfileReader().read(Path.of("p.yaml"), new StringReader(text)));

        assertEquals(11, problem.line());   // the misspelt key's line in the text above
    }
}

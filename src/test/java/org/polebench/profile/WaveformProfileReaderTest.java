package org.polebench.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

class WaveformProfileReaderTest {
    private static final String BASE = String.join("\n",
            "kind: waveform",
            "name: test-scope",
            "description: a test layout",
            "layout: {delimiter: tab, header-lines: 2}",
            "time: {interval-line: '^dt=(?<seconds>\\S+)'}",
            "channels: {input: 1, output: 2}",
            "");

    private static InstrumentProfile read(String yaml) throws InputProblem {
        return new ProfileReader().read(Path.of("test.yaml"), new StringReader(yaml));
    }

    @Test
    void readsTheLayoutTheClockTheChannelsAndTheDefaults() throws InputProblem {
        WaveformProfile profile = read(BASE + "samples: {unit: codes, volts-per-code: 0.5m, zero-code: 128, rails: [0, 255]}\n")
                .asWaveform().orElseThrow();
        assertEquals(Delimiter.TAB, profile.layout().delimiter());
        assertEquals(2, profile.layout().headerLines());
        assertEquals("*.csv", profile.layout().files(), "the default files pattern");
        assertTrue(profile.clock().timeColumn().isEmpty());
        assertEquals(FrequencySource.From.ESTIMATED, profile.frequency().from(), "the default: estimated");
        // code 255 is (255 − 128) × 0.5 mV = 63.5 mV (the profile's own scale, by hand)
        assertEquals(0.0635, profile.coding().highVolts().getAsDouble(), 1e-15);
        assertEquals(-0.064, profile.coding().lowVolts().getAsDouble(), 1e-15);
    }

    @Test
    void everyMistakeNamesItsLineAndAFix() {
        // each case: the text, the line the problem must name, words of its message
        Object[][] cases = {
            {BASE.replace("time: {interval-line: '^dt=(?<seconds>\\S+)'}", "time: {column: 1, interval-line: 'x'}"),
                    5, "either a column or an interval-line"},
            {BASE.replace("(?<seconds>\\S+)", "(\\S+)"), 5, "no group named 'seconds'"},
            {BASE + "frequency: {from: header}\n", 7, "from: header needs a pattern"},
            {BASE + "samples: {unit: codes}\n", 7, "unit: codes needs volts-per-code"},
            {BASE + "samples: {unit: volts, rails: [0, 255]}\n", 7, "rails applies to unit: codes"},
            {BASE.replace("channels: {input: 1, output: 2}", "channels: {input: 2, output: 2}"), 6,
                    "must differ"},
            {BASE + "frequency: {from: file-name, pattern: '[0-9]+Hz'}\n", 7, "no group named 'hz'"},
            {BASE + "colour: blue\n", 7, "unknown key 'colour'"},
        };
        for (Object[] c : cases) {
            InputProblem problem = assertThrows(InputProblem.class, () -> read((String) c[0]), (String) c[2]);
            assertEquals(((Integer) c[1]).longValue(), problem.line(), problem.describe());
            assertTrue(problem.getMessage().contains((String) c[2]), problem.describe());
            assertTrue(!problem.hint().isBlank());
        }
    }
}

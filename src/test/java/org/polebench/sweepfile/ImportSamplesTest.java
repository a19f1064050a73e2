package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

class ImportSamplesTest {
    private static final ProfileLibrary LIBRARY = ProfileLibrary.bundled();
    private static final SweepReader READER = new SweepReader(LIBRARY);

    static Stream<Arguments> tableSamples() {
        return Stream.of(
                Arguments.of("db-degrees.csv", "db-degrees"),
                Arguments.of("linear-ratio.csv", "linear-ratio"),
                Arguments.of("two-channel-rms.csv", "two-channel-rms"),
                Arguments.of("semicolon-decimal-comma.txt", "semicolon-decimal-comma"),
                Arguments.of("khz-radians.txt", "khz-radians"),
                Arguments.of("magnitude-only.txt", "magnitude-only"),
                Arguments.of("canonical.csv", "canonical"));
    }

    @Test
    void committedSamplesAreExactlyWhatTheDocumentedGeneratorWrites() throws Exception {
        Map<String, byte[]> expected = DemoImportSamples.render();
        for (Map.Entry<String, byte[]> file : expected.entrySet()) {
            byte[] committed = Files.readAllBytes(DemoImportSamples.FOLDER.resolve(file.getKey()));
            assertArrayEquals(file.getValue(), committed, file.getKey() + " differs from the generator's output");
            String text = new String(committed, java.nio.charset.StandardCharsets.ISO_8859_1);
            assertTrue(text.contains("DEMO DATA"), file.getKey() + " must say it is demo data");
        }
    }

    @ParameterizedTest
    @MethodSource("tableSamples")
    void everyTableSampleReadsAsTheClosedFormItWasMadeFrom(String fileName, String profile) throws InputProblem {
        ImportedSweep imported = READER.read(DemoImportSamples.FOLDER.resolve(fileName), profile);

        assertEquals(41, imported.sweep().size());
        assertTrue(imported.warnings().isEmpty(), imported.warnings().toString());
        assertEquals("2031-04-02T14:05:00Z", imported.sweep().source().captured().orElseThrow().toString());
        assertClosedForm(imported.sweep(), 0.0005 + 1e-9, 0.005 + 1e-9);
    }

    /**
     * Checks every point against {@link DemoSweeps#response} at the point's own frequency.
     * The generator rounds gain to 0.001 dB and phase to 0.01°, so half of those plus
     * round-off bound the difference.
     */
    static void assertClosedForm(Sweep sweep, double gainTolDb, double phaseTolDeg) {
        for (SweepPoint p : sweep.points()) {
            double[] h = DemoSweeps.response(p.frequencyHz());
            assertEquals(h[0], p.gainDb(), gainTolDb, "gain at " + p.frequencyHz());
            if (p.hasPhase()) {
                assertEquals(h[1], p.phaseDeg().getAsDouble(), phaseTolDeg, "phase at " + p.frequencyHz());
            }
        }
    }

    @ParameterizedTest
    @MethodSource("tableSamples")
    void autoSniffsEverySampleWithAHeaderAndSaysWhatItChose(String fileName, String profile) throws InputProblem {
        Path file = DemoImportSamples.FOLDER.resolve(fileName);
        if (profile.equals("magnitude-only")) {
            // no header: sniffing must refuse and name the profile that fits
            InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                    () -> READER.read(file, "auto"));
            assertTrue(problem.getMessage().contains("magnitude-only"), problem.getMessage());
            return;
        }
        ImportedSweep sniffed = READER.read(file, "auto");
        ImportedSweep named = READER.read(file, profile);
        assertEquals("auto", sniffed.profileName());
        assertTrue(sniffed.mapping().startsWith("auto:"), sniffed.mapping());
        assertEquals(named.sweep().points().size(), sniffed.sweep().points().size());
        for (int i = 0; i < named.sweep().size(); i++) {
            // same file, same numbers: the sniffed mapping must give the same values (the
            // profile's accuracy is not known to auto, so uncertainties may differ)
            assertEquals(named.sweep().points().get(i).gainDb(), sniffed.sweep().points().get(i).gainDb(), 0.0);
            assertEquals(named.sweep().points().get(i).phaseDeg(), sniffed.sweep().points().get(i).phaseDeg());
        }
    }

    @Test
    void scpiLogImportsWithTheRetriedStepAndListsTheErrorAndTheNoise() throws InputProblem {
        Path file = DemoImportSamples.FOLDER.resolve("scpi-generator-meter.log");
        ImportedSweep imported = READER.read(file, "scpi-generator-meter");

        assertEquals(41, imported.sweep().size());
        // NR3 with 6 significant digits: relative 5e-6 of the output amplitude is 4.3e-5 dB;
        // the phase is printed to 5 decimals of its mantissa (< 0.0005°)
        assertClosedForm(imported.sweep(), 5e-5, 5e-4);
        List<InputWarning> warnings = imported.warnings();
        assertEquals(2, warnings.size(), warnings.toString());
        assertEquals(lineOf(file, "-230,"), warnings.get(0).line());
        assertTrue(warnings.get(0).message().contains("-230"));
        assertEquals(lineOf(file, "noise on the line"), warnings.get(1).line());
        assertEquals("generator: Demo Instruments (invented),FG-0,0001,1.0; meter: Demo Instruments (invented),AC-2,0002,1.0",
                imported.sweep().source().instrument());
        assertEquals("2031-04-02T14:05:00.025Z", imported.sweep().source().captured().orElseThrow().toString());
        assertEquals("demo board 7, Gullhaven rig", imported.sweep().source().board().orElseThrow());
    }

    @Test
    void streamingLogImportsAndListsTheErrorLine() throws InputProblem {
        Path file = DemoImportSamples.FOLDER.resolve("streaming-sweeper.log");
        ImportedSweep imported = READER.read(file, "streaming-sweeper");

        assertEquals(40, imported.sweep().size());
        // printed to 0.001 dB and 0.01°, frequency to 5 significant digits (the closed form is
        // evaluated at the printed frequency, so that rounding does not count)
        assertClosedForm(imported.sweep(), 0.0005 + 1e-9, 0.005 + 1e-9);
        assertEquals(1, imported.warnings().size(), imported.warnings().toString());
        assertEquals(lineOf(file, "ERR 21"), imported.warnings().get(0).line());
        assertEquals("Demo Instruments (invented),LSW-1,0003,1.0", imported.sweep().source().instrument());
    }

    @Test
    void autoRecognisesEachSerialLog() throws InputProblem {
        assertEquals("scpi-generator-meter", READER.read(DemoImportSamples.FOLDER.resolve("scpi-generator-meter.log"),
                "auto").sweep().source().profile());
        assertEquals("streaming-sweeper", READER.read(DemoImportSamples.FOLDER.resolve("streaming-sweeper.log"),
                "auto").sweep().source().profile());
    }

    private static int lineOf(Path file, String text) {
        try {
            List<String> lines = Files.readAllLines(file);
            for (int i = 0; i < lines.size(); i++) {
                if (lines.get(i).contains(text)) {
                    return i + 1;
                }
            }
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        throw new AssertionError(text + " not in " + file);
    }
}

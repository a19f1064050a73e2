package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.TableProfile;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

class SweepRoundTripTest {
    private static final ProfileLibrary LIBRARY = ProfileLibrary.bundled();

    @TempDir
    Path dir;

    static Stream<String> tableProfiles() {
        return LIBRARY.tableProfiles().stream().map(TableProfile::name);
    }

    @Test
    void canonicalSweepReadsBackExactlyWithItsProvenance() throws Exception {
        Sweep original = DemoSweeps.twoPoleHighPass(41, true);
        Path file = dir.resolve("demo.csv");
        new SweepWriter().writeCanonical(original, file, false);

        ImportedSweep back = new SweepReader(LIBRARY).read(file, "canonical");

        // Double.toString writes the shortest text that parses to the same double (JLS/Javadoc of
        // Double.toString), so every value must come back bit for bit: no tolerance.
        assertEquals(original.points(), back.sweep().points());
        assertEquals(original.source().instrument(), back.sweep().source().instrument());
        assertEquals(original.source().captured(), back.sweep().source().captured());
        assertEquals(original.source().board(), back.sweep().source().board());
        assertEquals(original.source().profile(), back.sweep().source().profile());
        assertEquals(original.source().notes(), back.sweep().source().notes());
        assertEquals(Path.of(file.toString()), back.sweep().source().sourceFile().orElseThrow());
        assertEquals(64, back.sweep().source().sha256().length());
        assertTrue(back.warnings().isEmpty(), back.warnings().toString());
    }

    @Test
    void canonicalMagnitudeOnlySweepRoundTrips() throws Exception {
        Sweep original = DemoSweeps.twoPoleHighPass(20, false);
        Path file = dir.resolve("mag.csv");
        new SweepWriter().writeCanonical(original, file, false);
        Sweep back = new SweepReader(LIBRARY).read(file, "auto").sweep();
        // exact, as above
        assertEquals(original.points(), back.points());
    }

    @ParameterizedTest
    @MethodSource("tableProfiles")
    void everyTableLayoutWrittenThenReadWithItsProfileGivesTheSweepBack(String name) throws Exception {
        TableProfile profile = (TableProfile) LIBRARY.find(name).orElseThrow();
        Sweep original = DemoSweeps.twoPoleHighPass(41, true);
        Path file = dir.resolve(name + ".txt");
        new SweepWriter().write(original, file, profile, false);

        Sweep back = new SweepReader(LIBRARY).read(file, name).sweep();

        assertEquals(original.size(), back.size());
        boolean phase = profile.columns().phase().isPresent();
        assertEquals(phase, back.hasPhase());
        for (int i = 0; i < original.size(); i++) {
            SweepPoint a = original.points().get(i);
            SweepPoint b = back.points().get(i);
            // 1e-9 (issue 3): unit changes (kHz, radians, ratio, amplitudes) cost a few ulps,
            // some 1e-16 relative; 1e-9 leaves room while still catching any real slip
            assertEquals(a.frequencyHz(), b.frequencyHz(), 1e-9 * a.frequencyHz(), name + " frequency " + i);
            assertEquals(a.gainDb(), b.gainDb(), 1e-9, name + " gain " + i);
            if (phase) {
                assertEquals(a.phaseDeg().getAsDouble(), b.phaseDeg().getAsDouble(), 1e-9, name + " phase " + i);
            }
        }
    }

    @Test
    void writerRefusesToOverwriteUnlessAskedAndKeepsTheOldFile() throws Exception {
        Path file = dir.resolve("keep.csv");
        Files.writeString(file, "user data\n");
        Sweep sweep = DemoSweeps.twoPoleHighPass(10, true);

        InputProblem problem = assertThrows(InputProblem.class,
                () -> new SweepWriter().writeCanonical(sweep, file, false));

        assertTrue(problem.describe().contains("keep.csv"));
        assertEquals("user data\n", Files.readString(file));
        new SweepWriter().writeCanonical(sweep, file, true);
        assertTrue(Files.readString(file).startsWith("# polebench sweep"));
        // no temporary file is left beside the target
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of(file), left.toList());
        }
    }

    @Test
    void writingALayoutThatNeedsAPhaseFromAMagnitudeOnlySweepIsRefused() throws IOException {
        TableProfile profile = (TableProfile) LIBRARY.find("db-degrees").orElseThrow();
        Sweep sweep = DemoSweeps.twoPoleHighPass(10, false);
        assertThrows(IllegalArgumentException.class,
                () -> new SweepWriter().write(sweep, dir.resolve("x.csv"), profile, false));
    }
}

package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;

/** Regular expressions a profile supplies are matched in linear time, or refused where written (issue 15). */
class ProfilePatternTest {
    @TempDir
    Path dir;

    private Path profile(String ignore) throws Exception {
        String text = Files.readString(Path.of("instrument-profiles", "streaming-sweeper.yaml"))
                .replace("name: streaming-sweeper", "name: hostile")
                .replace("ignore: ['^BEGIN\\b.*', '^STAT\\b.*']", "ignore: ['" + ignore + "']");
        assertTrue(text.contains(ignore), "the ignore line was replaced");
        return Files.writeString(dir.resolve("hostile.yaml"), text);
    }

    private Path log(String extraLine) throws Exception {
        List<String> lines = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            double hz = 10 * Math.pow(10, i / 4.0);
            lines.add(String.format(Locale.ROOT, "PT %d %.4f %.3f %.2f", i + 1, hz, -20.0 / (1 + i), 80.0 - 6 * i));
        }
        lines.add(6, extraLine);
        return Files.write(dir.resolve("hostile.log"), lines);
    }

    @Test
    void nestedStarsOnANearMatchFinishWithTheRightAnswer() throws Exception {
        // ^(.*a){12}$ against 45 'a's and a 'b': a backtracking engine tries every way of cutting
        // the line into 12 pieces (C(45, 12), about 2.9e10) before it fails; RE2 walks the line once.
        String nearMatch = "a".repeat(45) + "b";
        assertEquals(46, nearMatch.length());
        Path profile = profile("^(.*a){12}$");
        ImportedSweep read = new SweepReader(ProfileLibrary.bundled()).read(log(nearMatch), profile.toString());

        // the line does not end in 'a', so the ignore pattern does not match it (by inspection):
        // it is listed as unparseable on its line (7) and the 12 points are kept
        assertEquals(12, read.sweep().size());
        assertTrue(read.warnings().stream().anyMatch(w -> w.line() == 7 && w.message().contains("line skipped")),
                read.warnings().toString());
    }

    @Test
    void theSamePatternMatchesALineThatFitsIt() throws Exception {
        // 46 'a's end in 'a' and hold twelve of them: ^(.*a){12}$ matches (by inspection), so the line is ignored
        Path profile = profile("^(.*a){12}$");
        ImportedSweep read = new SweepReader(ProfileLibrary.bundled()).read(log("a".repeat(46)), profile.toString());
        assertEquals(12, read.sweep().size());
        assertTrue(read.warnings().stream().noneMatch(w -> w.line() == 7), read.warnings().toString());
    }

    @Test
    void aBackreferenceIsRefusedNamingTheProfileAndLine() throws Exception {
        Path profile = profile("^(a)\\1$");
        InputProblem problem = assertThrows(InputProblem.class,
                () -> new SweepReader(ProfileLibrary.bundled()).read(log("aa"), profile.toString()));
        // the problem points at the ignore key's line, counted in the file written above
        assertEquals(profile, problem.file().orElseThrow());
        assertEquals(lineOf(profile, "ignore:"), problem.line());
        assertTrue(problem.getMessage().contains("regular expression"), problem.getMessage());
        assertTrue(problem.hint().contains("backreferences"), problem.hint());
    }

    private static long lineOf(Path file, String start) throws Exception {
        List<String> lines = Files.readAllLines(file);
        for (int i = 0; i < lines.size(); i++) {
            if (lines.get(i).startsWith(start)) {
                return i + 1;
            }
        }
        throw new AssertionError(start + " not in " + file);
    }
}

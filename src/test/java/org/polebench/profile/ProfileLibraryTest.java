package org.polebench.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;

class ProfileLibraryTest {
    @TempDir
    Path dir;

    @Test
    void indexListsEveryShippedProfileFile() throws Exception {
        List<String> listed = Files.readAllLines(Path.of("instrument-profiles", "index.txt")).stream()
                .filter(l -> !l.isBlank() && !l.startsWith("#")).sorted().toList();
        try (Stream<Path> files = Files.list(Path.of("instrument-profiles"))) {
            List<String> present = files.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".yaml")).sorted()
                    .toList();
            assertEquals(present, listed);
        }
        assertEquals(listed.size(), ProfileLibrary.bundled().profiles().size());
    }

    @Test
    void everyShippedProfileIsNamedForItsFile() throws Exception {
        // the library finds a shipped profile by name without reading the others, which holds only
        // while name and file agree (ProfileLibrary's Javadoc)
        List<String> stems = Files.readAllLines(Path.of("instrument-profiles", "index.txt")).stream()
                .filter(l -> !l.isBlank() && !l.startsWith("#")).map(l -> l.replaceFirst("\\.yaml$", "")).toList();
        assertEquals(stems, ProfileLibrary.bundled().profiles().stream().map(InstrumentProfile::name).toList());
        for (String stem : stems) {
            assertEquals(stem, new ProfileReader().read(Path.of("instrument-profiles", stem + ".yaml")).name());
        }
    }

    @Test
    void shipsAtLeastSixTableLayoutsAndThreeSerialProtocols() {
        ProfileLibrary library = ProfileLibrary.bundled();
        assertTrue(library.tableProfiles().size() - 1 >= 6, "six table profiles besides canonical");
        // SCPI command and answer, a streaming sweeper, a generator plus scope
        assertEquals(3, library.serialProfiles().size());
        LineProtocol.ScpiExchange scpi = (LineProtocol.ScpiExchange) library.serialProfiles().get(0).protocol();
        // SCPI-99 spellings and IEEE 488.2 common commands, NR3 numbers
        assertEquals("SYST:ERR?", scpi.errorQuery());
        assertEquals("*IDN?", scpi.instruments().get(0).identify());
        assertEquals("FREQ 1.000000E+03", scpi.step().get(0).render(1000, 0.5));
        // 5 periods of 10 Hz is 500 ms, above the 200 ms minimum
        assertEquals(500, scpi.settle().millisAt(10));
    }

    @Test
    void aWorkingTreeProfileJoinsTheLibrary() throws Exception {
        Path folder = Files.createDirectories(dir.resolve("instrument-profiles"));
        Files.writeString(folder.resolve("mine.yaml"), "kind: table\nname: mine\ndescription: test\n"
                + "columns: {frequency: 1, gain: 2}\nlayout: {header: false}\n");
        ProfileLibrary library = ProfileLibrary.standard(dir);
        assertTrue(library.find("mine").isPresent());
        assertTrue(library.find("db-degrees").isPresent());
    }

    @Test
    void aWorkingTreeCopyOfAShippedProfileIsTheShippedOneAndAnEditedCopyWins() throws Exception {
        Path folder = Files.createDirectories(dir.resolve("instrument-profiles"));
        Path shipped = Path.of("instrument-profiles", "db-degrees.yaml");
        Files.copy(shipped, folder.resolve("db-degrees.yaml"));
        // an exact copy: the shipped profile, the same in every field
        assertEquals(ProfileLibrary.bundled().find("db-degrees").orElseThrow(),
                ProfileLibrary.standard(dir).find("db-degrees").orElseThrow());
        // an edited copy of the same file name is the user's and wins
        Files.writeString(folder.resolve("db-degrees.yaml"),
                Files.readString(shipped).replace("description:", "description: edited,"));
        assertTrue(ProfileLibrary.standard(dir).find("db-degrees").orElseThrow().description().startsWith("edited"));
    }

    @Test
    void misspeltKeyIsRefusedWithItsLine() {
        String text = "kind: table\nname: x\ndescription: d\ncolumns: {frequency: 1, gain: 2}\n"
                + "layout:\n  header: false\n  delimitter: tab\n";
        InputProblem problem = assertThrows(InputProblem.class,
                () -> new ProfileReader().read(Path.of("x.yaml"), new StringReader(text)));
        assertEquals(7, problem.line());
        assertTrue(problem.getMessage().contains("delimitter"));
    }

    @Test
    void amplitudesOfTheWrongKindAreRefused() {
        String text = "kind: serial-stream\nname: s\ndescription: d\nport: {baud: 9600}\nstart: GO\n"
                + "point: '^(?<frequency>\\S+) (?<gain>\\S+)$'\namplitude: 1 Vpp\nunits: {amplitude: Vrms}\n";
        InputProblem problem = assertThrows(InputProblem.class,
                () -> new ProfileReader().read(Path.of("s.yaml"), new StringReader(text)));
        assertEquals(7, problem.line());
    }
}

package org.polebench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The atomic writer of the files made for the user (issue 14, input hygiene). */
class OutputFileTest {
    @TempDir
    Path dir;

    private static void write(Path file, boolean overwrite, String text) throws InputProblem, IOException {
        OutputFile.write(file, overwrite, out -> out.write(text.getBytes(StandardCharsets.UTF_8)));
    }

    private boolean posix() throws IOException {
        return Files.getFileStore(dir).supportsFileAttributeView("posix");
    }

    @Test
    void aNewFileHasThePermissionsTheUmaskGives() throws Exception {
        assumeTrue(posix());
        // reference: a file created with default attributes gets mode 0666 less the umask
        // (POSIX open(2), common practice); Files.createTempFile would have made it 0600
        Path reference = Files.createFile(dir.resolve("reference"));
        Path file = dir.resolve("sweep.csv");

        write(file, false, "x\n");

        assertEquals(Files.getPosixFilePermissions(reference), Files.getPosixFilePermissions(file));
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of("reference", "sweep.csv"), left.map(p -> p.getFileName().toString()).sorted().toList(),
                    "no temporary file is left behind");
        }
    }

    @Test
    void anExistingFileIsKeptWithoutOverwrite() throws Exception {
        Path file = Files.writeString(dir.resolve("mine.csv"), "mine\n");
        InputProblem problem = assertThrows(InputProblem.class, () -> write(file, false, "new\n"));
        assertTrue(problem.hint().contains("--force"), problem.hint());
        assertEquals("mine\n", Files.readString(file));
    }

    @Test
    void forceOnASymbolicLinkWritesToItsTargetAndKeepsTheLink() throws Exception {
        Path target = Files.writeString(dir.resolve("real.csv"), "old\n");
        Path link = Files.createSymbolicLink(dir.resolve("link.csv"), Path.of("real.csv"));

        assertThrows(InputProblem.class, () -> write(link, false, "new\n"));
        write(link, true, "new\n");

        assertTrue(Files.isSymbolicLink(link));
        assertEquals("new\n", Files.readString(target));
    }

    @Test
    void aDanglingSymbolicLinkCreatesItsTarget() throws Exception {
        Path link = Files.createSymbolicLink(dir.resolve("link.csv"), Path.of("made.csv"));
        write(link, false, "made\n");
        assertTrue(Files.isSymbolicLink(link));
        assertEquals("made\n", Files.readString(dir.resolve("made.csv")));
    }

    @Test
    void aFolderIsRefusedEvenWithForce() throws Exception {
        Path folder = Files.createDirectory(dir.resolve("folder"));
        InputProblem problem = assertThrows(InputProblem.class, () -> write(folder, true, "x\n"));
        assertTrue(problem.getMessage().contains("a folder, not a regular file"), problem.getMessage());
        assertTrue(Files.isDirectory(folder));
    }

    @Test
    void aDeviceIsRefusedEvenWithForce() {
        Path devNull = Path.of("/dev/null");
        assumeTrue(Files.exists(devNull));
        InputProblem problem = assertThrows(InputProblem.class, () -> write(devNull, true, "x\n"));
        assertTrue(problem.getMessage().contains("device or other special file"), problem.getMessage());
        assertTrue(Files.exists(devNull) && !Files.isRegularFile(devNull), "/dev/null is still a device");
    }

    @Test
    void aFifoAndALinkToItAreRefused() throws Exception {
        Path fifo = dir.resolve("pipe");
        Process mkfifo;
        try {
            mkfifo = new ProcessBuilder("mkfifo", fifo.toString()).start();
        } catch (IOException e) {
            mkfifo = null;
        }
        assumeTrue(mkfifo != null && mkfifo.waitFor(10, TimeUnit.SECONDS) && mkfifo.exitValue() == 0);
        Path link = Files.createSymbolicLink(dir.resolve("link"), fifo);

        assertThrows(InputProblem.class, () -> write(fifo, true, "x\n"));
        InputProblem problem = assertThrows(InputProblem.class, () -> write(link, true, "x\n"));
        assertTrue(problem.getMessage().contains("it leads to " + fifo), problem.getMessage());
    }

    @Test
    void aWriteThatFailsNamesTheFileAndTheCause() throws Exception {
        // a file where a folder is needed: fails for root too, unlike a read-only folder
        Path blocker = Files.writeString(dir.resolve("blocker"), "x");
        Path file = blocker.resolve("sweep.csv");
        IOException e = assertThrows(IOException.class, () -> write(file, false, "x\n"));
        assertTrue(e.getMessage().startsWith("cannot write " + file + ": "), e.getMessage());
        assertTrue(e.getMessage().contains(blocker.toString()), e.getMessage());
    }

    @Test
    void theCauseIsTheOperatingSystemsReasonOrTheErrorsKind() {
        // the reason strings are Linux's strerror texts for EACCES and ENOSPC (from memory)
        assertEquals("No space left on device (/mnt/out.csv)",
                OutputFile.cause(new FileSystemException("/mnt/out.csv", null, "No space left on device")));
        assertEquals("permission denied (/mnt/out.csv)", OutputFile.cause(new AccessDeniedException("/mnt/out.csv")));
    }
}

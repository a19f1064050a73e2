package org.polebench.capture;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * A linked pair of pseudo-terminals made by socat
 * ({@code socat -d -d pty,raw,echo=0,link=A pty,raw,echo=0,link=B}): bytes written to one end
 * come out of the other, through the kernel's real tty layer, so tests run the serial path
 * with no mock. Tests are skipped, with a message, where socat is not installed
 * ({@code .ci/run} installs it).
 */
public final class PseudoTerminalPair implements AutoCloseable {
    private final Process socat;
    private final Path a;
    private final Path b;

    private PseudoTerminalPair(Process socat, Path a, Path b) {
        this.socat = socat;
        this.a = a;
        this.b = b;
    }

    static boolean socatInstalled() {
        for (String dir : List.of("/usr/bin", "/usr/local/bin", "/bin")) {
            if (Files.isExecutable(Path.of(dir, "socat"))) {
                return true;
            }
        }
        return false;
    }

    /** Starts socat and waits (up to 10 s, a loaded machine) until both links exist. */
    public static PseudoTerminalPair open(Path parent) throws IOException, InterruptedException {
        Assumptions.assumeTrue(socatInstalled(), "socat is not installed: serial-path tests skipped "
                + "(.ci/run installs it; or apt-get install socat)");
        Path directory = Files.createTempDirectory(parent, "pty");
        Path a = directory.resolve("pty-a");
        Path b = directory.resolve("pty-b");
        Process socat = new ProcessBuilder("socat", "-d", "-d", "pty,raw,echo=0,link=" + a,
                "pty,raw,echo=0,link=" + b)
                .redirectErrorStream(true)
                .redirectOutput(directory.resolve("socat.log").toFile())
                .start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
        while (!(Files.exists(a) && Files.exists(b))) {
            if (!socat.isAlive() || System.nanoTime() > deadline) {
                socat.destroyForcibly();
                throw new IOException("socat did not make the pseudo-terminals: "
                        + Files.readString(directory.resolve("socat.log")));
            }
            Thread.sleep(20);
        }
        return new PseudoTerminalPair(socat, a, b);
    }

    /** The end the simulator takes. */
    public Path instrumentEnd() {
        return a;
    }

    /** The end the capture takes. */
    public Path benchEnd() {
        return b;
    }

    boolean alive() {
        return socat.isAlive();
    }

    /** Waits for socat to end by itself (it does when one end is closed), up to the time given. */
    boolean awaitExit(long millis) throws InterruptedException {
        return socat.waitFor(millis, TimeUnit.MILLISECONDS);
    }

    /** Ends socat; interrupted while waiting, it kills socat and keeps the thread's interrupt. */
    @Override
    public void close() {
        socat.destroy();
        try {
            if (!socat.waitFor(5, TimeUnit.SECONDS)) {
                socat.destroyForcibly();
                socat.waitFor(5, TimeUnit.SECONDS);
            }
        } catch (InterruptedException interrupted) {
            socat.destroyForcibly();
            Thread.currentThread().interrupt();
        }
    }
}

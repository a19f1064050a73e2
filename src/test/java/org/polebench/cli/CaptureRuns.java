package org.polebench.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepReader;

/**
 * What the capture command tests share: a command line run through {@link Main}, one run in a
 * thread of its own (a simulator, or a capture to stop) whose output is read while it runs, the
 * test profiles in {@code src/test/resources/capture/}, and a captured sweep read back.
 */
final class CaptureRuns {
    private CaptureRuns() {
    }

    /** One command line's outcome. */
    record Result(int code, String out, String err) {
    }

    static Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(code, out.toString(), err.toString());
    }

    /** A command running in a thread of its own, its output readable while it runs. */
    static final class Background {
        final StringWriter out = new StringWriter();
        final StringWriter err = new StringWriter();
        final AtomicInteger code = new AtomicInteger(-1);
        final Thread thread;

        Background(String... args) {
            thread = new Thread(() -> code.set(Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true))),
                    "background polebench");
            thread.setDaemon(true);
            thread.start();
        }

        String awaitOutput(Pattern pattern, long millis) throws InterruptedException {
            long deadline = System.currentTimeMillis() + millis;
            while (System.currentTimeMillis() < deadline) {
                Matcher m = pattern.matcher(out.toString());
                if (m.find()) {
                    return m.group(1);
                }
                Thread.sleep(20);
            }
            throw new AssertionError("no " + pattern + " in: " + out + err);
        }

        int join(long millis) throws InterruptedException {
            thread.join(millis);
            return code.get();
        }
    }

    /** @return the path of a test profile in {@code src/test/resources/capture/} */
    static String resource(String name) {
        try {
            return Path.of(CaptureRuns.class.getResource("/capture/" + name).toURI()).toString();
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static Sweep read(Path file) throws Exception {
        return new SweepReader(ProfileLibrary.bundled()).read(file, "canonical").sweep();
    }
}

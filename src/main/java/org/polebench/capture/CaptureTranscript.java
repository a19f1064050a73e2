package org.polebench.capture;

import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Clock;
import java.time.Instant;
import org.polebench.sweepfile.SerialLogParser;

/**
 * The transcript of a live capture: every line sent and received, one per line, as
 * {@code <ISO-8601 instant> <instrument> > <line>} for what polebench sent and
 * {@code ... <instrument> < <line>} for what came back, with {@code # event: <instant> <text>}
 * lines for what polebench noticed or decided (timeouts, retries, stops). Each line is handed to the operating system
 * as soon as it happens, so nothing received is lost when the capture or the port dies. The
 * format is the one {@link SerialLogParser} reads, so a transcript can be imported like any
 * saved log.
 *
 * <p>Control characters in received text (other than tab) are written as {@code \xNN} and a
 * backslash as {@code \\}, so that one received line stays one transcript line.
 * A resumed capture appends to the same file.
 */
final class CaptureTranscript implements Closeable {
    private final Path file;
    private final OutputStream out;
    private final Clock clock;
    private final StringBuilder line = new StringBuilder(128);

    private CaptureTranscript(Path file, OutputStream out, Clock clock) {
        this.file = file;
        this.out = out;
        this.clock = clock;
    }

    /** Opens the transcript for appending, creating it when new. */
    static CaptureTranscript open(Path file, Clock clock) throws IOException {
        Files.createDirectories(file.toAbsolutePath().getParent());
        OutputStream out = Files.newOutputStream(file, StandardOpenOption.CREATE, StandardOpenOption.APPEND,
                StandardOpenOption.WRITE);
        return new CaptureTranscript(file, out, clock);
    }

    Path file() {
        return file;
    }

    void sent(String instrument, String text) throws IOException {
        traffic(instrument, '>', text);
    }

    void received(String instrument, String text) throws IOException {
        traffic(instrument, '<', text);
    }

    /** A comment line: what polebench noticed or decided. */
    void note(String text) throws IOException {
        line.setLength(0);
        line.append("# event: ").append(Instant.now(clock)).append(' ');
        escape(text, line);
        write();
    }

    private void traffic(String instrument, char direction, String text) throws IOException {
        line.setLength(0);
        line.append(Instant.now(clock)).append(' ').append(instrument).append(' ').append(direction).append(' ');
        escape(text, line);
        write();
    }

    private void write() throws IOException {
        line.append('\n');
        out.write(line.toString().getBytes(StandardCharsets.UTF_8));
        out.flush();
    }

    /** @return the text as the transcript writes it: control characters as \xNN, backslash as \\ */
    static String escaped(String text) {
        StringBuilder b = new StringBuilder(text.length() + 8);
        escape(text, b);
        return b.toString();
    }

    private static void escape(String text, StringBuilder to) {
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\\') {
                to.append("\\\\");
            } else if (c < 0x20 && c != '\t' || c == 0x7f) {
                to.append(String.format(java.util.Locale.ROOT, "\\x%02X", (int) c));
            } else {
                to.append(c);
            }
        }
    }

    @Override
    public void close() throws IOException {
        out.close();
    }
}

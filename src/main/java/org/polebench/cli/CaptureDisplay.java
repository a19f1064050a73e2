package org.polebench.cli;

import java.io.PrintWriter;
import java.time.Duration;
import java.util.Locale;
import org.polebench.sweep.Provenance;
import org.polebench.capture.CaptureListener;
import org.polebench.capture.CaptureProgress;
import org.polebench.units.EngineeringValue;

/**
 * Shows a capture's progress: on a terminal one line redrawn in place (a bar, point i of n,
 * the frequency and the time left), otherwise one plain line per point, fit for a log file.
 * Warnings and retries go to the error writer, on a line of their own.
 */
final class CaptureDisplay implements CaptureListener {
    private static final int BAR = 24;

    private final PrintWriter out;
    private final PrintWriter err;
    private final boolean terminal;
    private boolean barShown;

    CaptureDisplay(PrintWriter out, PrintWriter err, boolean terminal) {
        this.out = out;
        this.err = err;
        this.terminal = terminal;
    }

    @Override
    public void identified(String instrument, String identity) {
        // an instrument's answer reaches the terminal with ESC, BEL and the like as \xNN: raw,
        // they would move the cursor, recolour or ring it (issue 15)
        out.println(Provenance.printable(instrument) + ": " + Provenance.printable(identity));
        out.flush();
    }

    @Override
    public void started(int firstPoint, int total) {
        out.println(firstPoint == 1 ? "sweeping " + total + " points"
                : "resuming at point " + firstPoint + " of " + total);
        out.flush();
    }

    @Override
    public void point(CaptureProgress progress) {
        String frequency = EngineeringValue.format(progress.point().frequencyHz(), "Hz", 4);
        String phase = progress.point().phaseDeg().isPresent()
                ? String.format(Locale.ROOT, " %8.2f°", progress.point().phaseDeg().getAsDouble()) : "";
        if (terminal) {
            int filled = (int) Math.round(BAR * (double) progress.pointNumber() / progress.total());
            out.print(String.format(Locale.ROOT, "\r[%s%s] %d/%d %11s %8.2f dB%s  %s left ", "#".repeat(filled),
                    "-".repeat(BAR - filled), progress.pointNumber(), progress.total(), frequency,
                    progress.point().gainDb(), phase, clock(progress.timeLeft())));
            barShown = true;
            if (progress.pointNumber() == progress.total()) {
                endBar();
            }
        } else {
            out.println(String.format(Locale.ROOT, "point %d/%d %s %.3f dB%s, %s left", progress.pointNumber(),
                    progress.total(), frequency, progress.point().gainDb(), phase, clock(progress.timeLeft())));
        }
        out.flush();
    }

    @Override
    public void retrying(double frequencyHz, String reason, int attempt, int allowed) {
        endBar();
        err.println("polebench: " + EngineeringValue.format(frequencyHz, "Hz", 4) + ": " + Provenance.printable(reason) + "; repeating the step ("
                + attempt + " of " + allowed + ")");
        err.flush();
    }

    @Override
    public void warning(String message) {
        endBar();
        err.println("polebench: warning: " + Provenance.printable(message));
        err.flush();
    }

    /** Ends the redrawn line so that other output starts on a line of its own. */
    void endBar() {
        if (barShown) {
            out.println();
            out.flush();
            barShown = false;
        }
    }

    private static String clock(Duration left) {
        long seconds = Math.max(0, (left.toMillis() + 500) / 1000);
        return seconds >= 3600 ? String.format(Locale.ROOT, "%d:%02d:%02d", seconds / 3600, seconds / 60 % 60, seconds % 60)
                : String.format(Locale.ROOT, "%d:%02d", seconds / 60, seconds % 60);
    }
}

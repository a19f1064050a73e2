package org.polebench.capture;

import java.util.Locale;
import org.polebench.profile.ScpiCommand;

/**
 * The frequencies of a stepped sweep: {@code points} frequencies from {@code fromHz} to
 * {@code toHz}, both included, equally spaced in log frequency (equal ratios, as bench
 * sweeps over decades are taken; common practice).
 *
 * @param fromHz lowest frequency in Hz, positive
 * @param toHz   highest frequency in Hz, above fromHz
 * @param points at least 2
 */
public record SweepPlan(double fromHz, double toHz, int points) {
    public SweepPlan {
        if (!(fromHz > 0) || !Double.isFinite(toHz) || !(toHz > fromHz)) {
            throw new IllegalArgumentException("a sweep needs 0 < from < to, was " + fromHz + " to " + toHz);
        }
        if (points < 2) {
            throw new IllegalArgumentException("a sweep needs at least two points, was " + points);
        }
    }

    /** @return the i-th frequency in Hz, i from 0; the ends are exactly fromHz and toHz */
    public double frequencyHz(int i) {
        if (i < 0 || i >= points) {
            throw new IllegalArgumentException("point " + i + " is outside 0.." + (points - 1));
        }
        if (i == 0) {
            return fromHz;
        }
        if (i == points - 1) {
            return toHz;
        }
        return fromHz * Math.exp(Math.log(toHz / fromHz) * i / (points - 1));
    }

    /**
     * @return the i-th frequency as the instrument is told it: the NR3 text of
     *         {@link ScpiCommand#nr3} read back, 7 significant digits, which is the frequency
     *         the point is recorded at
     */
    public double sentHz(int i) {
        return Double.parseDouble(ScpiCommand.nr3(frequencyHz(i)));
    }

    /** @return the plan in the words a capture's sweep file keeps, read back by {@link #parse} */
    public String describe() {
        return String.format(Locale.ROOT, "from_hz=%s to_hz=%s points=%d log-spaced", Double.toString(fromHz),
                Double.toString(toHz), points);
    }

    /** @return the plan of a {@link #describe()} text, or null when the text is not one */
    static SweepPlan parse(String text) {
        String[] words = text.strip().split("\\s+");
        try {
            double from = Double.NaN;
            double to = Double.NaN;
            int n = -1;
            for (String word : words) {
                if (word.startsWith("from_hz=")) {
                    from = Double.parseDouble(word.substring(8));
                } else if (word.startsWith("to_hz=")) {
                    to = Double.parseDouble(word.substring(6));
                } else if (word.startsWith("points=")) {
                    n = Integer.parseInt(word.substring(7));
                }
            }
            return new SweepPlan(from, to, n);
        } catch (IllegalArgumentException e) {
            return null;
        }
    }
}

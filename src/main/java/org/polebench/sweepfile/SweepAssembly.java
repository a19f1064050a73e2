package org.polebench.sweepfile;

import static org.polebench.sweepfile.ReadingConversion.format;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.ReadingScale;
import org.polebench.sweep.CalibrationAccuracy;
import org.polebench.sweep.LowerCornerEstimate;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.PackedPoints;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.RoughLowerCorner;
import org.polebench.sweep.Sweep;

/**
 * Turns an instrument's raw readings, offered one at a time with their line, into a sweep:
 * converts units and applies the data checks ({@link ReadingConversion}, the rule live capture
 * shares) and drops bad readings with a warning each, then
 * sorts, merges duplicate frequencies, unwraps phase and refuses a sweep of fewer than
 * {@link #MIN_POINTS} points. Readings are kept in columns of doubles grown a block at a time
 * ({@link DoubleColumn}), so memory is four numbers a kept point (frequency, gain, phase, line)
 * while reading and three in the finished sweep ({@link PackedPoints}), whatever the file's
 * size, and columns the file does not have cost nothing.
 *
 * <p>One instance serves one import and is not shared between threads.
 */
final class SweepAssembly {
    /** Fewer points than this cannot support a pole-zero fit of a two-pole stage (issue 3). */
    static final int MIN_POINTS = 8;
    private static final int MAX_ARRAY = Integer.MAX_VALUE - 8;

    private final Path file;
    private final ReadingScale scale;
    private final ReadingConversion conversion;
    private final boolean hasPhase;
    private final Optional<CalibrationAccuracy> calibration;
    private final WarningTally tally;

    private final long maxPoints;
    private DoubleColumn frequencyHz = new DoubleColumn();
    private DoubleColumn gainDb = new DoubleColumn();
    private DoubleColumn phaseDeg = new DoubleColumn();
    private DoubleColumn gainUncertaintyDb = new DoubleColumn();
    private DoubleColumn phaseUncertaintyDeg = new DoubleColumn();
    private LineColumn lines = new LineColumn();
    private int count;

    /**
     * @param file      named in warnings and problems; null for a live port
     * @param hasPhase  whether every point carries a phase
     * @param maxPoints the most readings kept before the import is refused ({@link InputLimits})
     */
    SweepAssembly(Path file, InstrumentProfile profile, boolean hasPhase, WarningTally tally, long maxPoints) {
        this.maxPoints = maxPoints;
        this.file = file;
        this.scale = profile.scale();
        this.conversion = new ReadingConversion(profile);
        this.hasPhase = hasPhase;
        // the profile's accuracy is a calibration error common to the whole sweep, carried beside
        // the points rather than as each point's noise (docs/method.md, "Uncertainty (GUM, JCGM 100:2008)")
        this.calibration = profile.accuracy().calibration(profile.name());
        this.tally = tally;
    }

    boolean hasPhase() {
        return hasPhase;
    }

    /** @return how many readings were accepted so far */
    int count() {
        return count;
    }

    /**
     * Offers one reading in the instrument's units. NaN marks what the reading lacks.
     *
     * @param rawGain   gain in dB or as a ratio (dB and ratio profiles)
     * @param rawInput  input amplitude (amplitude profiles)
     * @param rawOutput output amplitude (amplitude profiles)
     * @param rawPhase  phase in the profile's unit and sign; NaN when the sweep has none
     * @param uGainDb   this point's standard uncertainty of gain in dB, NaN when the file states none
     * @param uPhaseDeg this point's standard uncertainty of phase in degrees, NaN when the file states none
     * @return true when the reading was kept
     * @throws InputProblem when keeping it would pass the limit on points
     */
    boolean offer(long line, double rawFrequency, double rawGain, double rawInput, double rawOutput,
                  double rawPhase, double uGainDb, double uPhaseDeg) throws InputProblem {
        ReadingConversion.Reading hz = conversion.frequencyHz(rawFrequency);
        if (hz.dropped().isPresent()) {
            return drop(hz.dropped().get(), line);
        }
        ReadingConversion.Reading gain = conversion.gainDb(rawGain, rawInput, rawOutput);
        if (gain.dropped().isPresent()) {
            return drop(gain.dropped().get(), line);
        }
        double phase = Double.NaN;
        if (hasPhase) {
            ReadingConversion.Reading converted = conversion.phaseDeg(rawPhase);
            if (converted.dropped().isPresent()) {
                return drop(converted.dropped().get(), line);
            }
            phase = converted.value();
        }
        if (uGainDb < 0 || uPhaseDeg < 0 || Double.isInfinite(uGainDb) || Double.isInfinite(uPhaseDeg)) {
            tally.add("bad uncertainties", line, "an uncertainty must be finite and not negative; row skipped");
            return false;
        }
        // a Java array holds at most about 2³¹ values, so no setting passes that
        if (count >= Math.min(maxPoints, MAX_ARRAY)) {
            throw new InputProblem(file, line, "more than " + Math.min(maxPoints, MAX_ARRAY)
                    + " readings kept: the limit on points in one sweep (" + InputLimits.MAX_POINTS + ")",
                    InputLimits.raise(InputLimits.MAX_POINTS, maxPoints, "keep every n-th row, or split the file"));
        }
        frequencyHz.add(hz.value());
        gainDb.add(gain.value());
        phaseDeg.add(phase);
        gainUncertaintyDb.add(uGainDb);
        phaseUncertaintyDeg.add(uPhaseDeg);
        lines.add(line);
        count++;
        return true;
    }

    private boolean drop(ReadingConversion.Dropped dropped, long line) {
        tally.add(dropped.reason().plural(), line, dropped.rowMessage());
        return false;
    }

    /**
     * Sorts, merges and unwraps, then builds the sweep.
     *
     * <p>Duplicate frequencies are merged into one point: the mean gain in dB, the mean phase
     * (each reading first brought within half a turn of the first), and the largest of their
     * uncertainties, not a smaller one, since an instrument's accuracy is mostly systematic and
     * does not average out. Wrapped phase is unwrapped outward from the point of highest gain
     * (the midband), which keeps its reported value.
     *
     * @param lastLine the file's last line, named when too few points remain
     * @throws InputProblem when fewer than {@link #MIN_POINTS} points remain
     */
    Sweep finish(Provenance provenance, long lastLine) throws InputProblem {
        requireEnough(count, lastLine);
        order();
        int merged = mergeDuplicates();
        requireEnough(merged, lastLine);
        for (DoubleColumn column : List.of(frequencyHz, gainDb, phaseDeg, gainUncertaintyDb, phaseUncertaintyDeg)) {
            column.truncate(merged);
        }
        lines.truncate(merged);
        double[] phase = hasPhase ? phaseDeg.release() : null;
        if (phase != null && scale.phaseWrapped()) {
            PhaseUnwrap.unwrap(phase, merged, indexOfHighestGain(merged));
        }
        // each column is let go as it is copied, so the finished sweep never sits beside all of them
        PackedPoints points = PackedPoints.adopt(frequencyHz.release(), gainDb.release(), phase,
                gainUncertaintyDb.release(), hasPhase ? phaseUncertaintyDeg.release() : null);
        Sweep sweep = new Sweep(provenance, points, calibration);
        checkBand(sweep);
        return sweep;
    }

    /** Warns when the sweep misses either side of the lower corner (see {@link RoughLowerCorner}). */
    private void checkBand(Sweep sweep) {
        LowerCornerEstimate corner = new RoughLowerCorner().estimate(sweep);
        if (!corner.reachesBelow()) {
            tally.add("band limits", 0, "the sweep does not reach below the lower corner: its lowest point ("
                    + format(sweep.lowestHz()) + " Hz) is within 3 dB of the midband level ("
                    + String.format(Locale.ROOT, "%.2f", corner.midbandGainDb())
                    + " dB); the corner cannot be located from these data");
        }
        if (!corner.reachesAbove()) {
            tally.add("band limits", 0, "the sweep does not reach above the lower corner: the gain still rises by more than "
                    + RoughLowerCorner.RISING_DB_PER_OCTAVE + " dB over its top octave (to " + format(sweep.highestHz())
                    + " Hz); the midband and the corner cannot be located from these data");
        }
    }

    private void requireEnough(int points, long lastLine) throws InputProblem {
        if (points < MIN_POINTS) {
            throw new InputProblem(file, Math.max(lastLine, 0),
                    "only " + points + " usable point" + (points == 1 ? "" : "s") + " in the data up to this line; "
                            + MIN_POINTS + " or more are needed",
                    "measure more frequencies, or check the warnings and the profile (delimiter, columns, units)");
        }
    }

    private void order() {
        boolean ascending = true;
        boolean descending = true;
        for (int i = 1; i < count && (ascending || descending); i++) {
            ascending &= frequencyHz.get(i) >= frequencyHz.get(i - 1);
            descending &= frequencyHz.get(i) <= frequencyHz.get(i - 1);
        }
        if (ascending) {
            return;
        }
        if (descending) {
            tally.add("order changes", lines.get(0), "frequencies descend from this line on (a sweep from high to low); "
                    + "points reversed into ascending order");
            reverse();
            return;
        }
        for (int i = 1; i < count; i++) {
            if (frequencyHz.get(i) < frequencyHz.get(i - 1)) {
                tally.add("order changes", lines.get(i), "frequency " + format(frequencyHz.get(i)) + " Hz comes after "
                        + format(frequencyHz.get(i - 1)) + " Hz (line " + lines.get(i - 1) + "); points sorted by frequency");
            }
        }
        // stable, so repeated frequencies keep file order for merging
        int[] index = stableOrder();
        frequencyHz = frequencyHz.permuted(index);
        gainDb = gainDb.permuted(index);
        phaseDeg = phaseDeg.permuted(index);
        gainUncertaintyDb = gainUncertaintyDb.permuted(index);
        phaseUncertaintyDeg = phaseUncertaintyDeg.permuted(index);
        lines = lines.permuted(index);
    }

    /**
     * @return the reading indices in ascending frequency, equal frequencies in file order: a
     *         bottom-up merge sort on plain int arrays (Knuth, TAOCP vol. 3, 5.2.4), which needs
     *         8 bytes a point where boxed indices sorted by a comparator needed about 20
     */
    private int[] stableOrder() {
        int[] index = new int[count];
        for (int i = 0; i < count; i++) {
            index[i] = i;
        }
        int[] spare = new int[count];
        for (int width = 1; width < count; width *= 2) {
            for (int from = 0; from < count; from += 2 * width) {
                int middle = Math.min(from + width, count);
                int to = (int) Math.min((long) from + 2L * width, count);
                int a = from;
                int b = middle;
                for (int k = from; k < to; k++) {
                    // take from the left run on ties: that keeps the sort stable
                    if (a < middle && (b >= to || frequencyHz.get(index[a]) <= frequencyHz.get(index[b]))) {
                        spare[k] = index[a++];
                    } else {
                        spare[k] = index[b++];
                    }
                }
            }
            int[] swap = index;
            index = spare;
            spare = swap;
            if (width > count / 2) {
                break;
            }
        }
        return index;
    }

    private void reverse() {
        for (int i = 0, j = count - 1; i < j; i++, j--) {
            swap(frequencyHz, i, j);
            swap(gainDb, i, j);
            swap(phaseDeg, i, j);
            swap(gainUncertaintyDb, i, j);
            swap(phaseUncertaintyDeg, i, j);
            long line = lines.get(i);
            lines.set(i, lines.get(j));
            lines.set(j, line);
        }
    }

    private static void swap(DoubleColumn values, int i, int j) {
        double value = values.get(i);
        values.set(i, values.get(j));
        values.set(j, value);
    }

    /** @return the number of points after merging runs of equal frequency in place */
    private int mergeDuplicates() {
        int out = 0;
        int i = 0;
        while (i < count) {
            int j = i + 1;
            while (j < count && frequencyHz.get(j) == frequencyHz.get(i)) {
                tally.add("repeated frequencies", lines.get(j), "frequency " + format(frequencyHz.get(j))
                        + " Hz repeats line " + lines.get(i) + "; the readings are averaged into one point");
                j++;
            }
            int n = j - i;
            if (n == 1) {
                if (out != i) {
                    frequencyHz.set(out, frequencyHz.get(i));
                    gainDb.set(out, gainDb.get(i));
                    phaseDeg.set(out, phaseDeg.get(i));
                    gainUncertaintyDb.set(out, gainUncertaintyDb.get(i));
                    phaseUncertaintyDeg.set(out, phaseUncertaintyDeg.get(i));
                    lines.set(out, lines.get(i));
                }
            } else {
                double gainSum = 0;
                double phaseSum = 0;
                double uGain = gainUncertaintyDb.get(i);
                double uPhase = phaseUncertaintyDeg.get(i);
                for (int k = i; k < j; k++) {
                    gainSum += gainDb.get(k);
                    phaseSum += hasPhase ? PhaseUnwrap.nearestTurn(phaseDeg.get(k), phaseDeg.get(i)) : 0;
                    uGain = Math.max(uGain, gainUncertaintyDb.get(k));
                    uPhase = Math.max(uPhase, phaseUncertaintyDeg.get(k));
                }
                frequencyHz.set(out, frequencyHz.get(i));
                gainDb.set(out, gainSum / n);
                phaseDeg.set(out, hasPhase ? phaseSum / n : Double.NaN);
                gainUncertaintyDb.set(out, uGain);
                phaseUncertaintyDeg.set(out, uPhase);
                lines.set(out, lines.get(i));
            }
            out++;
            i = j;
        }
        return out;
    }

    private int indexOfHighestGain(int n) {
        int best = 0;
        for (int i = 1; i < n; i++) {
            if (gainDb.get(i) > gainDb.get(best)) {
                best = i;
            }
        }
        return best;
    }
}

package org.polebench.sweepfile;

import static org.polebench.sweepfile.ReadingConversion.format;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.ReadingScale;
import org.polebench.sweep.CalibrationAccuracy;
import org.polebench.sweep.LowerCornerEstimate;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.RoughLowerCorner;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Turns an instrument's raw readings, offered one at a time with their line, into a sweep:
 * converts units and applies the data checks ({@link ReadingConversion}, the rule live capture
 * shares) and drops bad readings with a warning each, then
 * sorts, merges duplicate frequencies, unwraps phase and refuses a sweep of fewer than
 * {@link #MIN_POINTS} points. Readings are kept in growing primitive arrays, so memory is a
 * few doubles per point whatever the file's size.
 *
 * <p>One instance serves one import and is not shared between threads.
 */
final class SweepAssembly {
    /** Fewer points than this cannot support a pole-zero fit of a two-pole stage (issue 3). */
    static final int MIN_POINTS = 8;

    private final Path file;
    private final ReadingScale scale;
    private final ReadingConversion conversion;
    private final boolean hasPhase;
    private final Optional<CalibrationAccuracy> calibration;
    private final WarningTally tally;

    private double[] frequencyHz = new double[256];
    private double[] gainDb = new double[256];
    private double[] phaseDeg = new double[256];
    private double[] gainUncertaintyDb = new double[256];
    private double[] phaseUncertaintyDeg = new double[256];
    private int[] lines = new int[256];
    private int count;

    /**
     * @param file      named in warnings and problems; null for a live port
     * @param hasPhase  whether every point carries a phase
     */
    SweepAssembly(Path file, InstrumentProfile profile, boolean hasPhase, WarningTally tally) {
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
     */
    boolean offer(int line, double rawFrequency, double rawGain, double rawInput, double rawOutput,
                  double rawPhase, double uGainDb, double uPhaseDeg) {
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
        grow();
        frequencyHz[count] = hz.value();
        gainDb[count] = gain.value();
        phaseDeg[count] = phase;
        gainUncertaintyDb[count] = uGainDb;
        phaseUncertaintyDeg[count] = uPhaseDeg;
        lines[count] = line;
        count++;
        return true;
    }

    private boolean drop(ReadingConversion.Dropped dropped, int line) {
        tally.add(dropped.reason().plural(), line, dropped.rowMessage());
        return false;
    }

    private void grow() {
        if (count < frequencyHz.length) {
            return;
        }
        int size = frequencyHz.length * 2;
        frequencyHz = Arrays.copyOf(frequencyHz, size);
        gainDb = Arrays.copyOf(gainDb, size);
        phaseDeg = Arrays.copyOf(phaseDeg, size);
        gainUncertaintyDb = Arrays.copyOf(gainUncertaintyDb, size);
        phaseUncertaintyDeg = Arrays.copyOf(phaseUncertaintyDeg, size);
        lines = Arrays.copyOf(lines, size);
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
    Sweep finish(Provenance provenance, int lastLine) throws InputProblem {
        requireEnough(count, lastLine);
        order();
        int merged = mergeDuplicates();
        requireEnough(merged, lastLine);
        if (hasPhase && scale.phaseWrapped()) {
            PhaseUnwrap.unwrap(phaseDeg, merged, indexOfHighestGain(merged));
        }
        List<SweepPoint> points = new ArrayList<>(merged);
        OptionalDouble lastUGain = OptionalDouble.empty();
        OptionalDouble lastUPhase = OptionalDouble.empty();
        for (int i = 0; i < merged; i++) {
            // a profile's default uncertainty is one value for every point: share one instance
            lastUGain = shared(lastUGain, gainUncertaintyDb[i]);
            lastUPhase = hasPhase ? shared(lastUPhase, phaseUncertaintyDeg[i]) : OptionalDouble.empty();
            OptionalDouble phase = hasPhase ? OptionalDouble.of(phaseDeg[i]) : OptionalDouble.empty();
            points.add(new SweepPoint(frequencyHz[i], gainDb[i], phase, lastUGain, lastUPhase));
        }
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

    private static OptionalDouble shared(OptionalDouble last, double value) {
        if (Double.isNaN(value)) {
            return OptionalDouble.empty();
        }
        if (last.isPresent() && Double.compare(last.getAsDouble(), value) == 0) {
            return last;
        }
        return OptionalDouble.of(value);
    }

    private void requireEnough(int points, int lastLine) throws InputProblem {
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
            ascending &= frequencyHz[i] >= frequencyHz[i - 1];
            descending &= frequencyHz[i] <= frequencyHz[i - 1];
        }
        if (ascending) {
            return;
        }
        if (descending) {
            tally.add("order changes", lines[0], "frequencies descend from this line on (a sweep from high to low); "
                    + "points reversed into ascending order");
            reverse();
            return;
        }
        for (int i = 1; i < count; i++) {
            if (frequencyHz[i] < frequencyHz[i - 1]) {
                tally.add("order changes", lines[i], "frequency " + format(frequencyHz[i]) + " Hz comes after "
                        + format(frequencyHz[i - 1]) + " Hz (line " + lines[i - 1] + "); points sorted by frequency");
            }
        }
        Integer[] index = new Integer[count];
        for (int i = 0; i < count; i++) {
            index[i] = i;
        }
        // stable, so repeated frequencies keep file order for merging
        Arrays.sort(index, Comparator.comparingDouble(i -> frequencyHz[i]));
        frequencyHz = permute(frequencyHz, index);
        gainDb = permute(gainDb, index);
        phaseDeg = permute(phaseDeg, index);
        gainUncertaintyDb = permute(gainUncertaintyDb, index);
        phaseUncertaintyDeg = permute(phaseUncertaintyDeg, index);
        int[] sortedLines = new int[count];
        for (int i = 0; i < count; i++) {
            sortedLines[i] = lines[index[i]];
        }
        lines = sortedLines;
    }

    private double[] permute(double[] values, Integer[] index) {
        double[] out = new double[count];
        for (int i = 0; i < count; i++) {
            out[i] = values[index[i]];
        }
        return out;
    }

    private void reverse() {
        for (int i = 0, j = count - 1; i < j; i++, j--) {
            swap(frequencyHz, i, j);
            swap(gainDb, i, j);
            swap(phaseDeg, i, j);
            swap(gainUncertaintyDb, i, j);
            swap(phaseUncertaintyDeg, i, j);
            int line = lines[i];
            lines[i] = lines[j];
            lines[j] = line;
        }
    }

    private static void swap(double[] values, int i, int j) {
        double value = values[i];
        values[i] = values[j];
        values[j] = value;
    }

    /** @return the number of points after merging runs of equal frequency in place */
    private int mergeDuplicates() {
        int out = 0;
        int i = 0;
        while (i < count) {
            int j = i + 1;
            while (j < count && frequencyHz[j] == frequencyHz[i]) {
                tally.add("repeated frequencies", lines[j], "frequency " + format(frequencyHz[j]) + " Hz repeats line "
                        + lines[i] + "; the readings are averaged into one point");
                j++;
            }
            double gainSum = 0;
            double phaseSum = 0;
            double uGain = gainUncertaintyDb[i];
            double uPhase = phaseUncertaintyDeg[i];
            for (int k = i; k < j; k++) {
                gainSum += gainDb[k];
                phaseSum += hasPhase ? PhaseUnwrap.nearestTurn(phaseDeg[k], phaseDeg[i]) : 0;
                uGain = Math.max(uGain, gainUncertaintyDb[k]);
                uPhase = Math.max(uPhase, phaseUncertaintyDeg[k]);
            }
            int n = j - i;
            frequencyHz[out] = frequencyHz[i];
            gainDb[out] = n == 1 ? gainDb[i] : gainSum / n;
            phaseDeg[out] = n == 1 ? phaseDeg[i] : (hasPhase ? phaseSum / n : Double.NaN);
            gainUncertaintyDb[out] = uGain;
            phaseUncertaintyDeg[out] = uPhase;
            lines[out] = lines[i];
            out++;
            i = j;
        }
        return out;
    }

    private int indexOfHighestGain(int n) {
        int best = 0;
        for (int i = 1; i < n; i++) {
            if (gainDb[i] > gainDb[best]) {
                best = i;
            }
        }
        return best;
    }
}

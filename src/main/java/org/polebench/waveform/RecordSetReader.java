package org.polebench.waveform;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.WaveformProfile;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Reads a set of waveform records, one at a time, into a sweep: each record is read, fitted
 * ({@link SineFitter}: three-parameter when it states its frequency, four-parameter otherwise)
 * and checked ({@link RecordChecks}), and only its point is kept, so memory is that of one
 * record. A record that does not read or cannot be fitted is dropped with a warning giving the
 * reason. The points' uncertainties are the fits' own; the profile's stated accuracy, when it
 * has one, is carried as the sweep's calibration term, as for a table.
 */
public final class RecordSetReader {
    /** A sweep needs as many points as a table import asks for (issue 3: a two-pole fit needs them). */
    public static final int MIN_RECORDS = 8;

    private final WaveformProfile profile;

    public RecordSetReader(WaveformProfile profile) {
        this.profile = profile;
    }

    /**
     * @param files  the record files, in the order to read them
     * @param origin the folder or first file the records came from, for the sweep's provenance
     * @param label  the profile's name as the user gave it ({@code auto} when sniffed)
     * @throws InputProblem when fewer than {@link #MIN_RECORDS} records give a point
     */
    public WaveformImport read(List<Path> files, Path origin, String label) throws InputProblem {
        MessageDigest all = sha256();
        RecordReader reader = new RecordReader(profile);
        RecordMeasurement measurement = new RecordMeasurement(profile.coding());
        List<InputWarning> warnings = new ArrayList<>();
        List<Kept> kept = new ArrayList<>();
        int threeParameter = 0;
        int fourParameter = 0;
        for (Path file : files) {
            MessageDigest one = sha256();
            try {
                WaveformRecord record = reader.read(file, one);
                OptionalDouble stated = record.statedFrequencyHz();
                if (stated.isPresent()) {
                    threeParameter++;
                } else {
                    if (profile.frequency().pattern().isPresent()) {
                        warnings.add(new InputWarning(file, 0, "the record states no frequency (the profile looks for "
                                + profile.frequency().pattern().get().pattern() + " in the " + profile.frequency().from().word()
                                + "); the frequency was fitted"));
                    }
                    fourParameter++;
                }
                RecordMeasurement.Outcome measured = measurement.measure(record, stated);
                if (measured.dropped().isPresent()) {
                    warnings.add(new InputWarning(file, 0, "record dropped: " + measured.dropped().get()));
                    continue;
                }
                warnings.addAll(measured.warnings());
                RecordFit fit = measured.fit();
                kept.add(new Kept(file, fit));
            } catch (InputProblem problem) {
                warnings.add(new InputWarning(file, problem.line(), "record dropped: " + problem.getMessage()
                        + " (" + problem.hint() + ")"));
            } finally {
                all.update(one.digest());
            }
        }
        kept.sort(Comparator.comparingDouble(k -> k.fit.frequencyHz()));
        List<Kept> distinct = new ArrayList<>();
        for (Kept k : kept) {
            if (!distinct.isEmpty()) {
                Kept last = distinct.get(distinct.size() - 1);
                if (k.fit.frequencyHz() <= last.fit.frequencyHz() * (1 + 1e-9)) {
                    warnings.add(new InputWarning(k.file, 0, "record dropped: its frequency repeats that of "
                            + last.file.getFileName()));
                    continue;
                }
            }
            distinct.add(k);
        }
        if (distinct.size() < MIN_RECORDS) {
            throw new InputProblem(origin, 0, files.size() + " record file(s) gave " + distinct.size()
                    + " usable point(s); a sweep needs at least " + MIN_RECORDS
                    + (warnings.isEmpty() ? "" : " (first reason: " + warnings.get(0).describe() + ")"),
                    "save a record at each of at least " + MIN_RECORDS + " frequencies, or check the profile ("
                            + profile.name() + ") against the records");
        }
        int n = distinct.size();
        double[] phase = new double[n];
        int highest = 0;
        for (int i = 0; i < n; i++) {
            phase[i] = distinct.get(i).fit.phaseDeg();
            if (distinct.get(i).fit.gainDb() > distinct.get(highest).fit.gainDb()) {
                highest = i;
            }
        }
        // each fitted phase is folded into one turn; unwrapped along frequency from the point of
        // highest gain, as a table's wrapped phase is
        PhaseUnwrap.unwrap(phase, n, highest);
        List<SweepPoint> points = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            RecordFit fit = distinct.get(i).fit;
            points.add(RecordMeasurement.point(fit, phase[i]));
        }
        String how = String.format(Locale.ROOT, "%d of %d records fitted (%d with the frequency stated, "
                + "three-parameter; %d with it free, four-parameter; IEEE Std 1057)", n, files.size(), threeParameter,
                fourParameter);
        Provenance provenance = new Provenance(Optional.of(origin), HexFormat.of().formatHex(all.digest()), "",
                label, Optional.empty(), Optional.empty(), List.of("waveform records: " + how));
        Sweep sweep = new Sweep(provenance, points, profile.accuracy().calibration(profile.name()));
        return new WaveformImport(sweep, mapping(how), warnings, files.size());
    }

    private String mapping(String how) {
        String clock = profile.clock().timeColumn().isPresent()
                ? "time = column " + profile.clock().timeColumn().getAsInt() + " in s"
                : "sample interval from the header";
        String samples = profile.coding().codes()
                ? String.format(Locale.ROOT, "ADC codes × %.6g V from code %.6g", profile.coding().voltsPerCode(),
                profile.coding().zeroCode())
                : "volts";
        return "waveform records: " + clock + "; input = column " + profile.channels().input() + ", output = column "
                + profile.channels().output() + " in " + samples + "; frequency " + profile.frequency().from().word()
                + "; " + how;
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }

    private record Kept(Path file, RecordFit fit) {
    }
}

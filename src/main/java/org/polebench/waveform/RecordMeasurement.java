package org.polebench.waveform;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.SampleCoding;
import org.polebench.sweep.SweepPoint;

/**
 * One record made into one gain and phase point: the IEEE Std 1057 fit (three-parameter when
 * the frequency is stated, four-parameter otherwise) and the record's checks (docs/method.md,
 * "Sine fitting of scope records" and "Checks of each record"). Shared by the import of record
 * files and by live scope capture, so that a record reads alike either way.
 */
public final class RecordMeasurement {
    private final SineFitter fitter = new SineFitter();
    private final RecordChecks checks;

    /** @param coding how the samples became volts, and the channel's rails or range (for the checks) */
    public RecordMeasurement(SampleCoding coding) {
        this.checks = new RecordChecks(coding);
    }

    /**
     * @param fit      the record's fit
     * @param dropped  why the fit means nothing and the record gives no point; empty when it gives one
     * @param warnings the checks' warnings (none when dropped)
     */
    public record Outcome(RecordFit fit, Optional<String> dropped, List<InputWarning> warnings) {
        public Outcome {
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * @param statedHz the test frequency when it is known (three-parameter fit), empty to fit it
     * @throws InputProblem when the record cannot be fitted at all (too short, flat)
     */
    public Outcome measure(WaveformRecord record, OptionalDouble statedHz) throws InputProblem {
        RecordFit fit = statedHz.isPresent() ? fitter.fitKnown(record, statedHz.getAsDouble()) : fitter.fitFree(record);
        Optional<String> unusable = checks.unusable(record, fit);
        if (unusable.isPresent()) {
            return new Outcome(fit, unusable, List.of());
        }
        return new Outcome(fit, Optional.empty(), checks.check(record, fit));
    }

    /**
     * @param phaseDeg the fit's phase once unwrapped against its neighbours
     * @return the sweep point of a fitted record, with the fit's standard uncertainties
     */
    public static SweepPoint point(RecordFit fit, double phaseDeg) {
        return new SweepPoint(fit.frequencyHz(), fit.gainDb(), OptionalDouble.of(phaseDeg),
                OptionalDouble.of(fit.gainUncertaintyDb()), OptionalDouble.of(fit.phaseUncertaintyDeg()));
    }
}

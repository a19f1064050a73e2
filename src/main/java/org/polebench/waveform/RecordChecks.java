package org.polebench.waveform;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputWarning;
import org.polebench.profile.SampleCoding;
import org.polebench.units.MeasuredValueFormat;

/**
 * The checks of one fitted record (docs/method.md, "Checks of each record"), each a warning
 * naming the record's file and, where one sample is concerned, its line and number: clipping,
 * fewer than two periods, a signal near the noise floor, harmonic distortion, and an offset that
 * takes the signal beyond the channel's range. {@link #unusable} says when a fit means nothing
 * and the record is dropped instead.
 */
public final class RecordChecks {
    /** Fewer periods than this in a record warn: the sine and its offset are then hard to tell apart. */
    public static final double MIN_PERIODS = 2;
    /** Below half a period the fit cannot tell a sine from a slope, and the record is dropped. */
    public static final double DROP_PERIODS = 0.5;
    /** A channel's signal-to-noise ratio below this warns. */
    public static final double NOISE_WARNING_DB = 20;
    /** Below this the fitted sine is not above the noise, and the record is dropped. */
    public static final double NOISE_DROP_DB = 0;
    /** Total harmonic distortion above this warns. */
    public static final double THD_WARNING = 0.01;
    /** Harmonics 2 to this one make up the THD (those below the Nyquist frequency). */
    public static final int HIGHEST_HARMONIC = 5;

    private final SampleCoding coding;

    public RecordChecks(SampleCoding coding) {
        this.coding = coding;
    }

    /** @return why the record's fit means nothing, when it does not; empty when it can be used */
    public Optional<String> unusable(WaveformRecord record, RecordFit fit) {
        double periods = fit.frequencyHz() * record.durationSeconds();
        if (periods < DROP_PERIODS) {
            return Optional.of(String.format(Locale.ROOT, "it holds %.2f periods of the fitted sine; a fit needs at "
                    + "least %.1f", periods, DROP_PERIODS));
        }
        for (int k = 0; k < 2; k++) {
            FittedSine sine = k == 0 ? fit.input() : fit.output();
            if (!(sine.snrDb() > NOISE_DROP_DB)) {
                return Optional.of(String.format(Locale.ROOT, "the %s channel's sine (%s) is not above its noise "
                        + "(σ %s)", k == 0 ? "input" : "output", volts(sine.amplitudeVolts()), volts(sine.noiseSigmaVolts())));
            }
        }
        if (!Double.isFinite(fit.gainDb()) || !Double.isFinite(fit.phaseDeg())) {
            return Optional.of("the fitted gain or phase is not finite");
        }
        return Optional.empty();
    }

    /** @return every warning about the record, input channel first */
    public List<InputWarning> check(WaveformRecord record, RecordFit fit) {
        List<InputWarning> warnings = new ArrayList<>();
        double periods = fit.frequencyHz() * record.durationSeconds();
        if (periods < MIN_PERIODS) {
            warnings.add(new InputWarning(record.file(), 0, String.format(Locale.ROOT,
                    "the record holds %.2f periods; with fewer than %.0f the sine and its offset are hard to tell apart "
                            + "and the uncertainties grow", periods, MIN_PERIODS)));
        }
        double[] thd = totalHarmonicDistortion(record, fit);
        for (int k = 0; k < 2; k++) {
            String channel = k == 0 ? "input" : "output";
            FittedSine sine = k == 0 ? fit.input() : fit.output();
            double[] y = k == 0 ? record.inputSamples() : record.outputSamples();
            clipping(record, fit, y, sine, channel).ifPresent(warnings::add);
            if (sine.snrDb() < NOISE_WARNING_DB) {
                warnings.add(new InputWarning(record.file(), 0, String.format(Locale.ROOT,
                        "the %s channel is near its noise floor: signal-to-noise %.1f dB (below %.0f dB)", channel,
                        sine.snrDb(), NOISE_WARNING_DB)));
            }
            if (thd[k] > THD_WARNING) {
                warnings.add(new InputWarning(record.file(), 0, String.format(Locale.ROOT,
                        "the %s channel is distorted: THD %.2f %% (harmonics 2 to %d; above %.0f %%); the gain and "
                                + "phase are the fundamental's", channel, 100 * thd[k], HIGHEST_HARMONIC,
                        100 * THD_WARNING)));
            }
            offset(record, sine, channel).ifPresent(warnings::add);
        }
        return warnings;
    }

    private Optional<InputWarning> offset(WaveformRecord record, FittedSine sine, String channel) {
        OptionalDouble low = coding.lowVolts();
        OptionalDouble high = coding.highVolts();
        if (low.isEmpty()) {
            return Optional.empty();
        }
        double top = sine.offsetVolts() + sine.amplitudeVolts();
        double bottom = sine.offsetVolts() - sine.amplitudeVolts();
        if (top > high.getAsDouble() || bottom < low.getAsDouble()) {
            return Optional.of(new InputWarning(record.file(), 0, String.format(Locale.ROOT,
                    "the %s channel's DC offset %s takes the sine (%s peak) beyond the channel's range %s to %s",
                    channel, volts(sine.offsetVolts()), volts(sine.amplitudeVolts()), volts(low.getAsDouble()),
                    volts(high.getAsDouble()))));
        }
        return Optional.empty();
    }

    /**
     * Clipping shows as a run of equal samples at the converter's rail, or at the record's own
     * highest or lowest value longer than an unclipped sine gives: a sine of amplitude A stays
     * within one resolution step q of its peak for 2·acos(1 − q/A)/ω seconds (common practice).
     */
    private Optional<InputWarning> clipping(WaveformRecord record, RecordFit fit, double[] y, FittedSine sine,
                                            String channel) {
        int n = y.length;
        double max = Double.NEGATIVE_INFINITY;
        double min = Double.POSITIVE_INFINITY;
        double step = Double.POSITIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            max = Math.max(max, y[i]);
            min = Math.min(min, y[i]);
            if (i > 0) {
                double d = Math.abs(y[i] - y[i - 1]);
                if (d > 0 && d < step) {
                    step = d;
                }
            }
        }
        double q = coding.codes() ? coding.voltsPerCode() : (Double.isFinite(step) ? step : 0);
        if (coding.lowRail().isPresent()) {
            for (double rail : new double[] {coding.volts(coding.lowRail().getAsDouble()),
                    coding.volts(coding.highRail().getAsDouble())}) {
                Run run = longestRun(y, rail);
                if (run.length >= 2) {
                    return Optional.of(warning(record, channel, run, rail, "at the converter's rail"));
                }
            }
        }
        double amplitude = Math.max(sine.amplitudeVolts(), Double.MIN_NORMAL);
        double omega = 2 * Math.PI * fit.frequencyHz();
        double dwell = 2 * Math.acos(Math.max(1 - q / amplitude, -1)) / (omega * record.intervalSeconds());
        long allowed = Math.max(3, (long) Math.ceil(2 * dwell + 2));
        for (double extreme : new double[] {max, min}) {
            Run run = longestRun(y, extreme);
            if (run.length >= allowed) {
                return Optional.of(warning(record, channel, run, extreme, "at the record's "
                        + (extreme == max ? "highest" : "lowest") + " value"));
            }
        }
        return Optional.empty();
    }

    /** Volts for people: four figures with an SI prefix and a true minus sign (units/MeasuredValueFormat). */
    private static String volts(double value) {
        return MeasuredValueFormat.engineering(value, "V", 4);
    }

    private static InputWarning warning(WaveformRecord record, String channel, Run run, double level, String where) {
        return new InputWarning(record.file(), record.lineOf(run.start), String.format(Locale.ROOT,
                "the %s channel is clipped: %d samples in a row %s (%s) from sample %d; its amplitude, "
                        + "and so the gain, reads low", channel, run.length, where, volts(level), run.start + 1));
    }

    private record Run(int start, int length) {
    }

    private static Run longestRun(double[] y, double value) {
        int bestStart = 0;
        int best = 0;
        int start = -1;
        for (int i = 0; i <= y.length; i++) {
            boolean at = i < y.length && y[i] == value;
            if (at && start < 0) {
                start = i;
            } else if (!at && start >= 0) {
                if (i - start > best) {
                    best = i - start;
                    bestStart = start;
                }
                start = -1;
            }
        }
        return new Run(bestStart, best);
    }

    /**
     * @return each channel's total harmonic distortion √(Σ A_h²)/A₁ over harmonics 2 to
     *         {@value #HIGHEST_HARMONIC} below the Nyquist frequency, each A_h from a
     *         three-parameter fit at h·f to the residual of the fundamental's fit (IEEE Std 1057
     *         allows fitting at any known frequency)
     */
    public static double[] totalHarmonicDistortion(WaveformRecord record, RecordFit fit) {
        int n = record.length();
        double w = 2 * Math.PI * fit.frequencyHz() * record.durationSeconds();
        double middle = record.startSeconds() + (n - 1) / 2.0 * record.intervalSeconds();
        double omega = 2 * Math.PI * fit.frequencyHz();
        double[][] fundamental = new double[2][3];
        FittedSine[] sines = {fit.input(), fit.output()};
        for (int k = 0; k < 2; k++) {
            double phaseMiddle = sines[k].phaseRad() + omega * middle;
            fundamental[k][0] = sines[k].amplitudeVolts() * Math.cos(phaseMiddle);
            fundamental[k][1] = -sines[k].amplitudeVolts() * Math.sin(phaseMiddle);
            fundamental[k][2] = sines[k].offsetVolts();
        }
        double[] sumSquares = new double[2];
        double[] in = record.inputSamples();
        double[] out = record.outputSamples();
        for (int h = 2; h <= HIGHEST_HARMONIC && h * w < Math.PI * n; h++) {
            double invN = 1.0 / n;
            double middleIndex = (n - 1) / 2.0;
            double baseCos = Math.cos(w * invN);
            double baseSin = Math.sin(w * invN);
            double stepCos = Math.cos(h * w * invN);
            double stepSin = Math.sin(h * w * invN);
            double cc = 0, ss = 0, cs = 0, c1 = 0, s1 = 0;
            double rc0 = 0, rs0 = 0, r10 = 0, rc1 = 0, rs1 = 0, r11 = 0;
            double a0 = fundamental[0][0], b0 = fundamental[0][1], d0 = fundamental[0][2];
            double a1 = fundamental[1][0], b1 = fundamental[1][1], d1 = fundamental[1][2];
            // blocks of 256 samples, each started from Math.cos and Math.sin (as SineFitter's sums)
            for (int start = 0; start < n; start += 256) {
                double theta = w * ((start - middleIndex) * invN);
                double bc = Math.cos(theta);
                double bs = Math.sin(theta);
                double c = Math.cos(h * theta);
                double s = Math.sin(h * theta);
                int end = Math.min(n, start + 256);
                for (int i = start; i < end; i++) {
                    cc += c * c;
                    ss += s * s;
                    cs += c * s;
                    c1 += c;
                    s1 += s;
                    double e0 = in[i] - (a0 * bc + b0 * bs + d0);
                    double e1 = out[i] - (a1 * bc + b1 * bs + d1);
                    rc0 += e0 * c;
                    rs0 += e0 * s;
                    r10 += e0;
                    rc1 += e1 * c;
                    rs1 += e1 * s;
                    r11 += e1;
                    double nb = bc * baseCos - bs * baseSin;
                    bs = bs * baseCos + bc * baseSin;
                    bc = nb;
                    double nc = c * stepCos - s * stepSin;
                    s = s * stepCos + c * stepSin;
                    c = nc;
                }
            }
            double[] rc = {rc0, rc1};
            double[] rs = {rs0, rs1};
            double[] r1 = {r10, r11};
            SineFitter.Sums sums = new SineFitter.Sums();
            sums.n = n;
            sums.cc = cc;
            sums.ss = ss;
            sums.cs = cs;
            sums.c = c1;
            sums.s = s1;
            for (int k = 0; k < 2; k++) {
                sums.yc[k] = rc[k];
                sums.ys[k] = rs[k];
                sums.y[k] = r1[k];
                double[] p = SineFitter.solve3(sums, k);
                sumSquares[k] += p[0] * p[0] + p[1] * p[1];
            }
        }
        return new double[] {Math.sqrt(sumSquares[0]) / sines[0].amplitudeVolts(),
                Math.sqrt(sumSquares[1]) / sines[1].amplitudeVolts()};
    }
}

package org.polebench.waveform;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputWarning;
import org.polebench.profile.ProfileReader;
import org.polebench.profile.SampleCoding;
import org.polebench.profile.WaveformProfile;
import org.polebench.waveform.TestRecords.Tone;

class RecordChecksTest {
    private static final double F = 1234.5;
    private static final double DT = 1e-5;
    private static final RecordChecks VOLTS = new RecordChecks(SampleCoding.volts(OptionalDouble.empty()));

    @TempDir
    Path folder;

    private static String messages(List<InputWarning> warnings) {
        return String.join(" | ", warnings.stream().map(InputWarning::describe).toList());
    }

    @Test
    void aFivePercentThirdHarmonicIsReportedAsItsThdAndLeavesTheGainAlone() throws Exception {
        // synthetic truth: the output carries a third harmonic at 5 % of its fundamental
        Tone in = Tone.of(0.5, 0.3, 0.01);
        Tone out = new Tone(2.0, -1.0, 0.0, 0.05);
        WaveformRecord record = TestRecords.record(2000, DT, 0, F, in, out, 0, null, OptionalDouble.of(F));
        RecordFit fit = new SineFitter().fitKnown(record, F);
        double[] thd = RecordChecks.totalHarmonicDistortion(record, fit);
        // 24.69 periods (not whole), so the harmonic leaks slightly into the fundamental's fit:
        // 1e-3 bounds that leakage here
        assertEquals(0.05, thd[1], 1e-3, "synthetic truth: THD of the output");
        assertEquals(0, thd[0], 1e-6, "synthetic truth: a clean input");
        // the fundamentals' ratio (synthetic truth); over a non-whole number of periods the harmonic
        // is not orthogonal to the fundamental, and leaks into its fit by about h3/(2π·periods) =
        // 0.05/155 of the amplitude, 0.003 dB: the tolerance allows that
        assertEquals(20 * Math.log10(2.0 / 0.5), fit.gainDb(), 0.005, "synthetic truth: the fundamentals' ratio");
        List<InputWarning> warnings = VOLTS.check(record, fit);
        assertEquals(1, warnings.size(), messages(warnings));
        assertTrue(warnings.get(0).message().contains("output channel is distorted: THD 5.0"), messages(warnings));
    }

    @Test
    void aClippedOutputIsNamedWithTheSampleWhereItsFlatTopStarts() throws Exception {
        // synthetic truth: an output of 1 V peak clipped at ±0.8 V by its channel
        Tone in = Tone.of(0.2, 0.0, 0.0);
        Tone out = Tone.of(1.0, 0.4, 0.0);
        WaveformRecord clean = TestRecords.record(2000, DT, 0, F, in, out, 0, null, OptionalDouble.of(F));
        double[] x = new double[2000];
        double[] y = new double[2000];
        for (int i = 0; i < 2000; i++) {
            x[i] = clean.input(i);
            y[i] = Math.max(-0.8, Math.min(0.8, clean.output(i)));
        }
        WaveformRecord record = new WaveformRecord(Path.of("clipped.csv"), 0, DT, x, y, OptionalDouble.of(F), 7);
        RecordFit fit = new SineFitter().fitKnown(record, F);
        List<InputWarning> warnings = VOLTS.check(record, fit);
        // independent of RecordChecks: the longest run of samples at +0.8 V or −0.8 V, found here
        int bestStart = -1;
        int best = 0;
        for (int i = 0; i < 2000; ) {
            if (Math.abs(y[i]) == 0.8) {
                int j = i;
                while (j < 2000 && y[j] == y[i]) {
                    j++;
                }
                if (j - i > best) {
                    best = j - i;
                    bestStart = i;
                }
                i = j;
            } else {
                i++;
            }
        }
        String expected = String.format(Locale.ROOT, "output channel is clipped: %d samples in a row", best);
        InputWarning clipping = warnings.stream().filter(w -> w.message().contains("clipped")).findFirst().orElseThrow(
                () -> new AssertionError(messages(warnings)));
        assertTrue(clipping.message().contains(expected) && clipping.message().contains("from sample " + (bestStart + 1)),
                clipping.describe());
        assertEquals(7 + bestStart, clipping.line(), "the sample's file line: the first sample's line plus its index");
        // the unclipped record gives no clipping warning
        assertTrue(VOLTS.check(clean, new SineFitter().fitKnown(clean, F)).isEmpty());
    }

    @Test
    void aRecordOfOneAndAHalfPeriodsWarnsAndStillFits() throws Exception {
        // synthetic truth: 150 Hz for 1000 samples of 10 µs is 1.5 periods
        Tone in = Tone.of(0.5, 0.3, 0.1);
        Tone out = Tone.of(1.5, -0.2, -0.1);
        WaveformRecord record = TestRecords.record(1000, DT, 0, 150, in, out, 1e-4, new Random(3), OptionalDouble.empty());
        RecordFit fit = new SineFitter().fitFree(record);
        List<InputWarning> warnings = VOLTS.check(record, fit);
        assertEquals(1, warnings.size(), messages(warnings));
        assertTrue(warnings.get(0).message().startsWith("the record holds 1.50 periods"), messages(warnings));
        // the stated uncertainty covers the truth (synthetic truth; k = 3 for a single draw)
        assertEquals(20 * Math.log10(3), fit.gainDb(), 3 * fit.gainUncertaintyDb());
        assertTrue(VOLTS.unusable(record, fit).isEmpty());
    }

    @Test
    void aSignalInTheNoiseWarnsAndOneBelowItIsDropped() throws Exception {
        Tone in = Tone.of(1.0, 0.0, 0.0);
        // synthetic truth: SNR of the output (0.05 V peak, σ 0.01 V) is 10·log10(0.05²/2/0.01²) = 11 dB
        WaveformRecord noisy = TestRecords.record(2000, DT, 0, F, in, Tone.of(0.05, 0, 0), 0.01, new Random(5),
                OptionalDouble.of(F));
        List<InputWarning> warnings = VOLTS.check(noisy, new SineFitter().fitKnown(noisy, F));
        assertTrue(warnings.stream().anyMatch(w -> w.message().startsWith("the output channel is near its noise floor")),
                messages(warnings));
        // and an output with no sine at all is dropped
        WaveformRecord silent = TestRecords.record(2000, DT, 0, F, in, Tone.of(0, 0, 0), 0.01, new Random(6),
                OptionalDouble.of(F));
        RecordFit fit = new SineFitter().fitKnown(silent, F);
        // a pure-noise fit has A² ≈ 4σ²/N (two parameters' noise), far below σ²: SNR ≈ 10·log10(2/N) < 0 dB
        assertTrue(VOLTS.unusable(silent, fit).orElse("").contains("output channel's sine"), fit.toString());
    }

    /** A 12-bit converter, 1 mV a code, 0 V at code 2048 (a profile of this test's own). */
    private WaveformProfile codesProfile() throws Exception {
        String yaml = String.join("\n",
                "kind: waveform",
                "name: test-codes",
                "description: tab-separated ADC codes with the interval in the header",
                "layout: {delimiter: tab, header-lines: 3}",
                "time: {interval-line: '^interval (?<seconds>\\S+)'}",
                "channels: {input: 1, output: 2}",
                "samples: {unit: codes, volts-per-code: 1 mV, zero-code: 2048, rails: [0, 4095]}",
                "frequency: {from: header, pattern: '^frequency (?<hz>\\S+)'}",
                "");
        return new ProfileReader().read(Path.of("test-codes.yaml"), new StringReader(yaml)).asWaveform().orElseThrow();
    }

    private Path codesRecord(String name, double outPeakVolts, double outOffsetVolts) throws Exception {
        StringBuilder text = new StringBuilder("interval 1e-5\nfrequency 1234.5\nch1\tch2\n");
        for (int i = 0; i < 2000; i++) {
            double t = i * DT;
            long a = Math.round(2048 + 1000 * Math.cos(2 * Math.PI * F * t + 0.3));
            long b = Math.round(2048 + 1000 * (outOffsetVolts + outPeakVolts * Math.cos(2 * Math.PI * F * t - 0.9)));
            text.append(Math.max(0, Math.min(4095, a))).append('\t').append(Math.max(0, Math.min(4095, b))).append('\n');
        }
        Path file = folder.resolve(name);
        Files.writeString(file, text);
        return file;
    }

    @Test
    void aRecordInAdcCodesIsScaledToVolts() throws Exception {
        WaveformProfile profile = codesProfile();
        WaveformRecord record = new RecordReader(profile).read(codesRecord("codes.txt", 1.5, 0), MessageDigest.getInstance("SHA-256"));
        RecordFit fit = new SineFitter().fitKnown(record, record.statedFrequencyHz().orElseThrow());
        // synthetic truth: 1.0 V and 1.5 V peaks; rounding to 1 mV codes adds σ = 1 mV/√12 of noise,
        // so the amplitudes scatter by √(2/N)·σ ≈ 9 µV (Händel 2000): 1e-4 V is ten times that
        assertEquals(1.0, fit.input().amplitudeVolts(), 1e-4);
        assertEquals(1.5, fit.output().amplitudeVolts(), 1e-4);
        assertEquals(Math.toDegrees(-1.2), fit.phaseDeg(), 0.01, "synthetic truth: −0.9 rad − 0.3 rad");
        assertEquals(1234.5, fit.frequencyHz(), 0, "stated in the header");
        assertTrue(new RecordChecks(profile.coding()).check(record, fit).isEmpty());
    }

    @Test
    void codesAtTheConvertersRailAreClippingAndAnOffsetBeyondTheRangeIsNamed() throws Exception {
        WaveformProfile profile = codesProfile();
        // synthetic truth: a 1.5 V peak on a 1.0 V offset reaches 2.5 V, beyond the top code's 2.047 V
        WaveformRecord record = new RecordReader(profile).read(codesRecord("rail.txt", 1.5, 1.0),
                MessageDigest.getInstance("SHA-256"));
        RecordFit fit = new SineFitter().fitKnown(record, 1234.5);
        String all = messages(new RecordChecks(profile.coding()).check(record, fit));
        assertTrue(all.contains("output channel is clipped") && all.contains("at the converter's rail (2.047 V)"), all);
        assertTrue(all.contains("output channel's DC offset"), all);
    }
}

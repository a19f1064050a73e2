package org.polebench.capture;

import java.io.IOException;
import java.time.Duration;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.SampleCoding;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.ReadingConversion;
import org.polebench.units.StrictNumber;
import org.polebench.waveform.RecordFit;
import org.polebench.waveform.RecordMeasurement;
import org.polebench.waveform.ScopeBlock;
import org.polebench.waveform.WaveformRecord;

/**
 * Capture from a generator and a two-channel scope ({@code kind: serial-scope}): the setup,
 * then per planned frequency: set the generator, settle, ask the scope's sample interval (and
 * each channel's volts per code when the profile has scale queries), fetch both channels'
 * records (ASCII numbers, or definite-length blocks read by their length prefix), and fit the
 * pair as it arrives with the three-parameter sine fit of IEEE Std 1057 at the frequency set
 * (it is known), with the record's checks as warnings. The method is in
 * docs/method.md, "Sine fitting of scope records".
 * The point goes to the sweep file at once, with the fit's own standard uncertainties, as
 * record import gives them (the profile's stated accuracy is a calibration term common to all
 * points, not a point's own). A timeout or an unreadable answer repeats the step after the
 * links are drained quiet; a record the fit cannot use leaves the point out, as import drops it.
 */
final class ScopeRunner implements ProtocolRunner {
    private final SerialProfile profile;
    private final LineProtocol.ScopeFetch scope;

    private final ScpiCommandSender sender;

    ScopeRunner(SerialProfile profile, LineProtocol.ScopeFetch scope) {
        this.profile = profile;
        this.scope = scope;
        this.sender = new ScpiCommandSender(profile, scope.maxAmplitude());
    }

    @Override
    public List<String> linkNames() {
        return new InstrumentLinks(scope.instruments()).names();
    }

    @Override
    public PortSettings portSettings(String linkName) {
        return new InstrumentLinks(scope.instruments()).port(linkName);
    }

    @Override
    public String linkFor(String instrument) {
        return instrument;
    }

    @Override
    public double maxAmplitude() {
        return scope.maxAmplitude();
    }

    @Override
    public double defaultAmplitude() {
        return scope.amplitude();
    }

    @Override
    public boolean hasPhase() {
        return true;
    }

    @Override
    public boolean pointUncertainties() {
        return true;
    }

    @Override
    public Map<String, String> identityQueries() {
        return new InstrumentLinks(scope.instruments()).identityQueries();
    }

    @Override
    public int identifyRetries() {
        return scope.retries();
    }

    @Override
    public void sweep(CaptureSession session) throws IOException, CaptureHalt {
        new Steps(session).run();
    }

    @Override
    public void finishQuietly(CaptureSession session) {
        sender.finishQuietly(session, scope.finish());
    }

    private String render(CaptureSession session, ScpiCommand command, double frequencyHz) {
        return sender.render(session, command, frequencyHz);
    }


    /** The steps of one capture, with what they keep from point to point. */
    private final class Steps {
        final CaptureSession s;
        double[] recordedHz;
        long elapsedNanos;
        int timedPoints;

        Steps(CaptureSession session) {
            this.s = session;
        }

        void run() throws IOException, CaptureHalt {
            for (ScpiCommand command : scope.setup()) {
                once(command);
            }
            int first = firstPending();
            s.listener.started(first + 1, s.plan.points());
            for (int i = first; i < s.plan.points(); i++) {
                long started = System.nanoTime();
                StepAttempt attempt = stepWithRetries(i);
                if (attempt.point != null) {
                    s.append(attempt.point);
                } else {
                    s.countLeftOut();
                    s.warn(ReadingConversion.format(recordedHz(i)) + " Hz left out: " + attempt.reason);
                    s.transcript.note("point left out: " + attempt.reason);
                }
                elapsedNanos += System.nanoTime() - started;
                timedPoints++;
                if (attempt.point != null) {
                    long leftMs = Math.round(elapsedNanos / 1e6 / timedPoints * (s.plan.points() - 1 - i));
                    s.listener.point(new CaptureProgress(i + 1, s.plan.points(), attempt.point, Duration.ofMillis(leftMs)));
                }
            }
            for (ScpiCommand command : scope.finish()) {
                once(command);
            }
        }

        private void once(ScpiCommand command) throws IOException, CaptureHalt {
            s.send(command.instrument(), render(s, command, Double.NaN));
            if (command.role().answered() && s.await(command.instrument(), scope.timeoutMs()).isEmpty()) {
                s.warn(command.instrument() + " did not answer '" + command.template() + "' within "
                        + scope.timeoutMs() + " ms");
            }
        }

        /** @return the index of the first planned point above the last one on file */
        private int firstPending() {
            Optional<SweepPoint> last = s.sweep.last();
            if (last.isEmpty()) {
                return 0;
            }
            int i = 0;
            while (i < s.plan.points() && recordedHz(i) <= last.get().frequencyHz()) {
                i++;
            }
            return i;
        }

        /** @return the frequency a point is recorded at: what the generator is told, in Hz */
        private double recordedHz(int i) {
            if (recordedHz == null) {
                ReadingScale scale = profile.scale();
                recordedHz = new double[s.plan.points()];
                for (int j = 0; j < recordedHz.length; j++) {
                    recordedHz[j] = scale.hertz(Double.parseDouble(ScpiCommand.nr3(scale.rawFrequency(s.plan.frequencyHz(j)))));
                }
            }
            return recordedHz[i];
        }

        private StepAttempt stepWithRetries(int i) throws IOException, CaptureHalt {
            double hz = recordedHz(i);
            StepAttempt attempt = null;
            for (int n = 0; n <= scope.retries(); n++) {
                if (n > 0) {
                    s.listener.retrying(hz, attempt.reason, n, scope.retries());
                    s.transcript.note("repeating the step for " + ReadingConversion.format(hz) + " Hz (" + n + " of "
                            + scope.retries() + "): " + attempt.reason);
                    drainAll();
                }
                attempt = step(hz);
                if (attempt.point != null || !attempt.failure.worthRepeating) {
                    return attempt;
                }
            }
            CaptureOutcome.StopReason reason = attempt.failure == StepAttempt.Failure.NO_ANSWER
                    ? CaptureOutcome.StopReason.NO_ANSWER : CaptureOutcome.StopReason.BAD_ANSWERS;
            throw new CaptureHalt(reason, "at " + ReadingConversion.format(hz) + " Hz (point " + (i + 1) + " of "
                    + s.plan.points() + "): " + attempt.reason + ", " + (scope.retries() + 1) + " times");
        }

        /** Late answers of a failed step (a block's tail, an answer after its timeout) are set aside. */
        private void drainAll() throws IOException, CaptureHalt {
            Map<LineTransport, Boolean> seen = new IdentityHashMap<>();
            for (LineProtocol.ScpiInstrument instrument : scope.instruments()) {
                LineTransport link = s.links.get(instrument.name());
                if (seen.put(link, Boolean.TRUE) == null) {
                    s.drainUntilQuiet(instrument.name(), CaptureSession.QUIET_MS);
                    String tail = link.discardUnfinished();
                    if (!tail.isEmpty()) {
                        s.transcript.note("discarded " + tail.length() + " characters from " + instrument.name()
                                + " without a line ending (the tail of an answer cut short)");
                    }
                }
            }
        }

        private StepAttempt step(double frequencyHz) throws IOException, CaptureHalt {
            s.send(scope.setFrequency().instrument(), render(s, scope.setFrequency(), frequencyHz));
            s.settle(scope.settle().millisAt(frequencyHz));
            Answer interval = number(scope.interval(), "sample interval");
            if (interval.failure != null) {
                return interval.failure;
            }
            SampleCoding inputCoding = scope.coding();
            SampleCoding outputCoding = scope.coding();
            if (scope.inputScale().isPresent()) {
                Answer in = number(scope.inputScale().get(), "input channel's volts per code");
                if (in.failure != null) {
                    return in.failure;
                }
                Answer out = number(scope.outputScale().get(), "output channel's volts per code");
                if (out.failure != null) {
                    return out.failure;
                }
                inputCoding = scaled(in.value);
                outputCoding = scaled(out.value);
            }
            Samples input = record(scope.input(), inputCoding);
            if (input.failure != null) {
                return input.failure;
            }
            Samples output = record(scope.output(), outputCoding);
            if (output.failure != null) {
                return output.failure;
            }
            if (input.volts.length != output.volts.length) {
                return StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "the channels' records differ in length ("
                        + input.volts.length + " and " + output.volts.length + " samples)");
            }
            WaveformRecord record = new WaveformRecord(null, 0, interval.value, input.volts, output.volts,
                    OptionalDouble.of(frequencyHz), 0);
            // with a scale per channel the rails differ between channels, so the checks look for
            // clipping at each record's own extremes; with one coding its rails are checked too
            SampleCoding checked = scope.inputScale().isPresent() ? SampleCoding.volts(OptionalDouble.empty()) : scope.coding();
            RecordMeasurement.Outcome measured;
            try {
                measured = new RecordMeasurement(checked).measure(record, OptionalDouble.of(frequencyHz));
            } catch (InputProblem problem) {
                return StepAttempt.leftOut(frequencyHz, "its records cannot be fitted: " + problem.getMessage());
            }
            if (measured.dropped().isPresent()) {
                return StepAttempt.leftOut(frequencyHz, "record dropped: " + measured.dropped().get());
            }
            String at = ReadingConversion.format(frequencyHz) + " Hz: ";
            for (InputWarning warning : measured.warnings()) {
                s.warn(at + warning.message());
            }
            RecordFit fit = measured.fit();
            return StepAttempt.of(RecordMeasurement.point(fit, s.unwrapPhaseDeg(fit.phaseDeg())));
        }

        private SampleCoding scaled(double voltsPerCode) {
            SampleCoding c = scope.coding();
            return new SampleCoding(true, voltsPerCode, c.zeroCode(), c.lowRail(), c.highRail(), OptionalDouble.empty());
        }

        private Answer number(LineProtocol.ScopeQuery query, String what) throws IOException, CaptureHalt {
            s.send(query.instrument(), query.query());
            Optional<String> answer = s.await(query.instrument(), scope.timeoutMs());
            if (answer.isEmpty()) {
                return Answer.failed(StepAttempt.failed(StepAttempt.Failure.NO_ANSWER, "no answer from "
                        + query.instrument() + " to '" + query.query() + "' within " + scope.timeoutMs() + " ms"));
            }
            double value = StrictNumber.parse(answer.get().strip(), false);
            if (!(value > 0) || !Double.isFinite(value)) {
                return Answer.failed(StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "the " + what + " '"
                        + answer.get().strip() + "' (answer to '" + query.query() + "') is not a positive number"));
            }
            return new Answer(value, null);
        }

        private Samples record(LineProtocol.ScopeQuery query, SampleCoding coding) throws IOException, CaptureHalt {
            s.send(query.instrument(), query.query());
            double[] values;
            try {
                if (scope.format() == LineProtocol.WaveformFormat.BLOCK) {
                    Optional<BlockAnswer> block = s.awaitBlock(query.instrument(), scope.timeoutMs());
                    if (block.isEmpty()) {
                        return Samples.failed(noRecord(query));
                    }
                    if (block.get().refusal().isPresent()) {
                        return Samples.failed(StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "the answer to '"
                                + query.query() + "' is not a record: " + block.get().refusal().get()));
                    }
                    values = ScopeBlock.definiteLength(block.get().bytes(), scope.blockCoding());
                } else {
                    Optional<String> line = s.await(query.instrument(), scope.timeoutMs());
                    if (line.isEmpty()) {
                        return Samples.failed(noRecord(query));
                    }
                    values = ScopeBlock.ascii(line.get());
                }
            } catch (InputProblem problem) {
                return Samples.failed(StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "the answer to '"
                        + query.query() + "' is not a record: " + problem.getMessage()));
            }
            if (coding.codes()) {
                for (int k = 0; k < values.length; k++) {
                    values[k] = coding.volts(values[k]);
                }
            }
            return new Samples(values, null);
        }

        private StepAttempt noRecord(LineProtocol.ScopeQuery query) {
            return StepAttempt.failed(StepAttempt.Failure.NO_ANSWER, "no record from " + query.instrument() + " to '"
                    + query.query() + "' within " + scope.timeoutMs() + " ms");
        }
    }

    /** A number answered, or the failed attempt. */
    private static final class Answer {
        final double value;
        final StepAttempt failure;

        Answer(double value, StepAttempt failure) {
            this.value = value;
            this.failure = failure;
        }

        static Answer failed(StepAttempt failure) {
            return new Answer(Double.NaN, failure);
        }
    }

    /** One channel's record in volts, or the failed attempt. */
    private static final class Samples {
        final double[] volts;
        final StepAttempt failure;

        Samples(double[] volts, StepAttempt failure) {
            this.volts = volts;
            this.failure = failure;
        }

        static Samples failed(StepAttempt failure) {
            return new Samples(null, failure);
        }
    }
}

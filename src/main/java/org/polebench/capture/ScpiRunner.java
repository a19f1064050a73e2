package org.polebench.capture;

import java.io.IOException;
import java.time.Duration;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import org.polebench.profile.CommandRole;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.ReadingConversion;
import org.polebench.units.StrictNumber;

/**
 * Capture by SCPI command and answer: the setup, then per planned frequency the profile's step
 * (set the frequency, settle, read, check the error queue), repeated after a timeout, an
 * unreadable or erroneous answer or an error in the queue, with the link brought back in step
 * before each repeat (see {@link SweepCapture} for the fault rules and their sources), then the
 * finish commands.
 */
final class ScpiRunner implements ProtocolRunner {
    /** SCPI's overrange reading, 9.9E37 (SCPI-99 vol. 1 §7.2.1.5, from memory). */
    private static final double SCPI_OVERRANGE = 9.9e37;
    private static final Pattern ERROR_ANSWER = Pattern.compile("^(?<code>[+-]?\\d+)\\s*,\\s*\"(?<text>.*)\"$");
    /** Error-queue entries read after one error before giving up: a queue holds a few dozen at most. */
    private static final int MAX_QUEUE_READS = 32;

    private final SerialProfile profile;
    private final LineProtocol.ScpiExchange scpi;

    private final ScpiCommandSender sender;

    ScpiRunner(SerialProfile profile, LineProtocol.ScpiExchange scpi) {
        this.profile = profile;
        this.scpi = scpi;
        this.sender = new ScpiCommandSender(profile, scpi.maxAmplitude());
    }

    @Override
    public List<String> linkNames() {
        return new InstrumentLinks(scpi.instruments()).names();
    }

    @Override
    public PortSettings portSettings(String linkName) {
        return new InstrumentLinks(scpi.instruments()).port(linkName);
    }

    /** Each SCPI instrument has a link of its own name (several names may share one link). */
    @Override
    public String linkFor(String instrument) {
        return instrument;
    }

    @Override
    public double maxAmplitude() {
        return scpi.maxAmplitude();
    }

    @Override
    public double defaultAmplitude() {
        return scpi.amplitude();
    }

    @Override
    public boolean hasPhase() {
        return scpi.step().stream().anyMatch(c -> c.role() == CommandRole.READS_PHASE);
    }

    @Override
    public Map<String, String> identityQueries() {
        return new InstrumentLinks(scpi.instruments()).identityQueries();
    }

    @Override
    public int identifyRetries() {
        return scpi.retries();
    }

    @Override
    public void sweep(CaptureSession session) throws IOException, CaptureHalt {
        new Steps(session).run();
    }

    @Override
    public void finishQuietly(CaptureSession session) {
        sender.finishQuietly(session, scpi.finish());
    }

    private String render(CaptureSession session, ScpiCommand command, double frequencyHz) {
        return sender.render(session, command, frequencyHz);
    }


    private static int code(Matcher error) {
        return Integer.parseInt(error.group("code").replace("+", ""));
    }

    /** The steps of one capture, with what they keep from point to point. */
    private final class Steps {
        final CaptureSession s;
        final Map<LineTransport, Integer> owedIdentities = new IdentityHashMap<>();
        long overheadNanos;
        int timedPoints;
        double[] recordedHz;
        long[] settleAfterMs;

        Steps(CaptureSession session) {
            this.s = session;
        }

        void run() throws IOException, CaptureHalt {
            for (ScpiCommand command : scpi.setup()) {
                exchangeOnce(command, Double.NaN);
            }
            if (!scpi.errorQuery().isBlank()) {
                List<String> errors = readErrorQueue(scpi.instruments().get(0).name(), Optional.empty());
                if (!errors.isEmpty()) {
                    throw new CaptureHalt(CaptureOutcome.StopReason.SETUP_REFUSED, "the instrument reported "
                            + String.join("; ", errors) + " after the setup commands; check the profile's setup against "
                            + "the instrument's manual");
                }
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
                long elapsed = System.nanoTime() - started;
                overheadNanos += Math.max(0, elapsed - scpi.settle().millisAt(recordedHz(i)) * 1_000_000L);
                timedPoints++;
                if (attempt.point != null) {
                    s.listener.point(new CaptureProgress(i + 1, s.plan.points(), attempt.point, timeLeft(i)));
                }
            }
            for (ScpiCommand command : scpi.finish()) {
                exchangeOnce(command, Double.NaN);
            }
        }

        private Duration timeLeft(int done) {
            int points = s.plan.points();
            if (settleAfterMs == null) {
                // the settling still to come after each point, summed from the top once
                settleAfterMs = new long[points];
                for (int j = points - 2; j >= 0; j--) {
                    settleAfterMs[j] = settleAfterMs[j + 1] + scpi.settle().millisAt(recordedHz(j + 1));
                }
            }
            double meanOverheadMs = timedPoints == 0 ? 0 : overheadNanos / 1e6 / timedPoints;
            return Duration.ofMillis(Math.round(settleAfterMs[done] + (points - 1 - done) * meanOverheadMs));
        }

        /** @return the index of the first planned point above the last one on file */
        private int firstPending() {
            Optional<SweepPoint> last = s.sweep.last();
            if (last.isEmpty()) {
                return 0;
            }
            double lastHz = last.get().frequencyHz();
            int i = 0;
            while (i < s.plan.points() && recordedHz(i) <= lastHz) {
                i++;
            }
            return i;
        }

        /** @return the frequency a point is recorded at: what the instrument is told, in Hz */
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

        /** Setup and finish: one command, its answer read and logged when it has one. */
        private void exchangeOnce(ScpiCommand command, double frequencyHz) throws IOException, CaptureHalt {
            s.send(command.instrument(), render(s, command, frequencyHz));
            if (command.role().answered()) {
                if (s.await(command.instrument(), scpi.timeoutMs()).isEmpty()) {
                    s.warn(command.instrument() + " did not answer '" + command.template() + "' within "
                            + scpi.timeoutMs() + " ms");
                }
            }
        }

        private StepAttempt stepWithRetries(int i) throws IOException, CaptureHalt {
            double hz = recordedHz(i);
            StepAttempt attempt = null;
            for (int n = 0; n <= scpi.retries(); n++) {
                if (n > 0) {
                    s.listener.retrying(hz, attempt.reason, n, scpi.retries());
                    s.transcript.note("repeating the step for " + ReadingConversion.format(hz) + " Hz (" + n + " of "
                            + scpi.retries() + "): " + attempt.reason);
                    if (!resynchronise()) {
                        attempt = StepAttempt.failed(StepAttempt.Failure.NO_ANSWER, "the instrument did not answer its "
                                + "identity query within " + scpi.timeoutMs() + " ms while polebench brought the line "
                                + "back in step");
                        continue;
                    }
                }
                attempt = step(hz);
                if (attempt.point != null || !attempt.failure.worthRepeating) {
                    return attempt;
                }
                s.transcript.note("step for " + ReadingConversion.format(hz) + " Hz failed: " + attempt.reason);
            }
            CaptureOutcome.StopReason reason = attempt.failure == StepAttempt.Failure.NO_ANSWER
                    ? CaptureOutcome.StopReason.NO_ANSWER : CaptureOutcome.StopReason.BAD_ANSWERS;
            throw new CaptureHalt(reason, "at " + ReadingConversion.format(hz) + " Hz (point " + (i + 1) + " of "
                    + s.plan.points() + "): " + attempt.reason + ", " + (scpi.retries() + 1) + " times");
        }

        private StepAttempt step(double frequencyHz) throws IOException, CaptureHalt {
            boolean waits = scpi.step().stream().anyMatch(c -> c.role() == CommandRole.WAITS_FOR_COMPLETION);
            long settleMs = scpi.settle().millisAt(frequencyHz);
            double gain = Double.NaN;
            double input = Double.NaN;
            double output = Double.NaN;
            double phase = Double.NaN;
            for (ScpiCommand command : scpi.step()) {
                String text = render(s, command, frequencyHz);
                s.send(command.instrument(), text);
                if (command.role() == CommandRole.SETS_FREQUENCY && !waits) {
                    s.settle(settleMs);
                }
                if (!command.role().answered()) {
                    continue;
                }
                Optional<String> answer = s.await(command.instrument(), scpi.timeoutMs());
                if (answer.isEmpty()) {
                    return StepAttempt.failed(StepAttempt.Failure.NO_ANSWER, "no answer from " + command.instrument()
                            + " to '" + text + "' within " + scpi.timeoutMs() + " ms");
                }
                String body = answer.get().strip();
                Matcher error = ERROR_ANSWER.matcher(body);
                switch (command.role()) {
                    case WAITS_FOR_COMPLETION:
                        if (!body.equals("1") && !body.equals("+1")) {
                            return unreadable(command, body);
                        }
                        s.settle(settleMs);
                        break;
                    case READS_ERROR_QUEUE:
                        if (!error.matches()) {
                            return unreadable(command, body);
                        }
                        if (code(error) != 0) {
                            List<String> more = readErrorQueue(command.instrument(), Optional.of(body));
                            return StepAttempt.failed(StepAttempt.Failure.ERROR, command.instrument() + " reported "
                                    + String.join("; ", more));
                        }
                        break;
                    case IDENTIFIES:
                        break;
                    default: {
                        if (error.matches() && code(error) != 0) {
                            return StepAttempt.failed(StepAttempt.Failure.ERROR, command.instrument() + " answered '"
                                    + text + "' with the error " + body);
                        }
                        double value = StrictNumber.parse(body, false);
                        if (Double.isNaN(value)) {
                            return unreadable(command, body);
                        }
                        if (Math.abs(value) >= SCPI_OVERRANGE) {
                            return StepAttempt.failed(StepAttempt.Failure.SATURATED, command.instrument() + " answered '"
                                    + text + "' with the overrange value " + body + " (its input is saturated)");
                        }
                        if (command.role() == CommandRole.READS_GAIN) {
                            gain = value;
                        } else if (command.role() == CommandRole.READS_INPUT_AMPLITUDE) {
                            input = value;
                        } else if (command.role() == CommandRole.READS_OUTPUT_AMPLITUDE) {
                            output = value;
                        } else if (command.role() == CommandRole.READS_PHASE) {
                            phase = value;
                        }
                    }
                }
            }
            return s.point(frequencyHz, gain, input, output, phase);
        }

        private StepAttempt unreadable(ScpiCommand command, String body) {
            return StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "the answer '" + CaptureTranscript.escaped(body)
                    + "' from " + command.instrument() + " to '" + command.template() + "' cannot be read");
        }

        /**
         * Reads the error queue until it answers code 0.
         *
         * @param first an entry read already
         * @return the non-zero entries, oldest first
         */
        private List<String> readErrorQueue(String instrument, Optional<String> first) throws IOException, CaptureHalt {
            List<String> errors = new ArrayList<>();
            first.ifPresent(errors::add);
            for (int n = 0; n < MAX_QUEUE_READS; n++) {
                s.send(instrument, scpi.errorQuery());
                Optional<String> answer = s.await(instrument, scpi.timeoutMs());
                if (answer.isEmpty()) {
                    errors.add("(no answer to " + scpi.errorQuery() + ")");
                    return errors;
                }
                Matcher entry = ERROR_ANSWER.matcher(answer.get().strip());
                if (!entry.matches()) {
                    errors.add("(unreadable error-queue answer '" + CaptureTranscript.escaped(answer.get()) + "')");
                    return errors;
                }
                if (code(entry) == 0) {
                    return errors;
                }
                errors.add(answer.get().strip());
            }
            return errors;
        }

        /**
         * Brings every link back in step: on each, asks the identity and discards every line
         * until the identity comes back, as many times as identities are owed on that link
         * (an earlier resynchronisation may have timed out with its query still queued); once
         * one has come back, a short quiet spell also ends the wait, in case an owed answer
         * was lost. A link without a known identity is drained until quiet.
         *
         * @return false when some link did not give its identity back within the timeout
         */
        private boolean resynchronise() throws IOException, CaptureHalt {
            Map<LineTransport, String> seen = new IdentityHashMap<>();
            boolean synced = true;
            for (LineProtocol.ScpiInstrument instrument : scpi.instruments()) {
                LineTransport link = s.links.get(instrument.name());
                String identity = s.identities.get(instrument.name());
                if (seen.containsKey(link)) {
                    continue;
                }
                seen.put(link, instrument.name());
                if (identity == null) {
                    s.drainUntilQuiet(instrument.name(), Math.min(scpi.timeoutMs(), CaptureSession.QUIET_MS));
                    continue;
                }
                owedIdentities.merge(link, 1, Integer::sum);
                s.send(instrument.name(), instrument.identify());
                long deadline = System.nanoTime() + scpi.timeoutMs() * 1_000_000L;
                boolean back = false;
                while (true) {
                    long leftMs = back ? CaptureSession.QUIET_MS : (deadline - System.nanoTime()) / 1_000_000L;
                    Optional<String> line = leftMs > 0 ? s.await(instrument.name(), leftMs) : Optional.empty();
                    if (line.isEmpty()) {
                        if (back) {
                            owedIdentities.put(link, 0);   // an owed answer was lost: the line is quiet and in step
                        } else {
                            s.transcript.note("resynchronising " + instrument.name() + ": its identity did not come "
                                    + "back within " + scpi.timeoutMs() + " ms");
                            synced = false;
                        }
                        break;
                    }
                    if (line.get().strip().equals(identity)) {
                        back = true;
                        int owed = owedIdentities.merge(link, -1, Integer::sum);
                        if (owed <= 0) {
                            owedIdentities.put(link, 0);
                            break;
                        }
                        continue;
                    }
                    s.transcript.note("discarded while resynchronising " + instrument.name() + ": a late or stray line");
                }
            }
            return synced;
        }
    }
}

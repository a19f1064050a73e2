package org.polebench.capture;

import java.io.IOException;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import com.google.re2j.Matcher;
import org.polebench.profile.GainForm;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.ReadingConversion;
import org.polebench.units.StrictNumber;

/**
 * Capture from an instrument that sweeps by itself: one start command, then one line per
 * point until the end line. A point on file already (a resumed capture) is not added again; a
 * point whose line cannot be read, or whose reading import would drop, is left out with a
 * warning; silence for the profile's timeout stops the capture, and the instrument is told
 * to halt.
 */
final class StreamRunner implements ProtocolRunner {
    /** Identity queries repeated when unanswered: the streaming profiles name no retries of their own. */
    private static final int IDENTIFY_RETRIES = 2;

    private final SerialProfile profile;
    private final LineProtocol.StreamedLines stream;

    StreamRunner(SerialProfile profile, LineProtocol.StreamedLines stream) {
        this.profile = profile;
        this.stream = stream;
    }

    /** One link, named for the profile. */
    @Override
    public List<String> linkNames() {
        return List.of(profile.name());
    }

    @Override
    public PortSettings portSettings(String linkName) {
        return stream.port();
    }

    @Override
    public String linkFor(String instrument) {
        return profile.name();
    }

    @Override
    public double maxAmplitude() {
        return stream.maxAmplitude();
    }

    @Override
    public double defaultAmplitude() {
        return stream.amplitude();
    }

    @Override
    public boolean hasPhase() {
        return stream.point().pattern().contains("(?<phase>");
    }

    @Override
    public Map<String, String> identityQueries() {
        Map<String, String> queries = new LinkedHashMap<>();
        if (!stream.identify().isBlank()) {
            queries.put(profile.name(), stream.identify());
        }
        return queries;
    }

    @Override
    public int identifyRetries() {
        return IDENTIFY_RETRIES;
    }

    @Override
    public void sweep(CaptureSession s) throws IOException, CaptureHalt {
        String who = profile.name();
        ReadingScale scale = profile.scale();
        String start = stream.start()
                .replace("{start_hz_nr3}", ScpiCommand.nr3(scale.rawFrequency(s.plan.fromHz())))
                .replace("{stop_hz_nr3}", ScpiCommand.nr3(scale.rawFrequency(s.plan.toHz())))
                .replace("{points}", Integer.toString(s.plan.points()))
                .replace(ScpiCommand.AMPLITUDE, ScpiCommand.nr3(s.amplitude));
        double lastOnFile = s.sweep.last().map(SweepPoint::frequencyHz).orElse(0.0);
        int onFile = s.sweep.points().size();
        s.listener.started(onFile + 1, s.plan.points());
        s.send(who, start);
        int seen = 0;
        while (true) {
            Optional<String> answer;
            try {
                answer = s.await(who, stream.timeoutMs());
            } catch (CaptureHalt halt) {
                finishQuietly(s);
                throw halt;
            }
            if (answer.isEmpty()) {
                finishQuietly(s);
                throw new CaptureHalt(CaptureOutcome.StopReason.NO_ANSWER, "the instrument sent nothing for "
                        + stream.timeoutMs() + " ms after " + seen + " points of this run");
            }
            String body = answer.get().strip();
            Matcher point = stream.point().matcher(body);
            if (point.matches()) {
                seen++;
                StepAttempt attempt = streamedPoint(s, point, scale);
                if (attempt.point == null) {
                    s.countLeftOut();
                    s.warn(Double.isNaN(attempt.frequencyHz) ? "a streamed point was left out: " + attempt.reason
                            : ReadingConversion.format(attempt.frequencyHz) + " Hz left out: " + attempt.reason);
                } else if (attempt.point.frequencyHz() <= lastOnFile) {
                    s.transcript.note("point at " + ReadingConversion.format(attempt.point.frequencyHz())
                            + " Hz is on file already; not added again");
                } else {
                    s.append(attempt.point);
                    lastOnFile = attempt.point.frequencyHz();
                    int number = Math.min(s.sweep.points().size(), s.plan.points());
                    s.listener.point(new CaptureProgress(number, s.plan.points(), attempt.point, Duration.ZERO));
                }
                continue;
            }
            if (stream.error().isPresent() && stream.error().get().matcher(body).matches()) {
                s.warn("the instrument reported an error: " + CaptureTranscript.escaped(body));
                continue;
            }
            if (stream.end().isPresent() && stream.end().get().matcher(body).matches()) {
                return;
            }
            if (stream.ignore().stream().noneMatch(p -> p.matcher(body).matches())) {
                s.warn("a line matching nothing in the profile was skipped: " + CaptureTranscript.escaped(body));
            }
        }
    }

    private StepAttempt streamedPoint(CaptureSession s, Matcher point, ReadingScale scale) {
        boolean amplitudes = scale.gainForm() == GainForm.AMPLITUDES;
        boolean hasPhase = hasPhase();
        double rawHz = number(point, "frequency");
        double g = amplitudes ? Double.NaN : number(point, "gain");
        double in = amplitudes ? number(point, "input") : Double.NaN;
        double out = amplitudes ? number(point, "output") : Double.NaN;
        double ph = hasPhase ? number(point, "phase") : Double.NaN;
        if (Double.isNaN(rawHz) || !amplitudes && Double.isNaN(g) || amplitudes && (Double.isNaN(in) || Double.isNaN(out))
                || hasPhase && Double.isNaN(ph)) {
            return StepAttempt.failed(StepAttempt.Failure.UNREADABLE, "'" + point.group() + "' has a field that is not a number");
        }
        ReadingConversion.Reading hz = s.frequencyHz(rawHz);
        if (hz.dropped().isPresent()) {
            return StepAttempt.failed(StepAttempt.Failure.LEFT_OUT, "'" + point.group() + "': "
                    + hz.dropped().get().message());
        }
        return s.point(hz.value(), g, in, out, ph);
    }

    private static double number(Matcher matcher, String group) {
        String text = matcher.group(group);
        return text == null ? Double.NaN : StrictNumber.parse(text, false);
    }

    /** Tells the instrument to halt its sweep, where the profile has a command for it. */
    @Override
    public void finishQuietly(CaptureSession s) {
        if (!stream.stop().isBlank()) {
            try {
                s.send(profile.name(), stream.stop());
            } catch (IOException e) {
                // the port is gone: nothing more can be told to the instrument
            }
        }
    }
}

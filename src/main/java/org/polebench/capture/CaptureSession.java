package org.polebench.capture;

import java.io.IOException;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.BooleanSupplier;
import org.polebench.InputProblem;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.AppendedSweep;
import org.polebench.sweepfile.ReadingConversion;

/**
 * One capture as it runs, whatever the protocol: the links and the lines on them, the
 * transcript, identification, the sweep file, the conversion of readings into points and the
 * warnings. Its {@link ProtocolRunner} does the protocol's own part. Made by
 * {@link SweepCapture#run} for one capture and used on that capture's thread only.
 */
final class CaptureSession {
    /** A slice of waiting between checks for a stop request, in ms. */
    private static final long SLICE_MS = 50;
    /** How long a line must stay quiet to count as drained, in ms: well above a line's turnaround. */
    static final long QUIET_MS = 300;

    final SerialProfile profile;
    final ProtocolRunner runner;
    final CaptureRequest request;
    final SweepPlan plan;
    /** the generator level, in volts of the profile's amplitude kind */
    final double amplitude;
    final Map<String, LineTransport> links;
    final CaptureListener listener;
    /** each instrument's identity as it answered, by instrument */
    final Map<String, String> identities = new LinkedHashMap<>();
    private final Clock clock;
    private final ReadingConversion conversion;
    private final BooleanSupplier stopRequested;
    private final List<String> warnings = new ArrayList<>();
    private final OptionalDouble uGain;
    private final OptionalDouble uPhase;
    private final boolean hasPhase;
    AppendedSweep sweep;
    CaptureTranscript transcript;
    private double previousPhaseDeg = Double.NaN;
    private int skipped;

    CaptureSession(SerialProfile profile, ProtocolRunner runner, Clock clock, CaptureRequest request, SweepPlan plan,
                   double amplitude, Map<String, LineTransport> links, CaptureListener listener,
                   BooleanSupplier stopRequested, AppendedSweep sweep) {
        this.profile = profile;
        this.runner = runner;
        this.clock = clock;
        this.conversion = new ReadingConversion(profile);
        this.request = request;
        this.plan = plan;
        this.amplitude = amplitude;
        this.links = links;
        this.listener = listener;
        this.stopRequested = stopRequested;
        this.sweep = sweep;
        this.hasPhase = runner.hasPhase();
        this.uGain = profile.accuracy().gainStandardUncertaintyDb();
        this.uPhase = hasPhase ? profile.accuracy().phaseStandardUncertaintyDeg() : OptionalDouble.empty();
    }

    CaptureOutcome execute() throws IOException, InputProblem {
        transcript = CaptureTranscript.open(request.transcript(), clock);
        transcript.note((sweep == null ? "capture starts: " : "capture resumes: ") + "profile " + profile.name()
                + ", " + plan.describe() + ", amplitude " + amplitude + " " + kind() + ", " + describeLinks());
        try {
            drainStaleLines();
            identify();
            if (sweep == null) {
                sweep = AppendedSweep.create(request.sweepFile(), provenance(), hasPhase,
                        uGain.isPresent() || runner.pointUncertainties(), uPhase.isPresent() || runner.pointUncertainties());
            } else {
                checkIdentity();
                sweep.last().ifPresent(p -> previousPhaseDeg = p.phaseDeg().orElse(Double.NaN));
            }
            runner.sweep(this);
            sweep.settlePhaseTurns();
            sweep.force();
            transcript.note("capture complete: " + sweep.points().size() + " points in " + request.sweepFile());
            return new CaptureOutcome.Completed(request.sweepFile(), request.transcript(), sweep.points().size(),
                    skipped, warnings);
        } catch (CaptureHalt halt) {
            if (halt.reason != CaptureOutcome.StopReason.PORT_LOST) {
                runner.finishQuietly(this);
            }
            return stopped(halt.reason, halt.getMessage());
        } catch (PortLostException lost) {
            return stopped(CaptureOutcome.StopReason.PORT_LOST, lost.getMessage());
        }
    }

    private CaptureOutcome stopped(CaptureOutcome.StopReason reason, String message) throws IOException {
        keepUnfinishedLines();
        int done = sweep == null ? 0 : sweep.points().size();
        transcript.note("capture stopped (" + reason.name().toLowerCase(Locale.ROOT).replace('_', ' ') + "): "
                + message + "; " + done + " points on disk");
        if (sweep != null) {
            sweep.force();
        }
        return new CaptureOutcome.Stopped(reason, message, request.sweepFile(), request.transcript(), done,
                plan.points(), warnings);
    }

    /** Whatever arrived without its line ending before a stop still goes into the transcript. */
    private void keepUnfinishedLines() throws IOException {
        Map<LineTransport, String> seen = new IdentityHashMap<>();
        for (Map.Entry<String, LineTransport> link : links.entrySet()) {
            if (seen.put(link.getValue(), link.getKey()) != null) {
                continue;
            }
            try {
                Optional<String> line;
                while ((line = link.getValue().receive(0)).isPresent()) {
                    transcript.received(link.getKey(), line.get());
                }
            } catch (IOException gone) {
                // the port is gone; what it delivered was read above
            }
            String rest = link.getValue().unfinishedLine();
            if (!rest.isEmpty()) {
                transcript.note("unfinished line from " + link.getKey() + " (no line ending before the stop): "
                        + rest);
            }
        }
    }

    void closeFiles() throws IOException {
        try {
            if (sweep != null) {
                sweep.close();
            }
        } finally {
            if (transcript != null) {
                transcript.close();
            }
        }
    }

    /** @return the symbol of the profile's amplitude kind, such as Vrms */
    String kind() {
        return profile.scale().amplitudeKind().symbol();
    }

    private String describeLinks() {
        List<String> parts = new ArrayList<>();
        for (Map.Entry<String, LineTransport> link : links.entrySet()) {
            parts.add(link.getKey() + " on " + link.getValue().describe());
        }
        return String.join(", ", parts);
    }

    private Provenance provenance() {
        List<String> notes = new ArrayList<>();
        notes.add("captured live by polebench: " + describeLinks());
        notes.add(SweepCapture.PLAN_NOTE + plan.describe() + " amplitude=" + amplitude + " " + kind());
        notes.addAll(request.notes());
        return new Provenance(Optional.of(request.transcript()), "", identityText(), profile.name(),
                Optional.of(Instant.now(clock)), request.board(), notes);
    }

    private String identityText() {
        List<String> parts = new ArrayList<>();
        identities.forEach((who, idn) -> parts.add(identities.size() == 1 ? idn : who + ": " + idn));
        return String.join("; ", parts);
    }

    private void checkIdentity() {
        Optional<String> before = sweep.comment("instrument");
        String now = identityText();
        if (before.isPresent() && !now.isEmpty() && !before.get().equals(now)) {
            warn("the instruments answer differently than when this capture began (then: " + before.get()
                    + "; now: " + now + "); the points may not be comparable");
        }
    }

    void warn(String message) {
        warnings.add(message);
        listener.warning(message);
    }

    // ---- points ---------------------------------------------------------------------

    /**
     * Converts one point's readings by the rule import uses ({@link ReadingConversion}), and
     * unwraps the phase against the point before it.
     *
     * @param frequencyHz the point's frequency, in Hz
     * @return the point, or the reading left out with import's reason (never a failure worth
     *         repeating: the same reading would come again)
     */
    StepAttempt point(double frequencyHz, double rawGain, double rawInput, double rawOutput, double rawPhase) {
        ReadingConversion.Reading gain = conversion.gainDb(rawGain, rawInput, rawOutput);
        if (gain.dropped().isPresent()) {
            return StepAttempt.leftOut(frequencyHz, gain.dropped().get());
        }
        OptionalDouble phase = OptionalDouble.empty();
        if (hasPhase) {
            ReadingConversion.Reading converted = conversion.phaseDeg(rawPhase);
            if (converted.dropped().isPresent()) {
                return StepAttempt.leftOut(frequencyHz, converted.dropped().get());
            }
            double deg = converted.value();
            if (profile.scale().phaseWrapped()) {
                deg = Double.isNaN(previousPhaseDeg) ? PhaseUnwrap.fold(deg) : PhaseUnwrap.nearestTurn(deg, previousPhaseDeg);
            }
            phase = OptionalDouble.of(deg);
        }
        return StepAttempt.of(new SweepPoint(frequencyHz, gain.value(), phase, uGain, uPhase));
    }

    /** @return the frequency in Hz of a raw reading, or why it is none, by import's rule */
    ReadingConversion.Reading frequencyHz(double rawFrequency) {
        return conversion.frequencyHz(rawFrequency);
    }

    /**
     * @param deg a phase folded into one turn, in degrees
     * @return it moved by whole turns to lie nearest the previous point's phase (the first point's folded)
     */
    double unwrapPhaseDeg(double deg) {
        return Double.isNaN(previousPhaseDeg) ? PhaseUnwrap.fold(deg) : PhaseUnwrap.nearestTurn(deg, previousPhaseDeg);
    }

    /** Puts a point on disk; the next point's phase is unwrapped against it. */
    void append(SweepPoint point) throws IOException {
        sweep.append(point);
        previousPhaseDeg = point.phaseDeg().orElse(Double.NaN);
    }

    /** Counts a point left out; the runner words the warning. */
    void countLeftOut() {
        skipped++;
    }

    // ---- identification -------------------------------------------------------------

    /**
     * Reads, logs and sets aside whatever waits on each link before anything is sent:
     * answers to queries of an earlier session that stopped (a queue the instrument still
     * held), which would otherwise be taken for answers to this one.
     */
    private void drainStaleLines() throws IOException, CaptureHalt {
        Map<LineTransport, String> seen = new IdentityHashMap<>();
        for (Map.Entry<String, LineTransport> link : links.entrySet()) {
            if (seen.put(link.getValue(), link.getKey()) != null) {
                continue;
            }
            int stale = 0;
            while (await(link.getKey(), QUIET_MS).isPresent()) {
                stale++;
            }
            if (stale > 0) {
                transcript.note(stale + " line(s) were waiting on " + link.getValue().describe()
                        + " before anything was sent (left from an earlier session); set aside");
            }
        }
    }

    private void identify() throws IOException, CaptureHalt {
        int retries = runner.identifyRetries();
        int timeoutMs = profile.protocol().timeoutMs();
        for (Map.Entry<String, String> query : runner.identityQueries().entrySet()) {
            String who = query.getKey();
            Optional<String> answer = Optional.empty();
            for (int attempt = 0; attempt <= retries && answer.isEmpty(); attempt++) {
                if (attempt > 0) {
                    drainUntilQuiet(who, Math.min(timeoutMs, 500));
                }
                send(who, query.getValue());
                answer = await(who, timeoutMs).map(String::strip).filter(a -> !a.isEmpty());
            }
            if (answer.isEmpty()) {
                throw new CaptureHalt(CaptureOutcome.StopReason.NO_ANSWER, who + " did not answer '" + query.getValue()
                        + "' within " + timeoutMs + " ms, " + (retries + 1) + " times; check the cable, the port "
                        + "settings (" + runner.portSettings(runner.linkFor(who)).baud()
                        + " baud) and that the instrument is on");
            }
            identities.put(who, answer.get());
            listener.identified(who, answer.get());
        }
    }

    // ---- lines ----------------------------------------------------------------------

    void drainUntilQuiet(String who, long quietMs) throws IOException, CaptureHalt {
        while (await(who, quietMs).isPresent()) {
            transcript.note("discarded a stray line from " + who);
        }
    }

    void send(String who, String text) throws IOException {
        transcript.sent(who, text);
        links.get(runner.linkFor(who)).send(text);
    }

    /** @return the next line from that instrument's link, logged; empty after the timeout */
    Optional<String> await(String who, long timeoutMs) throws IOException, CaptureHalt {
        LineTransport link = links.get(runner.linkFor(who));
        long deadline = System.nanoTime() + timeoutMs * 1_000_000L;
        while (true) {
            if (stopRequested.getAsBoolean()) {
                throw new CaptureHalt(CaptureOutcome.StopReason.INTERRUPTED, "stopped on request (Ctrl-C)");
            }
            long leftMs = (deadline - System.nanoTime() + 999_999L) / 1_000_000L;
            if (leftMs <= 0) {
                return Optional.empty();
            }
            Optional<String> line = link.receive(Math.min(leftMs, SLICE_MS));
            if (line.isPresent()) {
                transcript.received(who, line.get());
                return line;
            }
        }
    }

    /**
     * @return the next answer from that instrument's link read as a definite-length block (or
     *         why it is not one), noted in the transcript by its size; empty after the timeout.
     *         A stop request is looked at before the wait, not during it: the wait is one
     *         timeout at most.
     */
    Optional<BlockAnswer> awaitBlock(String who, long timeoutMs) throws IOException, CaptureHalt {
        if (stopRequested.getAsBoolean()) {
            throw new CaptureHalt(CaptureOutcome.StopReason.INTERRUPTED, "stopped on request (Ctrl-C)");
        }
        Optional<BlockAnswer> block = links.get(runner.linkFor(who)).receiveBlock(timeoutMs);
        if (block.isPresent()) {
            transcript.note(block.get().refusal().isPresent() ? "from " + who + ", not a block: "
                    + block.get().refusal().get() : "from " + who + ": a block of " + block.get().length() + " bytes");
        }
        return block;
    }

    /** Waits the settling time at that frequency, polling for a stop request. */
    void settle(long settleMs) throws CaptureHalt {
        long deadline = System.nanoTime() + settleMs * 1_000_000L;
        while (true) {
            if (stopRequested.getAsBoolean()) {
                throw new CaptureHalt(CaptureOutcome.StopReason.INTERRUPTED, "stopped on request (Ctrl-C)");
            }
            long leftNanos = deadline - System.nanoTime();
            if (leftNanos <= 0) {
                return;
            }
            try {
                Thread.sleep(Math.min(SLICE_MS, Math.max(1, leftNanos / 1_000_000L)));
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new CaptureHalt(CaptureOutcome.StopReason.INTERRUPTED, "interrupted");
            }
        }
    }
}

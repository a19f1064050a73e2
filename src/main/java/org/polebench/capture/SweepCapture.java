package org.polebench.capture;

import java.io.IOException;
import java.nio.file.Files;
import java.time.Clock;
import java.time.Duration;
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
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.polebench.InputProblem;
import org.polebench.profile.CommandRole;
import org.polebench.profile.GainForm;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ReadingLimits;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.PhaseUnwrap;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.AppendedSweep;
import org.polebench.sweepfile.SweepAssembly;
import org.polebench.units.Decibels;
import org.polebench.units.StrictNumber;

/**
 * Drives a serial profile over live links and records the sweep: identifies each instrument,
 * sends the setup, steps the frequency along a {@link SweepPlan}, waits for settling
 * ({@link LineProtocol.Settling}), reads the measurements and the error queue as the
 * profile's step says, and appends each completed point to {@code NAME.sweep.csv} while every
 * line sent and received goes to {@code NAME.transcript.log} as it happens.
 *
 * <p>Faults. An answer that does not come within the profile's timeout, an unreadable or
 * erroneous answer (SCPI {@code <code>,"<text>"}, SCPI-99 vol. 2 ch. 21, from memory), or an
 * error in the queue makes the whole step be repeated, up to the profile's {@code retries};
 * before each repeat the link is resynchronised: the identity query is sent again and every
 * line is discarded (but logged) until the identity comes back, so that a late answer to the
 * failed step cannot be taken for an answer to the repeat (an instrument answers its queries
 * in order: IEEE 488.2 message exchange, from memory). When the retries are spent the capture
 * stops. A vanished port or a stop request (Ctrl-C) stops it at once. Every stop leaves every
 * completed point on disk, sends the profile's finish commands where the port still works
 * (turning the generator off), and can be continued with a resumed request, which skips every
 * planned point up to the last one on file.
 *
 * <p>A saturated reading (the overrange value, or an amplitude at or above the profile's full
 * scale) or one at the profile's floor leaves its point out with a warning, without a repeat:
 * the same level at the same frequency would read the same.
 *
 * <p>Levels. A level above the profile's {@code max-amplitude} is refused before anything is
 * sent, and no command carrying a level is rendered above it.
 *
 * <p>Phase. Each point is unwrapped against the point before it (the first is folded into
 * (−180°, 180°]); when the sweep is complete the whole file is shifted by the whole turns
 * that bring its highest-gain point into (−180°, 180°], the convention of the importer.
 * Since each step depends only on the point before, a resumed sweep equals an uninterrupted
 * one exactly.
 *
 * <p>Holds configuration only; one instance serves one capture at a time per set of links.
 */
public final class SweepCapture {
    /** SCPI's overrange reading, 9.9E37 (SCPI-99 vol. 1 §7.2.1.5, from memory). */
    private static final double SCPI_OVERRANGE = 9.9e37;
    private static final Pattern ERROR_ANSWER = Pattern.compile("^(?<code>[+-]?\\d+)\\s*,\\s*\"(?<text>.*)\"$");
    /** Error-queue entries read after one error before giving up: a queue holds a few dozen at most. */
    private static final int MAX_QUEUE_READS = 32;
    /** A slice of waiting between checks for a stop request, in ms. */
    private static final long SLICE_MS = 50;
    /** How long a line must stay quiet to count as drained, in ms: well above a line's turnaround. */
    private static final long QUIET_MS = 300;
    static final String PLAN_NOTE = "capture plan: ";

    private final SerialProfile profile;
    private final Clock clock;

    public SweepCapture(SerialProfile profile) {
        this(profile, Clock.systemUTC());
    }

    /** @param clock the clock of the transcript's and the sweep's timestamps */
    public SweepCapture(SerialProfile profile, Clock clock) {
        this.profile = profile;
        this.clock = clock;
    }

    /** @return the names the links are keyed by: the SCPI instruments, or the streaming profile's name */
    public List<String> linkNames() {
        if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
            List<String> names = new ArrayList<>();
            for (LineProtocol.ScpiInstrument instrument : ((LineProtocol.ScpiExchange) profile.protocol()).instruments()) {
                names.add(instrument.name());
            }
            return names;
        }
        return List.of(profile.name());
    }

    /** @return the port settings for the link of that name */
    public PortSettings portSettings(String linkName) {
        if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
            for (LineProtocol.ScpiInstrument instrument : ((LineProtocol.ScpiExchange) profile.protocol()).instruments()) {
                if (instrument.name().equals(linkName)) {
                    return instrument.port();
                }
            }
            throw new IllegalArgumentException("the profile has no instrument " + linkName);
        }
        return ((LineProtocol.StreamedLines) profile.protocol()).port();
    }

    /** @return the highest level the profile allows, in volts of its amplitude kind */
    public double maxAmplitude() {
        return profile.protocol() instanceof LineProtocol.ScpiExchange
                ? ((LineProtocol.ScpiExchange) profile.protocol()).maxAmplitude()
                : ((LineProtocol.StreamedLines) profile.protocol()).maxAmplitude();
    }

    /** @return the profile's own level, in volts of its amplitude kind */
    public double defaultAmplitude() {
        return profile.protocol() instanceof LineProtocol.ScpiExchange
                ? ((LineProtocol.ScpiExchange) profile.protocol()).amplitude()
                : ((LineProtocol.StreamedLines) profile.protocol()).amplitude();
    }

    /**
     * Runs the capture to its end or to a stop.
     *
     * @param links         an open link per name of {@link #linkNames()}; several names may
     *                      share one link (one port serving both instruments); the caller
     *                      closes them
     * @param stopRequested polled between lines and during settling; true stops the capture
     *                      cleanly
     * @throws InputProblem when the request is at fault (a level above the maximum, an output
     *                      that exists, a resume that does not match its file); nothing was
     *                      sent then
     * @throws IOException  when the sweep or transcript file cannot be written
     */
    public CaptureOutcome run(CaptureRequest request, Map<String, LineTransport> links, CaptureListener listener,
                              BooleanSupplier stopRequested) throws InputProblem, IOException {
        for (String name : linkNames()) {
            if (!links.containsKey(name)) {
                throw new IllegalArgumentException("no link for " + name);
            }
        }
        double amplitude = request.amplitude().orElse(defaultAmplitude());
        checkLevel(amplitude);
        SweepPlan plan = planOf(request);
        AppendedSweep sweep = request.resume() ? AppendedSweep.reopen(request.sweepFile()) : null;
        if (sweep != null) {
            SweepPlan recorded = recordedPlan(sweep);
            if (request.plan().isPresent() && !request.plan().get().equals(recorded)) {
                sweep.close();
                throw new InputProblem(request.sweepFile(), 0, "the resumed capture was planned as " + recorded.describe()
                        + ", not " + request.plan().get().describe(), "leave out --from, --to and --points when resuming");
            }
            plan = recorded;
            OptionalDouble level = recordedAmplitude(sweep);
            if (level.isPresent() && request.amplitude().isPresent() && level.getAsDouble() != amplitude) {
                sweep.close();
                throw new InputProblem(request.sweepFile(), 0, "the resumed capture ran at " + level.getAsDouble()
                        + " " + kind() + ", not " + amplitude, "leave out --amplitude when resuming");
            }
            if (level.isPresent()) {
                amplitude = level.getAsDouble();
                checkLevel(amplitude);
            }
        } else if (Files.exists(request.sweepFile()) || Files.exists(request.transcript())) {
            throw new InputProblem(Files.exists(request.sweepFile()) ? request.sweepFile() : request.transcript(), 0,
                    "the capture's output exists and is left as it is",
                    "continue it with --resume " + request.name() + ", or choose another --out name");
        }
        Run run = new Run(request, plan, amplitude, links, listener, stopRequested, sweep);
        try {
            return run.execute();
        } finally {
            run.closeFiles();
        }
    }

    private SweepPlan planOf(CaptureRequest request) throws InputProblem {
        if (request.plan().isPresent() || request.resume()) {
            return request.plan().orElse(null);
        }
        throw new InputProblem(null, 0, "a new capture needs its band and number of points",
                "give --from, --to and --points (or --resume NAME to continue one)");
    }

    private void checkLevel(double amplitude) throws InputProblem {
        if (!(amplitude > 0) || !Double.isFinite(amplitude)) {
            throw new InputProblem(profile.source().orElse(null), 0, "the level " + amplitude + " " + kind()
                    + " is not a positive level", "give a level such as 100m (volts, " + kind() + ")");
        }
        if (amplitude > maxAmplitude()) {
            throw new InputProblem(profile.source().orElse(null), 0, "the level " + amplitude + " " + kind()
                    + " is above the profile's max-amplitude of " + maxAmplitude() + " " + kind()
                    + "; nothing was sent", "lower --amplitude; polebench never sends a level above the profile's maximum");
        }
    }

    private String kind() {
        return profile.scale().amplitudeKind().symbol();
    }

    private static SweepPlan recordedPlan(AppendedSweep sweep) throws InputProblem {
        for (String note : sweep.notes()) {
            if (note.startsWith(PLAN_NOTE)) {
                SweepPlan plan = SweepPlan.parse(note.substring(PLAN_NOTE.length()));
                if (plan != null) {
                    return plan;
                }
            }
        }
        throw new InputProblem(sweep.file(), 0, "the sweep file does not say how the capture was planned",
                "resume only a file written by polebench capture (it has a '# note: " + PLAN_NOTE + "…' line)");
    }

    private static OptionalDouble recordedAmplitude(AppendedSweep sweep) {
        for (String note : sweep.notes()) {
            if (note.startsWith(PLAN_NOTE)) {
                for (String word : note.split("\\s+")) {
                    if (word.startsWith("amplitude=")) {
                        try {
                            return OptionalDouble.of(Double.parseDouble(word.substring(10)));
                        } catch (NumberFormatException e) {
                            return OptionalDouble.empty();
                        }
                    }
                }
            }
        }
        return OptionalDouble.empty();
    }

    /** A stop: why and what to tell the user. */
    private static final class Halt extends Exception {
        final CaptureOutcome.StopReason reason;

        Halt(CaptureOutcome.StopReason reason, String message) {
            super(message, null, false, false);
            this.reason = reason;
        }
    }

    /** How one attempt at a step went wrong. */
    private enum Failure {
        NO_ANSWER(true), UNREADABLE(true), ERROR(true), SATURATED(false), AT_FLOOR(false);

        final boolean worthRepeating;

        Failure(boolean worthRepeating) {
            this.worthRepeating = worthRepeating;
        }
    }

    /** The result of one attempt: a point, or a failure and its reason. */
    private static final class Attempt {
        final SweepPoint point;
        final Failure failure;
        final String reason;

        private Attempt(SweepPoint point, Failure failure, String reason) {
            this.point = point;
            this.failure = failure;
            this.reason = reason;
        }

        static Attempt of(SweepPoint point) {
            return new Attempt(point, null, "");
        }

        static Attempt failed(Failure failure, String reason) {
            return new Attempt(null, failure, reason);
        }
    }

    /** The state of one capture. */
    private final class Run {
        final CaptureRequest request;
        final SweepPlan plan;
        final double amplitude;
        final Map<String, LineTransport> links;
        final CaptureListener listener;
        final BooleanSupplier stopRequested;
        final List<String> warnings = new ArrayList<>();
        final Map<String, String> identities = new LinkedHashMap<>();
        final Map<LineTransport, Integer> owedIdentities = new IdentityHashMap<>();
        final OptionalDouble uGain = profile.accuracy().gainStandardUncertaintyDb();
        final OptionalDouble uPhase;
        final boolean hasPhase;
        AppendedSweep sweep;
        CaptureTranscript transcript;
        double previousPhaseDeg = Double.NaN;
        int skipped;
        long overheadNanos;
        int timedPoints;
        double[] recordedHz;
        long[] settleAfterMs;

        Run(CaptureRequest request, SweepPlan plan, double amplitude, Map<String, LineTransport> links,
            CaptureListener listener, BooleanSupplier stopRequested, AppendedSweep sweep) {
            this.request = request;
            this.plan = plan;
            this.amplitude = amplitude;
            this.links = links;
            this.listener = listener;
            this.stopRequested = stopRequested;
            this.sweep = sweep;
            if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
                hasPhase = ((LineProtocol.ScpiExchange) profile.protocol()).step().stream()
                        .anyMatch(c -> c.role() == CommandRole.READS_PHASE);
            } else {
                hasPhase = ((LineProtocol.StreamedLines) profile.protocol()).point().pattern().contains("(?<phase>");
            }
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
                    sweep = AppendedSweep.create(request.sweepFile(), provenance(), hasPhase, uGain.isPresent(),
                            uPhase.isPresent());
                } else {
                    checkIdentity();
                    sweep.last().ifPresent(p -> previousPhaseDeg = p.phaseDeg().orElse(Double.NaN));
                }
                if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
                    scpiSweep((LineProtocol.ScpiExchange) profile.protocol());
                } else {
                    streamedSweep((LineProtocol.StreamedLines) profile.protocol());
                }
                sweep.settlePhaseTurns();
                sweep.force();
                transcript.note("capture complete: " + sweep.points().size() + " points in " + request.sweepFile());
                return new CaptureOutcome.Completed(request.sweepFile(), request.transcript(), sweep.points().size(),
                        skipped, warnings);
            } catch (Halt halt) {
                if (halt.reason != CaptureOutcome.StopReason.PORT_LOST) {
                    finishQuietly();
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
            notes.add(PLAN_NOTE + plan.describe() + " amplitude=" + amplitude + " " + kind());
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

        private void warn(String message) {
            warnings.add(message);
            listener.warning(message);
        }

        // ---- identification -------------------------------------------------------------

        /**
         * Reads, logs and sets aside whatever waits on each link before anything is sent:
         * answers to queries of an earlier session that stopped (a queue the instrument still
         * held), which would otherwise be taken for answers to this one.
         */
        private void drainStaleLines() throws IOException, Halt {
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

        private void identify() throws IOException, Halt {
            int retries;
            int timeoutMs = profile.protocol().timeoutMs();
            Map<String, String> queries = new LinkedHashMap<>();
            if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
                LineProtocol.ScpiExchange scpi = (LineProtocol.ScpiExchange) profile.protocol();
                retries = scpi.retries();
                for (LineProtocol.ScpiInstrument instrument : scpi.instruments()) {
                    if (!instrument.identify().isBlank()) {
                        queries.put(instrument.name(), instrument.identify());
                    }
                }
            } else {
                retries = 2;
                String identify = ((LineProtocol.StreamedLines) profile.protocol()).identify();
                if (!identify.isBlank()) {
                    queries.put(profile.name(), identify);
                }
            }
            for (Map.Entry<String, String> query : queries.entrySet()) {
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
                    throw new Halt(CaptureOutcome.StopReason.NO_ANSWER, who + " did not answer '" + query.getValue()
                            + "' within " + timeoutMs + " ms, " + (retries + 1) + " times; check the cable, the port "
                            + "settings (" + portSettings(linkFor(who)).baud() + " baud) and that the instrument is on");
                }
                identities.put(who, answer.get());
                listener.identified(who, answer.get());
            }
        }

        private String linkFor(String who) {
            return profile.protocol() instanceof LineProtocol.ScpiExchange ? who : profile.name();
        }

        // ---- SCPI -----------------------------------------------------------------------

        private void scpiSweep(LineProtocol.ScpiExchange scpi) throws IOException, Halt {
            for (ScpiCommand command : scpi.setup()) {
                exchangeOnce(scpi, command, Double.NaN);
            }
            if (!scpi.errorQuery().isBlank()) {
                List<String> errors = readErrorQueue(scpi, scpi.instruments().get(0).name(), Optional.empty());
                if (!errors.isEmpty()) {
                    throw new Halt(CaptureOutcome.StopReason.SETUP_REFUSED, "the instrument reported "
                            + String.join("; ", errors) + " after the setup commands; check the profile's setup against "
                            + "the instrument's manual");
                }
            }
            int first = firstPending();
            listener.started(first + 1, plan.points());
            for (int i = first; i < plan.points(); i++) {
                long started = System.nanoTime();
                Attempt attempt = stepWithRetries(scpi, i);
                if (attempt.point != null) {
                    sweep.append(attempt.point);
                    previousPhaseDeg = attempt.point.phaseDeg().orElse(Double.NaN);
                } else {
                    skipped++;
                    warn(SweepAssembly.format(recordedHz(i)) + " Hz left out: " + attempt.reason);
                    transcript.note("point left out: " + attempt.reason);
                }
                long elapsed = System.nanoTime() - started;
                overheadNanos += Math.max(0, elapsed - scpi.settle().millisAt(recordedHz(i)) * 1_000_000L);
                timedPoints++;
                if (attempt.point != null) {
                    listener.point(new CaptureProgress(i + 1, plan.points(), attempt.point, timeLeft(scpi.settle(), i)));
                }
            }
            for (ScpiCommand command : scpi.finish()) {
                exchangeOnce(scpi, command, Double.NaN);
            }
        }

        private Duration timeLeft(LineProtocol.Settling settle, int done) {
            if (settleAfterMs == null) {
                // the settling still to come after each point, summed from the top once
                settleAfterMs = new long[plan.points()];
                for (int j = plan.points() - 2; j >= 0; j--) {
                    settleAfterMs[j] = settleAfterMs[j + 1] + settle.millisAt(recordedHz(j + 1));
                }
            }
            double meanOverheadMs = timedPoints == 0 ? 0 : overheadNanos / 1e6 / timedPoints;
            return Duration.ofMillis(Math.round(settleAfterMs[done] + (plan.points() - 1 - done) * meanOverheadMs));
        }

        /** @return the index of the first planned point above the last one on file */
        private int firstPending() {
            Optional<SweepPoint> last = sweep.last();
            if (last.isEmpty()) {
                return 0;
            }
            double lastHz = last.get().frequencyHz();
            int i = 0;
            while (i < plan.points() && recordedHz(i) <= lastHz) {
                i++;
            }
            return i;
        }

        /** @return the frequency a point is recorded at: what the instrument is told, in Hz */
        private double recordedHz(int i) {
            if (recordedHz == null) {
                ReadingScale scale = profile.scale();
                recordedHz = new double[plan.points()];
                for (int j = 0; j < recordedHz.length; j++) {
                    recordedHz[j] = scale.hertz(Double.parseDouble(ScpiCommand.nr3(scale.rawFrequency(plan.frequencyHz(j)))));
                }
            }
            return recordedHz[i];
        }

        private String render(ScpiCommand command, double frequencyHz) {
            // the level was checked against the maximum before anything was sent; this guards the templates
            if (command.template().contains(ScpiCommand.AMPLITUDE) && amplitude > maxAmplitude()) {
                throw new IllegalStateException("a level above the profile's maximum was about to be sent");
            }
            double raw = Double.isNaN(frequencyHz) ? 0 : profile.scale().rawFrequency(frequencyHz);
            return command.render(raw, amplitude);
        }

        /** Setup and finish: one command, its answer read and logged when it has one. */
        private void exchangeOnce(LineProtocol.ScpiExchange scpi, ScpiCommand command, double frequencyHz)
                throws IOException, Halt {
            send(command.instrument(), render(command, frequencyHz));
            if (command.role().answered()) {
                if (await(command.instrument(), scpi.timeoutMs()).isEmpty()) {
                    warn(command.instrument() + " did not answer '" + command.template() + "' within "
                            + scpi.timeoutMs() + " ms");
                }
            }
        }

        private Attempt stepWithRetries(LineProtocol.ScpiExchange scpi, int i) throws IOException, Halt {
            double hz = recordedHz(i);
            Attempt attempt = null;
            for (int n = 0; n <= scpi.retries(); n++) {
                if (n > 0) {
                    listener.retrying(hz, attempt.reason, n, scpi.retries());
                    transcript.note("repeating the step for " + SweepAssembly.format(hz) + " Hz (" + n + " of "
                            + scpi.retries() + "): " + attempt.reason);
                    if (!resynchronise(scpi)) {
                        attempt = Attempt.failed(Failure.NO_ANSWER, "the instrument did not answer its identity query "
                                + "within " + scpi.timeoutMs() + " ms while polebench brought the line back in step");
                        continue;
                    }
                }
                attempt = step(scpi, hz);
                if (attempt.point != null || !attempt.failure.worthRepeating) {
                    return attempt;
                }
                transcript.note("step for " + SweepAssembly.format(hz) + " Hz failed: " + attempt.reason);
            }
            CaptureOutcome.StopReason reason = attempt.failure == Failure.NO_ANSWER
                    ? CaptureOutcome.StopReason.NO_ANSWER : CaptureOutcome.StopReason.BAD_ANSWERS;
            throw new Halt(reason, "at " + SweepAssembly.format(hz) + " Hz (point " + (i + 1) + " of " + plan.points()
                    + "): " + attempt.reason + ", " + (scpi.retries() + 1) + " times");
        }

        private Attempt step(LineProtocol.ScpiExchange scpi, double frequencyHz) throws IOException, Halt {
            boolean waits = scpi.step().stream().anyMatch(c -> c.role() == CommandRole.WAITS_FOR_COMPLETION);
            double gain = Double.NaN;
            double input = Double.NaN;
            double output = Double.NaN;
            double phase = Double.NaN;
            for (ScpiCommand command : scpi.step()) {
                String text = render(command, frequencyHz);
                send(command.instrument(), text);
                if (command.role() == CommandRole.SETS_FREQUENCY && !waits) {
                    settle(scpi.settle(), frequencyHz);
                }
                if (!command.role().answered()) {
                    continue;
                }
                Optional<String> answer = await(command.instrument(), scpi.timeoutMs());
                if (answer.isEmpty()) {
                    return Attempt.failed(Failure.NO_ANSWER, "no answer from " + command.instrument() + " to '" + text
                            + "' within " + scpi.timeoutMs() + " ms");
                }
                String body = answer.get().strip();
                Matcher error = ERROR_ANSWER.matcher(body);
                switch (command.role()) {
                    case WAITS_FOR_COMPLETION:
                        if (!body.equals("1") && !body.equals("+1")) {
                            return unreadable(command, body);
                        }
                        settle(scpi.settle(), frequencyHz);
                        break;
                    case READS_ERROR_QUEUE:
                        if (!error.matches()) {
                            return unreadable(command, body);
                        }
                        if (code(error) != 0) {
                            List<String> more = readErrorQueue(scpi, command.instrument(), Optional.of(body));
                            return Attempt.failed(Failure.ERROR, command.instrument() + " reported "
                                    + String.join("; ", more));
                        }
                        break;
                    case IDENTIFIES:
                        break;
                    default: {
                        if (error.matches() && code(error) != 0) {
                            return Attempt.failed(Failure.ERROR, command.instrument() + " answered '" + text
                                    + "' with the error " + body);
                        }
                        double value = StrictNumber.parse(body, false);
                        if (Double.isNaN(value)) {
                            return unreadable(command, body);
                        }
                        if (Math.abs(value) >= SCPI_OVERRANGE) {
                            return Attempt.failed(Failure.SATURATED, command.instrument() + " answered '" + text
                                    + "' with the overrange value " + body + " (its input is saturated)");
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
            return point(frequencyHz, gain, input, output, phase);
        }

        private Attempt unreadable(ScpiCommand command, String body) {
            return Attempt.failed(Failure.UNREADABLE, "the answer '" + CaptureTranscript.escaped(body) + "' from "
                    + command.instrument() + " to '" + command.template() + "' cannot be read");
        }

        private int code(Matcher error) {
            return Integer.parseInt(error.group("code").replace("+", ""));
        }

        /**
         * Reads the error queue until it answers code 0.
         *
         * @param first an entry read already
         * @return the non-zero entries, oldest first
         */
        private List<String> readErrorQueue(LineProtocol.ScpiExchange scpi, String instrument, Optional<String> first)
                throws IOException, Halt {
            List<String> errors = new ArrayList<>();
            first.ifPresent(errors::add);
            for (int n = 0; n < MAX_QUEUE_READS; n++) {
                send(instrument, scpi.errorQuery());
                Optional<String> answer = await(instrument, scpi.timeoutMs());
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

        /** Converts one step's readings as {@link SweepAssembly} does, and checks the profile's limits. */
        private Attempt point(double frequencyHz, double rawGain, double rawInput, double rawOutput, double rawPhase) {
            ReadingScale scale = profile.scale();
            ReadingLimits limits = profile.limits();
            double gainDb;
            switch (scale.gainForm()) {
                case DB:
                    gainDb = rawGain;
                    break;
                case RATIO:
                    if (!(rawGain > 0)) {
                        return Attempt.failed(Failure.UNREADABLE, "the gain ratio " + rawGain + " is not a magnitude");
                    }
                    gainDb = Decibels.fromRatio(rawGain);
                    break;
                default:
                    if (limits.fullScale().isPresent() && Math.max(rawInput, rawOutput) >= limits.fullScale().getAsDouble()) {
                        return Attempt.failed(Failure.SATURATED, "amplitude " + Math.max(rawInput, rawOutput) + " "
                                + kind() + " is at or above the full scale of " + limits.fullScale().getAsDouble());
                    }
                    if (!(rawInput > 0) || !(rawOutput >= 0)) {
                        return Attempt.failed(Failure.UNREADABLE, "amplitudes " + rawInput + " and " + rawOutput
                                + " are not both positive");
                    }
                    if (rawOutput == 0 || limits.amplitudeFloor().isPresent()
                            && Math.min(rawInput, rawOutput) <= limits.amplitudeFloor().getAsDouble()) {
                        return Attempt.failed(Failure.AT_FLOOR, "amplitude " + Math.min(rawInput, rawOutput) + " "
                                + kind() + " is at or below the noise floor");
                    }
                    gainDb = Decibels.fromRatio(rawOutput / rawInput);
            }
            if (!(Math.abs(gainDb) <= SweepAssembly.MAX_GAIN_DB)) {
                return Attempt.failed(Failure.UNREADABLE, "gain " + gainDb + " dB is beyond any reading");
            }
            if (limits.noiseFloorDb().isPresent() && gainDb <= limits.noiseFloorDb().getAsDouble()) {
                return Attempt.failed(Failure.AT_FLOOR, "gain " + gainDb + " dB is at or below the noise floor");
            }
            OptionalDouble phase = OptionalDouble.empty();
            if (hasPhase) {
                double deg = scale.phaseDeg(rawPhase);
                if (!(Math.abs(deg) <= SweepAssembly.MAX_PHASE_DEG)) {
                    return Attempt.failed(Failure.UNREADABLE, "phase " + rawPhase + " is beyond any reading");
                }
                if (scale.phaseWrapped()) {
                    deg = Double.isNaN(previousPhaseDeg) ? PhaseUnwrap.fold(deg)
                            : PhaseUnwrap.nearestTurn(deg, previousPhaseDeg);
                }
                phase = OptionalDouble.of(deg);
            }
            return Attempt.of(new SweepPoint(frequencyHz, gainDb, phase, uGain, uPhase));
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
        private boolean resynchronise(LineProtocol.ScpiExchange scpi) throws IOException, Halt {
            Map<LineTransport, String> seen = new IdentityHashMap<>();
            boolean synced = true;
            for (LineProtocol.ScpiInstrument instrument : scpi.instruments()) {
                LineTransport link = links.get(instrument.name());
                String identity = identities.get(instrument.name());
                if (seen.containsKey(link)) {
                    continue;
                }
                seen.put(link, instrument.name());
                if (identity == null) {
                    drainUntilQuiet(instrument.name(), Math.min(scpi.timeoutMs(), QUIET_MS));
                    continue;
                }
                owedIdentities.merge(link, 1, Integer::sum);
                send(instrument.name(), instrument.identify());
                long deadline = System.nanoTime() + scpi.timeoutMs() * 1_000_000L;
                boolean back = false;
                while (true) {
                    long leftMs = back ? QUIET_MS : (deadline - System.nanoTime()) / 1_000_000L;
                    Optional<String> line = leftMs > 0 ? await(instrument.name(), leftMs) : Optional.empty();
                    if (line.isEmpty()) {
                        if (back) {
                            owedIdentities.put(link, 0);   // an owed answer was lost: the line is quiet and in step
                        } else {
                            transcript.note("resynchronising " + instrument.name() + ": its identity did not come back "
                                    + "within " + scpi.timeoutMs() + " ms");
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
                    transcript.note("discarded while resynchronising " + instrument.name() + ": a late or stray line");
                }
            }
            return synced;
        }

        private void drainUntilQuiet(String who, long quietMs) throws IOException, Halt {
            while (await(who, quietMs).isPresent()) {
                transcript.note("discarded a stray line from " + who);
            }
        }

        // ---- streaming instruments -----------------------------------------------------

        private void streamedSweep(LineProtocol.StreamedLines stream) throws IOException, Halt {
            String who = profile.name();
            ReadingScale scale = profile.scale();
            String start = stream.start()
                    .replace("{start_hz_nr3}", ScpiCommand.nr3(scale.rawFrequency(plan.fromHz())))
                    .replace("{stop_hz_nr3}", ScpiCommand.nr3(scale.rawFrequency(plan.toHz())))
                    .replace("{points}", Integer.toString(plan.points()))
                    .replace(ScpiCommand.AMPLITUDE, ScpiCommand.nr3(amplitude));
            double lastOnFile = sweep.last().map(SweepPoint::frequencyHz).orElse(0.0);
            int onFile = sweep.points().size();
            listener.started(onFile + 1, plan.points());
            send(who, start);
            int seen = 0;
            while (true) {
                Optional<String> answer;
                try {
                    answer = await(who, stream.timeoutMs());
                } catch (Halt halt) {
                    haltStream(stream);
                    throw halt;
                }
                if (answer.isEmpty()) {
                    haltStream(stream);
                    throw new Halt(CaptureOutcome.StopReason.NO_ANSWER, "the instrument sent nothing for "
                            + stream.timeoutMs() + " ms after " + seen + " points of this run");
                }
                String body = answer.get().strip();
                Matcher point = stream.point().matcher(body);
                if (point.matches()) {
                    seen++;
                    Attempt attempt = streamedPoint(point, scale);
                    if (attempt.point == null) {
                        skipped++;
                        warn("a streamed point was left out: " + attempt.reason);
                    } else if (attempt.point.frequencyHz() <= lastOnFile) {
                        transcript.note("point at " + SweepAssembly.format(attempt.point.frequencyHz())
                                + " Hz is on file already; not added again");
                    } else {
                        sweep.append(attempt.point);
                        previousPhaseDeg = attempt.point.phaseDeg().orElse(Double.NaN);
                        lastOnFile = attempt.point.frequencyHz();
                        int number = Math.min(sweep.points().size(), plan.points());
                        listener.point(new CaptureProgress(number, plan.points(), attempt.point, Duration.ZERO));
                    }
                    continue;
                }
                if (stream.error().isPresent() && stream.error().get().matcher(body).matches()) {
                    warn("the instrument reported an error: " + CaptureTranscript.escaped(body));
                    continue;
                }
                if (stream.end().isPresent() && stream.end().get().matcher(body).matches()) {
                    return;
                }
                if (stream.ignore().stream().noneMatch(p -> p.matcher(body).matches())) {
                    warn("a line matching nothing in the profile was skipped: " + CaptureTranscript.escaped(body));
                }
            }
        }

        private Attempt streamedPoint(Matcher point, ReadingScale scale) {
            double rawHz = number(point, "frequency");
            boolean amplitudes = scale.gainForm() == GainForm.AMPLITUDES;
            double g = amplitudes ? Double.NaN : number(point, "gain");
            double in = amplitudes ? number(point, "input") : Double.NaN;
            double out = amplitudes ? number(point, "output") : Double.NaN;
            double ph = hasPhase ? number(point, "phase") : Double.NaN;
            double hz = scale.hertz(rawHz);
            if (!(hz > 0) || Double.isInfinite(hz) || !amplitudes && Double.isNaN(g)
                    || amplitudes && (Double.isNaN(in) || Double.isNaN(out)) || hasPhase && Double.isNaN(ph)) {
                return Attempt.failed(Failure.UNREADABLE, "'" + point.group() + "' has a field that is not a number");
            }
            return point(hz, g, in, out, ph);
        }

        private double number(Matcher matcher, String group) {
            String text = matcher.group(group);
            return text == null ? Double.NaN : StrictNumber.parse(text, false);
        }

        private void haltStream(LineProtocol.StreamedLines stream) {
            if (!stream.stop().isBlank()) {
                try {
                    send(profile.name(), stream.stop());
                } catch (IOException e) {
                    // the port is gone: nothing more can be told to the instrument
                }
            }
        }

        // ---- lines ----------------------------------------------------------------------

        private void send(String who, String text) throws IOException {
            transcript.sent(who, text);
            links.get(linkFor(who)).send(text);
        }

        /** @return the next line from that instrument's link, logged; empty after the timeout */
        private Optional<String> await(String who, long timeoutMs) throws IOException, Halt {
            LineTransport link = links.get(linkFor(who));
            long deadline = System.nanoTime() + timeoutMs * 1_000_000L;
            while (true) {
                if (stopRequested.getAsBoolean()) {
                    throw new Halt(CaptureOutcome.StopReason.INTERRUPTED, "stopped on request (Ctrl-C)");
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

        private void settle(LineProtocol.Settling settle, double frequencyHz) throws Halt {
            long deadline = System.nanoTime() + settle.millisAt(frequencyHz) * 1_000_000L;
            while (true) {
                if (stopRequested.getAsBoolean()) {
                    throw new Halt(CaptureOutcome.StopReason.INTERRUPTED, "stopped on request (Ctrl-C)");
                }
                long leftNanos = deadline - System.nanoTime();
                if (leftNanos <= 0) {
                    return;
                }
                try {
                    Thread.sleep(Math.min(SLICE_MS, Math.max(1, leftNanos / 1_000_000L)));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new Halt(CaptureOutcome.StopReason.INTERRUPTED, "interrupted");
                }
            }
        }

        /** After a stop that left the port working: the finish commands, so the generator is left off. */
        private void finishQuietly() {
            try {
                if (profile.protocol() instanceof LineProtocol.ScpiExchange) {
                    for (ScpiCommand command : ((LineProtocol.ScpiExchange) profile.protocol()).finish()) {
                        send(command.instrument(), render(command, Double.NaN));
                    }
                } else {
                    haltStream((LineProtocol.StreamedLines) profile.protocol());
                }
            } catch (IOException e) {
                // the port failed as well: the stop message says what was done
            }
        }
    }
}

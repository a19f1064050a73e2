package org.polebench.capture;

import java.io.IOException;
import java.nio.file.Files;
import java.time.Clock;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.BooleanSupplier;
import org.polebench.InputProblem;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.SerialProfile;
import org.polebench.sweepfile.AppendedSweep;

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
 * <p>Readings. They become points by the rule import uses ({@code ReadingConversion} in
 * sweepfile): a reading import would drop (a gain ratio of 0 or below, an amplitude at or
 * above the profile's full scale or at its floor, a number beyond any reading) leaves its
 * point out with a warning naming its frequency, as does SCPI's overrange value, without a
 * repeat and without a stop: the same level at the same frequency would read the same.
 *
 * <p>Protocols. What depends on how the instrument talks is a {@code ProtocolRunner}, one per
 * protocol ({@code ScpiRunner}, {@code StreamRunner}); what they share is a
 * {@code CaptureSession}.
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
    static final String PLAN_NOTE = "capture plan: ";

    private final SerialProfile profile;
    private final ProtocolRunner runner;
    private final Clock clock;

    public SweepCapture(SerialProfile profile) {
        this(profile, Clock.systemUTC());
    }

    /** @param clock the clock of the transcript's and the sweep's timestamps */
    public SweepCapture(SerialProfile profile, Clock clock) {
        this.profile = profile;
        this.runner = ProtocolRunner.of(profile);
        this.clock = clock;
    }

    /** @return the names the links are keyed by: the SCPI instruments, or the streaming profile's name */
    public List<String> linkNames() {
        return runner.linkNames();
    }

    /** @return the port settings for the link of that name */
    public PortSettings portSettings(String linkName) {
        return runner.portSettings(linkName);
    }

    /** @return the highest level the profile allows, in volts of its amplitude kind */
    public double maxAmplitude() {
        return runner.maxAmplitude();
    }

    /** @return true when the capture fetches scope records (a {@code serial-scope} profile), whose probes need their own cautions */
    public boolean fetchesRecords() {
        return runner.pointUncertainties();
    }

    /** @return the profile's own level, in volts of its amplitude kind */
    public double defaultAmplitude() {
        return runner.defaultAmplitude();
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
        CaptureSession session = new CaptureSession(profile, runner, clock, request, plan, amplitude, links, listener,
                stopRequested, sweep);
        try {
            return session.execute();
        } finally {
            session.closeFiles();
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

    /**
     * The generator level a capture wrote into its sweep's plan note, as written there ("0.1 Vrms":
     * the number in volts and the profile's amplitude kind), for the report's test level.
     *
     * @param notes a sweep's notes
     * @return the level, empty for a sweep that polebench did not capture
     */
    public static Optional<String> recordedLevel(List<String> notes) {
        for (String note : notes) {
            int at = note.indexOf(" amplitude=");
            if (note.startsWith(PLAN_NOTE) && at >= 0) {
                return Optional.of(note.substring(at + " amplitude=".length()).strip());
            }
        }
        return Optional.empty();
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
}

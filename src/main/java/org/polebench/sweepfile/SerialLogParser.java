package org.polebench.sweepfile;

import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.profile.CommandRole;
import org.polebench.profile.GainForm;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.Sweep;
import org.polebench.units.StrictNumber;

/**
 * Reads the lines of a serial instrument's traffic, a saved log or a live session, into a
 * sweep, one line at a time: feed every line to {@link #accept}, then take {@link #result}.
 *
 * <p>A line may start with a timestamp (ISO-8601, or anything in square brackets), then an
 * optional sender name and direction marker ({@code >} or {@code ->} or {@code TX:} for what
 * was sent, {@code <}, {@code <-} or {@code RX:} for what came back). {@code #} lines are
 * comments ({@code # key: value} carry provenance). Without markers a line is a command when
 * it matches one of the profile's command templates, otherwise an answer to the last query.
 *
 * <p>SCPI logs: the command that sets the frequency starts a point; the answers to the step's
 * reading queries fill it; the next frequency command (or the end) completes it. An error
 * answer ({@code <code>,"<text>"} with a code other than 0, as from {@code SYST:ERR?}; SCPI-99
 * vol. 2 ch. 21, from memory) voids the readings taken so far in that step, so only a retry's
 * readings count. SCPI's overrange value 9.9E37 (SCPI-99 vol. 1 §7.2.1.5, from memory) is a
 * saturated reading. Echoed commands are ignored. Every skipped line is counted and listed
 * with its line number in the warnings.
 *
 * <p>One instance per log or capture; not for sharing between threads.
 */
public final class SerialLogParser {
    // the two patterns of our own log form stay Java's (the prefix needs a lookahead, which RE2
    // lacks); every pattern a profile supplies is RE2/J's, linear in the line (issue 15)
    private static final java.util.regex.Pattern PREFIX = java.util.regex.Pattern.compile(
            "^(?:(?<iso>\\d{4}-\\d{2}-\\d{2}[T ]\\d{2}:\\d{2}:\\d{2}(?:[.,]\\d+)?(?:Z|[+-]\\d{2}:?\\d{2})?)|\\[[^\\]]*\\])?"
                    + "\\s*(?:(?<who>[A-Za-z][\\w.-]*)\\s*(?=->|<-|>|<))?(?<dir>->|<-|>|<|TX:|RX:)?\\s*(?<body>.*)$");
    private static final java.util.regex.Pattern ERROR_ANSWER = java.util.regex.Pattern.compile("^(?<code>[+-]?\\d+)\\s*,\\s*\"(?<text>.*)\"$");
    /** SCPI's +9.9E37 stands for an overrange (infinite) reading, 9.91E37 for NaN. */
    private static final double SCPI_OVERRANGE = 9.9e37;

    private final SerialProfile profile;
    private final Path file;
    private final WarningTally tally;
    private final ProvenanceNotes notes = new ProvenanceNotes();
    private final SweepAssembly assembly;
    private final List<Known> commands = new ArrayList<>();
    private final Map<String, String> identities = new LinkedHashMap<>();
    private final String mapping;
    /** Takes one line's body as the profile's protocol reads it, chosen once. */
    private final LineTaker lines;
    private long lastLine;

    // the open SCPI step
    private boolean stepOpen;
    private long stepLine;
    private double stepFrequency;
    private double gain;
    private double input;
    private double output;
    private double phase;
    private int errorsInStep;
    // the query awaiting its answer
    private Known pending;
    private long pendingLine;
    /** the refusal once the limit on points is passed; null until then */
    private InputProblem refused;
    private String lastCommandText = "";
    private boolean answeredSinceCommand = true;

    /** A command template with its compiled log pattern. */
    private static final class Known {
        final ScpiCommand command;
        final Pattern pattern;

        Known(ScpiCommand command) {
            this.command = command;
            this.pattern = command.logPattern();
        }
    }

    /** A parser under the limit on points this JVM was started with ({@link InputLimits#standing()}). */
    public SerialLogParser(SerialProfile profile, Path file) {
        this(profile, file, InputLimits.standing().maxPoints());
    }

    /**
     * @param file      the log file, named in warnings; null for a live port
     * @param maxPoints the most points kept before the log is refused
     */
    public SerialLogParser(SerialProfile profile, Path file, long maxPoints) {
        this.profile = profile;
        this.file = file;
        this.tally = new WarningTally(file);
        Reading reading = profile.protocol().apply(new LineProtocol.Cases<Reading>() {
            @Override
            public Reading exchange(LineProtocol.ScpiExchange scpi) {
                scpi.step().forEach(c -> commands.add(new Known(c)));
                scpi.setup().forEach(c -> commands.add(new Known(c)));
                scpi.finish().forEach(c -> commands.add(new Known(c)));
                for (LineProtocol.ScpiInstrument instrument : scpi.instruments()) {
                    commands.add(new Known(new ScpiCommand(instrument.name(), instrument.identify(), CommandRole.IDENTIFIES)));
                }
                commands.add(new Known(new ScpiCommand(scpi.instruments().get(0).name(), scpi.errorQuery(),
                        CommandRole.READS_ERROR_QUEUE)));
                boolean hasPhase = scpi.step().stream().anyMatch(c -> c.role() == CommandRole.READS_PHASE);
                List<String> parts = new ArrayList<>();
                for (ScpiCommand c : scpi.step()) {
                    if (c.role() != CommandRole.SETTING && c.role() != CommandRole.WAITS_FOR_COMPLETION) {
                        parts.add(c.role().word() + " = '" + c.template() + "' to " + c.instrument());
                    }
                }
                return new Reading(hasPhase, "SCPI exchange: " + String.join("; ", parts),
                        (lineNo, body, sender, sent, received) -> scpiLine(scpi, lineNo, body, sender, sent, received));
            }

            @Override
            public Reading stream(LineProtocol.StreamedLines stream) {
                return new Reading(stream.point().pattern().contains("(?<phase>"),
                        "streamed lines: points from lines matching '" + stream.point().pattern() + "'",
                        (lineNo, body, sender, sent, received) -> streamLine(stream, lineNo, body, sent));
            }

            @Override
            public Reading scope(LineProtocol.ScopeFetch scope) {
                // a scope capture's transcript holds the commands and records, not readings; the
                // records were fitted as they arrived and the sweep file is the capture's result
                refused = new InputProblem(file, 0, "a log of profile '" + profile.name() + "' (kind serial-scope) "
                        + "holds scope records, not readings, and is not read as a sweep",
                        "read the sweep file the capture wrote (its --out file), or save the records as files and "
                                + "read them with a waveform profile");
                return new Reading(true, "scope records", (lineNo, body, sender, sent, received) -> { });
            }
        });
        mapping = reading.mapping();
        lines = reading.lines();
        boolean hasPhase = reading.hasPhase();
        this.assembly = new SweepAssembly(file, profile, hasPhase, tally, maxPoints);
        resetReadings();
    }

    /** @return points accepted so far (a live capture's progress) */
    public int pointCount() {
        return assembly.count() + (stepOpen && complete() ? 1 : 0);
    }

    /**
     * Takes one line of the log.
     *
     * @param lineNo 1-based line number, named in warnings
     * @param line   the line without its line ending
     */
    public void accept(long lineNo, String line) {
        if (refused != null) {
            return;
        }
        lastLine = Math.max(lastLine, lineNo);
        String stripped = line.strip();
        if (lineNo == 1 && stripped.startsWith("\uFEFF")) {
            stripped = stripped.substring(1);
        }
        if (stripped.isEmpty()) {
            return;
        }
        if (stripped.startsWith("#")) {
            notes.accept(lineNo, stripped.substring(1), tally);
            return;
        }
        java.util.regex.Matcher prefix = PREFIX.matcher(stripped);
        if (!prefix.matches()) {
            unparseable(lineNo, stripped, "cannot be read");
            return;
        }
        if (prefix.group("iso") != null) {
            timestamp(prefix.group("iso"));
        }
        String direction = prefix.group("dir");
        boolean received = direction != null && (direction.equals("<") || direction.equals("<-") || direction.equals("RX:"));
        boolean sent = direction != null && !received;
        String body = prefix.group("body").strip();
        if (body.isEmpty()) {
            return;
        }
        lines.take(lineNo, body, prefix.group("who"), sent, received);
    }

    private void scpiLine(LineProtocol.ScpiExchange scpi, long lineNo, String body, String sender, boolean sent,
                          boolean received) {
        Known command = received ? null : matchCommand(body, sender);
        if (received && matchCommand(body, sender) != null) {
            return;   // the instrument echoed a command back
        }
        if (command != null && !sent && !answeredSinceCommand && body.equalsIgnoreCase(lastCommandText)) {
            return;   // an echo in a log without direction markers
        }
        if (command != null) {
            command(scpi, lineNo, command, body);
            return;
        }
        if (sent) {
            unparseable(lineNo, body, "is a command this profile does not know");
            return;
        }
        answer(lineNo, body);
    }

    /**
     * @param sender the name before the direction marker, or null; when it names one of the
     *               profile's instruments, that instrument's commands are preferred (two
     *               instruments both answer {@code *IDN?})
     */
    private Known matchCommand(String body, String sender) {
        Known first = null;
        for (Known known : commands) {
            if (known.pattern.matcher(body).matches()) {
                if (sender == null || known.command.instrument().equalsIgnoreCase(sender)) {
                    return known;
                }
                first = first == null ? known : first;
            }
        }
        return first;
    }

    private void command(LineProtocol.ScpiExchange scpi, long lineNo, Known known, String body) {
        if (pending != null) {
            tally.add("unanswered queries", pendingLine, "'" + pending.command.template() + "' got no answer before line "
                    + lineNo);
            pending = null;
        }
        lastCommandText = body;
        answeredSinceCommand = false;
        ScpiCommand command = known.command;
        switch (command.role()) {
            case SETS_FREQUENCY: {
                completeStep();
                Matcher m = known.pattern.matcher(body);
                double hz = m.matches() ? ScpiCommand.argumentOf(m) : Double.NaN;
                if (!Double.isFinite(hz)) {
                    unparseable(lineNo, body, "has no readable frequency");
                    return;
                }
                stepOpen = true;
                stepLine = lineNo;
                stepFrequency = hz;
                resetReadings();
                break;
            }
            case SETS_AMPLITUDE: {
                Matcher m = known.pattern.matcher(body);
                double level = m.matches() ? ScpiCommand.argumentOf(m) : Double.NaN;
                if (level > scpi.maxAmplitude()) {
                    tally.add("levels above the profile's maximum", lineNo, "the generator was set to " + level + " "
                            + profile.scale().amplitudeKind().symbol() + ", above the profile's max-amplitude of "
                            + scpi.maxAmplitude());
                }
                break;
            }
            case SETTING:
                break;
            default:
                pending = known;
                pendingLine = lineNo;
        }
    }

    private void answer(long lineNo, String body) {
        answeredSinceCommand = true;
        if (pending == null) {
            unparseable(lineNo, body, "answers no query");
            return;
        }
        Known query = pending;
        pending = null;
        CommandRole role = query.command.role();
        java.util.regex.Matcher error = ERROR_ANSWER.matcher(body);
        if (role == CommandRole.READS_ERROR_QUEUE) {
            if (!error.matches()) {
                unparseable(lineNo, body, "is not an error-queue answer <code>,\"<text>\"");
            } else if (Integer.parseInt(error.group("code").replace("+", "")) != 0) {
                errorAnswer(lineNo, body);
            }
            return;
        }
        if (role == CommandRole.IDENTIFIES) {
            identities.put(query.command.instrument(), body);
            return;
        }
        if (role == CommandRole.WAITS_FOR_COMPLETION) {
            if (!body.equals("1") && !body.equals("+1")) {
                unparseable(lineNo, body, "is not the answer 1 to " + query.command.template());
            }
            return;
        }
        if (error.matches()) {
            errorAnswer(lineNo, body);
            return;
        }
        double value = StrictNumber.parse(body, false);
        if (Double.isNaN(value)) {
            unparseable(lineNo, body, "is not a number answering " + query.command.template());
            return;
        }
        if (!stepOpen) {
            unparseable(lineNo, body, "is a reading before any frequency was set");
            return;
        }
        if (Math.abs(value) >= SCPI_OVERRANGE) {
            tally.add("clipped readings", lineNo, "'" + body + "' is SCPI's overrange value: the "
                    + query.command.instrument() + " was saturated; reading dropped");
            return;
        }
        switch (role) {
            case READS_GAIN:
                gain = value;
                break;
            case READS_INPUT_AMPLITUDE:
                input = value;
                break;
            case READS_OUTPUT_AMPLITUDE:
                output = value;
                break;
            case READS_PHASE:
                phase = value;
                break;
            default:
                break;
        }
    }

    private void errorAnswer(long lineNo, String body) {
        tally.add("error answers", lineNo, "error answer " + body
                + (stepOpen ? "; readings of the step for " + ReadingConversion.format(stepFrequency) + " Hz so far are void"
                        : ""));
        if (stepOpen) {
            errorsInStep++;
            resetReadings();
        }
    }

    private void resetReadings() {
        gain = Double.NaN;
        input = Double.NaN;
        output = Double.NaN;
        phase = Double.NaN;
    }

    private boolean complete() {
        boolean magnitude = profile.scale().gainForm() == GainForm.AMPLITUDES
                ? !Double.isNaN(input) && !Double.isNaN(output) : !Double.isNaN(gain);
        return magnitude && (!assembly.hasPhase() || !Double.isNaN(phase));
    }

    private void completeStep() {
        if (!stepOpen) {
            return;
        }
        stepOpen = false;
        if (complete()) {
            offer(stepLine, stepFrequency, gain, input, output, phase);
        } else {
            tally.add("incomplete steps", stepLine, "the step for " + ReadingConversion.format(stepFrequency)
                    + " Hz lacks " + missing() + (errorsInStep > 0 ? " (after an error answer)" : "") + "; skipped");
        }
        errorsInStep = 0;
    }

    private String missing() {
        List<String> lacking = new ArrayList<>();
        if (profile.scale().gainForm() == GainForm.AMPLITUDES) {
            if (Double.isNaN(input)) {
                lacking.add("the input amplitude");
            }
            if (Double.isNaN(output)) {
                lacking.add("the output amplitude");
            }
        } else if (Double.isNaN(gain)) {
            lacking.add("the gain");
        }
        if (assembly.hasPhase() && Double.isNaN(phase)) {
            lacking.add("the phase");
        }
        return String.join(" and ", lacking);
    }

    private void streamLine(LineProtocol.StreamedLines stream, long lineNo, String body, boolean sent) {
        if (sent) {
            lastCommandText = body;
            return;
        }
        if (!stream.identify().isEmpty() && lastCommandText.equalsIgnoreCase(stream.identify())) {
            lastCommandText = "";
            if (!body.equalsIgnoreCase(stream.identify())) {
                identities.put(profile.name(), body);
                return;
            }
        }
        Matcher point = stream.point().matcher(body);
        if (point.matches()) {
            streamPoint(lineNo, body, point);
            return;
        }
        if (stream.error().isPresent() && stream.error().get().matcher(body).matches()) {
            tally.add("error answers", lineNo, "the instrument reported an error: " + TableSweepParser.printable(body));
            return;
        }
        for (Pattern ignore : stream.ignore()) {
            if (ignore.matcher(body).matches()) {
                return;
            }
        }
        if (stream.end().isPresent() && stream.end().get().matcher(body).matches()) {
            return;
        }
        String startWord = stream.start().strip().split("\\s+")[0];
        if (body.equalsIgnoreCase(stream.identify()) || body.equalsIgnoreCase(stream.stop())
                || body.regionMatches(true, 0, startWord, 0, startWord.length())) {
            if (body.equalsIgnoreCase(stream.identify())) {
                lastCommandText = body;
            }
            return;   // a command as typed or echoed
        }
        unparseable(lineNo, body, "matches no line this profile knows");
    }

    private void streamPoint(long lineNo, String body, Matcher point) {
        double frequency = group(point, "frequency");
        boolean amplitudes = profile.scale().gainForm() == GainForm.AMPLITUDES;
        double g = amplitudes ? Double.NaN : group(point, "gain");
        double in = amplitudes ? group(point, "input") : Double.NaN;
        double out = amplitudes ? group(point, "output") : Double.NaN;
        double ph = assembly.hasPhase() ? group(point, "phase") : Double.NaN;
        if (Double.isNaN(frequency) || Double.isNaN(g) && !amplitudes || amplitudes && (Double.isNaN(in) || Double.isNaN(out))
                || assembly.hasPhase() && Double.isNaN(ph)) {
            unparseable(lineNo, body, "has a field that is not a number");
            return;
        }
        offer(lineNo, frequency, g, in, out, ph);
    }

    /**
     * Keeps a point; past the limit on points the refusal is kept for {@link #result} to
     * throw, and later lines are ignored, so that memory stops growing at once while
     * {@link #accept} stays free of checked exceptions for the capture loop.
     */
    private void offer(long lineNo, double frequency, double g, double in, double out, double ph) {
        try {
            assembly.offer(lineNo, frequency, g, in, out, ph, Double.NaN, Double.NaN);
        } catch (InputProblem tooMany) {
            refused = tooMany;
        }
    }

    private static double group(Matcher matcher, String name) {
        String text = matcher.group(name);
        return text == null ? Double.NaN : StrictNumber.parse(text, false);
    }

    private void unparseable(long lineNo, String body, String why) {
        tally.add("unparseable lines", lineNo, "'" + TableSweepParser.printable(body) + "' " + why + "; line skipped");
    }

    private void timestamp(String iso) {
        try {
            String normal = iso.replace(' ', 'T').replace(',', '.');
            notes.captured(OffsetDateTime.parse(normal).toInstant());
        } catch (DateTimeParseException e) {
            // a timestamp without an offset cannot become an instant; the log's # date: may give one
        }
    }

    /** Records when the sweep was captured, for a live capture whose lines carry no timestamps; the first time given wins. */
    public void captured(Instant when) {
        notes.captured(when);
    }

    /**
     * @param sha256 hex SHA-256 of the log file, or empty for a live capture
     * @return the sweep with every warning
     * @throws InputProblem when fewer than 8 usable points were read
     */
    public ImportedSweep result(String sha256) throws InputProblem {
        if (refused != null) {
            throw refused;
        }
        if (pending != null) {
            tally.add("unanswered queries", pendingLine, "'" + pending.command.template() + "' got no answer");
            pending = null;
        }
        completeStep();
        if (refused != null) {
            throw refused;
        }
        if (!identities.isEmpty()) {
            List<String> parts = new ArrayList<>();
            identities.forEach((who, idn) -> parts.add(identities.size() == 1 ? idn : who + ": " + idn));
            if (notes.instrument().isEmpty()) {
                notes.instrument(String.join("; ", parts));
            }
        }
        Sweep sweep = assembly.finish(notes.provenance(file, sha256, profile.name()), lastLine);
        return new ImportedSweep(sweep, profile.name(), mapping + "; " + profile.scale().describe(), tally.warnings());
    }

    /** Same as {@link #result(String)} with no file hash (a live capture). */
    public ImportedSweep result() throws InputProblem {
        return result("");
    }

    /**
     * What the protocol makes of a log: whether its points carry a phase, the mapping line
     * {@code inspect} prints, and how a line is taken.
     */
    private record Reading(boolean hasPhase, String mapping, LineTaker lines) {
    }

    /** One line's body, after its timestamp and direction marker are read. */
    @FunctionalInterface
    private interface LineTaker {
        /**
         * @param sender   the name before the direction marker, or null
         * @param sent     the line went to the instrument
         * @param received the line came from the instrument (neither when the log has no markers)
         */
        void take(long lineNo, String body, String sender, boolean sent, boolean received);
    }
}

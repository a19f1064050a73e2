package org.polebench.synth;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.function.BooleanSupplier;
import java.util.function.Consumer;
import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import org.apache.commons.math3.complex.Complex;
import org.polebench.capture.LineTransport;
import org.polebench.capture.PortLostException;
import org.polebench.capture.SweepPlan;
import org.polebench.profile.BlockCoding;
import org.polebench.profile.CommandRole;
import org.polebench.profile.SampleCoding;
import org.polebench.profile.GainForm;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.ReadingScale;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.units.Decibels;
import org.polebench.units.StrictNumber;

/**
 * Plays the instruments of a serial profile on a line: answers the profile's commands as the
 * instruments would, measuring a {@link BoardResponse}, with Gaussian noise on gain and phase,
 * and on request misbehaves ({@link Misbehaviour}). It never measures anything real: its
 * identity says it is a simulation, and it exists for tests, demos and trying a profile.
 *
 * <p>SCPI profiles: every command of the setup, step and finish lists, the identity queries
 * and the error query is recognised by its template (blanks and letter case are free, as
 * SCPI-99 vol. 1 §6.1 allows; from memory). The frequency command sets the frequency; a level
 * command sets the level unless it is above the profile's maximum, which queues the error
 * {@code -222,"Data out of range"} (SCPI-99 error numbers, from memory); {@code *OPC?} answers
 * 1; {@code *CLS} empties the error queue; readings answer in the profile's units (amplitudes in
 * its kind, phase in its unit and sign, folded into one turn when it says so), an amplitude at or
 * above the profile's full scale as SCPI's overrange value 9.9E37; an unknown command queues
 * {@code -113,"Undefined header"}.
 *
 * <p>Streaming profiles: the simulator answers the identity query and, on the start command,
 * streams {@code BEGIN <n>}, then {@code PT <i> <Hz> <dB> <deg>} per log-spaced point and
 * {@code END <n>} (the line format of the shipped {@code streaming-sweeper} profile; a profile
 * whose point pattern does not read these lines is refused). The stop command ends a sweep.
 *
 * <p>Noise is drawn per frequency from a generator seeded by the seed and the frequency's bits,
 * gain first, then phase, so the same frequency always reads the same: a resumed capture sees
 * exactly what an uninterrupted one would have.
 *
 * <p>Holds configuration only; {@link #session()} holds a bench's state, shared by the ports
 * its instruments are on.
 */
public final class InstrumentSimulator {
    private static final Pattern NUMBER_GROUP = Pattern.compile("\\{(start_hz_nr3|stop_hz_nr3|points|amplitude_nr3)\\}");
    private static final String NO_ERROR = "0,\"No error\"";
    /** How long a closing simulator lets its last lines travel before it closes, in ms. */
    private static final long LINGER_MS = 500;

    private final SerialProfile profile;
    private final BoardResponse board;
    private final SweepNoise noise;
    private final long seed;
    private final List<Misbehaviour> misbehaviours;
    private final ScopeSignal scopeSignal;

    /**
     * @param noise the Gaussian noise on gain and phase
     * @param seed  seed of the noise
     * @throws IllegalArgumentException for a streaming profile whose point pattern does not
     *                                  read the simulator's point lines
     */
    public InstrumentSimulator(SerialProfile profile, BoardResponse board, SweepNoise noise, long seed,
                               List<Misbehaviour> misbehaviours) {
        this(profile, board, noise, seed, misbehaviours, ScopeSignal.PLAIN);
    }

    /**
     * As above, with what a simulated scope ({@code kind: serial-scope}) does to its records.
     *
     * @throws IllegalArgumentException also when the scope's converter has more bits than its
     *                                  block coding holds
     */
    public InstrumentSimulator(SerialProfile profile, BoardResponse board, SweepNoise noise, long seed,
                               List<Misbehaviour> misbehaviours, ScopeSignal scopeSignal) {
        this.scopeSignal = scopeSignal;
        this.profile = profile;
        this.board = board;
        this.noise = noise;
        this.seed = seed;
        this.misbehaviours = List.copyOf(misbehaviours);
        profile.protocol().apply(new LineProtocol.Cases<Void>() {
            @Override
            public Void exchange(LineProtocol.ScpiExchange scpi) {
                return null;   // the simulator answers the profile's own commands
            }

            @Override
            public Void stream(LineProtocol.StreamedLines stream) {
                String sample = pointLine(1, 1234.5, -3.25, 45.5);
                Matcher m = stream.point().matcher(sample);
                if (profile.scale().gainForm() == GainForm.AMPLITUDES || !m.matches()
                        || Math.abs(StrictNumber.parse(m.group("frequency"), false) - 1234.5) > 1e-6) {
                    throw new IllegalArgumentException("the simulator streams lines such as '" + sample
                            + "', which the profile's point pattern does not read");
                }
                return null;
            }

            @Override
            public Void scope(LineProtocol.ScopeFetch scope) {
                if (scope.format() == LineProtocol.WaveformFormat.BLOCK
                        && scopeSignal.bits() > 8 * scope.blockCoding().bytesPerSample()) {
                    throw new IllegalArgumentException("the scope's converter cannot have " + scopeSignal.bits()
                            + " bits in blocks of " + scope.blockCoding().word());
                }
                return null;
            }
        });
    }

    /**
     * @return the identity the simulator gives, in the four fields of IEEE 488.2 {@code *IDN?}:
     *         one for every instrument, since instruments sharing a line cannot be told apart
     */
    public String identity() {
        return "polebench,simulated bench (no real instrument),SIM-0001,1.0";
    }

    /** @return a fresh bench: frequency, level, error queue, misbehaviour counters */
    public Session session() {
        return new Session();
    }

    /** Why {@link Session#serve} returned. */
    public enum End {
        /** The far end closed the line. */
        LINE_LOST,
        /** A {@link Misbehaviour.Kind#CLOSE} misbehaviour closed it. */
        CLOSED_ON_PURPOSE,
        /** The stop signal was raised. */
        STOPPED
    }

    /**
     * The state of one simulated bench. Its instruments may sit on several lines, each
     * served on its own thread; the state is shared and guarded by the session's lock.
     */
    public final class Session {
        private double frequencyHz = 1000;
        private double level;
        private final Deque<String> errors = new ArrayDeque<>();
        private final List<Known> commands = new ArrayList<>();
        private final Set<Misbehaviour> fired = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
        private final List<Misbehaviour> armed = new ArrayList<>();
        private int frequencyCommands;
        private int pointsStreamed;
        /** How this session answers a line, chosen once by the profile's protocol. */
        private final Answering answering;

        private Session() {
            answering = profile.protocol().apply(new LineProtocol.Cases<Answering>() {
                @Override
                public Answering exchange(LineProtocol.ScpiExchange scpi) {
                    level = scpi.amplitude();
                    for (LineProtocol.ScpiInstrument instrument : scpi.instruments()) {
                        commands.add(new Known(new ScpiCommand(instrument.name(), instrument.identify(),
                                CommandRole.IDENTIFIES)));
                    }
                    scpi.step().forEach(c -> commands.add(new Known(c)));
                    scpi.setup().forEach(c -> commands.add(new Known(c)));
                    scpi.finish().forEach(c -> commands.add(new Known(c)));
                    commands.add(new Known(new ScpiCommand(scpi.instruments().get(0).name(), scpi.errorQuery(),
                            CommandRole.READS_ERROR_QUEUE)));
                    return (line, text, stop, sent) -> scpiLine(scpi, line, text, sent);
                }

                @Override
                public Answering stream(LineProtocol.StreamedLines stream) {
                    level = stream.amplitude();
                    return (line, text, stop, sent) -> streamLine(stream, line, text, stop, sent);
                }

                @Override
                public Answering scope(LineProtocol.ScopeFetch scope) {
                    level = scope.amplitude();
                    for (LineProtocol.ScpiInstrument instrument : scope.instruments()) {
                        commands.add(new Known(new ScpiCommand(instrument.name(), instrument.identify(),
                                CommandRole.IDENTIFIES)));
                    }
                    commands.add(new Known(scope.setFrequency()));
                    scope.setup().forEach(c -> commands.add(new Known(c)));
                    scope.finish().forEach(c -> commands.add(new Known(c)));
                    return new ScopeAnswers(scope)::answer;
                }
            });
        }

        /**
         * Answers the line until it is lost, a close misbehaviour closes it, or stop is raised.
         *
         * @param sent receives every line the simulator sends, as sent, on the serving thread
         */
        public End serve(LineTransport line, BooleanSupplier stop, Consumer<String> sent) throws IOException {
            try {
                while (!stop.getAsBoolean()) {
                    Optional<String> received;
                    try {
                        received = line.receive(50);
                    } catch (PortLostException e) {
                        return End.LINE_LOST;
                    }
                    if (received.isEmpty()) {
                        continue;
                    }
                    boolean open = answering.answer(line, received.get().strip(), stop, sent);
                    if (!open) {
                        // lines written just before are still on their way through the port;
                        // closing at once could discard them, which the misbehaviour is not
                        // meant to do
                        pause(LINGER_MS);
                        line.close();
                        return End.CLOSED_ON_PURPOSE;
                    }
                }
                return End.STOPPED;
            } catch (PortLostException e) {
                return End.LINE_LOST;
            }
        }

        // ---- SCPI -----------------------------------------------------------------------

        /** @return false when a misbehaviour closed the line */
        private boolean scpiLine(LineProtocol.ScpiExchange scpi, LineTransport line, String text, Consumer<String> sent)
                throws IOException {
            Optional<String> answer;
            synchronized (this) {
                Known known = match(text);
                if (known == null) {
                    errors.add("-113,\"Undefined header\"");
                    return true;
                }
                if (known.command.role() == CommandRole.SETS_FREQUENCY) {
                    frequencyCommands++;
                    arm(frequencyCommands);
                    if (take(Misbehaviour.Kind.CLOSE).isPresent()) {
                        return false;
                    }
                }
                answer = answer(scpi, known, text);
            }
            if (answer.isPresent()) {
                send(line, answer.get(), sent);
            }
            return true;
        }

        private Known match(String text) {
            for (Known known : commands) {
                if (known.pattern.matcher(text).matches()) {
                    return known;
                }
            }
            return null;
        }

        private Optional<String> answer(LineProtocol.ScpiExchange scpi, Known known, String text) {
            ReadingScale scale = profile.scale();
            switch (known.command.role()) {
                case SETS_FREQUENCY: {
                    double value = argument(known, text);
                    if (value > 0 && Double.isFinite(value)) {
                        frequencyHz = scale.hertz(value);
                    } else {
                        errors.add("-222,\"Data out of range\"");
                    }
                    return Optional.empty();
                }
                case SETS_AMPLITUDE: {
                    double value = argument(known, text);
                    if (value > 0 && value <= scpi.maxAmplitude()) {
                        level = value;
                    } else {
                        errors.add("-222,\"Data out of range\"");
                    }
                    return Optional.empty();
                }
                case SETTING:
                    // the setup sets the level after any *RST; resetting it here would let the
                    // meter's *RST undo the generator's level, since the bench shares one state
                    if (text.equalsIgnoreCase("*CLS")) {
                        errors.clear();
                    }
                    return Optional.empty();
                case IDENTIFIES:
                    return Optional.of(identity());
                case WAITS_FOR_COMPLETION:
                    return Optional.of("1");
                case READS_ERROR_QUEUE:
                    return Optional.of(errors.isEmpty() ? NO_ERROR : errors.poll());
                case READS_INPUT_AMPLITUDE:
                    return Optional.of(amplitude(level));
                case READS_OUTPUT_AMPLITUDE:
                    return Optional.of(amplitude(level * Decibels.toRatio(measuredGainDb(frequencyHz))));
                case READS_GAIN:
                    return Optional.of(ScpiCommand.nr3(scale.gainForm() == GainForm.RATIO
                            ? Decibels.toRatio(measuredGainDb(frequencyHz)) : measuredGainDb(frequencyHz)));
                case READS_PHASE:
                    return Optional.of(ScpiCommand.nr3(scale.rawPhase(measuredPhaseDeg(frequencyHz))));
                default:
                    throw new IllegalStateException("no answer for role " + known.command.role());
            }
        }

        /** @return the reading, or SCPI's overrange value 9.9E37 at or above the profile's full scale */
        private String amplitude(double volts) {
            if (profile.limits().fullScale().isPresent() && volts >= profile.limits().fullScale().getAsDouble()) {
                return "9.9E37";
            }
            return ScpiCommand.nr3(volts);
        }

        private double argument(Known known, String text) {
            Matcher m = known.pattern.matcher(text);
            return m.matches() ? ScpiCommand.argumentOf(m) : Double.NaN;
        }

        // ---- streaming ------------------------------------------------------------------

        private boolean streamLine(LineProtocol.StreamedLines stream, LineTransport line, String text,
                                   BooleanSupplier stop, Consumer<String> sent) throws IOException {
            if (!stream.identify().isBlank() && text.equalsIgnoreCase(stream.identify())) {
                send(line, identity(), sent);
                return true;
            }
            Matcher start = startPattern(stream.start()).matcher(text);
            if (!start.matches()) {
                if (!text.equalsIgnoreCase(stream.stop())) {
                    send(line, "ERR -113 unknown command", sent);
                }
                return true;
            }
            double from = profile.scale().hertz(StrictNumber.parse(start.group("start"), false));
            double to = profile.scale().hertz(StrictNumber.parse(start.group("stop"), false));
            int n;
            try {
                n = Integer.parseInt(start.group("points"));
            } catch (NumberFormatException e) {
                n = -1;
            }
            double requested = start.group("amplitude") == null ? level : StrictNumber.parse(start.group("amplitude"), false);
            if (!(from > 0) || !(to > from) || n < 2 || !(requested > 0) || requested > stream.maxAmplitude()) {
                send(line, "ERR -222 data out of range", sent);
                return true;
            }
            level = requested;
            SweepPlan plan = new SweepPlan(from, to, n);
            send(line, "BEGIN " + n, sent);
            for (int i = 0; i < n; i++) {
                if (stop.getAsBoolean()) {
                    return true;
                }
                Optional<String> interrupt = line.receive(0);
                if (interrupt.isPresent() && interrupt.get().strip().equalsIgnoreCase(stream.stop())) {
                    send(line, "END " + i, sent);
                    return true;
                }
                synchronized (this) {
                    pointsStreamed++;
                    arm(pointsStreamed);
                    if (take(Misbehaviour.Kind.CLOSE).isPresent()) {
                        return false;
                    }
                }
                double hz = Double.parseDouble(ScpiCommand.nr3(plan.frequencyHz(i)));
                String point = pointLine(i + 1, profile.scale().rawFrequency(hz), measuredGainDb(hz),
                        profile.scale().rawPhase(measuredPhaseDeg(hz)));
                send(line, point, sent);
            }
            send(line, "END " + n, sent);
            return true;
        }

        private Pattern startPattern(String template) {
            StringBuilder regex = new StringBuilder("(?i)");
            Matcher m = NUMBER_GROUP.matcher(template.strip());
            int last = 0;
            while (m.find()) {
                regex.append(quoteLoosely(template.strip().substring(last, m.start())));
                String name = m.group(1).equals("start_hz_nr3") ? "start" : m.group(1).equals("stop_hz_nr3") ? "stop"
                        : m.group(1).equals("points") ? "points" : "amplitude";
                regex.append("(?<").append(name).append(">\\S+)");
                last = m.end();
            }
            regex.append(quoteLoosely(template.strip().substring(last)));
            return Pattern.compile(regex.toString());
        }

        /** @return the text as a pattern in which each run of blanks matches any run of blanks */
        private String quoteLoosely(String text) {
            StringBuilder b = new StringBuilder();
            Matcher blanks = Pattern.compile("\\s+").matcher(text);
            int last = 0;
            while (blanks.find()) {
                if (blanks.start() > last) {
                    b.append(Pattern.quote(text.substring(last, blanks.start())));
                }
                b.append("\\s+");
                last = blanks.end();
            }
            if (last < text.length()) {
                b.append(Pattern.quote(text.substring(last)));
            }
            return b.toString();
        }

        // ---- scope ----------------------------------------------------------------------

        /** The simulated generator and scope of a {@code serial-scope} profile. */
        private final class ScopeAnswers {
            private final LineProtocol.ScopeFetch scope;
            private final Pattern interval;
            private final Pattern input;
            private final Pattern output;
            private final Pattern inputScale;
            private final Pattern outputScale;

            ScopeAnswers(LineProtocol.ScopeFetch scope) {
                this.scope = scope;
                this.interval = pattern(scope.interval());
                this.input = pattern(scope.input());
                this.output = pattern(scope.output());
                this.inputScale = scope.inputScale().map(ScopeAnswers::pattern).orElse(null);
                this.outputScale = scope.outputScale().map(ScopeAnswers::pattern).orElse(null);
            }

            private static Pattern pattern(LineProtocol.ScopeQuery query) {
                return new ScpiCommand(query.instrument(), query.query(), CommandRole.SETTING).logPattern();
            }

            /** @return false when a misbehaviour closed the line */
            boolean answer(LineTransport line, String text, BooleanSupplier stop, Consumer<String> sent)
                    throws IOException {
                double hz;
                double peakVolts;
                synchronized (Session.this) {
                    hz = frequencyHz;
                    peakVolts = peak(level);
                }
                boolean garbageHere = scope.format() == LineProtocol.WaveformFormat.ASCII;
                if (interval.matcher(text).matches()) {
                    send(line, ScpiCommand.nr3(intervalSeconds(hz)), sent, garbageHere);
                    return true;
                }
                for (int channel = 0; channel < 2; channel++) {
                    Pattern scale = channel == 0 ? inputScale : outputScale;
                    if (scale != null && scale.matcher(text).matches()) {
                        send(line, ScpiCommand.nr3(voltsPerCode(channelPeak(channel, hz, peakVolts))), sent, garbageHere);
                        return true;
                    }
                    if ((channel == 0 ? input : output).matcher(text).matches()) {
                        sendRecord(line, channel, hz, peakVolts, sent);
                        return true;
                    }
                }
                Optional<String> answer;
                synchronized (Session.this) {
                    Known known = match(text);
                    if (known == null) {
                        errors.add("-113,\"Undefined header\"");
                        return true;
                    }
                    answer = Optional.empty();
                    switch (known.command.role()) {
                        case SETS_FREQUENCY: {
                            frequencyCommands++;
                            arm(frequencyCommands);
                            if (take(Misbehaviour.Kind.CLOSE).isPresent()) {
                                return false;
                            }
                            double value = argument(known, text);
                            if (value > 0 && Double.isFinite(value)) {
                                frequencyHz = profile.scale().hertz(value);
                            }
                            break;
                        }
                        case SETS_AMPLITUDE: {
                            double value = argument(known, text);
                            if (value > 0 && value <= scope.maxAmplitude()) {
                                level = value;
                            }
                            break;
                        }
                        case IDENTIFIES:
                            answer = Optional.of(identity());
                            break;
                        case WAITS_FOR_COMPLETION:
                            answer = Optional.of("1");
                            break;
                        default:
                            break;
                    }
                }
                if (answer.isPresent()) {
                    send(line, answer.get(), sent, garbageHere);
                }
                return true;
            }

            private double intervalSeconds(double hz) {
                return scopeSignal.periods() / (hz * scopeSignal.samples());
            }

            /** @return the peak volts the channel shows: the level, or the level times |H| */
            private double channelPeak(int channel, double hz, double inputPeakVolts) {
                return channel == 0 ? inputPeakVolts : inputPeakVolts * board.atHz(hz).abs();
            }

            /**
             * The simulated scope sets each channel's range so that its sine's peak (or the
             * clipping level, when lower) fills 80 % of it, as an automatic vertical setting
             * does; with no scale query the profile's fixed volts per code hold.
             */
            private double rangeVolts(double peakVolts) {
                return 1.25 * Math.min(peakVolts, scopeSignal.clipVolts());
            }

            private double voltsPerCode(double peakVolts) {
                if (scope.inputScale().isEmpty()) {
                    return scope.coding().voltsPerCode();
                }
                double highest = scope.format() == LineProtocol.WaveformFormat.BLOCK
                        ? scope.blockCoding().highestCode() + 1 : 128;
                return rangeVolts(peakVolts) / highest;
            }

            private void sendRecord(LineTransport line, int channel, double hz, double inputPeakVolts,
                                    Consumer<String> sent) throws IOException {
                double peakVolts = channelPeak(channel, hz, inputPeakVolts);
                double phase = channel == 0 ? 0 : board.atHz(hz).getArgument();
                double dt = intervalSeconds(hz);
                int n = scopeSignal.samples();
                double range = rangeVolts(peakVolts);
                double step = scopeSignal.bits() == 0 ? 0 : range / Math.pow(2, scopeSignal.bits() - 1);
                SplittableRandom random = new SplittableRandom(seed * 0x9E3779B97F4A7C15L
                        ^ Double.doubleToLongBits(hz) ^ (channel + 1L) * 0xBF58476D1CE4E5B9L);
                double[] volts = new double[n];
                for (int k = 0; k < n; k++) {
                    // a start phase of 0.3 rad, so that the record does not begin at a zero crossing
                    double v = peakVolts * Math.sin(2 * Math.PI * hz * k * dt + 0.3 + phase)
                            + scopeSignal.noiseVolts() * random.nextGaussian();
                    v = Math.max(-scopeSignal.clipVolts(), Math.min(scopeSignal.clipVolts(), v));
                    if (step > 0) {
                        v = Math.max(-range, Math.min(range, Math.round(v / step) * step));
                    }
                    volts[k] = v;
                }
                SampleCoding coding = scope.coding();
                double vpc = voltsPerCode(peakVolts);
                if (scope.format() == LineProtocol.WaveformFormat.BLOCK) {
                    BlockCoding blockCoding = scope.blockCoding();
                    int width = blockCoding.bytesPerSample();
                    String length = Integer.toString(n * width);
                    byte[] header = ("#" + length.length() + length).getBytes(StandardCharsets.US_ASCII);
                    byte[] ending = profile.protocol().apply(new PortEnding()).getBytes(StandardCharsets.US_ASCII);
                    byte[] block = new byte[header.length + n * width + ending.length];
                    System.arraycopy(header, 0, block, 0, header.length);
                    for (int k = 0; k < n; k++) {
                        double code = Math.rint(volts[k] / vpc + coding.zeroCode());
                        int c = (int) Math.max(blockCoding.lowestCode(), Math.min(blockCoding.highestCode(), code));
                        int at = header.length + k * width;
                        switch (blockCoding) {
                            case INT8:
                                block[at] = (byte) c;
                                break;
                            case INT16_BIG_ENDIAN:
                                block[at] = (byte) (c >> 8);
                                block[at + 1] = (byte) c;
                                break;
                            case INT16_LITTLE_ENDIAN:
                                block[at] = (byte) c;
                                block[at + 1] = (byte) (c >> 8);
                                break;
                            default:
                                throw new IllegalStateException("no coding " + blockCoding);
                        }
                    }
                    System.arraycopy(ending, 0, block, block.length - ending.length, ending.length);
                    sendBlock(line, block, sent);
                    return;
                }
                StringBuilder text = new StringBuilder(n * 14);
                for (int k = 0; k < n; k++) {
                    if (k > 0) {
                        text.append(',');
                    }
                    double value = coding.codes() ? Math.rint(volts[k] / vpc + coding.zeroCode()) : volts[k];
                    text.append(String.format(Locale.ROOT, "%.6E", value));
                }
                send(line, text.toString(), sent);
            }

            /** @return the level as peak volts, from the profile's amplitude kind */
            private double peak(double levelOfKind) {
                switch (profile.scale().amplitudeKind()) {
                    case PEAK_TO_PEAK:
                        return levelOfKind / 2;
                    case RMS:
                        return levelOfKind * Math.sqrt(2);
                    default:
                        return levelOfKind;
                }
            }
        }

        /** Sends a block, with the line's misbehaviours: dropped, stalled, or its header spoilt. */
        private void sendBlock(LineTransport line, byte[] block, Consumer<String> sent) throws IOException {
            Optional<Misbehaviour> drop;
            Optional<Misbehaviour> garbage;
            Optional<Misbehaviour> stall;
            synchronized (this) {
                drop = take(Misbehaviour.Kind.DROP);
                garbage = drop.isPresent() ? Optional.empty() : take(Misbehaviour.Kind.GARBAGE);
                stall = drop.isPresent() ? Optional.empty() : take(Misbehaviour.Kind.STALL);
            }
            if (drop.isPresent()) {
                return;
            }
            if (stall.isPresent()) {
                pause(stall.get().stallMs());
            }
            if (garbage.isPresent()) {
                // a header whose count is not digits: the block cannot be read by its length
                line.send(garbage("block"));
                sent.accept("(a spoilt block header)");
                return;
            }
            line.sendBytes(block);
            sent.accept("(a block of " + block.length + " bytes)");
        }

        // ---- misbehaviour and noise ---------------------------------------------------

        private void arm(int count) {
            for (Misbehaviour m : misbehaviours) {
                if (m.step() == count && !fired.contains(m)) {
                    fired.add(m);
                    armed.add(m);
                }
            }
        }

        private Optional<Misbehaviour> take(Misbehaviour.Kind kind) {
            for (Misbehaviour m : armed) {
                if (m.kind() == kind) {
                    armed.remove(m);
                    return Optional.of(m);
                }
            }
            return Optional.empty();
        }

        private void send(LineTransport line, String text, Consumer<String> sent) throws IOException {
            send(line, text, sent, true);
        }

        /** @param garbageHere false to keep a garbage misbehaviour for the next block (a scope's record) */
        private void send(LineTransport line, String text, Consumer<String> sent, boolean garbageHere)
                throws IOException {
            Optional<Misbehaviour> drop;
            Optional<Misbehaviour> garbage;
            Optional<Misbehaviour> stall;
            synchronized (this) {
                drop = take(Misbehaviour.Kind.DROP);
                garbage = drop.isPresent() || !garbageHere ? Optional.empty() : take(Misbehaviour.Kind.GARBAGE);
                stall = drop.isPresent() ? Optional.empty() : take(Misbehaviour.Kind.STALL);
            }
            if (drop.isPresent()) {
                return;
            }
            if (stall.isPresent()) {
                pause(stall.get().stallMs());
            }
            String out = garbage.isPresent() ? garbage(text) : text;
            line.send(out);
            sent.accept(out);
        }

        private String garbage(String text) {
            SplittableRandom random = new SplittableRandom(seed ^ text.hashCode());
            StringBuilder b = new StringBuilder("#?");
            for (int i = 0; i < 8; i++) {
                b.append((char) ('!' + random.nextInt(14)));
            }
            return b.toString();
        }
    }

    private static void pause(long millis) {
        try {
            Thread.sleep(millis);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private double measuredGainDb(double frequencyHz) {
        Complex h = board.atHz(frequencyHz);
        return Decibels.fromRatio(h.abs()) + noise.gainSigmaDb() * draws(frequencyHz)[0];
    }

    private double measuredPhaseDeg(double frequencyHz) {
        Complex h = board.atHz(frequencyHz);
        return Math.toDegrees(h.getArgument()) + noise.phaseSigmaDeg() * draws(frequencyHz)[1];
    }

    /** @return two standard normal draws for this frequency: gain's, then phase's */
    private double[] draws(double frequencyHz) {
        SplittableRandom random = new SplittableRandom(seed * 0x9E3779B97F4A7C15L ^ Double.doubleToLongBits(frequencyHz));
        double gain = random.nextGaussian();
        double phase = random.nextGaussian();
        return new double[] {gain, phase};
    }

    private static String pointLine(int index, double frequency, double gainDb, double phaseDeg) {
        return String.format(Locale.ROOT, "PT %d %s %.6f %.4f", index, ScpiCommand.nr3(frequency), gainDb, phaseDeg);
    }

    /** The line ending of the profile's first instrument's port, which a block's end carries. */
    private static final class PortEnding implements LineProtocol.Cases<String> {
        @Override
        public String exchange(LineProtocol.ScpiExchange scpi) {
            return scpi.instruments().get(0).port().lineEnding().text();
        }

        @Override
        public String stream(LineProtocol.StreamedLines stream) {
            return stream.port().lineEnding().text();
        }

        @Override
        public String scope(LineProtocol.ScopeFetch scope) {
            for (LineProtocol.ScpiInstrument instrument : scope.instruments()) {
                if (instrument.name().equals(scope.input().instrument())) {
                    return instrument.port().lineEnding().text();
                }
            }
            return scope.instruments().get(0).port().lineEnding().text();
        }
    }

    /** A command template with its compiled pattern. */
    private static final class Known {
        final ScpiCommand command;
        final Pattern pattern;

        Known(ScpiCommand command) {
            this.command = command;
            this.pattern = command.logPattern();
        }
    }

    /** One received line answered by a session: SCPI command and answer, or a streamed sweep. */
    @FunctionalInterface
    private interface Answering {
        /** @return false when a misbehaviour closed the line */
        boolean answer(LineTransport line, String text, BooleanSupplier stop, Consumer<String> sent) throws IOException;
    }
}

package org.polebench.profile;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import com.google.re2j.Pattern;

/** How a serial instrument talks: SCPI command and answer, or a stream of result lines. */
public sealed interface LineProtocol permits LineProtocol.ScpiExchange, LineProtocol.StreamedLines,
        LineProtocol.ScopeFetch {

    /** @return milliseconds to wait for one answer line */
    int timeoutMs();

    /**
     * @return what {@code cases} gives for this protocol; a new protocol adds a method to
     *         {@link Cases}, so the compiler finds every place that acts on the protocols
     */
    <R> R apply(Cases<R> cases);

    /** One action per protocol, for {@link #apply}. */
    interface Cases<R> {
        R exchange(ScpiExchange scpi);

        R stream(StreamedLines stream);

        R scope(ScopeFetch scope);
    }

    /**
     * One named instrument on its own port.
     *
     * @param identify the identity query, {@code *IDN?} for IEEE 488.2 devices
     */
    record ScpiInstrument(String name, PortSettings port, String identify) {
    }

    /**
     * How long to wait after the frequency is set before reading: at least {@code minMs},
     * and at least {@code periods} periods of the test frequency (a meter needs whole periods
     * of a low-frequency signal; common practice).
     */
    record Settling(int periods, int minMs) {
        public Settling {
            if (periods < 0 || minMs < 0) {
                throw new IllegalArgumentException("settling must be non-negative");
            }
        }

        /** @return the settling time in ms at this frequency */
        public long millisAt(double frequencyHz) {
            return Math.max(minMs, (long) Math.ceil(1000.0 * periods / frequencyHz));
        }
    }

    /**
     * A generator and a meter (or one instrument doing both) driven by SCPI commands.
     *
     * @param instruments  the instruments by name, with port settings and identity query
     * @param setup        commands sent once before the sweep
     * @param step         commands sent for each frequency, in order; settling happens after
     *                     the command that waits for completion, or after the frequency is set
     * @param finish       commands sent once after the sweep (such as turning the output off)
     * @param errorQuery   the error-queue query, {@code SYST:ERR?} (SCPI-99)
     * @param retries      how often a step is repeated after an error answer or a timeout
     * @param amplitude    generator level in the profile's amplitude kind, in volts
     * @param maxAmplitude the highest level the profile allows, in volts of that kind
     */
    record ScpiExchange(List<ScpiInstrument> instruments, List<ScpiCommand> setup, List<ScpiCommand> step,
                        List<ScpiCommand> finish, Settling settle, String errorQuery, int retries, int timeoutMs, double amplitude,
                        double maxAmplitude) implements LineProtocol {
        public ScpiExchange {
            instruments = List.copyOf(instruments);
            setup = List.copyOf(setup);
            step = List.copyOf(step);
            finish = List.copyOf(finish);
            Objects.requireNonNull(settle);
            if (step.stream().noneMatch(c -> c.role() == CommandRole.SETS_FREQUENCY)) {
                throw new IllegalArgumentException("a step needs a command that sets the frequency");
            }
            if (!(amplitude > 0) || amplitude > maxAmplitude) {
                throw new IllegalArgumentException("the amplitude must be positive and at most the maximum");
            }
        }

        @Override
        public <R> R apply(Cases<R> cases) {
            return cases.exchange(this);
        }
    }

    /**
     * An instrument that sweeps by itself and streams one line per point.
     *
     * @param start   the command that starts a sweep; placeholders {@code {start_hz}},
     *                {@code {stop_hz}}, {@code {points}}, {@code {amplitude}}
     * @param point   a line holding one point: named groups {@code frequency}, then
     *                {@code gain} or {@code input} and {@code output}, and optionally {@code phase}
     * @param ignore  lines that are expected and carry nothing (status, prompts)
     * @param error   a line reporting an error; counted and listed in the warnings
     * @param end     the line that ends a sweep
     */
    record StreamedLines(PortSettings port, String identify, String start, String stop, Pattern point,
                         List<Pattern> ignore, Optional<Pattern> error, Optional<Pattern> end, int timeoutMs,
                         double amplitude, double maxAmplitude) implements LineProtocol {
        public StreamedLines {
            ignore = List.copyOf(ignore);
            if (!point.pattern().contains("(?<frequency>")) {
                throw new IllegalArgumentException("the point pattern needs a group named frequency");
            }
        }

        @Override
        public <R> R apply(Cases<R> cases) {
            return cases.stream(this);
        }
    }

    /** How a scope sends one channel's record: ASCII numbers or IEEE 488.2 definite-length blocks. */
    enum WaveformFormat {
        /** Numbers separated by commas on one line. */
        ASCII,
        /** {@code #<n><length><bytes>} (IEEE Std 488.2-1992, 8.7.9), then the line ending. */
        BLOCK;

        /** @return the profile's spelling */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * One query sent to one instrument.
     *
     * @param instrument the instrument it goes to, as named in the profile
     * @param query      the query's text
     */
    record ScopeQuery(String instrument, String query) {
        public ScopeQuery {
            if (query == null || query.isBlank()) {
                throw new IllegalArgumentException("a query needs text");
            }
        }
    }

    /**
     * A generator and a two-channel scope: per frequency the generator is set, then the scope's
     * sample interval and both channels' records are fetched, and each record pair is fitted as
     * it arrives (docs/user-guide.md, "Live scope capture").
     *
     * @param instruments  the instruments by name, with port settings and identity query
     * @param setup        commands sent once before the sweep (the level among them)
     * @param setFrequency the command that sets the generator's frequency ({@code {frequency_nr3}})
     * @param interval     the query answered by the sample interval in seconds
     * @param input        the query answered by the stage input's record (channel 1 as a rule)
     * @param output       the query answered by the stage output's record
     * @param inputScale   a query answered by the input channel's volts per code, read with each
     *                     record (the scope's vertical setting); empty to use {@code coding}'s
     * @param outputScale  the same for the output channel
     * @param format       ASCII numbers or definite-length blocks
     * @param blockCoding  how a block's bytes hold the codes (ignored for ASCII)
     * @param coding       how the numbers (or codes) become volts, and the channel's rails or range
     * @param finish       commands sent once after the sweep
     * @param settle       the wait after the frequency is set
     * @param retries      how often a step is repeated after a timeout or an unreadable record
     * @param amplitude    generator level in the profile's amplitude kind, in volts
     * @param maxAmplitude the highest level the profile allows, in volts of that kind
     */
    record ScopeFetch(List<ScpiInstrument> instruments, List<ScpiCommand> setup, ScpiCommand setFrequency,
                      ScopeQuery interval, ScopeQuery input, ScopeQuery output, Optional<ScopeQuery> inputScale,
                      Optional<ScopeQuery> outputScale, WaveformFormat format,
                      BlockCoding blockCoding, SampleCoding coding,
                      List<ScpiCommand> finish, Settling settle, int retries, int timeoutMs, double amplitude,
                      double maxAmplitude) implements LineProtocol {
        public ScopeFetch {
            instruments = List.copyOf(instruments);
            setup = List.copyOf(setup);
            finish = List.copyOf(finish);
            Objects.requireNonNull(settle);
            Objects.requireNonNull(format);
            Objects.requireNonNull(blockCoding);
            Objects.requireNonNull(coding);
            if (inputScale.isPresent() != outputScale.isPresent()) {
                throw new IllegalArgumentException("scale queries come as a pair");
            }
            if (setFrequency.role() != CommandRole.SETS_FREQUENCY) {
                throw new IllegalArgumentException("the frequency command must set the frequency");
            }
            if (!(amplitude > 0) || amplitude > maxAmplitude) {
                throw new IllegalArgumentException("the amplitude must be positive and at most the maximum");
            }
        }

        @Override
        public <R> R apply(Cases<R> cases) {
            return cases.scope(this);
        }
    }
}

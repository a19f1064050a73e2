package org.polebench.profile;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import com.google.re2j.Pattern;

/** How a serial instrument talks: SCPI command and answer, or a stream of result lines. */
public sealed interface LineProtocol permits LineProtocol.ScpiExchange, LineProtocol.StreamedLines {

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
}

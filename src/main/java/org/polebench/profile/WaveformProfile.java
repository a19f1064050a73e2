package org.polebench.profile;

import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;
import com.google.re2j.Pattern;
import org.polebench.bench.Bench;

/**
 * A profile that reads scope waveform records: one file per test frequency, each holding the
 * stage's input and output sampled against time (docs/user-guide.md, "Scope waveform records").
 * The waveform package fits each record to one gain and phase point; this value only says how
 * the records are laid out.
 *
 * @param layout    how the text of one record is cut into header lines and sample rows
 * @param clock     where the sample times come from: a time column or an interval in the header
 * @param channels  which columns hold the input and output samples
 * @param coding    volts or ADC codes, with the scale and the channel's range
 * @param frequency where a record's test frequency comes from
 * @param signature a regular expression that one of a record's header lines matches, for
 *                  {@code --profile auto}; empty when the profile is only used by name
 */
public record WaveformProfile(String name, String description, WaveformLayout layout, SampleClock clock,
                              WaveformChannels channels, SampleCoding coding, FrequencySource frequency,
                              Optional<Pattern> signature, InstrumentAccuracy accuracy, Optional<Path> source,
                              Optional<Bench> bench) implements InstrumentProfile {
    public WaveformProfile {
        Objects.requireNonNull(name);
        Objects.requireNonNull(description);
        clock.timeColumn().ifPresent(time -> {
            if (time == channels.input() || time == channels.output()) {
                throw new IllegalArgumentException("profile " + name + ": the time column is also a channel");
            }
        });
    }

    /** Gain and phase come out of the fits in polebench's own units: Hz, dB, degrees lead positive. */
    @Override
    public ReadingScale scale() {
        return ReadingScale.canonical();
    }

    /** A record's own checks (clipping, noise, harmonics) replace the table limits. */
    @Override
    public ReadingLimits limits() {
        return ReadingLimits.none();
    }

    @Override
    public Optional<TableProfile> asTable() {
        return Optional.empty();
    }

    @Override
    public Optional<SerialProfile> asSerial() {
        return Optional.empty();
    }

    @Override
    public Optional<WaveformProfile> asWaveform() {
        return Optional.of(this);
    }

    @Override
    public <R> R match(Cases<R> cases) {
        return cases.waveform(this);
    }
}

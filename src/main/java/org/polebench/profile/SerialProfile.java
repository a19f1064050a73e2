package org.polebench.profile;

import java.nio.file.Path;
import java.util.Optional;
import org.polebench.bench.Bench;

/** A profile for an instrument on a serial line: its protocol and how its numbers read. */
public record SerialProfile(String name, String description, LineProtocol protocol, ReadingScale scale,
                            InstrumentAccuracy accuracy, ReadingLimits limits, Optional<Path> source,
                            Optional<Bench> bench)
        implements InstrumentProfile {
    /** A profile without a {@code bench:} section. */
    public SerialProfile(String name, String description, LineProtocol protocol, ReadingScale scale,
                         InstrumentAccuracy accuracy, ReadingLimits limits, Optional<Path> source) {
        this(name, description, protocol, scale, accuracy, limits, source, Optional.empty());
    }

    @Override
    public Optional<TableProfile> asTable() {
        return Optional.empty();
    }

    @Override
    public Optional<SerialProfile> asSerial() {
        return Optional.of(this);
    }

    @Override
    public Optional<WaveformProfile> asWaveform() {
        return Optional.empty();
    }

    @Override
    public <R> R match(Cases<R> cases) {
        return cases.serial(this);
    }
}

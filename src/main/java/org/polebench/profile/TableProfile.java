package org.polebench.profile;

import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;
import org.polebench.bench.Bench;

/** A profile that maps a delimited text table onto a sweep. */
public record TableProfile(String name, String description, TableLayout layout, TableColumns columns,
                           ReadingScale scale, InstrumentAccuracy accuracy, ReadingLimits limits,
                           Optional<Path> source, Optional<Bench> bench) implements InstrumentProfile {
    /** A profile without a {@code bench:} section. */
    public TableProfile(String name, String description, TableLayout layout, TableColumns columns,
                        ReadingScale scale, InstrumentAccuracy accuracy, ReadingLimits limits, Optional<Path> source) {
        this(name, description, layout, columns, scale, accuracy, limits, source, Optional.empty());
    }

    public TableProfile {
        Objects.requireNonNull(name);
        Objects.requireNonNull(description);
        if ((scale.gainForm() == GainForm.AMPLITUDES) != columns.inputAmplitude().isPresent()) {
            throw new IllegalArgumentException("profile " + name + ": the gain form and the columns disagree");
        }
        if (!layout.header() && anyByName(columns)) {
            throw new IllegalArgumentException("profile " + name + ": without a header, columns must be numbered");
        }
    }

    @Override
    public Optional<TableProfile> asTable() {
        return Optional.of(this);
    }

    @Override
    public Optional<SerialProfile> asSerial() {
        return Optional.empty();
    }

    @Override
    public Optional<WaveformProfile> asWaveform() {
        return Optional.empty();
    }

    @Override
    public <R> R match(Cases<R> cases) {
        return cases.table(this);
    }

    private static boolean anyByName(TableColumns c) {
        return !c.frequency().byNumber()
                || c.gain().map(r -> !r.byNumber()).orElse(false)
                || c.inputAmplitude().map(r -> !r.byNumber()).orElse(false)
                || c.outputAmplitude().map(r -> !r.byNumber()).orElse(false)
                || c.phase().map(r -> !r.byNumber()).orElse(false)
                || c.gainUncertainty().map(r -> !r.byNumber()).orElse(false)
                || c.phaseUncertainty().map(r -> !r.byNumber()).orElse(false);
    }
}

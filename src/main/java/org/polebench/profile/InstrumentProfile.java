package org.polebench.profile;

import java.nio.file.Path;
import java.util.Optional;
import org.polebench.bench.Bench;

/**
 * How to read one kind of instrument's output: a table layout, a serial line protocol or the
 * layout of scope waveform records.
 * Profiles live in {@code instrument-profiles/*.yaml} (this project's own format, see
 * docs/user-guide.md, "Instrument profiles") and are read by {@link ProfileReader}. Code that
 * treats the kinds differently calls {@link #match} with a {@link Cases}, or asks for one kind
 * with {@link #asTable()}, {@link #asSerial()} or {@link #asWaveform()}, never {@code instanceof}: a new kind of
 * profile then fails to compile until every such place handles it.
 */
public sealed interface InstrumentProfile permits TableProfile, SerialProfile, WaveformProfile {
    /** @return the profile's name, used with {@code --profile} */
    String name();

    /** @return one line saying what layout or protocol it reads */
    String description();

    /** @return the YAML file it was read from; empty for profiles made in code */
    Optional<Path> source();

    /** @return how raw readings become Hz, dB and degrees */
    ReadingScale scale();

    InstrumentAccuracy accuracy();

    ReadingLimits limits();

    /**
     * @return the profile's {@code bench:} section: how this instrument is always used, the
     *         default when no {@code --bench} file is given; empty when the profile has none
     */
    Optional<Bench> bench();

    /** @return this profile when it reads table files, empty for another kind */
    Optional<TableProfile> asTable();

    /** @return this profile when it talks to a serial instrument, empty for another kind */
    Optional<SerialProfile> asSerial();

    /** @return this profile when it reads scope waveform records, empty for another kind */
    Optional<WaveformProfile> asWaveform();

    /** @return what {@code cases} gives for this profile's kind */
    <R> R match(Cases<R> cases);

    /**
     * One method per kind of profile, for code that treats them differently: adding a kind
     * adds a method here, and every implementation fails to compile until it handles it.
     */
    interface Cases<R> {
        R table(TableProfile table);

        R serial(SerialProfile serial);

        R waveform(WaveformProfile waveform);
    }
}

package org.polebench.sweep;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * Where a sweep came from, for traceability in reports.
 *
 * @param sourceFile  the file it was read from; empty for a live capture not yet saved
 * @param sha256      hex SHA-256 of that file's bytes; empty when there is no file
 * @param instrument  the instrument's identity (an {@code *IDN?} answer or the file's own words);
 *                    empty when unknown
 * @param profile     the profile name used to read it, or {@code "canonical"}
 * @param captured    when it was measured, when known
 * @param board       the board or serial number, when known
 * @param notes       free text lines: the stage, the operator, how it was synthesized, …
 */
public record Provenance(Optional<Path> sourceFile, String sha256, String instrument, String profile,
                         Optional<Instant> captured, Optional<String> board, List<String> notes) {
    public Provenance {
        notes = List.copyOf(notes);
        sha256 = sha256 == null ? "" : sha256;
        instrument = instrument == null ? "" : instrument;
        profile = profile == null ? "" : profile;
    }

    /** Provenance for data made in memory, as in tests and synthesis. */
    public static Provenance inMemory(String description) {
        return new Provenance(Optional.empty(), "", "", "in-memory", Optional.empty(), Optional.empty(),
                List.of(description));
    }
}

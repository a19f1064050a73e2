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
        notes = notes.stream().map(Provenance::printable).toList();
        sha256 = sha256 == null ? "" : sha256;
        instrument = instrument == null ? "" : printable(instrument);
        profile = profile == null ? "" : profile;
        board = board.map(Provenance::printable);
    }

    /**
     * @return the text with every control character (C0, DEL and C1: ESC, BEL, a carriage return
     *         …) written as a visible escape such as {@code \x1b}: an instrument's identity or a
     *         file's comment goes into sweep file headers, reports and the terminal, where a raw
     *         ESC would be read as a terminal command (issue 15)
     */
    public static String printable(String text) {
        StringBuilder out = null;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            boolean control = c < 0x20 || (c >= 0x7f && c <= 0x9f);
            if (control && out == null) {
                out = new StringBuilder(text.length() + 8).append(text, 0, i);
            }
            if (out != null) {
                if (control) {
                    out.append(String.format(java.util.Locale.ROOT, "\\x%02x", (int) c));
                } else {
                    out.append(c);
                }
            }
        }
        return out == null ? text : out.toString();
    }

    /** Provenance for data made in memory, as in tests and synthesis. */
    public static Provenance inMemory(String description) {
        return new Provenance(Optional.empty(), "", "", "in-memory", Optional.empty(), Optional.empty(),
                List.of(description));
    }
}

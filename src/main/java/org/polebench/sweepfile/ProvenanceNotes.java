package org.polebench.sweepfile;

import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.polebench.sweep.Provenance;

/**
 * Gathers provenance from a file's {@code # key: value} comment lines, the canonical sweep's
 * own keys (see {@link SweepWriter}): {@code instrument}, {@code date} (ISO-8601 with an
 * offset), {@code board}, {@code profile}, {@code note}; any other key is kept as a note
 * "key: value", and comment text without a key as a note of its own.
 */
final class ProvenanceNotes {
    /** Keys the writer itself produces and the reader does not keep as notes. */
    private static final List<String> FORMAT_KEYS = List.of("units", "columns", "polebench sweep");
    private static final int MAX_NOTES = 200;

    private String instrument = "";
    private String profile = "";
    private Instant captured;
    private String board;
    private final List<String> notes = new ArrayList<>();

    /** @param text the comment without its prefix */
    void accept(long line, String text, WarningTally tally) {
        String body = text.strip();
        if (body.isEmpty()) {
            return;
        }
        int colon = body.indexOf(':');
        String key = colon > 0 ? body.substring(0, colon).strip().toLowerCase(Locale.ROOT) : "";
        String value = colon > 0 ? body.substring(colon + 1).strip() : body;
        if (colon <= 0 || key.contains(" ") && !FORMAT_KEYS.contains(key)) {
            if (!FORMAT_KEYS.contains(body.toLowerCase(Locale.ROOT))) {
                note(body);
            }
            return;
        }
        switch (key) {
            case "instrument":
                instrument = value;
                break;
            case "profile":
                profile = value;
                break;
            case "board":
                board = value;
                break;
            case "note":
                note(value);
                break;
            case "date":
                try {
                    captured = OffsetDateTime.parse(value).toInstant();
                } catch (DateTimeParseException e) {
                    tally.add("unreadable dates", line, "date '" + value + "' is not ISO-8601 with an offset "
                            + "(such as 2031-04-02T14:05:00Z); kept as a note");
                    note("date: " + value);
                }
                break;
            default:
                if (!FORMAT_KEYS.contains(key)) {
                    note(key + ": " + value);
                }
        }
    }

    void note(String text) {
        if (notes.size() < MAX_NOTES && !notes.contains(text)) {
            notes.add(text);
        }
    }

    /** @return the instrument named in the comments, or the empty text */
    String instrument() {
        return instrument;
    }

    void instrument(String identity) {
        instrument = identity;
    }

    void captured(Instant when) {
        if (captured == null) {
            captured = when;
        }
    }

    /**
     * @param file         the file read
     * @param sha256       its hash
     * @param readWith     the profile that read it, used when the comments name none
     */
    Provenance provenance(Path file, String sha256, String readWith) {
        return new Provenance(Optional.ofNullable(file), sha256, instrument, profile.isEmpty() ? readWith : profile,
                Optional.ofNullable(captured), Optional.ofNullable(board), notes);
    }
}

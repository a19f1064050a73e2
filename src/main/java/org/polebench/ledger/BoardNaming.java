package org.polebench.ledger;

import java.nio.file.Path;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A board's id in a batch: a {@code --board-pattern} match in the file's name when one is
 * given and matches; else the sweep's own ({@code # board:} in its provenance); else the file's
 * name without its endings ({@code board-17.sweep.csv} is board {@code board-17}).
 */
final class BoardNaming {
    private final Optional<Pattern> pattern;

    BoardNaming(Optional<Pattern> pattern) {
        this.pattern = pattern;
    }

    /** @param ownId the board the sweep names, if it names one and could be read */
    String of(Path sweepFile, Optional<String> ownId) {
        String name = sweepFile.getFileName().toString();
        if (pattern.isPresent()) {
            Matcher match = pattern.get().matcher(name);
            if (match.find()) {
                String id = match.groupCount() >= 1 && match.group(1) != null ? match.group(1) : match.group();
                if (!id.isBlank()) {
                    return id;
                }
            }
        }
        if (ownId.isPresent() && !ownId.get().isBlank()) {
            return ownId.get().strip();
        }
        return fromFileName(name);
    }

    static String fromFileName(String name) {
        String id = name;
        int dot = id.lastIndexOf('.');
        if (dot > 0) {
            id = id.substring(0, dot);
        }
        if (id.endsWith(".sweep")) {
            id = id.substring(0, id.length() - ".sweep".length());
        }
        return id;
    }
}

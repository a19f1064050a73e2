package org.polebench.sweepfile;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.InputWarning;

/**
 * Collects an import's warnings by kind. The first {@link #LISTED_PER_KIND} of each kind are
 * kept with their line; the rest are counted and summed up in one closing warning, so that a
 * million bad rows cost a counter, not a million messages.
 */
final class WarningTally {
    static final int LISTED_PER_KIND = 25;

    private final Path file;
    private final Map<String, long[]> counts = new LinkedHashMap<>();
    private final List<InputWarning> listed = new ArrayList<>();

    /** @param file named in every warning; null for a live port */
    WarningTally(Path file) {
        this.file = file;
    }

    /**
     * @param kind    a short plural noun for the summary line, such as "non-numeric cells"
     * @param line    1-based line, 0 when no single line is concerned
     */
    void add(String kind, long line, String message) {
        long[] count = counts.computeIfAbsent(kind, k -> new long[1]);
        count[0]++;
        if (count[0] <= LISTED_PER_KIND) {
            listed.add(new InputWarning(file, line, message));
        }
    }

    /** @return how many warnings of this kind were raised */
    long count(String kind) {
        long[] count = counts.get(kind);
        return count == null ? 0 : count[0];
    }

    /** @return the listed warnings, then one summary for each kind with more than were listed */
    List<InputWarning> warnings() {
        List<InputWarning> all = new ArrayList<>(listed);
        for (Map.Entry<String, long[]> entry : counts.entrySet()) {
            long total = entry.getValue()[0];
            if (total > LISTED_PER_KIND) {
                all.add(new InputWarning(file, 0, total + " " + entry.getKey() + " in all; the first "
                        + LISTED_PER_KIND + " are listed above"));
            }
        }
        return all;
    }
}

package org.polebench.circuit;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Finds the word a user most likely meant, by Levenshtein edit distance (V. I. Levenshtein,
 * Soviet Physics Doklady 10(8), 1966): insertions, deletions and substitutions each cost one.
 * Used for stage-file keys and nodes, and for the part designators of command-line faults.
 */
public final class Spelling {
    private Spelling() {
    }

    /**
     * @return the closest candidate within a distance of max(1, length/3) (at most 3), so that
     *         {@code tolerence} suggests {@code tolerance} but {@code foo} suggests nothing; ties go
     *         to the first candidate
     */
    public static Optional<String> closest(String word, Collection<String> candidates) {
        return closestAll(word, candidates).stream().findFirst();
    }

    /** @return " Did you mean 'x'?" (with a leading space, to follow a sentence) or an empty text */
    public static String didYouMean(String word, Collection<String> candidates) {
        return closest(word, candidates).map(s -> " Did you mean '" + s + "'?").orElse("");
    }

    /**
     * @return every candidate at the smallest distance, within a distance of max(1, length/3) (at
     *         most 3), in the candidates' order: {@code RE1} suggests both {@code R1} and {@code RE}
     */
    public static List<String> closestAll(String word, Collection<String> candidates) {
        List<String> best = new ArrayList<>();
        int bestDistance = Math.min(3, Math.max(1, word.length() / 3));
        String lowered = word.toLowerCase(Locale.ROOT);
        for (String candidate : candidates) {
            if (candidate.equals(word)) {
                continue;
            }
            int distance = distance(lowered, candidate.toLowerCase(Locale.ROOT));
            if (distance < bestDistance) {
                best.clear();
                bestDistance = distance;
            }
            if (distance == bestDistance) {
                best.add(candidate);
            }
        }
        return best;
    }

    /** @return the Levenshtein distance of a and b, case-sensitive */
    static int distance(String a, String b) {
        int[] previous = new int[b.length() + 1];
        int[] current = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            previous[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            current[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int substitution = previous[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                current[j] = Math.min(substitution, Math.min(previous[j] + 1, current[j - 1] + 1));
            }
            int[] swap = previous;
            previous = current;
            current = swap;
        }
        return previous[b.length()];
    }
}

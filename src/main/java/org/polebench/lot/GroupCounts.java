package org.polebench.lot;

/**
 * The outcome counts of the boards that share one station or one day.
 *
 * @param key    the station's name ("" when none was given) or the UTC date, as yyyy-mm-dd
 * @param counts their outcomes
 */
public record GroupCounts(String key, OutcomeCounts counts) {
}

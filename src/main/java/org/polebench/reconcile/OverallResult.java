package org.polebench.reconcile;

import java.util.Locale;

/**
 * The overall result of a verdict (issue 11): {@code FAIL} when any decided check fails;
 * otherwise {@code INCOMPLETE} when any limit is not decided (or the stage names none);
 * {@code PASS} only when every limit was decided from the sweep and passed.
 */
public enum OverallResult {
    PASS,
    FAIL,
    INCOMPLETE;

    /** @return "pass", "fail" or "incomplete", as JSON writes it */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}

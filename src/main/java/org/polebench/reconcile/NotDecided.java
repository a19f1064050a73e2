package org.polebench.reconcile;

import java.util.Locale;

/**
 * Why a limit is not decided from this sweep (issue 11, "Verdicts only from what the sweep
 * shows"; docs/method.md, "The verdict"). A limit is decided only from a quantity the sweep
 * itself determines; every other check is "not decided", never passed, and makes the overall
 * result {@link OverallResult#INCOMPLETE} unless a decided check fails.
 */
public enum NotDecided {
    /**
     * The rational fit does not describe the sweep (χ²/ν above
     * {@link Reconciler#FIT_ADEQUATE_CHI_SQUARE}): whatever value is shown comes from the
     * back-solved stage model or from a fit that misses the data, not from the sweep.
     */
    FIT_DOES_NOT_DESCRIBE_SWEEP,
    /**
     * The fit describes the sweep but quotes no value for the quantity (the sweep shows no −3 dB
     * point of its own); the value shown is the back-solved stage model's alone.
     */
    FROM_MODEL_ONLY,
    /**
     * The quantity lies outside the swept band: a lower corner at or below the lowest fitted
     * point, or an upper corner above the highest (or an upper rolloff the sweep never shows).
     */
    OUTSIDE_SWEPT_BAND,
    /**
     * No fitted point lies on the midband plateau: none at least
     * {@link SweepDetermination#MIDBAND_CLEARANCE} times above the lower corner (and that far below
     * a fitted upper corner), so the midband gain is the model's extrapolation.
     */
    MIDBAND_NOT_REACHED;

    /** @return the reason as JSON writes it, lower case with underscores ("outside_swept_band") */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}

package org.polebench.fit;

/** How far a reported pole or zero can be trusted as a number. */
public enum RootStatus {
    /** Estimated from the data, with its uncertainty. */
    FITTED,
    /** Fixed by the model's structure (a zero at DC): exact by assumption, uncertainty zero. */
    STRUCTURAL,
    /**
     * More than a decade outside the swept band (below its lowest frequency, or above its highest
     * for the high-band pole): the data barely touch it, so it must not be quoted as a number.
     */
    UNIDENTIFIABLE
}

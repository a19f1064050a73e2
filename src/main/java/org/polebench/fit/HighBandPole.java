package org.polebench.fit;

/** Whether the model may carry one pole of the upper rolloff, above the low band. */
public enum HighBandPole {
    /** Offer it to the order selection only when the top of the sweep falls away from midband. */
    DETECT,
    /** Never: the sweep is taken to stop below the upper rolloff. */
    NEVER,
    /** Always: the sweep is known to reach the upper rolloff. */
    ALWAYS
}

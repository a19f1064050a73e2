package org.polebench.reconcile;

import java.util.List;

/**
 * The verdict and the limits that could not be checked from this sweep (an upper-corner limit
 * when the sweep stops below the upper rolloff): those are named, never counted as passed.
 *
 * @param verdict    every check that could be made, under the stated rule
 * @param notChecked one sentence per limit left unchecked
 */
public record Conformity(Verdict verdict, List<String> notChecked) {
    public Conformity {
        notChecked = List.copyOf(notChecked);
    }
}

package org.polebench.reconcile;

import java.util.List;

/**
 * The overall result against the stage's limits (issue 11; docs/method.md, "The verdict"):
 * {@link OverallResult#FAIL} when any decided check fails; otherwise
 * {@link OverallResult#INCOMPLETE} when any limit is not decided from the sweep, or when the
 * stage names no limits (nothing was shown to pass); {@link OverallResult#PASS} only when every
 * limit was decided from the sweep and every one passed under the stated rule.
 *
 * @param rule       the decision rule of every decided check
 * @param checks     the limits decided from quantities the sweep determines
 * @param notDecided the limits the sweep does not decide, each with its reason
 */
public record Verdict(DecisionRule rule, List<LimitCheck> checks, List<NotDecidedCheck> notDecided) {
    public Verdict {
        checks = List.copyOf(checks);
        notDecided = List.copyOf(notDecided);
    }

    /** @return true only when the overall result is {@link OverallResult#PASS} */
    public boolean passed() {
        return overall() == OverallResult.PASS;
    }

    /** @return true when the stage named no limits to check against */
    public boolean nothingToCheck() {
        return checks.isEmpty() && notDecided.isEmpty();
    }

    public OverallResult overall() {
        if (checks.stream().anyMatch(check -> !check.pass())) {
            return OverallResult.FAIL;
        }
        if (nothingToCheck() || !notDecided.isEmpty()) {
            return OverallResult.INCOMPLETE;
        }
        return OverallResult.PASS;
    }
}

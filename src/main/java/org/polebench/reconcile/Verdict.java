package org.polebench.reconcile;

import java.util.List;

/**
 * The overall result against the stage's limits: pass only when every check passes under the
 * stated rule. With no limits in the stage there are no checks, and the verdict says so rather
 * than claiming a pass.
 */
public record Verdict(DecisionRule rule, List<LimitCheck> checks) {
    public Verdict {
        checks = List.copyOf(checks);
    }

    /** @return true when there are checks and every one passed */
    public boolean passed() {
        return !checks.isEmpty() && checks.stream().allMatch(LimitCheck::pass);
    }

    /** @return true when the stage named no limits to check against */
    public boolean nothingToCheck() {
        return checks.isEmpty();
    }

    /** @return "pass", "fail", or "no limits" */
    public String overall() {
        if (checks.isEmpty()) {
            return "no limits";
        }
        return passed() ? "pass" : "fail";
    }
}

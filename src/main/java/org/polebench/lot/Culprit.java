package org.polebench.lot;

/**
 * One bar of the Pareto of culprits: a most probable hypothesis and how many failed or
 * unexplained boards it names.
 *
 * @param name       the hypothesis in words, as the board's result gives it (a part, "Q1 bias
 *                   current", "flat gain error", "C2 and RE1", …)
 * @param boards     how many boards it names
 * @param cumulative the fraction of all such boards named by this bar and those before it, 0 to 1
 */
public record Culprit(String name, int boards, double cumulative) {
}

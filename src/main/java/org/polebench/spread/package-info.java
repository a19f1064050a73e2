/**
 * The Monte Carlo over the parts' tolerances (docs/method.md, "Tolerance spread"): boards drawn
 * within the stage's tolerance bands, the spread of their exact lower corners
 * ({@link org.polebench.spread.ToleranceSpread}, {@link org.polebench.spread.CornerSpread}) and
 * of their responses ({@link org.polebench.spread.ResponseSpread}), one board drawn alone for
 * invented lots ({@link org.polebench.spread.BoardDraw}), and
 * {@link org.polebench.spread.StageAnalysis}, a whole stage's prediction with its spread.
 * Uses units, circuit and analysis; knows nothing of sweeps, fits or reports.
 */
package org.polebench.spread;

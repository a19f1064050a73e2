package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;

/**
 * Chooses the model order by the Bayesian information criterion, BIC = χ²/s² + k·ln N
 * (Schwarz, Annals of Statistics 6(2), 1978), with N real residuals and k parameters. BIC rather
 * than AIC or AICc because it is consistent (it picks the true order with probability → 1 as the
 * sweep grows, where AIC keeps a fixed chance of one pole too many) and because its heavier
 * penalty suits "never report what the data cannot support". χ² uses the points' uncertainties;
 * when they understate the scatter, s² = the smallest χ²/ν among eligible candidates (the
 * best-fitting model's residual variance, much as Mallows' Cp takes σ² from the fullest model)
 * keeps a misstated σ from buying extra poles; s² is never below 1.
 * A candidate whose information matrix is singular (more parameters than the data determine) is
 * not eligible.
 */
final class OrderSelection {

    /** The selection outcome: the chosen fit and every candidate's score. */
    static final class Outcome {
        final RefinedFit chosen;
        final List<CandidateScore> scores;

        Outcome(RefinedFit chosen, List<CandidateScore> scores) {
            this.chosen = chosen;
            this.scores = scores;
        }
    }

    /**
     * @param fits candidates in the order tried; null entries for those that did not converge
     * @param tried the structure each entry was meant to have (for the score list)
     * @return the outcome; its chosen fit is null when no candidate was eligible
     */
    Outcome choose(List<RefinedFit> fits, List<ModelStructure> tried) {
        double scale = Double.POSITIVE_INFINITY;
        for (RefinedFit fit : fits) {
            if (eligible(fit)) {
                scale = Math.min(scale, fit.chiSquare / fit.degreesOfFreedom());
            }
        }
        scale = Double.isInfinite(scale) ? 1 : Math.max(1, scale);
        // a model whose midband gain the data do not determine (a pole and a zero far above the
        // band trade against |K|) is no measurement of it: when any candidate determines it, only
        // those compete (issue 14)
        boolean anyDetermined = false;
        for (RefinedFit fit : fits) {
            anyDetermined |= eligible(fit) && determinesMidband(fit);
        }
        double[] bic = new double[fits.size()];
        int best = -1;
        for (int i = 0; i < fits.size(); i++) {
            RefinedFit fit = fits.get(i);
            bic[i] = eligible(fit) && (!anyDetermined || determinesMidband(fit))
                    ? fit.chiSquare / scale + fit.parameters.length * Math.log(fit.residuals)
                    : Double.NaN;
            if (!Double.isNaN(bic[i]) && (best < 0 || bic[i] < bic[best])) {
                best = i;
            }
        }
        List<CandidateScore> scores = new ArrayList<>();
        for (int i = 0; i < fits.size(); i++) {
            RefinedFit fit = fits.get(i);
            ModelStructure structure = fit == null ? tried.get(i) : fit.structure();
            scores.add(new CandidateScore(structure, structure.parameterCount(),
                    fit == null ? Double.NaN : fit.chiSquare, bic[i], i == best));
        }
        return new Outcome(best < 0 ? null : fits.get(best), scores);
    }

    /**
     * The standard uncertainty of ln|K| above which a candidate does not determine the midband
     * gain: 1 Np (8.7 dB), where a determined midband has thousandths of a neper and an
     * undetermined one (a free pole–zero pair above the band) whole nepers.
     */
    static final double UNDETERMINED_MIDBAND_NEPERS = 1;

    // u(ln|K|) from the inverse information, scaled by the fit's own χ²/ν when above 1 (Birge)
    private static boolean determinesMidband(RefinedFit fit) {
        double variance = fit.inverseInformation[0][0] * Math.max(1, fit.chiSquare / fit.degreesOfFreedom());
        return Math.sqrt(variance) <= UNDETERMINED_MIDBAND_NEPERS;
    }

    private static boolean eligible(RefinedFit fit) {
        return fit != null && fit.inverseInformation != null && fit.degreesOfFreedom() >= 1;
    }
}

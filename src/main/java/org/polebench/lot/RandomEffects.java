package org.polebench.lot;

import java.util.List;

/**
 * The DerSimonian–Laird random-effects estimate (DerSimonian and Laird, "Meta-analysis in
 * clinical trials", Controlled Clinical Trials 7, 1986): readings yᵢ with standard uncertainties
 * uᵢ of true values drawn from N(μ, τ²). With wᵢ = 1/uᵢ² and the fixed-effect mean
 * ȳ = Σwᵢyᵢ/Σwᵢ, Cochran's Q = Σwᵢ(yᵢ − ȳ)², the method-of-moments
 * τ̂² = max(0, (Q − (k − 1))/(Σwᵢ − Σwᵢ²/Σwᵢ)), and with wᵢ* = 1/(uᵢ² + τ̂²):
 * μ̂ = Σwᵢ*yᵢ/Σwᵢ*, u(μ̂) = 1/√Σwᵢ*. A board here is a study there: its back-solved ln-factor is
 * its reading, and the spread of true values from board to board is the parts' real spread.
 */
final class RandomEffects {
    private RandomEffects() {
    }

    /**
     * @param readings    yᵢ, at least one
     * @param uncertainty uᵢ, positive, one per reading
     */
    static PooledEstimate pool(List<Double> readings, List<Double> uncertainty) {
        int k = readings.size();
        if (k == 0 || uncertainty.size() != k) {
            throw new IllegalArgumentException("pooling needs readings with one uncertainty each");
        }
        double sumW = 0;
        double sumW2 = 0;
        double sumWy = 0;
        for (int i = 0; i < k; i++) {
            double u = uncertainty.get(i);
            if (!(u > 0)) {
                throw new IllegalArgumentException("a reading's uncertainty is positive, was " + u);
            }
            double w = 1 / (u * u);
            sumW += w;
            sumW2 += w * w;
            sumWy += w * readings.get(i);
        }
        double fixed = sumWy / sumW;
        double q = 0;
        for (int i = 0; i < k; i++) {
            double d = readings.get(i) - fixed;
            q += d * d / (uncertainty.get(i) * uncertainty.get(i));
        }
        double denominator = sumW - sumW2 / sumW;
        double tau2 = k > 1 && denominator > 0 ? Math.max(0, (q - (k - 1)) / denominator) : 0;
        double sumStar = 0;
        double sumStarY = 0;
        for (int i = 0; i < k; i++) {
            double u = uncertainty.get(i);
            double w = 1 / (u * u + tau2);
            sumStar += w;
            sumStarY += w * readings.get(i);
        }
        return new PooledEstimate(sumStarY / sumStar, 1 / Math.sqrt(sumStar), Math.sqrt(tau2), q, k);
    }
}

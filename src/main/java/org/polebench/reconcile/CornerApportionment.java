package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import org.polebench.analysis.CapacitorSensitivity;
import org.polebench.analysis.Prediction;

/**
 * First-order apportionment of the lower corner's error among the capacitors: the MAP of the
 * linearised problem ln(f_m/f_p) = Σ s_i·φ_i + ε, with s_i = ∂ln f_L/∂ln C_i of the exact
 * corner, φ_i ~ N(μ_i, σ_i²) from each part's tolerance prior and ε ~ N(0, u²) from the
 * measured corner's uncertainty. For one linear observation with Gaussian priors the MAP is
 * φ = μ + Σs·(y − sᵀμ)/(sᵀΣs + u²) (the Gaussian conditioning formula, e.g. Bishop, Pattern
 * Recognition and Machine Learning, 2006, 2.3.3): each part takes a share in proportion to
 * its sensitivity times its tolerance variance. Stateless.
 */
public final class CornerApportionment {

    /**
     * @param prediction     the nominal stage's prediction (its exact corner and sensitivities)
     * @param capacitors     the capacitor parameters in port order, with their tolerance priors
     * @param measuredHz     the measured lower corner, positive
     * @param uMeasuredHz    its standard uncertainty, at least 0
     * @throws IllegalArgumentException when the prediction has no exact corner or the lists differ
     */
    public Apportionment apportion(Prediction prediction, List<ModelParameter> capacitors, double measuredHz,
                                   double uMeasuredHz) {
        if (prediction.exactLowerCornerHz().isEmpty()) {
            throw new IllegalArgumentException("an apportionment needs a predicted exact corner");
        }
        List<CapacitorSensitivity> sensitivities = prediction.capacitorSensitivities();
        if (sensitivities.size() != capacitors.size()) {
            throw new IllegalArgumentException("one capacitor parameter per low-band capacitor");
        }
        double y = Math.log(measuredHz / prediction.exactLowerCornerHz().getAsDouble());
        double u = uMeasuredHz / measuredHz;
        int k = capacitors.size();
        double[] s = new double[k];
        double predictedShift = 0;
        double variance = u * u;
        for (int i = 0; i < k; i++) {
            s[i] = sensitivities.get(i).exactCornerPerLnC().orElse(0);
            Prior prior = capacitors.get(i).tolerancePrior();
            predictedShift += s[i] * prior.mean();
            variance += s[i] * s[i] * prior.standardDeviation() * prior.standardDeviation();
        }
        double innovation = variance > 0 ? (y - predictedShift) / variance : 0;
        double[] contribution = new double[k];
        double total = 0;
        double[] phi = new double[k];
        for (int i = 0; i < k; i++) {
            Prior prior = capacitors.get(i).tolerancePrior();
            phi[i] = prior.mean() + prior.standardDeviation() * prior.standardDeviation() * s[i] * innovation;
            contribution[i] = s[i] * phi[i];
            total += contribution[i];
        }
        List<CapacitorShare> shares = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            ModelParameter parameter = capacitors.get(i);
            shares.add(new CapacitorShare(parameter.label(), s[i], phi[i], parameter.valueOf(phi[i]), contribution[i],
                    total == 0 ? Double.NaN : contribution[i] / total));
        }
        return new Apportionment(y, u, shares);
    }
}

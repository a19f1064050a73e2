package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.analysis.CornerFinder;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;

/**
 * First-order apportionment of the lower corner's error among the capacitors: the MAP of the
 * linearised problem ln f_m = ln f(μ) + Σ s_i·(φ_i − μ_i) + ε, linearised about the board the
 * tolerance priors expect (every capacitor at C_nom·e^μ_i: an aluminium electrolytic's
 * −20 %/+80 % band is centred 18 % above nominal), with s_i = ∂ln f_L/∂ln C_i of the exact corner
 * there, φ_i ~ N(μ_i, σ_i²) and ε ~ N(0, u²) from the measured corner's uncertainty. For one
 * linear observation with Gaussian priors the MAP is φ = μ + Σs·(y − ln f(μ))/(sᵀΣs + u²) (the
 * Gaussian conditioning formula, e.g. Bishop, Pattern Recognition and Machine Learning, 2006,
 * 2.3.3): each part takes a share in proportion to its sensitivity times its tolerance variance.
 * Contributions are s_i·(φ_i − μ_i) plus each part's first-order share s_i·μ_i of the expected
 * board's own offset ln(f(μ)/f_nom); they add up to ln(f_m/f_nom) but for the shrinkage
 * u²/(sᵀΣs + u²). Stateless.
 */
public final class CornerApportionment {
    private final PortReduction reduction = new PortReduction();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final CornerFinder corners = new CornerFinder();

    /**
     * @param stage          the stage as designed
     * @param points         its operating points
     * @param prediction     the nominal stage's prediction (its exact corner)
     * @param capacitors     the capacitor parameters in port order, with their tolerance priors
     * @param measuredHz     the measured lower corner, positive
     * @param uMeasuredHz    its standard uncertainty, at least 0
     * @return the apportionment; empty when the stage at its prior means has no lower corner
     * @throws IllegalArgumentException when the prediction has no exact corner or the lists differ
     */
    public Optional<Apportionment> apportion(Stage stage, OperatingPoints points, Prediction prediction,
                                             List<ModelParameter> capacitors, double measuredHz, double uMeasuredHz) {
        if (prediction.exactLowerCornerHz().isEmpty()) {
            throw new IllegalArgumentException("an apportionment needs a predicted exact corner");
        }
        if (prediction.lowBand().order() != capacitors.size()) {
            throw new IllegalArgumentException("one capacitor parameter per low-band capacitor");
        }
        int k = capacitors.size();
        Stage expected = stage;
        for (ModelParameter capacitor : capacitors) {
            expected = expected.withCapacitance(capacitor.label(), capacitor.valueOf(capacitor.tolerancePrior().mean()));
        }
        Reduction low = reduction.reduce(expansion.expand(expected, points), Band.LOW);
        if (low.stateModel().isEmpty()) {
            return Optional.empty();
        }
        StateModel model = low.stateModel().get();
        OptionalDouble cornerRadPerS = corners.lowerCornerRadPerS(model);
        if (cornerRadPerS.isEmpty()) {
            return Optional.empty();
        }
        double[] s = corners.cornerSensitivities(model, cornerRadPerS.getAsDouble());
        double y = Math.log(measuredHz / prediction.exactLowerCornerHz().getAsDouble());
        double innovation = Math.log(2 * Math.PI * measuredHz / cornerRadPerS.getAsDouble());
        double u = uMeasuredHz / measuredHz;
        double variance = u * u;
        for (int i = 0; i < k; i++) {
            double sigma = capacitors.get(i).tolerancePrior().standardDeviation();
            variance += s[i] * s[i] * sigma * sigma;
        }
        double gain = variance > 0 ? innovation / variance : 0;
        // the expected board's own offset ln(f(μ)/f_nom) is shared as its first-order terms s_i·μ_i
        double offset = Math.log(cornerRadPerS.getAsDouble() / (2 * Math.PI * prediction.exactLowerCornerHz().getAsDouble()));
        double firstOrderOffset = 0;
        for (int i = 0; i < k; i++) {
            firstOrderOffset += s[i] * capacitors.get(i).tolerancePrior().mean();
        }
        double[] contribution = new double[k];
        double[] phi = new double[k];
        double total = 0;
        for (int i = 0; i < k; i++) {
            Prior prior = capacitors.get(i).tolerancePrior();
            phi[i] = prior.mean() + prior.standardDeviation() * prior.standardDeviation() * s[i] * gain;
            double offsetShare = firstOrderOffset == 0 ? 0 : s[i] * prior.mean() * offset / firstOrderOffset;
            contribution[i] = s[i] * (phi[i] - prior.mean()) + offsetShare;
            total += contribution[i];
        }
        List<CapacitorShare> shares = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            ModelParameter parameter = capacitors.get(i);
            shares.add(new CapacitorShare(parameter.label(), s[i], phi[i], parameter.valueOf(phi[i]), contribution[i],
                    total == 0 ? Double.NaN : contribution[i] / total));
        }
        return Optional.of(new Apportionment(y, u, shares));
    }
}

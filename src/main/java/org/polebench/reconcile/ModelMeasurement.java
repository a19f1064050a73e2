package org.polebench.reconcile;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.analysis.CornerFinder;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.fit.Estimate;
import org.polebench.units.Decibels;

/**
 * The midband gain and the lower corner of the board as the back-solve sees it: the stage's
 * own model at the MAP estimate, with standard uncertainties propagated to first order from the
 * posterior covariance (GUM 5.1.2): capacitor gradients from the exact corner sensitivities
 * ({@link CornerFinder#cornerSensitivities}), bias gradients by forward difference. The coverage
 * factor is 2 (GUM 6.3). Stateless.
 */
public final class ModelMeasurement {
    private static final double BIAS_STEP = 1e-5;
    public static final double COVERAGE = 2;

    private final PortReduction reduction = new PortReduction();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final CornerFinder corners = new CornerFinder();

    /** @return midband gain in dB with uncertainty, and the lower corner in Hz when the model has one */
    public Measured measure(Stage stage, OperatingPoints nominalPoints, BackSolve backSolve) {
        List<ParameterEstimate> parameters = backSolve.parameters();
        int p = parameters.size();
        double[] theta = new double[p];
        for (int j = 0; j < p; j++) {
            theta[j] = parameters.get(j).logEstimate();
        }
        Optional<StateModel> model = model(stage, nominalPoints, parameters, theta);
        if (model.isEmpty()) {
            return new Measured(Optional.empty(), Optional.empty());
        }
        double gainDb = Decibels.fromRatio(Math.abs(model.get().directGain())) + Decibels.fromNepers(theta[p - 1]);
        OptionalDouble corner = corners.lowerCornerRadPerS(model.get());
        double[] gainGradient = new double[p];
        double[] cornerGradient = new double[p];
        gainGradient[p - 1] = 1 / Decibels.NEPERS_PER_DB;
        if (corner.isPresent()) {
            double[] s = corners.cornerSensitivities(model.get(), corner.getAsDouble());
            int i = 0;
            for (int j = 0; j < p; j++) {
                if (parameters.get(j).parameter().kind() == ParameterKind.CAPACITOR) {
                    cornerGradient[j] = s[i++];
                }
            }
        }
        for (int j = 0; j < p; j++) {
            if (parameters.get(j).parameter().kind() != ParameterKind.BIAS) {
                continue;
            }
            double[] stepped = theta.clone();
            stepped[j] += BIAS_STEP;
            Optional<StateModel> other = model(stage, nominalPoints, parameters, stepped);
            if (other.isEmpty()) {
                continue;
            }
            gainGradient[j] = (Decibels.fromRatio(Math.abs(other.get().directGain()))
                    - Decibels.fromRatio(Math.abs(model.get().directGain()))) / BIAS_STEP;
            OptionalDouble moved = corners.lowerCornerRadPerS(other.get());
            if (corner.isPresent() && moved.isPresent()) {
                cornerGradient[j] = Math.log(moved.getAsDouble() / corner.getAsDouble()) / BIAS_STEP;
            }
        }
        Estimate gain = new Estimate(gainDb, Math.sqrt(quadratic(gainGradient, backSolve, parameters)), COVERAGE);
        Optional<Estimate> lower = Optional.empty();
        if (corner.isPresent()) {
            double hz = corner.getAsDouble() / (2 * Math.PI);
            lower = Optional.of(new Estimate(hz, hz * Math.sqrt(quadratic(cornerGradient, backSolve, parameters)),
                    COVERAGE));
        }
        return new Measured(Optional.of(gain), lower);
    }

    // gᵀΣg with Σ_ij = ρ_ij·u_i·u_j on the log scale
    private static double quadratic(double[] g, BackSolve backSolve, List<ParameterEstimate> parameters) {
        double sum = 0;
        for (int i = 0; i < g.length; i++) {
            for (int j = 0; j < g.length; j++) {
                sum += g[i] * g[j] * backSolve.correlation().get(i).get(j)
                        * parameters.get(i).logUncertainty() * parameters.get(j).logUncertainty();
            }
        }
        return Math.max(0, sum);
    }

    private Optional<StateModel> model(Stage stage, OperatingPoints points, List<ParameterEstimate> parameters,
                                       double[] theta) {
        Stage scaled = stage;
        OperatingPoints scaledPoints = points;
        for (int j = 0; j < parameters.size(); j++) {
            ModelParameter parameter = parameters.get(j).parameter();
            if (parameter.kind() == ParameterKind.CAPACITOR) {
                scaled = scaled.withCapacitance(parameter.label(), parameter.valueOf(theta[j]));
            } else if (parameter.kind() == ParameterKind.BIAS) {
                scaledPoints = scaledPoints.withCurrentScaled(parameter.label(), Math.exp(theta[j]));
            }
        }
        Reduction low = reduction.reduce(expansion.expand(scaled, scaledPoints), Band.LOW);
        return low instanceof Reduction.StateSpace ? Optional.of(((Reduction.StateSpace) low).model())
                : Optional.empty();
    }

    /**
     * @param midbandGainDb the model's |D| in dB plus the gain calibration; empty if singular
     * @param lowerCornerHz the model's exact lower corner; empty when it has none
     */
    public record Measured(Optional<Estimate> midbandGainDb, Optional<Estimate> lowerCornerHz) {
    }
}

package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.analysis.CornerFinder;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.fit.Estimate;
import org.polebench.units.Decibels;

/**
 * The midband gain and the lower corner of the board as the back-solve sees it: the stage's
 * own model at the MAP estimate, with standard uncertainties propagated to first order from the
 * posterior covariance (GUM 5.1.2): capacitor gradients from the exact corner sensitivities
 * ({@link CornerFinder#cornerSensitivities}), gradients of the bias currents, β and freed resistors by forward difference. The coverage
 * factor is 2 (GUM 6.3). Stateless.
 */
public final class ModelMeasurement {
    /** Forward-difference step in the ln of a network parameter (bias current, β, resistor). */
    private static final double STEP = 1e-5;
    public static final double COVERAGE = 2;

    private final PortReduction reduction = new PortReduction();
    private final CornerFinder corners = new CornerFinder();

    private static String label(List<ParameterEstimate> parameters, int j) {
        return parameters.get(j).parameter().label();
    }

    /** @return midband gain in dB with uncertainty, and the lower corner in Hz when the model has one */
    public Measured measure(Stage stage, OperatingPoints nominalPoints, BackSolve backSolve) {
        return measure(stage, nominalPoints, backSolve, 0);
    }

    /**
     * As {@link #measure(Stage, OperatingPoints, BackSolve)}, with the instrument's flat gain
     * calibration error added to the midband's uncertainty (docs/method.md, "Uncertainty (GUM, JCGM 100:2008)"). The
     * back-solve's own gain calibration parameter takes up whatever flat gain the sweep shows, so
     * its posterior knows only the point noise; the instrument's calibration error moves the
     * measured midband one for one and is independent of that noise, so its variance is added
     * (GUM 5.1.2, sensitivity 1). It moves no corner relative to midband, so the corner is as it was.
     *
     * @param calibrationGainUncertaintyDb u of the instrument's flat gain error, dB (0 for none)
     */
    public Measured measure(Stage stage, OperatingPoints nominalPoints, BackSolve backSolve,
                            double calibrationGainUncertaintyDb) {
        List<ParameterEstimate> parameters = backSolve.parameters();
        int p = parameters.size();
        double[] theta = new double[p];
        List<String> capacitors = new ArrayList<>();
        for (int j = 0; j < p; j++) {
            theta[j] = parameters.get(j).logEstimate();
            if (parameters.get(j).parameter().kind() == ParameterKind.CAPACITOR && stage.part(label(parameters, j)).isPresent()) {
                capacitors.add(parameters.get(j).parameter().label());
            }
        }
        // a part a declared bench added (its loads) is not the board's: the board's own model is
        // measured without it
        BoardNetwork board = new BoardNetwork(stage, nominalPoints, capacitors);
        Optional<StateModel> model = model(board, parameters, theta);
        if (model.isEmpty()) {
            return new Measured(Optional.empty(), Optional.empty());
        }
        int gainIndex = indexOf(parameters, ParameterKind.GAIN);
        double gainDb = Decibels.fromRatio(Math.abs(model.get().directGain())) + Decibels.fromNepers(theta[gainIndex]);
        OptionalDouble corner = corners.lowerCornerRadPerS(model.get());
        double[] gainGradient = new double[p];
        double[] cornerGradient = new double[p];
        gainGradient[gainIndex] = 1 / Decibels.NEPERS_PER_DB;
        if (corner.isPresent()) {
            double[] s = corners.cornerSensitivities(model.get(), corner.getAsDouble());
            int i = 0;
            for (int j = 0; j < p; j++) {
                if (parameters.get(j).parameter().kind() == ParameterKind.CAPACITOR && board.hasPart(label(parameters, j))) {
                    cornerGradient[j] = s[i++];
                }
            }
        }
        for (int j = 0; j < p; j++) {
            ParameterKind kind = parameters.get(j).parameter().kind();
            if (kind == ParameterKind.CAPACITOR || kind == ParameterKind.GAIN) {
                continue;
            }
            double[] stepped = theta.clone();
            stepped[j] += STEP;
            Optional<StateModel> other = model(board, parameters, stepped);
            if (other.isEmpty()) {
                continue;
            }
            gainGradient[j] = (Decibels.fromRatio(Math.abs(other.get().directGain()))
                    - Decibels.fromRatio(Math.abs(model.get().directGain()))) / STEP;
            OptionalDouble moved = corners.lowerCornerRadPerS(other.get());
            if (corner.isPresent() && moved.isPresent()) {
                cornerGradient[j] = Math.log(moved.getAsDouble() / corner.getAsDouble()) / STEP;
            }
        }
        Estimate gain = new Estimate(gainDb, Math.sqrt(quadratic(gainGradient, backSolve, parameters)
                + calibrationGainUncertaintyDb * calibrationGainUncertaintyDb), COVERAGE);
        Optional<Estimate> lower = Optional.empty();
        if (corner.isPresent()) {
            double hz = corner.getAsDouble() / (2 * Math.PI);
            lower = Optional.of(new Estimate(hz, hz * Math.sqrt(quadratic(cornerGradient, backSolve, parameters)),
                    COVERAGE));
        }
        return new Measured(Optional.of(gain), lower);
    }

    private static int indexOf(List<ParameterEstimate> parameters, ParameterKind kind) {
        for (int j = 0; j < parameters.size(); j++) {
            if (parameters.get(j).parameter().kind() == kind) {
                return j;
            }
        }
        throw new IllegalArgumentException("the back-solve has no " + kind + " parameter");
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

    // the back-solve's estimates laid onto the board network's parameter order; a resistor the
    // hypothesis did not free stays at its value
    Optional<StateModel> model(BoardNetwork board, List<ParameterEstimate> parameters, double[] theta) {
        List<Double> lnCapacitor = new ArrayList<>();
        double[] lnNetwork = board.nominal();
        int m = board.transistors().size();
        int nb = board.bjts().size();
        for (int j = 0; j < parameters.size(); j++) {
            ModelParameter parameter = parameters.get(j).parameter();
            switch (parameter.kind()) {
                case CAPACITOR:
                    if (board.hasPart(parameter.label())) {
                        lnCapacitor.add(theta[j]);
                    }
                    break;
                case BIAS:
                    lnNetwork[board.transistors().indexOf(parameter.label())] = theta[j];
                    break;
                case CURRENT_GAIN:
                    lnNetwork[m + board.bjts().indexOf(parameter.label())] = theta[j];
                    break;
                case RESISTOR:
                    lnNetwork[m + nb + board.resistors().indexOf(parameter.label())] = theta[j];
                    break;
                default:
                    break;
            }
        }
        double[] capacitors = lnCapacitor.stream().mapToDouble(Double::doubleValue).toArray();
        SmallSignalNetwork network = board.network(capacitors, lnNetwork);
        if (network == null) {
            return Optional.empty();
        }
        return reduction.reduce(network, Band.LOW).stateModel();
    }

    /**
     * @param midbandGainDb the model's |D| in dB plus the gain calibration; empty if singular
     * @param lowerCornerHz the model's exact lower corner; empty when it has none
     */
    public record Measured(Optional<Estimate> midbandGainDb, Optional<Estimate> lowerCornerHz) {
    }
}

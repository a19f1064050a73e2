package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.analysis.CornerFinder;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.Stage;

/**
 * The lower corner's change from the stage as designed to the board the back-solve found,
 * apportioned exactly among the parts along the straight path between them: with θ(t) = t·θ̂ in
 * the back-solve's log-scale parameters (t from 0, every part nominal, to 1, the most probable
 * hypothesis' estimates), ln f(θ̂) − ln f(0) = Σ_i θ̂_i·∫₀¹ ∂ln f/∂θ_i(θ(t)) dt (the fundamental
 * theorem of calculus along a path; the shares are the path-integrated attributions of Aumann
 * and Shapley, Values of Non-Atomic Games, 1974). Each capacitor's term uses the corner's exact
 * sensitivity ∂ln f/∂ln C at every node of an {@value #NODES}-point Gauss–Legendre rule
 * (Abramowitz and Stegun, 25.4.29, table 25.4); the bias currents', β's and freed resistors'
 * terms are the remainder, one row. The shares add up to the back-solved corner's change and
 * name the back-solve's culprit first, so the apportionment and the back-solve never disagree,
 * however far the board lies from its design. A change within twice its standard uncertainty
 * gets its terms but no shares: a fraction of what may be nothing means nothing. Stateless.
 */
public final class CornerApportionment {
    /** Gauss–Legendre nodes on [0, 1]: exact for polynomials of degree 15, ample for a corner's smooth path. */
    static final int NODES = 8;
    // Abramowitz and Stegun, table 25.4, n = 8, on [−1, 1]
    private static final double[] ABSCISSAE = {0.1834346424956498, 0.5255324099163290, 0.7966664774136267,
            0.9602898564975363};
    private static final double[] WEIGHTS = {0.3626837833783620, 0.3137066458778873, 0.2223810344533745,
            0.1012285362903763};

    private final CornerFinder corners = new CornerFinder();
    private final ModelMeasurement measurement = new ModelMeasurement();

    /**
     * @param stage     the board's own stage as designed
     * @param points    its nominal operating points
     * @param backSolve the most probable hypothesis' back-solve
     * @param uLnCorner the standard uncertainty of the back-solved ln corner
     * @return the apportionment; empty where the path leaves the model's domain (a transistor out
     *         of its amplifying region) or the board has no lower corner somewhere along it
     */
    public Optional<Apportionment> apportion(Stage stage, OperatingPoints points, BackSolve backSolve,
                                             double uLnCorner) {
        List<ParameterEstimate> parameters = backSolve.parameters();
        int p = parameters.size();
        double[] target = new double[p];
        List<String> capacitors = new ArrayList<>();
        List<Integer> capacitorIndex = new ArrayList<>();
        for (int j = 0; j < p; j++) {
            ModelParameter parameter = parameters.get(j).parameter();
            // the gain calibration moves no corner; a measuring channel is not the board's
            boolean board = parameter.kind() != ParameterKind.GAIN && parameter.kind() != ParameterKind.CHANNEL_CORNER;
            target[j] = board ? parameters.get(j).logEstimate() : 0;
            if (parameter.kind() == ParameterKind.CAPACITOR && stage.part(parameter.label()).isPresent()) {
                capacitors.add(parameter.label());
                capacitorIndex.add(j);
            }
        }
        BoardNetwork network = new BoardNetwork(stage, points, capacitors);
        OptionalDouble start = corner(network, parameters, scaled(target, 0));
        OptionalDouble end = corner(network, parameters, scaled(target, 1));
        if (start.isEmpty() || end.isEmpty()) {
            return Optional.empty();
        }
        double total = Math.log(end.getAsDouble() / start.getAsDouble());
        double[] integral = new double[capacitors.size()];
        for (int q = 0; q < 2 * ABSCISSAE.length; q++) {
            double x = q < ABSCISSAE.length ? -ABSCISSAE[q] : ABSCISSAE[q - ABSCISSAE.length];
            double w = WEIGHTS[q % ABSCISSAE.length] / 2;
            double[] theta = scaled(target, (x + 1) / 2);
            Optional<StateModel> model = measurement.model(network, parameters, theta);
            if (model.isEmpty()) {
                return Optional.empty();
            }
            OptionalDouble corner = corners.lowerCornerRadPerS(model.get());
            if (corner.isEmpty()) {
                return Optional.empty();
            }
            double[] s = corners.cornerSensitivities(model.get(), corner.getAsDouble());
            for (int i = 0; i < integral.length; i++) {
                integral[i] += w * s[i];
            }
        }
        // a change within twice its uncertainty has no meaningful shares: each part's term is
        // shown, its fraction of a change that may be nothing is not (a healthy board's 479 %)
        boolean resolved = Math.abs(total) > 2 * uLnCorner && total != 0;
        List<CapacitorShare> shares = new ArrayList<>(capacitors.size());
        double capacitorTotal = 0;
        for (int i = 0; i < capacitors.size(); i++) {
            int j = capacitorIndex.get(i);
            capacitorTotal += integral[i] * target[j];
        }
        for (int i = 0; i < capacitors.size(); i++) {
            int j = capacitorIndex.get(i);
            ParameterEstimate estimate = parameters.get(j);
            double contribution = integral[i] * target[j];
            shares.add(new CapacitorShare(capacitors.get(i), integral[i], target[j], estimate.value(), contribution,
                    resolved ? contribution / total : Double.NaN));
        }
        double other = total - capacitorTotal;
        Optional<ParameterEstimate> anyNetwork = parameters.stream()
                .filter(e -> e.parameter().kind() == ParameterKind.BIAS || e.parameter().kind() == ParameterKind.CURRENT_GAIN
                        || e.parameter().kind() == ParameterKind.RESISTOR).findFirst();
        return Optional.of(new Apportionment(total, uLnCorner, shares, anyNetwork.isPresent() ? other : 0,
                resolved ? other / total : Double.NaN));
    }

    private OptionalDouble corner(BoardNetwork network, List<ParameterEstimate> parameters, double[] theta) {
        Optional<StateModel> model = measurement.model(network, parameters, theta);
        if (model.isEmpty()) {
            return OptionalDouble.empty();
        }
        return corners.lowerCornerRadPerS(model.get());
    }

    private static double[] scaled(double[] target, double t) {
        double[] theta = new double[target.length];
        for (int j = 0; j < theta.length; j++) {
            theta[j] = t * target[j];
        }
        return theta;
    }
}

package org.polebench.spread;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;

/**
 * The exact lower corner of boards drawn from one nominal stage, each board given as numbers:
 * its part values ({@link Stage#partValues()}) and the factors on its given bias currents. The
 * kernel of the tolerance spread (docs/method.md, "Tolerance spread"). A draw changes values, never
 * structure, so the DC network, the small-signal element list and the low-band reduction's
 * graph checks and MNA layout are made once here ({@link BiasSolver#prepare},
 * {@link SmallSignalExpansion#prepare}, {@link PortReduction#prepare}); a board then costs one
 * bias solve, one restamp of the element values, one port reduction and one corner search, the
 * same numerics as {@link StagePredictor#exactLowerCornerHz(org.polebench.circuit.SmallSignalNetwork)}
 * on the board built as a stage. Immutable; one instance serves any thread.
 */
final class BoardCorners {
    private final BiasSolver.Prepared bias;
    private final SmallSignalExpansion.Prepared expansion;
    private final PortReduction.Prepared lowBand;
    private final StagePredictor predictor;
    private final int transistors;
    /** the indices, in {@link Stage#transistors()}, of the transistors with a given bias current */
    private final int[] given;

    private BoardCorners(BiasSolver.Prepared bias, SmallSignalExpansion.Prepared expansion,
                         PortReduction.Prepared lowBand, StagePredictor predictor, int transistors, int[] given) {
        this.bias = bias;
        this.expansion = expansion;
        this.lowBand = lowBand;
        this.predictor = predictor;
        this.transistors = transistors;
        this.given = given;
    }

    /**
     * Lays the kernel out from the nominal stage. The reduction's layout needs one network with
     * an in-region bias (its conductances positive): the nominal's, or else the first draw's
     * that has one; any serves, since every in-region board has the same layout.
     *
     * @param draws part values of the boards to come, tried in order when the nominal's bias is
     *              out of region
     * @return empty when no board can be analysed: the stage has a node without a DC path, or no
     *         draw's bias is in region
     */
    static Optional<BoardCorners> prepare(Stage nominal, double[][] draws, StagePredictor predictor) {
        BiasSolver.Prepared bias;
        try {
            bias = new BiasSolver().prepare(nominal);
        } catch (InputProblem noDcPath) {
            return Optional.empty();
        }
        SmallSignalExpansion.Prepared expansion = new SmallSignalExpansion().prepare(nominal);
        List<Transistor> all = nominal.transistors();
        int[] given = new int[(int) all.stream().filter(t -> t.bias().givenAmps().isPresent()).count()];
        for (int t = 0, g = 0; t < all.size(); t++) {
            if (all.get(t).bias().givenAmps().isPresent()) {
                given[g++] = t;
            }
        }
        double[] currentAmps = new double[all.size()];
        double[] sourceBodyVolts = new double[all.size()];
        for (int n = -1; n < draws.length; n++) {
            double[] values = n < 0 ? nominal.partValues() : draws[n];
            if (bias.solveInRegion(values, currentAmps, sourceBodyVolts)) {
                PortReduction.Prepared lowBand =
                        predictor.lowBandLayout(expansion.network(values, currentAmps, sourceBodyVolts));
                return Optional.of(new BoardCorners(bias, expansion, lowBand, predictor, all.size(), given));
            }
        }
        return Optional.empty();
    }

    /**
     * @param partValues  the board's part values
     * @param biasFactors one factor per given bias current, in transistor order
     * @return the exact lower corner in Hz; 0 when the board has none (or its low band is
     *         singular); NaN when its bias leaves the active region
     */
    double cornerHz(double[] partValues, double[] biasFactors) {
        double[] currentAmps = new double[transistors];
        double[] sourceBodyVolts = new double[transistors];
        if (!bias.solveInRegion(partValues, currentAmps, sourceBodyVolts)) {
            return Double.NaN;
        }
        for (int g = 0; g < given.length; g++) {
            // as OperatingPoints.withCurrentScaled: the current follows, the voltages stay as solved
            currentAmps[given[g]] *= biasFactors[g];
        }
        OptionalDouble corner = predictor.exactLowerCornerHz(
                lowBand.reduce(expansion.elementValues(partValues, currentAmps, sourceBodyVolts)));
        return corner.isPresent() ? corner.getAsDouble() : 0;
    }
}

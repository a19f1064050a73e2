package org.polebench.spread;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;

/**
 * Monte Carlo band of the gain |H(f)| over the stage's part tolerances, for the tolerance band
 * of a Bode plot. Boards are drawn exactly as {@link ToleranceSpread} draws them, through
 * {@link ToleranceBands} (uniform in ln(value) across each band, from one
 * {@link SplittableRandom} with the given seed, in part order), so with the same seed the n boards here are the first n boards of the corner spread.
 * Each board's bias is solved again; its gain is the full complex MNA response
 * ({@link FullResponse}), both bands. At every frequency the band runs between the
 * (1 − coverage)/2 and (1 + coverage)/2 percentiles of the boards' gains (Hyndman and Fan 1996,
 * definition 7), so it is a pointwise band, not the envelope of any one board. Immutable.
 */
public final class ResponseSpread {
    /** The central fraction of boards the band holds when the caller does not say. */
    public static final double DEFAULT_COVERAGE = 0.95;

    private final int boards;
    private final long seed;
    private final double coverage;
    private final BiasSolver biasSolver = new BiasSolver();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();

    /**
     * @param boards   at least 20, so the 2.5 % and 97.5 % points are not the extremes alone
     * @param coverage in (0, 1)
     */
    public ResponseSpread(int boards, long seed, double coverage) {
        if (boards < 20) {
            throw new IllegalArgumentException("a response spread needs at least 20 boards, was " + boards);
        }
        if (!(coverage > 0 && coverage < 1)) {
            throw new IllegalArgumentException("coverage lies in (0, 1), was " + coverage);
        }
        this.boards = boards;
        this.seed = seed;
        this.coverage = coverage;
    }

    /**
     * @param nominal       the stage as designed
     * @param frequenciesHz ascending positive frequencies
     * @return the band; at a frequency where no board could be analysed both edges are NaN
     */
    public GainSpread gain(Stage nominal, List<Double> frequenciesHz) {
        int n = frequenciesHz.size();
        SplittableRandom random = new SplittableRandom(seed);
        ToleranceBands bands = new ToleranceBands(nominal);
        List<Transistor> given = ToleranceBands.givenBias(nominal);
        double[][] gains = new double[n][boards];
        int[] counts = new int[n];
        int failures = 0;
        BiasSolver.Prepared bias;
        try {
            bias = biasSolver.prepare(nominal);
        } catch (InputProblem noDcPath) {
            bias = null;
        }
        for (int b = 0; b < boards; b++) {
            Stage drawn = nominal.withPartValues(bands.board(random));
            double[] factors = bands.biasFactors(random);
            OperatingPoints points;
            try {
                if (bias == null) {
                    failures++;
                    continue;
                }
                points = bias.solve(drawn);
            } catch (InputProblem outOfRegion) {
                failures++;
                continue;
            }
            for (int t = 0; t < given.size(); t++) {
                points = points.withCurrentScaled(given.get(t).name(), factors[t]);
            }
            FullResponse response = new FullResponse(expansion.expand(drawn, points));
            for (int i = 0; i < n; i++) {
                Optional<Complex> h = response.atHz(frequenciesHz.get(i));
                if (h.isPresent() && h.get().abs() > 0) {
                    gains[i][counts[i]++] = 20 * Math.log10(h.get().abs());
                }
            }
        }
        List<Double> low = new ArrayList<>(n);
        List<Double> high = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            double[] sorted = Arrays.copyOf(gains[i], counts[i]);
            Arrays.sort(sorted);
            low.add(percentile(sorted, (1 - coverage) / 2));
            high.add(percentile(sorted, (1 + coverage) / 2));
        }
        return new GainSpread(frequenciesHz, low, high, coverage, boards, failures, seed);
    }

    // Hyndman and Fan (1996) definition 7, as CornerSpread uses
    private static double percentile(double[] sorted, double fraction) {
        if (sorted.length == 0) {
            return Double.NaN;
        }
        double position = fraction * (sorted.length - 1);
        int below = (int) Math.floor(position);
        int above = Math.min(sorted.length - 1, below + 1);
        double weight = position - below;
        return sorted[below] * (1 - weight) + sorted[above] * weight;
    }
}

package org.polebench.spread;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.polebench.analysis.StagePredictor;
import org.polebench.circuit.Stage;

/**
 * Monte Carlo spread of the exact lower corner over the stage's part tolerances, β spreads and
 * given bias currents (docs/method.md, "Tolerance spread").
 *
 * <p>Each value is drawn uniformly in ln(value) across its tolerance band: the same rectangular
 * reading of a band that the back-solve's priors use (GUM, JCGM 100:2008, 4.3.7), so the spread
 * and the priors describe the same population. Resistors and β change the bias, which is solved
 * again for every sample; a sample whose bias leaves the active region is counted, not used.
 * The boards are analysed as numbers by {@link BoardCorners}, laid out once from the nominal.
 * Draws come from one {@link SplittableRandom} with the given seed, in part order, so a run is
 * repeatable: every board is drawn before any is analysed, and each draw takes its values in
 * the same order whether or not its bias then solves, so the spread does not depend on the
 * number of threads that analyse the draws.
 */
public final class ToleranceSpread {
    /** Samples when the user does not say (issue 2). */
    public static final int DEFAULT_SAMPLES = 10_000;
    /** Seed when the user does not say, so that two runs of a report agree. */
    public static final long DEFAULT_SEED = 20_261_201L;

    private final int samples;
    private final long seed;
    private final int threads;
    private final StagePredictor predictor = new StagePredictor();

    public ToleranceSpread() {
        this(DEFAULT_SAMPLES, DEFAULT_SEED);
    }

    /**
     * Analyses the draws on every available processor; the result does not depend on how many.
     *
     * @param samples at least 20, so that the 5 % and 95 % points are not the extremes
     */
    public ToleranceSpread(int samples, long seed) {
        this(samples, seed, Runtime.getRuntime().availableProcessors());
    }

    private ToleranceSpread(int samples, long seed, int threads) {
        if (samples < 20) {
            throw new IllegalArgumentException("a tolerance spread needs at least 20 samples, was " + samples);
        }
        if (threads < 1) {
            throw new IllegalArgumentException("a tolerance spread needs at least one thread, was " + threads);
        }
        this.samples = samples;
        this.seed = seed;
        this.threads = threads;
    }

    public ToleranceSpread withSamples(int newSamples) {
        return new ToleranceSpread(newSamples, seed, threads);
    }

    public ToleranceSpread withSeed(long newSeed) {
        return new ToleranceSpread(samples, newSeed, threads);
    }

    /** @param newThreads how many threads analyse the draws (1 for the single-core benchmark) */
    public ToleranceSpread withThreads(int newThreads) {
        return new ToleranceSpread(samples, seed, newThreads);
    }

    /**
     * @return the percentiles of the exact lower corner; empty of corners when no sample could
     *         be analysed (every draw left the active region or had no corner)
     */
    public CornerSpread lowerCorner(Stage nominal) {
        // Every draw is made first, in order, from one generator, so the boards drawn do not
        // depend on how many threads then analyse them: the spread is the same on any machine.
        SplittableRandom random = new SplittableRandom(seed);
        ToleranceBands bands = new ToleranceBands(nominal);
        double[][] boardValues = new double[samples][];
        double[][] biasFactors = new double[samples][];
        for (int n = 0; n < samples; n++) {
            boardValues[n] = bands.board(random);
            biasFactors[n] = bands.biasFactors(random);
        }
        Optional<BoardCorners> prepared = BoardCorners.prepare(nominal, boardValues, predictor);
        if (prepared.isEmpty()) {
            // a node without a DC path is one in every draw, and so is a bias out of region in all
            return new CornerSpread(samples, seed, samples, List.of());
        }
        BoardCorners boards = prepared.get();
        double[] corners = new double[samples];
        IntStream draws = IntStream.range(0, samples);
        if (threads > 1) {
            ForkJoinPool pool = new ForkJoinPool(threads);
            try {
                pool.submit(() -> draws.parallel().forEach(n ->
                        corners[n] = boards.cornerHz(boardValues[n], biasFactors[n]))).get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("the tolerance spread was interrupted", e);
            } catch (ExecutionException e) {
                throw new IllegalStateException("a tolerance draw failed", e.getCause());
            } finally {
                pool.shutdown();
            }
        } else {
            draws.forEach(n -> corners[n] = boards.cornerHz(boardValues[n], biasFactors[n]));
        }
        int biasFailures = 0;
        double[] usable = new double[samples];
        int used = 0;
        for (double cornerHz : corners) {
            if (Double.isNaN(cornerHz)) {
                biasFailures++;
            } else if (cornerHz > 0) {
                usable[used++] = cornerHz;
            }
        }
        double[] sorted = Arrays.copyOf(usable, used);
        Arrays.sort(sorted);
        List<Double> values = new ArrayList<>(used);
        for (double corner : sorted) {
            values.add(corner);
        }
        return new CornerSpread(samples, seed, biasFailures, values);
    }
}

package org.polebench.spread;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.apache.commons.math3.distribution.BinomialDistribution;
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
 * repeatable: boards are drawn a batch at a time before any of the batch is analysed, and each
 * draw takes its values in the same order whether or not its bias then solves, so the spread
 * does not depend on the number of threads that analyse the draws.
 *
 * <p>Early stop (docs/method.md, "Tolerance spread"): after every {@value #CHECK_EVERY} boards
 * the 5, 50 and 95 % points each get their distribution-free 95 % confidence interval from the
 * order statistics, [x_(l), x_(u)] with l and u the binomial (n, p) 2.5 % and 97.5 % points
 * (Hahn and Meeker, Statistical Intervals, 1991, 5.2; the normal approximation is not needed
 * with Commons Math's binomial); once every interval's half-width is within {@code precision}
 * of its percentile, the spread stops. The checks fall at fixed board counts, so the same seed
 * stops at the same board on any machine.
 */
public final class ToleranceSpread {
    /** Samples when the user does not say (issue 2). */
    public static final int DEFAULT_SAMPLES = 10_000;
    /** Seed when the user does not say, so that two runs of a report agree. */
    public static final long DEFAULT_SEED = 20_261_201L;
    /**
     * The relative precision (half-width of each percentile's 95 % interval over the
     * percentile) at which the spread stops early when the user does not say: ±0.5 %, below the
     * part tolerances it reports on (1 % and more) and well below the spread itself.
     */
    public static final double DEFAULT_PRECISION = 0.005;
    /** Boards drawn and analysed between progress reports. */
    static final int BATCH = 200;
    /** Boards between the early-stop checks, and the fewest before the first. */
    static final int CHECK_EVERY = 1_000;
    private static final double[] CHECKED = {0.05, 0.50, 0.95};

    private final int samples;
    private final long seed;
    private final int threads;
    private final double precision;
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
        this(samples, seed, Runtime.getRuntime().availableProcessors(), DEFAULT_PRECISION);
    }

    private ToleranceSpread(int samples, long seed, int threads, double precision) {
        if (samples < 20) {
            throw new IllegalArgumentException("a tolerance spread needs at least 20 samples, was " + samples);
        }
        if (threads < 1) {
            throw new IllegalArgumentException("a tolerance spread needs at least one thread, was " + threads);
        }
        if (!(precision >= 0)) {
            throw new IllegalArgumentException("a precision is 0 or more, was " + precision);
        }
        this.samples = samples;
        this.seed = seed;
        this.threads = threads;
        this.precision = precision;
    }

    public ToleranceSpread withSamples(int newSamples) {
        return new ToleranceSpread(newSamples, seed, threads, precision);
    }

    public ToleranceSpread withSeed(long newSeed) {
        return new ToleranceSpread(samples, newSeed, threads, precision);
    }

    /** @param newThreads how many threads analyse the draws (1 for the single-core benchmark) */
    public ToleranceSpread withThreads(int newThreads) {
        return new ToleranceSpread(samples, seed, newThreads, precision);
    }

    /** @param relative the early-stop precision (see the class comment); 0 to draw every sample */
    public ToleranceSpread withPrecision(double relative) {
        return new ToleranceSpread(samples, seed, threads, relative);
    }

    /** @return the relative precision at which this spread stops early; 0 for never */
    public double precision() {
        return precision;
    }

    /**
     * @return the percentiles of the exact lower corner; empty of corners when no sample could
     *         be analysed (every draw left the active region or had no corner)
     */
    public CornerSpread lowerCorner(Stage nominal) {
        return lowerCorner(nominal, SpreadProgress.NONE);
    }

    /**
     * @param progress told after every batch of {@value #BATCH} boards
     * @return as {@link #lowerCorner(Stage)}, with the boards actually drawn
     */
    public CornerSpread lowerCorner(Stage nominal, SpreadProgress progress) {
        SplittableRandom random = new SplittableRandom(seed);
        ToleranceBands bands = new ToleranceBands(nominal);
        BoardCorners boards = null;
        double[] corners = new double[samples];
        int drawn = 0;
        boolean known = false;
        ForkJoinPool pool = threads > 1 ? new ForkJoinPool(threads) : null;
        try {
            while (drawn < samples && !known) {
                int size = Math.min(BATCH, samples - drawn);
                // the batch's draws first, in order, from the one generator: the boards drawn do
                // not depend on how many threads then analyse them
                double[][] boardValues = new double[size][];
                double[][] biasFactors = new double[size][];
                for (int n = 0; n < size; n++) {
                    boardValues[n] = bands.board(random);
                    biasFactors[n] = bands.biasFactors(random);
                }
                if (boards == null) {
                    // laid out from the nominal, or else the first draw with an in-region bias;
                    // a node without a DC path fails every batch, each draw then counted out
                    boards = BoardCorners.prepare(nominal, boardValues, predictor).orElse(null);
                }
                int first = drawn;
                if (boards == null) {
                    // no in-region bias yet: every draw of this batch is out of region
                    java.util.Arrays.fill(corners, first, first + size, Double.NaN);
                } else {
                    analyse(boards, boardValues, biasFactors, corners, first, pool);
                }
                drawn += size;
                progress.drawn(drawn, samples);
                known = precision > 0 && drawn % CHECK_EVERY == 0 && drawn < samples
                        && percentilesKnown(corners, drawn);
            }
        } finally {
            if (pool != null) {
                pool.shutdown();
            }
        }
        int biasFailures = 0;
        double[] usable = new double[drawn];
        int used = 0;
        for (int n = 0; n < drawn; n++) {
            double cornerHz = corners[n];
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
        return new CornerSpread(drawn, seed, biasFailures, values, samples, known ? precision : 0);
    }

    private static void analyse(BoardCorners boards, double[][] boardValues, double[][] biasFactors, double[] corners,
                                int first, ForkJoinPool pool) {
        IntStream draws = IntStream.range(0, boardValues.length);
        if (pool == null) {
            draws.forEach(n -> corners[first + n] = boards.cornerHz(boardValues[n], biasFactors[n]));
            return;
        }
        try {
            pool.submit(() -> draws.parallel().forEach(n ->
                    corners[first + n] = boards.cornerHz(boardValues[n], biasFactors[n]))).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("the tolerance spread was interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("a tolerance draw failed", e.getCause());
        }
    }

    /**
     * @return whether the 5, 50 and 95 % points of the first {@code drawn} corners each have a
     *         distribution-free 95 % interval within ±precision of themselves (class comment)
     */
    private boolean percentilesKnown(double[] corners, int drawn) {
        double[] sorted = Arrays.stream(corners, 0, drawn).filter(c -> !Double.isNaN(c) && c > 0).sorted().toArray();
        int n = sorted.length;
        if (n < CHECK_EVERY / 2) {
            return false;
        }
        for (double p : CHECKED) {
            Interval interval = interval(sorted, p);
            double point = new CornerSpread(n, seed, 0, toList(sorted)).percentileHz(p).getAsDouble();
            if (!(interval.high - interval.low <= 2 * precision * point)) {
                return false;
            }
        }
        return true;
    }

    /** A distribution-free confidence interval of a percentile, in Hz. */
    record Interval(double low, double high) {
    }

    /**
     * @param sorted the analysed corners, ascending
     * @return [x_(l), x_(u)] (1-based order statistics) with l the binomial (n, p) 2.5 % point and
     *         u one above its 97.5 % point: P(x_(l) ≤ x_p ≤ x_(u)) ≥ 95 % whatever the
     *         distribution (Hahn and Meeker, Statistical Intervals, 1991, 5.2), clamped to the sample
     */
    static Interval interval(double[] sorted, double p) {
        int n = sorted.length;
        BinomialDistribution binomial = new BinomialDistribution(null, n, p);
        int low = Math.max(1, binomial.inverseCumulativeProbability(0.025));
        int high = Math.min(n, binomial.inverseCumulativeProbability(0.975) + 1);
        return new Interval(sorted[low - 1], sorted[high - 1]);
    }

    private static List<Double> toList(double[] values) {
        List<Double> list = new ArrayList<>(values.length);
        for (double v : values) {
            list.add(v);
        }
        return list;
    }
}

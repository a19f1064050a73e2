package org.polebench.fit;

import java.util.Arrays;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.ValueAndJacobianFunction;
import org.apache.commons.math3.linear.AbstractRealMatrix;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;
import org.polebench.linalg.HouseholderQr;

/**
 * Weighted least squares on complex-log residuals rₖ = ln(H_meas,k / H_model,k): real part in
 * nepers over σ_gain, imaginary part (principal value, so no phase unwrapping) in radians over
 * σ_phase; a magnitude-only sweep uses the real part alone (docs/method.md, "Fitting").
 * Levenberg–Marquardt from Commons Math; its residual is target − model, so the target is zero
 * and the model value is −r/σ (docs/contributing.md, "Library behaviour the code works around").
 */
final class LogResidualFit {
    // a low band of five close poles with a pole–zero doublet in its start needs about 75
    // iterations (ManyCornerStageFitTest), so 60 stopped it short of the optimum; 150 leaves
    // margin. Candidates whose roots run away stop early through the box check.
    private static final int MAX_ITERATIONS = 150;
    private static final int MAX_EVALUATIONS = 300;
    private static final double SINKING_DEPTH = 100;
    private static final int SINKING_STEPS = 5;
    // Commons Math's defaults. A looser cost tolerance (1e-6: χ² within 2e-4 of its minimum, far
    // below what the order selection weighs) cut the iterations by a quarter but changed which
    // model the demo sweeps choose: a candidate whose complex zero pair creeps towards DC stops
    // short of the point where its information matrix turns singular, and so stays eligible. The
    // tight tolerance keeps that test honest; a noise-free sweep is recovered far inside 1e-6
    // relative (NoiseFreeRecoveryTest).
    private static final double TOLERANCE = 1e-10;
    private static final double TWO_PI = 2 * Math.PI;

    /**
     * @param robustWeights per-point factors on the weights (IRLS), or null for plain weights
     * @return the refined fit, or null when LM does not converge
     */
    RefinedFit refine(PreparedSweep data, RationalModel model, double[] start, double[] robustWeights) {
        int n = data.size();
        int rows = data.residualCount();
        // √w per row folded into the model and Jacobian: an explicit weight matrix would make
        // Commons Math multiply by it densely (rows² work per evaluation)
        double[] root = new double[rows];
        for (int k = 0; k < n; k++) {
            double r = robustWeights == null ? 1 : Math.sqrt(robustWeights[k]);
            root[k] = r / data.sigmaGain[k];
            if (data.hasPhase) {
                root[n + k] = r / data.sigmaPhase[k];
            }
        }
        double[] box = rootBox(data);
        SinkingRoot sinking = new SinkingRoot(model.structure(), Math.log(data.x[0]) - Math.log(SINKING_DEPTH));
        WeightedResiduals function = new WeightedResiduals(data, model, root);
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .model(function)
                .target(new double[rows])
                .maxIterations(MAX_ITERATIONS)
                .maxEvaluations(MAX_EVALUATIONS)
                // lazy: a trial step needs only the residuals; the Jacobian is formed once per
                // accepted step, when the optimiser asks for it
                .lazyEvaluation(true)
                .checker((iteration, previous, current) -> {
                    // called with each accepted point only (trial steps may roam further)
                    double[] p = current.getPoint().toArray();
                    for (int i = 1; i < p.length; i++) {
                        if (!(p[i] > box[0] && p[i] < box[1])) {
                            throw new RunawayRoot();
                        }
                    }
                    if (sinking.seenIn(previous.getPoint().toArray(), p)) {
                        throw new RunawayRoot();
                    }
                    return false;
                })
                .build();
        LeastSquaresOptimizer.Optimum optimum;
        try {
            optimum = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(TOLERANCE)
                    .withParameterRelativeTolerance(TOLERANCE)
                    .withOrthoTolerance(TOLERANCE)
                    .optimize(problem);
        } catch (MathIllegalStateException | RunawayRoot notConverged) {
            // too many iterations, or a root heading for DC or infinity (a zero that wants to be a
            // DC zero, a pole–zero pair cancelling): this structure is not what the data hold
            return null;
        }
        double[] p = optimum.getPoint().toArray();
        for (double v : p) {
            if (!Double.isFinite(v)) {
                return null;
            }
        }
        return assess(data, model, p);
    }

    /**
     * Bounds on every log-parameter but ln|K|: a root more than 10⁶ beyond either end of the band
     * has left anything the data can say (ln ζ gets the same, far wider than any real damping).
     */
    private static double[] rootBox(PreparedSweep data) {
        double reach = Math.log(1e6);
        return new double[]{Math.log(data.x[0]) - reach, Math.log(data.x[data.size() - 1]) + reach};
    }

    /**
     * Watches the accepted steps for a root sinking towards DC: a real root, or the ω₀ of a pair,
     * that lies more than {@link #SINKING_DEPTH} below the lowest swept frequency and has moved
     * down on each of the last {@link #SINKING_STEPS} steps. Down there a root shifts the band's
     * phase by under 1/{@link #SINKING_DEPTH} rad (a zero at s = −z adds z/ω), so the steps creep
     * at a tiny gain in χ² towards the box at 10⁶ below the band, which ends the run as a runaway
     * in the end, or exhaust the iteration limit first (a zero pair folding into two DC zeros took
     * all 150). One instance watches one refinement.
     */
    private static final class SinkingRoot {
        private final boolean[] frequency;
        private final double floor;
        private final int[] descents;

        SinkingRoot(ModelStructure s, double floor) {
            this.frequency = new boolean[s.parameterCount()];
            this.floor = floor;
            this.descents = new int[s.parameterCount()];
            for (int i = s.realZeroOffset(); i < s.zeroPairOffset(); i++) {
                frequency[i] = true;
            }
            for (int i = s.zeroPairOffset(); i < s.realPoleOffset(); i += 2) {
                frequency[i] = true;
            }
            for (int i = s.realPoleOffset(); i < s.polePairOffset(); i++) {
                frequency[i] = true;
            }
            for (int i = s.polePairOffset(); i < s.highBandOffset(); i += 2) {
                frequency[i] = true;
            }
        }

        /** @return whether some root has now sunk for the stated number of steps */
        boolean seenIn(double[] previous, double[] current) {
            for (int i = 0; i < current.length; i++) {
                descents[i] = frequency[i] && current[i] < floor && current[i] < previous[i] ? descents[i] + 1 : 0;
                if (descents[i] >= SINKING_STEPS) {
                    return true;
                }
            }
            return false;
        }
    }

    /** Thrown from inside the optimiser to stop a candidate whose root has run away. */
    private static final class RunawayRoot extends RuntimeException {
        private static final long serialVersionUID = 1L;

        RunawayRoot() {
            super(null, null, false, false);
        }
    }

    /**
     * χ² and (JᵀWJ)⁻¹ with the points' own (not robust) weights at the given parameters, the
     * inverse from the QR factor of the weighted Jacobian W^½·J (JᵀWJ = RᵀR is never formed:
     * docs/method.md, "Least squares by QR").
     */
    RefinedFit assess(PreparedSweep data, RationalModel model, double[] p) {
        int n = data.size();
        int rows = data.residualCount();
        int np = p.length;
        double[] value = new double[rows];
        double[] jacobian = new double[rows * np];
        evaluate(data, model, p, value, jacobian);
        double chi2 = 0;
        double[][] weighted = new double[np][rows];
        for (int r = 0; r < rows; r++) {
            double sigma = r < n ? data.sigmaGain[r] : data.sigmaPhase[r - n];
            chi2 += value[r] * value[r] / (sigma * sigma);
            int row = r * np;
            for (int i = 0; i < np; i++) {
                weighted[i][r] = jacobian[row + i] / sigma;
            }
        }
        return new RefinedFit(model, p, chi2, covariance(weighted, rows), rows);
    }

    /** Model value −r and its Jacobian ∂ ln H_model/∂p as one array per row. */
    static void evaluate(PreparedSweep data, RationalModel model, double[] p, double[] value, double[][] jacobian) {
        int np = p.length;
        double[] flat = new double[value.length * np];
        evaluate(data, model, p, value, flat);
        for (int r = 0; r < value.length; r++) {
            jacobian[r] = Arrays.copyOfRange(flat, r * np, (r + 1) * np);
        }
    }

    /**
     * Model value −r, gain rows first, then phase rows, and (unless {@code jacobian} is null)
     * ∂ ln H_model/∂p, row after row in one array (row r at r·p.length).
     */
    static void evaluate(PreparedSweep data, RationalModel model, double[] p, double[] value, double[] jacobian) {
        int n = data.size();
        int np = p.length;
        double[] out = new double[2];
        double[] e = RationalModel.exponentials(p);
        double[] gRe = jacobian == null ? null : new double[np];
        double[] gIm = jacobian == null ? null : new double[np];
        for (int k = 0; k < n; k++) {
            model.logAt(p, e, data.x[k], data.lnX[k], out, gRe, gIm);
            value[k] = out[0] - data.lnGain[k];
            if (jacobian != null) {
                System.arraycopy(gRe, 0, jacobian, k * np, np);
            }
            if (data.hasPhase) {
                value[n + k] = wrapped(out[1] - data.phaseRad[k]);
                if (jacobian != null) {
                    System.arraycopy(gIm, 0, jacobian, (n + k) * np, np);
                }
            }
        }
    }

    /** The angle in [−π, π]: the principal value of a phase residual (IEEE remainder by 2π). */
    private static double wrapped(double rad) {
        return rad - TWO_PI * Math.rint(rad / TWO_PI);
    }

    /**
     * The weighted model −r/σ and its Jacobian, as the optimiser asks for them. The optimiser
     * asks for the residuals of one point more than once (once for them, once for their norm),
     * so the last point's values are kept. One instance serves one refinement on one thread.
     */
    private static final class WeightedResiduals implements ValueAndJacobianFunction {
        private final PreparedSweep data;
        private final RationalModel model;
        private final double[] root;
        private double[] lastPoint;
        private double[] lastValue;

        WeightedResiduals(PreparedSweep data, RationalModel model, double[] root) {
            this.data = data;
            this.model = model;
            this.root = root;
        }

        @Override
        public RealVector computeValue(double[] p) {
            if (!Arrays.equals(p, lastPoint)) {
                remember(p, null);
            }
            return new ArrayRealVector(lastValue);
        }

        @Override
        public RealMatrix computeJacobian(double[] p) {
            double[] jacobian = new double[root.length * p.length];
            remember(p, jacobian);
            return new Jacobian(root.length, p.length, jacobian);
        }

        @Override
        public Pair<RealVector, RealMatrix> value(RealVector point) {
            double[] p = point.toArray();
            RealMatrix jacobian = computeJacobian(p);
            return new Pair<>(computeValue(p), jacobian);
        }

        private void remember(double[] p, double[] jacobian) {
            int np = p.length;
            double[] value = new double[root.length];
            evaluate(data, model, p, value, jacobian);
            for (int r = 0; r < value.length; r++) {
                value[r] *= root[r];
                if (jacobian != null) {
                    for (int i = r * np; i < (r + 1) * np; i++) {
                        jacobian[i] *= root[r];
                    }
                }
            }
            lastPoint = p.clone();
            lastValue = value;
        }
    }

    /**
     * A dense matrix in one row-major array. The optimiser negates every Jacobian it decomposes
     * and takes the result as rows ({@code scalarMultiply(−1).getData()}); here that costs one
     * pass and one set of rows, where {@link Array2DRowRealMatrix} goes entry by entry through
     * bounds checks and copies its rows twice.
     */
    private static final class Jacobian extends AbstractRealMatrix {
        private final int rows;
        private final int columns;
        private final double[] entries;

        Jacobian(int rows, int columns, double[] entries) {
            super(rows, columns);
            this.rows = rows;
            this.columns = columns;
            this.entries = entries;
        }

        @Override
        public int getRowDimension() {
            return rows;
        }

        @Override
        public int getColumnDimension() {
            return columns;
        }

        @Override
        public double getEntry(int row, int column) {
            MatrixUtils.checkMatrixIndex(this, row, column);
            return entries[row * columns + column];
        }

        @Override
        public void setEntry(int row, int column, double value) {
            MatrixUtils.checkMatrixIndex(this, row, column);
            entries[row * columns + column] = value;
        }

        @Override
        public RealMatrix createMatrix(int rowDimension, int columnDimension) {
            return new Array2DRowRealMatrix(rowDimension, columnDimension);
        }

        @Override
        public RealMatrix copy() {
            return new Jacobian(rows, columns, entries.clone());
        }

        @Override
        public RealMatrix scalarMultiply(double d) {
            double[] scaled = new double[entries.length];
            for (int i = 0; i < scaled.length; i++) {
                scaled[i] = d * entries[i];
            }
            return new Jacobian(rows, columns, scaled);
        }

        @Override
        public double[][] getData() {
            double[][] out = new double[rows][];
            for (int r = 0; r < rows; r++) {
                out[r] = Arrays.copyOfRange(entries, r * columns, (r + 1) * columns);
            }
            return out;
        }
    }

    // a weighted Jacobian whose information JᵀWJ = RᵀR is singular to working precision (some
    // |R_jj| below √u of the largest: a parameter the data do not determine) is refused, the
    // rule the explicit Cholesky factor of JᵀWJ kept by failing there; a poorly determined
    // parameter short of that gives large, honest uncertainties
    private static double[][] covariance(double[][] weightedColumns, int rows) {
        if (rows < weightedColumns.length) {
            return null;
        }
        double[][] cov = HouseholderQr.ofColumns(weightedColumns, rows, Math.sqrt(Math.ulp(1.0))).map(HouseholderQr::gramInverse).orElse(null);
        for (int i = 0; cov != null && i < cov.length; i++) {
            if (!(cov[i][i] > 0) || !Double.isFinite(cov[i][i])) {
                return null;
            }
        }
        return cov;
    }
}

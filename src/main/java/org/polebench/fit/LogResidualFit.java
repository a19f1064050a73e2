package org.polebench.fit;

import java.util.Arrays;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.ValueAndJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException;
import org.apache.commons.math3.linear.NonSymmetricMatrixException;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;

/**
 * Weighted least squares on complex-log residuals rₖ = ln(H_meas,k / H_model,k): real part in
 * nepers over σ_gain, imaginary part (principal value, so no phase unwrapping) in radians over
 * σ_phase; a magnitude-only sweep uses the real part alone (DESIGN.md, "Measured model").
 * Levenberg–Marquardt from Commons Math; its residual is target − model, so the target is zero
 * and the model value is −r/σ (PITFALLS.md, "Least squares").
 */
final class LogResidualFit {
    // a low band of five close poles with a pole–zero doublet in its start needs about 75
    // iterations (ManyCornerStageFitTest), so 60 stopped it short of the optimum; 150 leaves
    // margin. Candidates whose roots run away stop early through the box check.
    private static final int MAX_ITERATIONS = 150;
    private static final int MAX_EVALUATIONS = 300;
    // Stop once both the actual and the predicted relative fall of χ² over a step are below 1e-6
    // (Moré's ftol, MINPACK). The predicted fall of a full step is its length in the metric of JᵀWJ,
    // so what is left lies within √(1e-6·χ²) standard uncertainties of the optimum: 0.015 u at
    // χ² ≈ ν ≈ 200, and χ² itself within 2e-4 of its minimum, far below the differences of order one
    // that the order selection weighs. Tighter (1e-10, the default) bought only extra iterations
    // along the flat valleys of over-parameterised candidates.
    private static final double COST_TOLERANCE = 1e-6;
    // Commons Math's defaults: a noise-free sweep, whose χ² falls to round-off, stops on these and
    // is recovered far inside 1e-6 relative (NoiseFreeRecoveryTest)
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
                    return false;
                })
                .build();
        LeastSquaresOptimizer.Optimum optimum;
        try {
            optimum = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(COST_TOLERANCE)
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

    /** Thrown from inside the optimiser to stop a candidate whose root has run away. */
    private static final class RunawayRoot extends RuntimeException {
        private static final long serialVersionUID = 1L;

        RunawayRoot() {
            super(null, null, false, false);
        }
    }

    /** χ² and (JᵀWJ)⁻¹ with the points' own (not robust) weights at the given parameters. */
    RefinedFit assess(PreparedSweep data, RationalModel model, double[] p) {
        int n = data.size();
        int rows = data.residualCount();
        double[] value = new double[rows];
        double[][] jacobian = new double[rows][];
        evaluate(data, model, p, value, jacobian);
        int np = p.length;
        double chi2 = 0;
        double[][] info = new double[np][np];
        for (int r = 0; r < rows; r++) {
            double sigma = r < n ? data.sigmaGain[r] : data.sigmaPhase[r - n];
            double w = 1 / (sigma * sigma);
            chi2 += w * value[r] * value[r];
            double[] g = jacobian[r];
            for (int i = 0; i < np; i++) {
                double wg = w * g[i];
                for (int j = 0; j <= i; j++) {
                    info[i][j] += wg * g[j];
                }
            }
        }
        for (int i = 0; i < np; i++) {
            for (int j = 0; j < i; j++) {
                info[j][i] = info[i][j];
            }
        }
        return new RefinedFit(model, p, chi2, invert(info), rows);
    }

    /** Model value −r and its Jacobian ∂ ln H_model/∂p, gain rows first, then phase rows. */
    static void evaluate(PreparedSweep data, RationalModel model, double[] p, double[] value, double[][] jacobian) {
        int n = data.size();
        int np = p.length;
        double[] out = new double[2];
        double[] e = RationalModel.exponentials(p);
        double[] unusedPhaseRow = data.hasPhase ? null : new double[np];
        for (int k = 0; k < n; k++) {
            double[] gRe = new double[np];
            double[] gIm = data.hasPhase ? new double[np] : unusedPhaseRow;
            model.logAt(p, e, data.x[k], data.lnX[k], out, gRe, gIm);
            value[k] = out[0] - data.lnGain[k];
            jacobian[k] = gRe;
            if (data.hasPhase) {
                value[n + k] = wrapped(out[1] - data.phaseRad[k]);
                jacobian[n + k] = gIm;
            }
        }
    }

    /** Model value −r alone, without the Jacobian. */
    static void evaluate(PreparedSweep data, RationalModel model, double[] p, double[] value) {
        int n = data.size();
        double[] out = new double[2];
        double[] e = RationalModel.exponentials(p);
        for (int k = 0; k < n; k++) {
            model.logAt(p, e, data.x[k], data.lnX[k], out, null, null);
            value[k] = out[0] - data.lnGain[k];
            if (data.hasPhase) {
                value[n + k] = wrapped(out[1] - data.phaseRad[k]);
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
                double[] value = new double[root.length];
                evaluate(data, model, p, value);
                for (int r = 0; r < value.length; r++) {
                    value[r] *= root[r];
                }
                lastPoint = p.clone();
                lastValue = value;
            }
            return new ArrayRealVector(lastValue);
        }

        @Override
        public RealMatrix computeJacobian(double[] p) {
            double[] value = new double[root.length];
            double[][] jacobian = new double[root.length][];
            evaluate(data, model, p, value, jacobian);
            for (int r = 0; r < value.length; r++) {
                value[r] *= root[r];
                double[] g = jacobian[r];
                for (int i = 0; i < g.length; i++) {
                    g[i] *= root[r];
                }
            }
            lastPoint = p.clone();
            lastValue = value;
            return new Jacobian(jacobian);
        }

        @Override
        public Pair<RealVector, RealMatrix> value(RealVector point) {
            double[] p = point.toArray();
            RealMatrix jacobian = computeJacobian(p);
            return new Pair<>(computeValue(p), jacobian);
        }
    }

    /**
     * A dense matrix whose scalar multiple is formed row by row: the optimiser negates every
     * Jacobian it decomposes, and the inherited method goes entry by entry through bounds checks.
     */
    private static final class Jacobian extends Array2DRowRealMatrix {
        private static final long serialVersionUID = 1L;

        Jacobian(double[][] rows) {
            super(rows, false);
        }

        @Override
        public RealMatrix scalarMultiply(double d) {
            double[][] rows = getDataRef();
            double[][] out = new double[rows.length][];
            for (int i = 0; i < rows.length; i++) {
                double[] row = rows[i];
                double[] scaled = new double[row.length];
                for (int j = 0; j < row.length; j++) {
                    scaled[j] = d * row[j];
                }
                out[i] = scaled;
            }
            return new Array2DRowRealMatrix(out, false);
        }
    }

    private static double[][] invert(double[][] info) {
        try {
            // relative symmetry 1e-9 and absolute positivity 1e-300: only a truly singular
            // information matrix (a parameter the data do not touch) is refused here; a poorly
            // determined one gives large, honest uncertainties
            RealMatrix inverse = new CholeskyDecomposition(new Array2DRowRealMatrix(info, false), 1e-9, 1e-300)
                    .getSolver().getInverse();
            double[][] cov = inverse.getData();
            for (int i = 0; i < cov.length; i++) {
                if (!(cov[i][i] > 0) || !Double.isFinite(cov[i][i])) {
                    return null;
                }
            }
            return cov;
        } catch (NonPositiveDefiniteMatrixException | NonSymmetricMatrixException singular) {
            return null;
        }
    }
}

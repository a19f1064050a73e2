package org.polebench.waveform;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.polebench.InputProblem;
import org.polebench.units.MeasuredValueFormat;

/**
 * The sine fits of IEEE Std 1057-2017 (IEEE Standard for Digitizing Waveform Recorders, clause 8,
 * "sine fitting"), applied to both channels of a record at one frequency
 * (docs/method.md, "Sine fitting of scope records"):
 *
 * <ul>
 * <li>the three-parameter fit: with the frequency known, y ≈ a·cos ωt + b·sin ωt + d is linear in
 *     (a, b, d) and solved by least squares for each channel;</li>
 * <li>the four-parameter fit: the frequency free, one ω shared by both channels (both see the
 *     same generator), solved by the standard's iteration: linearise in Δω around the current ω,
 *     solve for (a, b, d) of each channel and Δω together, repeat. It starts from the frequency of
 *     the interpolated FFT peak ({@link SpectralPeak}).</li>
 * </ul>
 *
 * <p>Time is measured from the record's middle sample and scaled by the record's length (x from
 * −½ to ½), so the normal equations stay well conditioned at any frequency; the cosine and sine
 * follow one rotation per sample, recomputed exactly every 256 samples so its rounding cannot
 * grow. The parameters' covariance is σ̂²(JᵀJ)⁻¹ with σ̂ from each channel's own residuals
 * (a record's channels have their own noise), and gain and phase take theirs by first-order
 * propagation (GUM, JCGM 100:2008, 5.1.2), correlations included.
 */
public final class SineFitter {
    /** How many four-parameter iterations before the record counts as not converging. */
    static final int MAX_ITERATIONS = 60;
    private static final int RESYNC = 256;
    private static final double TWO_PI = 2 * Math.PI;

    /**
     * The three-parameter fit of both channels at a known frequency.
     *
     * @throws InputProblem when the record cannot be fitted (too short, the frequency beyond Nyquist)
     */
    public RecordFit fitKnown(WaveformRecord record, double frequencyHz) throws InputProblem {
        checkLength(record);
        double w = TWO_PI * frequencyHz * record.durationSeconds();
        if (!(frequencyHz > 0) || !(w < Math.PI * record.length())) {
            throw new InputProblem(record.file(), 0, "the stated frequency " + frequencyHz
                    + " Hz is not between 0 and half the sample rate", "check the frequency the record states");
        }
        Sums sums = new Sums();
        accumulate(record, w, sums);
        double[][] p = new double[2][];
        for (int k = 0; k < 2; k++) {
            p[k] = solve3(sums, k);
        }
        return result(record, w, p, false, 0, sums, frequencyHz);
    }

    /**
     * The four-parameter fit, frequency free, from the interpolated FFT peak.
     *
     * @throws InputProblem when the record cannot be fitted (too short, no peak, no convergence)
     */
    public RecordFit fitFree(WaveformRecord record) throws InputProblem {
        checkLength(record);
        double startHz = SpectralPeak.estimateHz(record);
        double w0 = TWO_PI * startHz * record.durationSeconds();
        Iterated first = iterate(record, w0);
        if (first == null) {
            // a poor start (a record of a period or two, a strong harmonic): start again from the
            // best of a grid a bin either side, as judged by the three-parameter residual
            first = iterate(record, bestOfGrid(record, w0));
        }
        if (first == null) {
            throw new InputProblem(record.file(), 0, "the four-parameter sine fit did not converge from "
                    + MeasuredValueFormat.engineering(startHz, "Hz", 6),
                    "check that the record holds one sine of a steady frequency, or state the frequency");
        }
        // the last step was a thousandth of w's uncertainty or less: the parameters it solved for
        // and the sums of the step before stand for the converged ones, which saves a pass
        return result(record, first.w, first.p, true, first.iterations, first.sums, Double.NaN);
    }

    private static void checkLength(WaveformRecord record) throws InputProblem {
        if (record.length() < 16) {
            throw new InputProblem(record.file(), 0, "the record holds " + record.length()
                    + " samples; a sine fit needs at least 16", "save the record with more samples");
        }
    }

    /** The result of the four-parameter iteration: the scaled frequency, the channels' (a, b, d), the sums
     * of the last pass, and how many steps it took. */
    private record Iterated(double w, double[][] p, Sums sums, int iterations) {
    }

    private Iterated iterate(WaveformRecord record, double w0) {
        int n = record.length();
        double wMax = Math.PI * n;
        if (!(w0 > 0) || !(w0 < wMax)) {
            return null;
        }
        Sums sums = new Sums();
        accumulate(record, w0, sums);
        double[][] p = {solve3(sums, 0), solve3(sums, 1)};
        double[] weight = new double[2];
        for (int k = 0; k < 2; k++) {
            double rss = Math.max(sums.yy[k] - (p[k][0] * sums.yc[k] + p[k][1] * sums.ys[k] + p[k][2] * sums.y[k]), 0);
            double floor = 1e-28 * Math.max(sums.yy[k] / n, Double.MIN_NORMAL);
            weight[k] = 1 / Math.max(rss / n, floor);
        }
        double w = w0;
        double lastStep = Double.POSITIVE_INFINITY;
        int stalled = 0;
        for (int iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
            double[] x = solve7(sums, p, weight);
            if (x == null) {
                return null;
            }
            double step = Math.max(-Math.PI, Math.min(Math.PI, x[6]));   // at most half a bin a step
            w += step;
            if (!(w > 0) || !(w < wMax)) {
                return null;
            }
            for (int k = 0; k < 2; k++) {
                p[k] = new double[] {x[3 * k], x[3 * k + 1], x[3 * k + 2]};
            }
            double size = Math.abs(step);
            // converged once the step is negligible against w itself, or against w's own standard
            // uncertainty (a thousandth of it changes nothing the fit reports)
            if (size <= 1e-12 * Math.max(w, TWO_PI) || size <= 1e-3 * Math.sqrt(x[7])) {
                return new Iterated(w, p, sums, iteration);
            }
            // rounding keeps the last steps from shrinking further: converged once they are a
            // millionth of a bin and no longer halve
            stalled = size > 0.5 * lastStep ? stalled + 1 : 0;
            if (stalled >= 3 && size < 1e-6 * TWO_PI) {
                accumulate(record, w, sums);
                return new Iterated(w, new double[][] {solve3(sums, 0), solve3(sums, 1)}, sums, iteration);
            }
            lastStep = size;
            accumulate(record, w, sums);
        }
        return null;
    }

    private double bestOfGrid(WaveformRecord record, double w0) {
        double best = w0;
        double bestRss = Double.POSITIVE_INFINITY;
        Sums sums = new Sums();
        for (int i = -8; i <= 8; i++) {
            double w = w0 + i * TWO_PI / 8;
            if (!(w > 0) || !(w < Math.PI * record.length())) {
                continue;
            }
            accumulate(record, w, sums);
            double rss = 0;
            for (int k = 0; k < 2; k++) {
                double[] p = solve3(sums, k);
                rss += (sums.yy[k] - (p[0] * sums.yc[k] + p[1] * sums.ys[k] + p[2] * sums.y[k])) / Math.max(sums.yy[k], 1e-300);
            }
            if (rss < bestRss) {
                bestRss = rss;
                best = w;
            }
        }
        return best;
    }

    /** @param statedHz the stated frequency, reported as given; NaN when fitted */
    private RecordFit result(WaveformRecord record, double w, double[][] p, boolean free, int iterations, Sums sums,
                             double statedHz) {
        int n = record.length();
        double[] rss = residuals(record, w, p);
        double dof = n - (free ? 4 : 3);
        double[] sigma2 = new double[2];
        for (int k = 0; k < 2; k++) {
            double scale = Math.hypot(p[k][0], p[k][1]) + Math.abs(p[k][2]);
            // a noiseless record leaves rounding only; a floor far below any real noise keeps the
            // covariance finite
            sigma2[k] = Math.max(rss[k] / dof, Math.pow(1e-15 * Math.max(scale, Double.MIN_NORMAL), 2));
        }
        double[][] cov = new double[7][7];
        if (free) {
            double[] weight = {1 / sigma2[0], 1 / sigma2[1]};
            RealMatrix inverse = new LUDecomposition(normal7(sums, p, weight)).getSolver().getInverse();
            for (int i = 0; i < 7; i++) {
                for (int j = 0; j < 7; j++) {
                    cov[i][j] = inverse.getEntry(i, j);
                }
            }
        } else {
            for (int k = 0; k < 2; k++) {
                RealMatrix inverse = new LUDecomposition(normal3(sums)).getSolver().getInverse();
                for (int i = 0; i < 3; i++) {
                    for (int j = 0; j < 3; j++) {
                        cov[3 * k + i][3 * k + j] = sigma2[k] * inverse.getEntry(i, j);
                    }
                }
            }
        }
        double duration = record.durationSeconds();
        double omega = w / duration;
        double middleSeconds = record.startSeconds() + (n - 1) / 2.0 * record.intervalSeconds();
        FittedSine[] sines = new FittedSine[2];
        double[][] gradA = new double[2][];
        double[][] gradPhi = new double[2][];
        for (int k = 0; k < 2; k++) {
            double a = p[k][0];
            double b = p[k][1];
            double amplitude = Math.hypot(a, b);
            double a2 = Math.max(amplitude * amplitude, Double.MIN_NORMAL);
            // A = √(a² + b²), φ = atan2(−b, a) for y = A·cos(θ + φ) = a·cos θ + b·sin θ
            gradA[k] = unit(7, 3 * k, a / Math.sqrt(a2), 3 * k + 1, b / Math.sqrt(a2));
            gradPhi[k] = unit(7, 3 * k, b / a2, 3 * k + 1, -a / a2);
            double phaseMiddle = Math.atan2(-b, a);
            sines[k] = new FittedSine(amplitude, fold(phaseMiddle - omega * middleSeconds), p[k][2],
                    Math.sqrt(quadratic(gradA[k], cov)), Math.sqrt(quadratic(gradPhi[k], cov)),
                    Math.sqrt(rss[k] / n), Math.sqrt(rss[k] / dof));
        }
        // ln G = ln A_out − ln A_in; θ = φ_out − φ_in, both at the same instant, so ω's own error cancels
        double[] gradLnG = new double[7];
        double[] gradTheta = new double[7];
        for (int i = 0; i < 7; i++) {
            gradLnG[i] = gradA[1][i] / Math.max(sines[1].amplitudeVolts(), Double.MIN_NORMAL)
                    - gradA[0][i] / Math.max(sines[0].amplitudeVolts(), Double.MIN_NORMAL);
            gradTheta[i] = gradPhi[1][i] - gradPhi[0][i];
        }
        double uLnG = Math.sqrt(quadratic(gradLnG, cov));
        double uTheta = Math.sqrt(quadratic(gradTheta, cov));
        double gainDb = 20 * Math.log10(sines[1].amplitudeVolts() / sines[0].amplitudeVolts());
        double theta = Math.atan2(-p[1][1], p[1][0]) - Math.atan2(-p[0][1], p[0][0]);
        double frequencyHz = free ? w / (TWO_PI * duration) : statedHz;
        double uFrequency = free ? Math.sqrt(Math.max(cov[6][6], 0)) / (TWO_PI * duration) : 0;
        return new RecordFit(frequencyHz, uFrequency, free, sines[0], sines[1], gainDb,
                20 / Math.log(10) * uLnG, Math.toDegrees(fold(theta)), Math.toDegrees(uTheta), iterations);
    }

    /** @return each channel's residual sum of squares at the fitted parameters, summed explicitly */
    private static double[] residuals(WaveformRecord record, double w, double[][] p) {
        double[] in = record.inputSamples();
        double[] out = record.outputSamples();
        int n = in.length;
        double invN = 1.0 / n;
        double middle = (n - 1) / 2.0;
        double stepCos = Math.cos(w * invN);
        double stepSin = Math.sin(w * invN);
        double r0 = 0;
        double r1 = 0;
        for (int start = 0; start < n; start += RESYNC) {
            double theta0 = w * ((start - middle) * invN);
            double c = Math.cos(theta0);
            double s = Math.sin(theta0);
            int end = Math.min(n, start + RESYNC);
            for (int i = start; i < end; i++) {
                double e0 = in[i] - (p[0][0] * c + p[0][1] * s + p[0][2]);
                double e1 = out[i] - (p[1][0] * c + p[1][1] * s + p[1][2]);
                r0 += e0 * e0;
                r1 += e1 * e1;
                double next = c * stepCos - s * stepSin;
                s = s * stepCos + c * stepSin;
                c = next;
            }
        }
        return new double[] {r0, r1};
    }

    /**
     * The sums the normal equations need, over the record's samples at scaled frequency w: of the
     * cosine and sine and their products (shared by both channels), weighted by x and x² (for the
     * four-parameter fit's Δω column), and of each channel's samples against them.
     */
    static final class Sums {
        int n;
        double cc, ss, cs, c, s;
        double xcc, xss, xcs, xc, xs;
        double x2cc, x2ss, x2cs;
        final double[] yc = new double[2];
        final double[] ys = new double[2];
        final double[] y = new double[2];
        final double[] yy = new double[2];
        final double[] xyc = new double[2];
        final double[] xys = new double[2];
    }

    static void accumulate(WaveformRecord record, double w, Sums out) {
        double[] in = record.inputSamples();
        double[] op = record.outputSamples();
        int n = in.length;
        double invN = 1.0 / n;
        double middle = (n - 1) / 2.0;
        double stepCos = Math.cos(w * invN);
        double stepSin = Math.sin(w * invN);
        double cc = 0, ss = 0, cs = 0, c1 = 0, s1 = 0;
        double xcc = 0, xss = 0, xcs = 0, xc = 0, xs = 0;
        double x2cc = 0, x2ss = 0, x2cs = 0;
        double y0c = 0, y0s = 0, y0 = 0, y0y = 0, x0c = 0, x0s = 0;
        double y1c = 0, y1s = 0, y1 = 0, y1y = 0, x1c = 0, x1s = 0;
        // blocks of RESYNC samples: each block starts from Math.cos and Math.sin, then rotates
        for (int start = 0; start < n; start += RESYNC) {
            double theta0 = w * ((start - middle) * invN);
            double c = Math.cos(theta0);
            double s = Math.sin(theta0);
            int end = Math.min(n, start + RESYNC);
            for (int i = start; i < end; i++) {
                double x = (i - middle) * invN;
                double c2 = c * c;
                double s2 = s * s;
                double csp = c * s;
                cc += c2;
                ss += s2;
                cs += csp;
                c1 += c;
                s1 += s;
                double xc2 = x * c2;
                double xs2 = x * s2;
                double xcs1 = x * csp;
                xcc += xc2;
                xss += xs2;
                xcs += xcs1;
                xc += x * c;
                xs += x * s;
                x2cc += x * xc2;
                x2ss += x * xs2;
                x2cs += x * xcs1;
                double a = in[i];
                double b = op[i];
                double ac = a * c;
                double as = a * s;
                double bc = b * c;
                double bs = b * s;
                y0c += ac;
                y0s += as;
                y0 += a;
                y0y += a * a;
                x0c += x * ac;
                x0s += x * as;
                y1c += bc;
                y1s += bs;
                y1 += b;
                y1y += b * b;
                x1c += x * bc;
                x1s += x * bs;
                double next = c * stepCos - s * stepSin;
                s = s * stepCos + c * stepSin;
                c = next;
            }
        }
        out.n = n;
        out.cc = cc;
        out.ss = ss;
        out.cs = cs;
        out.c = c1;
        out.s = s1;
        out.xcc = xcc;
        out.xss = xss;
        out.xcs = xcs;
        out.xc = xc;
        out.xs = xs;
        out.x2cc = x2cc;
        out.x2ss = x2ss;
        out.x2cs = x2cs;
        out.yc[0] = y0c;
        out.ys[0] = y0s;
        out.y[0] = y0;
        out.yy[0] = y0y;
        out.xyc[0] = x0c;
        out.xys[0] = x0s;
        out.yc[1] = y1c;
        out.ys[1] = y1s;
        out.y[1] = y1;
        out.yy[1] = y1y;
        out.xyc[1] = x1c;
        out.xys[1] = x1s;
    }

    private static RealMatrix normal3(Sums s) {
        return new Array2DRowRealMatrix(new double[][] {
            {s.cc, s.cs, s.c}, {s.cs, s.ss, s.s}, {s.c, s.s, s.n}}, false);
    }

    /** @return (a, b, d) of channel k, the three-parameter least-squares solution */
    static double[] solve3(Sums s, int k) {
        DecompositionSolver solver = new LUDecomposition(normal3(s)).getSolver();
        return solver.solve(new ArrayRealVector(new double[] {s.yc[k], s.ys[k], s.y[k]}, false)).toArray();
    }

    /**
     * The weighted normal matrix of the four-parameter step: unknowns (a₀, b₀, d₀, a₁, b₁, d₁, Δw);
     * each channel's rows are [cos θ, sin θ, 1, g] with g = ∂y/∂w = x·(−a·sin θ + b·cos θ).
     */
    private static RealMatrix normal7(Sums s, double[][] p, double[] weight) {
        double[][] m = new double[7][7];
        for (int k = 0; k < 2; k++) {
            double a = p[k][0];
            double b = p[k][1];
            double wk = weight[k];
            double[][] block = {{s.cc, s.cs, s.c}, {s.cs, s.ss, s.s}, {s.c, s.s, s.n}};
            double[] g = {-a * s.xcs + b * s.xcc, -a * s.xss + b * s.xcs, -a * s.xs + b * s.xc};
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 3; j++) {
                    m[3 * k + i][3 * k + j] = wk * block[i][j];
                }
                m[3 * k + i][6] = wk * g[i];
                m[6][3 * k + i] = wk * g[i];
            }
            m[6][6] += wk * (a * a * s.x2ss - 2 * a * b * s.x2cs + b * b * s.x2cc);
        }
        return new Array2DRowRealMatrix(m, false);
    }

    /** @return (a₀, b₀, d₀, a₁, b₁, d₁, Δw) and, eighth, var(w) at these weights; null when singular */
    private static double[] solve7(Sums s, double[][] p, double[] weight) {
        double[] rhs = new double[7];
        for (int k = 0; k < 2; k++) {
            rhs[3 * k] = weight[k] * s.yc[k];
            rhs[3 * k + 1] = weight[k] * s.ys[k];
            rhs[3 * k + 2] = weight[k] * s.y[k];
            rhs[6] += weight[k] * (-p[k][0] * s.xys[k] + p[k][1] * s.xyc[k]);
        }
        DecompositionSolver solver = new LUDecomposition(normal7(s, p, weight)).getSolver();
        if (!solver.isNonSingular()) {
            return null;
        }
        double[] x = java.util.Arrays.copyOf(solver.solve(new ArrayRealVector(rhs, false)).toArray(), 8);
        // the weights are 1/σ² of each channel, so the inverse's last diagonal element is var(w)
        double[] unitW = new double[7];
        unitW[6] = 1;
        x[7] = Math.max(solver.solve(new ArrayRealVector(unitW, false)).getEntry(6), 0);
        for (double v : x) {
            if (!Double.isFinite(v)) {
                return null;
            }
        }
        return x;
    }

    private static double[] unit(int size, int i, double vi, int j, double vj) {
        double[] v = new double[size];
        v[i] = vi;
        v[j] = vj;
        return v;
    }

    private static double quadratic(double[] g, double[][] cov) {
        double sum = 0;
        for (int i = 0; i < g.length; i++) {
            if (g[i] == 0) {
                continue;
            }
            for (int j = 0; j < g.length; j++) {
                sum += g[i] * cov[i][j] * g[j];
            }
        }
        return Math.max(sum, 0);
    }

    /** @return the angle folded into (−π, π] */
    static double fold(double radians) {
        double folded = radians - TWO_PI * Math.floor(radians / TWO_PI);
        return folded > Math.PI ? folded - TWO_PI : folded;
    }
}

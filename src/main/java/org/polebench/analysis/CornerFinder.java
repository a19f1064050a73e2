package org.polebench.analysis;

import java.util.OptionalDouble;

/**
 * The exact −3 dB corners of a state-space model (docs/method.md, "Exact corners"): where |H(jω)|
 * crosses |midband gain|/√2, bracketed by a scan in steps of 1/{@value #STEPS_PER_DECADE}
 * decade and solved with Brent's method (Brent, Algorithms for Minimization without
 * Derivatives, 1973, chapter 4: bisection, secant and inverse quadratic interpolation) on
 * ln ω, to 1e-12 in ln ω. The function is |H|²/target − 1: finite where |H| = 0, of the sign
 * of |H| − |D|/√2, and evaluated through the model's Hessenberg form
 * ({@link HessenbergResponse}), O(k²) per point.
 *
 * <p>Lower corner: the scan runs down from 10 times a bound on the largest pole
 * ({@link SpectralBound}; above every pole, where H ≈ D) and takes the first crossing, so with
 * peaking it is the highest one below midband. Upper corner: the scan runs up from 0.1 times a
 * bound below the smallest high-band pole and takes the first crossing above midband. Two
 * crossings closer than one step (a very sharp dip) would be missed. Empty when the midband
 * gain is 0, when the band has no capacitors, or when the response never crosses within three
 * decades beyond the poles (a shelf that stays above −3 dB). Immutable.
 */
public final class CornerFinder {
    public static final int STEPS_PER_DECADE = 20;
    private static final double STEP = Math.pow(10, 1.0 / STEPS_PER_DECADE);
    private static final double LN_OMEGA_ACCURACY = 1e-12;
    private static final int MAX_EVALUATIONS = 200;

    /** @return the exact lower −3 dB corner of a low-band model in rad/s */
    public OptionalDouble lowerCornerRadPerS(StateModel lowBand) {
        double d = lowBand.directGain();
        if (lowBand.order() == 0 || d == 0) {
            return OptionalDouble.empty();
        }
        HessenbergResponse response = new HessenbergResponse(lowBand);
        double target = d * d / 2;
        double hi = 10 * lowBand.largestPoleBound();
        double excessHi = excess(response, target, hi);
        for (int tries = 0; tries < 6 && !(excessHi > 0); tries++) {
            hi *= 10;
            excessHi = excess(response, target, hi);
        }
        // floor = 1e-3/bound(A⁻¹) ≤ 1e-3·|smallest pole| ≤ 1e-3·bound(A): above half of that the
        // scan is surely above the floor, which is then left uncomputed
        double surelyAbove = 0.5e-3 * lowBand.largestPoleBound();
        double floor = Double.NaN;
        while (true) {
            if (!(hi > surelyAbove)) {
                if (Double.isNaN(floor)) {
                    floor = 1e-3 / lowBand.inverseSmallestPoleBound();
                }
                if (!(hi > floor)) {
                    break;
                }
            }
            double lo = hi / STEP;
            double excessLo = excess(response, target, lo);
            if (excessLo <= 0) {
                return solve(response, target, lo, excessLo, hi, excessHi);
            }
            hi = lo;
            excessHi = excessLo;
        }
        return OptionalDouble.empty();
    }

    /**
     * @param midbandGain the low-band model's D, V/V: the high-band response approaches it below
     *                    the high-band poles
     * @return the exact upper −3 dB corner of a high-band model in rad/s
     */
    public OptionalDouble upperCornerRadPerS(StateModel highBand, double midbandGain) {
        if (highBand.order() == 0 || midbandGain == 0) {
            return OptionalDouble.empty();
        }
        HessenbergResponse response = new HessenbergResponse(highBand);
        double target = midbandGain * midbandGain / 2;
        double lo = 0.1 / highBand.inverseSmallestPoleBound();
        double excessLo = excess(response, target, lo);
        for (int tries = 0; tries < 6 && !(excessLo > 0); tries++) {
            lo /= 10;
            excessLo = excess(response, target, lo);
        }
        double ceiling = 1e3 * highBand.largestPoleBound();
        while (lo < ceiling) {
            double hi = lo * STEP;
            double excessHi = excess(response, target, hi);
            if (excessHi <= 0) {
                return solve(response, target, hi, excessHi, lo, excessLo);
            }
            lo = hi;
            excessLo = excessHi;
        }
        return OptionalDouble.empty();
    }

    /** @return |H(jω)|²/target − 1: above 0 where the gain is above the −3 dB level */
    private static double excess(HessenbergResponse response, double target, double omegaRadPerS) {
        return response.magnitudeSquared(omegaRadPerS) / target - 1;
    }

    /**
     * Brent's zero finder in ln ω between a scan's two last points, whose values it reuses: at
     * {@code below} the excess is at most 0, at {@code above} it is positive. Written out here
     * rather than through Commons Math's {@code BrentSolver}, which evaluates both ends and a
     * midpoint again and builds its solver and counter objects per call: a tolerance spread
     * finds 10,000 corners. The root is the same crossing to the same 1e-12 in ln ω; only where
     * within that tolerance the iteration stops can differ.
     *
     * @return the crossing in rad/s; empty when the iteration runs out of evaluations (or meets NaN)
     */
    private static OptionalDouble solve(HessenbergResponse response, double target, double below,
                                        double excessBelow, double above, double excessAbove) {
        if (excessBelow == 0) {
            return OptionalDouble.of(below);
        }
        double a = Math.log(above);
        double fa = excessAbove;
        double b = Math.log(below);
        double fb = excessBelow;
        double c = a;
        double fc = fa;
        double e = b - a;
        double d = e;
        for (int evaluation = 0; evaluation < MAX_EVALUATIONS; evaluation++) {
            if (Math.abs(fc) < Math.abs(fb)) {
                // b is the best estimate so far, c the other end of the bracket
                a = b;
                b = c;
                c = a;
                fa = fb;
                fb = fc;
                fc = fa;
            }
            double tolerance = 2 * Math.ulp(1.0) * Math.abs(b) + LN_OMEGA_ACCURACY;
            double m = 0.5 * (c - b);
            if (Math.abs(m) <= tolerance || fb == 0) {
                return OptionalDouble.of(Math.exp(b));
            }
            if (Math.abs(e) < tolerance || Math.abs(fa) <= Math.abs(fb)) {
                d = m;
                e = m;
            } else {
                double s = fb / fa;
                double p;
                double q;
                if (a == c) {
                    p = 2 * m * s;
                    q = 1 - s;
                } else {
                    double r = fb / fc;
                    q = fa / fc;
                    p = s * (2 * m * q * (q - r) - (b - a) * (r - 1));
                    q = (q - 1) * (r - 1) * (s - 1);
                }
                if (p > 0) {
                    q = -q;
                } else {
                    p = -p;
                }
                // interpolate only when the step falls well inside the bracket and shrinks fast enough
                if (2 * p < 3 * m * q - Math.abs(tolerance * q) && p < Math.abs(0.5 * e * q)) {
                    e = d;
                    d = p / q;
                } else {
                    d = m;
                    e = m;
                }
            }
            a = b;
            fa = fb;
            b += Math.abs(d) > tolerance ? d : (m > 0 ? tolerance : -tolerance);
            fb = excess(response, target, Math.exp(b));
            if (Double.isNaN(fb)) {
                return OptionalDouble.empty();
            }
            if ((fb > 0) == (fc > 0)) {
                c = a;
                fc = fa;
                e = b - a;
                d = e;
            }
        }
        return OptionalDouble.empty();
    }

    /**
     * ∂ln ω/∂ln C_i of a corner ω where |H(jω)|² = const, by implicit differentiation. With
     * x = (sI − A)⁻¹B and w = (sI − A)⁻ᵀCᵀ at s = jω: since ∂A/∂ln C_i = −(row i of A) and
     * ∂B_i/∂ln C_i = −B_i, ∂H/∂ln C_i = −s·w_i·x_i, and ∂H/∂s = −Σ w_i·x_i. The values sum to −1
     * (scaling every capacitor by a scales every frequency by 1/a).
     *
     * @param model         a model without links (every low-band model)
     * @param cornerRadPerS a corner found by this class for the same model
     * @return one value per port, in port order
     */
    public double[] cornerSensitivities(StateModel model, double cornerRadPerS) {
        if (model.hasLinks()) {
            throw new IllegalArgumentException("sensitivities assume a diagonal capacitance matrix");
        }
        int k = model.order();
        ResponseEvaluator evaluator = new ResponseEvaluator(model);
        evaluator.evaluate(cornerRadPerS);
        evaluator.solveAdjoint();
        double hr = evaluator.responseRe();
        double hi = evaluator.responseIm();
        double[] numerator = new double[k];
        double denominator = 0;
        for (int i = 0; i < k; i++) {
            double pr = evaluator.stateRe(i) * evaluator.adjointRe(i) - evaluator.stateIm(i) * evaluator.adjointIm(i);
            double pi = evaluator.stateRe(i) * evaluator.adjointIm(i) + evaluator.stateIm(i) * evaluator.adjointRe(i);
            // Re(conj(H)·(−j)·p) = Re(conj(H)·(pi − j·pr)) = hr·pi − hi·pr
            numerator[i] = hr * pi - hi * pr;
            denominator += numerator[i];
        }
        double[] result = new double[k];
        for (int i = 0; i < k; i++) {
            result[i] = -numerator[i] / denominator;
        }
        return result;
    }
}

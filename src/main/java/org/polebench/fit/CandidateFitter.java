package org.polebench.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.polebench.units.Decibels;

/**
 * Fits one candidate order: a number of low-band poles, of DC zeros, and whether a high-band
 * pole is present. Starts from the predicted poles when their count matches, else from the
 * Sanathanan–Koerner estimate; refines with LM. Where two fitted real poles lie within a factor
 * of three of each other and the fit leaves more misfit than noise explains, the data may really
 * hold a complex pair, so the pair is tried as well and kept when it fits better with damping
 * below one.
 */
final class CandidateFitter {
    private static final double CLOSE_POLES = 3;

    private final SanathananKoerner linearised = new SanathananKoerner();
    private final LogResidualFit refinement = new LogResidualFit();

    /**
     * @param startPolesRadPerS predicted poles (empty for none)
     * @param unconstrained     {@link #unconstrainedEstimate} for this pole count and high-band
     *                          option, the start of the candidate without DC zeros (null: make it)
     * @return the best fit of this order, or null when no start converges
     */
    RefinedFit fit(PreparedSweep data, int poles, int dcZeros, boolean high, List<Complex> startPolesRadPerS,
                   RationalEstimate unconstrained) {
        int finiteZeros = poles - dcZeros;
        double highX = high ? highBandStart(data) : Double.NaN;
        StartingPoint start;
        if (poles == 0) {
            ModelStructure structure = new ModelStructure(0, 0, 0, 0, 0, high);
            double[] p = new double[structure.parameterCount()];
            if (high) {
                p[structure.highBandOffset()] = Math.log(highX);
            }
            start = StartingPoint.matchGainAndSign(new RationalModel(structure, false), p, data);
        } else {
            RationalEstimate estimate;
            if (startPolesRadPerS.size() == poles) {
                estimate = linearised.numeratorFor(data, dcZeros, finiteZeros,
                        predictedDenominator(data, startPolesRadPerS), highX);
            } else if (dcZeros == 0 && unconstrained != null) {
                estimate = unconstrained;
            } else {
                estimate = linearised.estimate(data, dcZeros, finiteZeros, poles, highX);
            }
            start = estimate == null ? null : StartingPoint.from(estimate, data, dcZeros, highX);
        }
        if (start == null) {
            return null;
        }
        RefinedFit best = refinement.refine(data, start.model, start.parameters, null);
        if (best != null && best.structure().realPoles() >= 2 && misfitExceedsNoise(best)) {
            RefinedFit paired = tryPair(data, best);
            if (paired != null && paired.chiSquare < best.chiSquare) {
                best = paired;
            }
        }
        return best;
    }

    /**
     * Which DC-zero counts to try. From the unconstrained linearised estimate: its zeros more than
     * a factor 3 below the lowest swept frequency are indistinguishable from DC zeros there, and a
     * zero within a factor 3 of that edge is ambiguous, so the count with it at DC is tried too.
     * That estimate never puts a zero exactly at DC and can hide DC zeros in finite zeros low in
     * the band (docs/method.md, "Model"), so the counts the data's own slope implies are added:
     * m DC zeros rise at 20·m dB per decade below every other root, finite zeros low in the band
     * steepen that and poles below it flatten it, so the integer nearest the slope over the
     * lowest decade of the sweep is tried, and both integers beside it when it lies between
     * n + 0.25 and n + 0.75.
     *
     * @param unconstrained {@link #unconstrainedEstimate} for this pole count (null when it failed)
     * @return for each count 0…poles, whether to try it
     */
    boolean[] dcZeroCounts(PreparedSweep data, int poles, RationalEstimate unconstrained) {
        boolean[] counts = new boolean[poles + 1];
        double slope = lowDecadeSlope(data);
        if (Double.isFinite(slope)) {
            counts[clampCount(Math.rint(slope), poles)] = true;
            // a slope midway between two integers speaks for both
            double fraction = slope - Math.floor(slope);
            if (Math.abs(fraction - 0.5) < 0.25) {
                counts[clampCount(Math.floor(slope), poles)] = true;
                counts[clampCount(Math.ceil(slope), poles)] = true;
            }
        }
        RationalEstimate estimate = unconstrained;
        PolynomialRoots zeros = estimate == null ? null : PolynomialRoots.of(estimate.numerator);
        if (zeros == null) {
            // no estimate to vote: try them all, as before the slope was consulted
            Arrays.fill(counts, true);
            return counts;
        }
        double below = data.x[0] / 3;
        double above = data.x[0] * 3;
        int dc = 0;
        int ambiguous = 0;
        for (double z : zeros.real) {
            double magnitude = estimate.squaredMagnitude ? Math.sqrt(Math.abs(z)) : Math.abs(z);
            dc += magnitude < below ? 1 : 0;
            ambiguous += magnitude >= below && magnitude < above ? 1 : 0;
        }
        for (Complex z : zeros.pairs) {
            double magnitude = estimate.squaredMagnitude ? Math.sqrt(z.abs()) : z.abs();
            dc += magnitude < below ? 2 : 0;
            ambiguous += magnitude >= below && magnitude < above ? 2 : 0;
        }
        for (int m = Math.min(dc, poles); m <= Math.min(dc + Math.min(ambiguous, 1), poles); m++) {
            counts[m] = true;
        }
        return counts;
    }

    /**
     * The Sanathanan–Koerner estimate with as many free zeros as poles and none fixed at DC.
     *
     * @param high whether the candidates carry a high-band pole (divided out of the data first)
     * @return the estimate, or null when its linear problem is singular
     */
    RationalEstimate unconstrainedEstimate(PreparedSweep data, int poles, boolean high) {
        return linearised.estimate(data, 0, poles, poles, high ? highBandStart(data) : Double.NaN);
    }

    /**
     * The least-squares slope of ln|H| against ln f over the sweep's lowest decade (at least its
     * lowest three points), in units of 20 dB per decade; NaN when those points span no frequency.
     */
    static double lowDecadeSlope(PreparedSweep data) {
        int n = 0;
        while (n < data.size() && (n < 3 || data.x[n] <= 10 * data.x[0])) {
            n++;
        }
        double sx = 0;
        double sy = 0;
        for (int k = 0; k < n; k++) {
            sx += Math.log(data.x[k]);
            sy += data.lnGain[k];
        }
        double mx = sx / n;
        double my = sy / n;
        double sxx = 0;
        double sxy = 0;
        for (int k = 0; k < n; k++) {
            double dx = Math.log(data.x[k]) - mx;
            sxx += dx * dx;
            sxy += dx * (data.lnGain[k] - my);
        }
        return sxx > 0 ? sxy / sxx : Double.NaN;
    }

    private static int clampCount(double count, int poles) {
        return (int) Math.max(0, Math.min(poles, count));
    }

    /**
     * Whether χ² lies above ν + 3√(2ν), three standard deviations of a χ² with ν degrees of
     * freedom above its mean: only then do the data demand more than real poles can give.
     */
    private static boolean misfitExceedsNoise(RefinedFit fit) {
        double nu = fit.degreesOfFreedom();
        return fit.chiSquare > nu + 3 * Math.sqrt(2 * nu);
    }

    /** Re-fits with the two closest real poles as one complex-pair factor; null unless damping ends below one. */
    private RefinedFit tryPair(PreparedSweep data, RefinedFit fit) {
        ModelStructure s = fit.structure();
        int off = s.realPoleOffset();
        int a = -1;
        int b = -1;
        double closest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < s.realPoles(); i++) {
            for (int j = i + 1; j < s.realPoles(); j++) {
                double ratio = Math.abs(fit.parameters[off + i] - fit.parameters[off + j]);
                if (ratio < closest) {
                    closest = ratio;
                    a = i;
                    b = j;
                }
            }
        }
        if (closest > Math.log(CLOSE_POLES)) {
            return null;
        }
        ModelStructure paired = new ModelStructure(s.dcZeros(), s.realZeros(), s.zeroPairs(), s.realPoles() - 2,
                s.polePairs() + 1, s.highBandPole());
        double[] p = new double[paired.parameterCount()];
        System.arraycopy(fit.parameters, 0, p, 0, off);
        int k = off;
        for (int i = 0; i < s.realPoles(); i++) {
            if (i != a && i != b) {
                p[k++] = fit.parameters[off + i];
            }
        }
        for (int i = 0; i < 2 * s.polePairs(); i++) {
            p[k++] = fit.parameters[s.polePairOffset() + i];
        }
        // (s + p₁)(s + p₂) = s² + 2ζω₀s + ω₀² with ω₀ = √(p₁p₂), ζ = (p₁ + p₂)/(2ω₀) ≥ 1; start just under 1
        double p1 = Math.exp(fit.parameters[off + a]);
        double p2 = Math.exp(fit.parameters[off + b]);
        p[k++] = 0.5 * (Math.log(p1) + Math.log(p2));
        p[k++] = Math.log(0.9);
        if (s.highBandPole()) {
            p[k] = fit.parameters[s.highBandOffset()];
        }
        RefinedFit refined = refinement.refine(data, new RationalModel(paired, fit.model.inverting()), p, null);
        if (refined == null) {
            return null;
        }
        int pair = paired.polePairOffset() + 2 * (paired.polePairs() - 1);
        return refined.parameters[pair + 1] < 0 ? refined : null;
    }

    /**
     * A start for the high-band pole from the drop d (dB) of the top point below the sweep's
     * maximum: a single pole is d dB down at f where (f/f_h)² = 10^(d/10) − 1.
     */
    static double highBandStart(PreparedSweep data) {
        int n = data.size();
        double max = Double.NEGATIVE_INFINITY;
        for (double g : data.lnGain) {
            max = Math.max(max, g);
        }
        double dropDb = (max - data.lnGain[n - 1]) / Decibels.NEPERS_PER_DB;
        double ratio = dropDb > 0.1 ? Math.sqrt(Math.pow(10, dropDb / 10) - 1) : 0.1;
        return data.x[n - 1] / ratio;
    }

    /** The predicted poles' monic polynomial in the data's variable (s/ω_ref, or (ω/ω_ref)² for |H|²). */
    private static double[] predictedDenominator(PreparedSweep data, List<Complex> polesRadPerS) {
        double omegaRef = 2 * Math.PI * data.referenceHz;
        List<Double> real = new ArrayList<>();
        List<Complex> pairs = new ArrayList<>();
        for (Complex pole : polesRadPerS) {
            Complex p = pole.divide(omegaRef);
            if (Math.abs(p.getImaginary()) <= 1e-9 * p.abs()) {
                // |jω − p|² = ω² + p²: a root at −p² in the variable ω²
                real.add(data.hasPhase ? p.getReal() : -p.getReal() * p.getReal());
            } else if (p.getImaginary() > 0) {
                pairs.add(data.hasPhase ? p : p.multiply(p).negate());
            }
        }
        if (!data.hasPhase) {
            // −p² of the upper member has negative imaginary part; its conjugate is the upper one
            List<Complex> upper = new ArrayList<>();
            for (Complex c : pairs) {
                upper.add(c.getImaginary() >= 0 ? c : c.conjugate());
            }
            pairs = upper;
        }
        return PolynomialRoots.monicFrom(real, pairs);
    }
}

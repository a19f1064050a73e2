package org.polebench.fit;

import java.util.ArrayList;
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
     * @return the best fit of this order, or null when no start converges
     */
    RefinedFit fit(PreparedSweep data, int poles, int dcZeros, boolean high, List<Complex> startPolesRadPerS) {
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
            RationalEstimate estimate = startPolesRadPerS.size() == poles
                    ? linearised.numeratorFor(data, dcZeros, finiteZeros, predictedDenominator(data, startPolesRadPerS),
                    highX)
                    : linearised.estimate(data, dcZeros, finiteZeros, poles, highX);
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

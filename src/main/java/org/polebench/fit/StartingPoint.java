package org.polebench.fit;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;

/**
 * A model structure with starting parameters, read off a linearised estimate: its polynomial
 * roots become ln(−p/ω_ref) (real) or (ln ω₀, ln ζ) (pairs); roots in the right half-plane are
 * reflected (a stable, minimum-phase start); ln|K| and the sign of K are then set to match the
 * data's mean gain and phase.
 */
final class StartingPoint {
    /** Starting roots are kept within a factor 1000 beyond the band's ends. */
    private static final double REACH = Math.log(1000);
    private static final double MIN_DAMPING = 0.02;
    private static final double MAX_DAMPING = 0.999;

    final RationalModel model;
    final double[] parameters;

    private StartingPoint(RationalModel model, double[] parameters) {
        this.model = model;
        this.parameters = parameters;
    }

    /** @return the start, or null when the estimate's roots cannot be found */
    static StartingPoint from(RationalEstimate estimate, PreparedSweep data, int dcZeros, double highBandX) {
        PolynomialRoots zeros = PolynomialRoots.of(estimate.numerator);
        PolynomialRoots poles = PolynomialRoots.of(estimate.denominator);
        if (zeros == null || poles == null) {
            return null;
        }
        if (estimate.squaredMagnitude) {
            zeros = fromSquaredMagnitude(zeros);
            poles = fromSquaredMagnitude(poles);
        }
        boolean high = !Double.isNaN(highBandX);
        ModelStructure structure = new ModelStructure(dcZeros, zeros.real.size(), zeros.pairs.size(),
                poles.real.size(), poles.pairs.size(), high);
        double[] p = new double[structure.parameterCount()];
        double lo = Math.log(data.x[0]) - REACH;
        double hi = Math.log(data.x[data.size() - 1]) + REACH;
        put(p, structure.realZeroOffset(), structure.zeroPairOffset(), zeros, lo, hi);
        put(p, structure.realPoleOffset(), structure.polePairOffset(), poles, lo, hi);
        if (high) {
            p[structure.highBandOffset()] = clamp(Math.log(highBandX), lo, hi);
        }
        return matchGainAndSign(new RationalModel(structure, false), p, data);
    }

    /** Sets ln|K| to the weighted mean gain misfit and K's sign from the circular mean phase misfit. */
    static StartingPoint matchGainAndSign(RationalModel model, double[] p, PreparedSweep data) {
        p[0] = 0;
        double[] out = new double[2];
        double sum = 0;
        double weights = 0;
        double sin = 0;
        double cos = 0;
        for (int k = 0; k < data.size(); k++) {
            model.logAt(p, data.x[k], out, null, null);
            double w = 1 / (data.sigmaGain[k] * data.sigmaGain[k]);
            sum += w * (data.lnGain[k] - out[0]);
            weights += w;
            if (data.hasPhase) {
                double d = data.phaseRad[k] - out[1];
                sin += Math.sin(d);
                cos += Math.cos(d);
            }
        }
        p[0] = sum / weights;
        boolean inverting = data.hasPhase && Math.abs(Math.atan2(sin, cos)) > Math.PI / 2;
        return new StartingPoint(new RationalModel(model.structure(), inverting ^ model.inverting()), p);
    }

    private static void put(double[] p, int realOffset, int pairOffset, PolynomialRoots roots, double lo, double hi) {
        for (int i = 0; i < roots.real.size(); i++) {
            double magnitude = Math.abs(roots.real.get(i));
            p[realOffset + i] = clamp(magnitude > 0 ? Math.log(magnitude) : lo, lo, hi);
        }
        for (int i = 0; i < roots.pairs.size(); i++) {
            Complex c = roots.pairs.get(i);
            double zeta = Math.min(MAX_DAMPING, Math.max(MIN_DAMPING, Math.abs(c.getReal()) / c.abs()));
            p[pairOffset + 2 * i] = clamp(Math.log(c.abs()), lo, hi);
            p[pairOffset + 2 * i + 1] = Math.log(zeta);
        }
    }

    /** Maps roots t of a polynomial in x² (|H|²) to the left-half-plane roots s = −√(−t). */
    private static PolynomialRoots fromSquaredMagnitude(PolynomialRoots inX2) {
        List<Double> real = new ArrayList<>();
        List<Complex> pairs = new ArrayList<>();
        for (double t : inX2.real) {
            // a real pole gives t = −p² < 0; t > 0 is round-off or a misfit, read as the nearest real root
            real.add(-Math.sqrt(Math.abs(t)));
        }
        for (Complex t : inX2.pairs) {
            Complex s = t.negate().sqrt().negate();
            pairs.add(new Complex(-Math.abs(s.getReal()), Math.abs(s.getImaginary())));
        }
        return PolynomialRoots.of(real, pairs);
    }

    private static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }
}

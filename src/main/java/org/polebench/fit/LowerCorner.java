package org.polebench.fit;

import java.util.OptionalDouble;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.exception.MathIllegalStateException;

/**
 * The lower −3 dB corner, two ways. Of the model: the highest normalised frequency below
 * midband at which the low band's gain is |K|/√2 (a response with peaking may cross more than
 * once; docs/method.md, "Exact corners"), bracketed by scanning down from well above every root and solved
 * with Brent's method in ln x; its gradient in the parameters follows from the implicit function
 * theorem, dx/dpᵢ = −(∂g/∂pᵢ)/(∂g/∂x) with g = ln|H_low| − ln|K| + ln√2. From the data: linear
 * interpolation in dB against log f between the two points straddling the same level.
 */
final class LowerCorner {
    /** −3.0103 dB: half power, exactly ln √2 nepers. */
    static final double HALF_POWER_NEPERS = 0.5 * Math.log(2);
    private static final double SCAN_STEP = Math.log(10) / 50;

    /**
     * @param lowBand the low-band model (no high-band pole) and its parameters
     * @return x_c = f_c/f_ref, or empty when the low band never falls 3 dB below |K|
     */
    OptionalDouble modelCorner(RationalModel lowBand, double[] p, double xLowest, double xHighest) {
        double top = Math.log(xHighest);
        double bottom = Math.log(xLowest);
        for (int i = 1; i < p.length; i++) {
            top = Math.max(top, p[i]);
            bottom = Math.min(bottom, p[i]);
        }
        top += Math.log(100);
        bottom -= Math.log(1000);
        double[] out = new double[2];
        double upper = top;
        double gUpper = level(lowBand, p, upper, out);
        for (double u = top - SCAN_STEP; u >= bottom; u -= SCAN_STEP) {
            double g = level(lowBand, p, u, out);
            if (gUpper >= 0 && g < 0) {
                try {
                    double root = new BrentSolver(1e-14, 1e-14).solve(200, t -> level(lowBand, p, t, new double[2]),
                            u, upper);
                    return OptionalDouble.of(Math.exp(root));
                } catch (MathIllegalStateException failed) {
                    return OptionalDouble.empty();
                }
            }
            upper = u;
            gUpper = g;
        }
        return OptionalDouble.empty();
    }

    /** dx_c/dp at the corner x_c, by implicit differentiation. */
    double[] cornerGradient(RationalModel lowBand, double[] p, double xCorner) {
        double[] out = new double[2];
        double[] gRe = new double[p.length];
        double[] gIm = new double[p.length];
        lowBand.logAt(p, xCorner, out, gRe, gIm);
        gRe[0] -= 1;
        double h = 1e-6;
        double slope = (level(lowBand, p, Math.log(xCorner) + h, out) - level(lowBand, p, Math.log(xCorner) - h, out))
                / (2 * h * xCorner);
        double[] grad = new double[p.length];
        for (int i = 0; i < p.length; i++) {
            grad[i] = -gRe[i] / slope;
        }
        return grad;
    }

    private static double level(RationalModel lowBand, double[] p, double lnX, double[] out) {
        lowBand.logAt(p, Math.exp(lnX), out, null, null);
        return out[0] - p[0] + HALF_POWER_NEPERS;
    }

    /**
     * The data's corner: scanning down from the point of highest gain, the first pair of
     * neighbouring points that straddles midband − 3.01 dB, interpolated linearly in dB against
     * ln f. Its uncertainty propagates the two points' gain uncertainties and the midband's,
     * taken as independent (the midband is fitted from all points, so this slightly overstates it).
     *
     * @param midbandNepers  ln|K| of the fit
     * @param uMidbandNepers its standard uncertainty
     * @return {frequency Hz, standard uncertainty Hz}, or null when the data never fall that far
     */
    double[] dataCorner(PreparedSweep data, double midbandNepers, double uMidbandNepers) {
        double level = midbandNepers - HALF_POWER_NEPERS;
        int top = 0;
        for (int k = 1; k < data.size(); k++) {
            if (data.lnGain[k] > data.lnGain[top]) {
                top = k;
            }
        }
        for (int k = top; k > 0; k--) {
            double g1 = data.lnGain[k];
            double g0 = data.lnGain[k - 1];
            if (g1 >= level && g0 < level) {
                double span = Math.log(data.frequencyHz[k] / data.frequencyHz[k - 1]);
                double dg = g1 - g0;
                double t = (level - g0) / dg;
                double f = data.frequencyHz[k - 1] * Math.exp(t * span);
                double dtdLevel = 1 / dg;
                double dtdG0 = (level - g1) / (dg * dg);
                double dtdG1 = -(level - g0) / (dg * dg);
                double varT = sq(dtdLevel * uMidbandNepers) + sq(dtdG0 * data.sigmaGain[k - 1])
                        + sq(dtdG1 * data.sigmaGain[k]);
                return new double[]{f, f * span * Math.sqrt(varT)};
            }
        }
        return null;
    }

    private static double sq(double v) {
        return v * v;
    }
}

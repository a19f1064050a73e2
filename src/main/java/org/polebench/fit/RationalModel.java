package org.polebench.fit;

/**
 * ln H(j·x) of a {@link ModelStructure} at normalised frequency x = f/f_ref, and its gradient
 * in the fit parameters. Working in logarithms makes every factor a sum term, so the gradient
 * is exact and cheap; the imaginary part is the sum of each factor's principal argument (the
 * caller wraps the residual, so no phase unwrapping is needed anywhere).
 *
 * <p>Factors: K (sign carried separately: an inverting stage adds π), sᵐ for the DC zeros,
 * (s + e^θ) per real root, s² + 2ζω₀s + ω₀² per pair (ω₀ = e^u, ζ = e^v, so a pair stays in the
 * left half-plane and ζ ≥ 1 is two real roots), and 1/(1 + s·e^−η) for the high-band pole.
 */
final class RationalModel {
    private final ModelStructure structure;
    private final boolean inverting;

    RationalModel(ModelStructure structure, boolean inverting) {
        this.structure = structure;
        this.inverting = inverting;
    }

    ModelStructure structure() {
        return structure;
    }

    boolean inverting() {
        return inverting;
    }

    /**
     * ln H at one normalised frequency.
     *
     * @param p    fit parameters (see {@link ModelStructure})
     * @param x    f/f_ref, positive
     * @param out  receives Re ln H (nepers) in [0] and Im ln H (radians, not wrapped) in [1]
     * @param gRe  receives ∂Re ln H/∂p, or null
     * @param gIm  receives ∂Im ln H/∂p, or null
     */
    void logAt(double[] p, double x, double[] out, double[] gRe, double[] gIm) {
        boolean grad = gRe != null;
        double re = p[0];
        double im = inverting ? Math.PI : 0;
        if (grad) {
            gRe[0] = 1;
            gIm[0] = 0;
        }
        int m = structure.dcZeros();
        if (m > 0) {
            re += m * Math.log(x);
            im += m * Math.PI / 2;
        }
        double[] acc = {re, im};
        realRoots(p, structure.realZeroOffset(), structure.realZeros(), x, 1, acc, gRe, gIm);
        pairs(p, structure.zeroPairOffset(), structure.zeroPairs(), x, 1, acc, gRe, gIm);
        realRoots(p, structure.realPoleOffset(), structure.realPoles(), x, -1, acc, gRe, gIm);
        pairs(p, structure.polePairOffset(), structure.polePairs(), x, -1, acc, gRe, gIm);
        if (structure.highBandPole()) {
            int i = structure.highBandOffset();
            double y = x * Math.exp(-p[i]);
            double mag2 = 1 + y * y;
            acc[0] -= 0.5 * Math.log(mag2);
            acc[1] -= Math.atan(y);
            if (grad) {
                gRe[i] = y * y / mag2;
                gIm[i] = y / mag2;
            }
        }
        out[0] = acc[0];
        out[1] = acc[1];
    }

    private static void realRoots(double[] p, int offset, int count, double x, int sign, double[] acc,
                                  double[] gRe, double[] gIm) {
        for (int i = offset; i < offset + count; i++) {
            double e = Math.exp(p[i]);
            double mag2 = e * e + x * x;
            acc[0] += sign * 0.5 * Math.log(mag2);
            acc[1] += sign * Math.atan2(x, e);
            if (gRe != null) {
                // d ln(e^θ + jx)/dθ = e^θ/(e^θ + jx)
                gRe[i] = sign * e * e / mag2;
                gIm[i] = -sign * e * x / mag2;
            }
        }
    }

    private static void pairs(double[] p, int offset, int count, double x, int sign, double[] acc,
                              double[] gRe, double[] gIm) {
        for (int j = 0; j < count; j++) {
            int i = offset + 2 * j;
            double w0 = Math.exp(p[i]);
            double zeta = Math.exp(p[i + 1]);
            double qRe = w0 * w0 - x * x;
            double qIm = 2 * zeta * w0 * x;
            double mag2 = qRe * qRe + qIm * qIm;
            acc[0] += sign * 0.5 * Math.log(mag2);
            acc[1] += sign * Math.atan2(qIm, qRe);
            if (gRe != null) {
                // dQ/du = 2ω₀² + j2ζω₀x, dQ/dv = j2ζω₀x; d ln Q = dQ·conj(Q)/|Q|²
                double duRe = 2 * w0 * w0;
                double duIm = qIm;
                gRe[i] = sign * (duRe * qRe + duIm * qIm) / mag2;
                gIm[i] = sign * (duIm * qRe - duRe * qIm) / mag2;
                gRe[i + 1] = sign * (qIm * qIm) / mag2;
                gIm[i + 1] = sign * (qIm * qRe) / mag2;
            }
        }
    }
}

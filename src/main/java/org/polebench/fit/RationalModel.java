package org.polebench.fit;

/**
 * ln H(j·x) of a {@link ModelStructure} at normalised frequency x = f/f_ref, and its gradient
 * in the fit parameters. The numerator and denominator are accumulated as complex products, so
 * each point costs two logarithms and one arctangent whatever the order; the imaginary part is
 * the principal argument of H (the caller wraps the residual, so no phase unwrapping is needed).
 * The gradient is exact: ∂ ln H/∂p is a sum of one factor's ∂F/∂p / F.
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
     * e^p for every parameter but ln|K| (entry 0 is unused), computed once per parameter vector.
     */
    static double[] exponentials(double[] p) {
        double[] e = new double[p.length];
        for (int i = 1; i < p.length; i++) {
            e[i] = Math.exp(p[i]);
        }
        return e;
    }

    /** ln H at one normalised frequency; see {@link #logAt(double[], double[], double, double[], double[], double[])}. */
    void logAt(double[] p, double x, double[] out, double[] gRe, double[] gIm) {
        logAt(p, exponentials(p), x, Math.log(x), out, gRe, gIm);
    }

    /**
     * ln H at one normalised frequency.
     *
     * @param p    fit parameters (see {@link ModelStructure})
     * @param e    {@link #exponentials(double[])} of p
     * @param x    f/f_ref, positive
     * @param lnX  ln x (kept with the sweep, so that it is not taken again at every evaluation)
     * @param out  receives Re ln H (nepers) in [0] and arg H (radians, principal value) in [1]
     * @param gRe  receives ∂Re ln H/∂p, or null
     * @param gIm  receives ∂Im ln H/∂p, or null
     */
    void logAt(double[] p, double[] e, double x, double lnX, double[] out, double[] gRe, double[] gIm) {
        boolean grad = gRe != null;
        // numerator product (nRe, nIm) and denominator product (dRe, dIm)
        double nRe = 1;
        double nIm = 0;
        double dRe = 1;
        double dIm = 0;
        if (grad) {
            gRe[0] = 1;
            gIm[0] = 0;
        }
        int end = structure.realZeroOffset() + structure.realZeros();
        for (int i = structure.realZeroOffset(); i < end; i++) {
            double t = nRe * e[i] - nIm * x;
            nIm = nRe * x + nIm * e[i];
            nRe = t;
            if (grad) {
                realRootGradient(e[i], x, 1, i, gRe, gIm);
            }
        }
        end = structure.zeroPairOffset() + 2 * structure.zeroPairs();
        for (int i = structure.zeroPairOffset(); i < end; i += 2) {
            double qRe = e[i] * e[i] - x * x;
            double qIm = 2 * e[i + 1] * e[i] * x;
            double t = nRe * qRe - nIm * qIm;
            nIm = nRe * qIm + nIm * qRe;
            nRe = t;
            if (grad) {
                pairGradient(e[i], qRe, qIm, 1, i, gRe, gIm);
            }
        }
        end = structure.realPoleOffset() + structure.realPoles();
        for (int i = structure.realPoleOffset(); i < end; i++) {
            double t = dRe * e[i] - dIm * x;
            dIm = dRe * x + dIm * e[i];
            dRe = t;
            if (grad) {
                realRootGradient(e[i], x, -1, i, gRe, gIm);
            }
        }
        end = structure.polePairOffset() + 2 * structure.polePairs();
        for (int i = structure.polePairOffset(); i < end; i += 2) {
            double qRe = e[i] * e[i] - x * x;
            double qIm = 2 * e[i + 1] * e[i] * x;
            double t = dRe * qRe - dIm * qIm;
            dIm = dRe * qIm + dIm * qRe;
            dRe = t;
            if (grad) {
                pairGradient(e[i], qRe, qIm, -1, i, gRe, gIm);
            }
        }
        if (structure.highBandPole()) {
            int i = structure.highBandOffset();
            double y = x / e[i];
            double t = dRe - dIm * y;
            dIm = dRe * y + dIm;
            dRe = t;
            if (grad) {
                // ∂/∂η of −ln(1 + jy), y = x·e^−η, is (y² + jy)/(1 + y²)
                double mag2 = 1 + y * y;
                gRe[i] = y * y / mag2;
                gIm[i] = y / mag2;
            }
        }
        int m = structure.dcZeros();
        // arg of N·conj(D), plus π/2 per DC zero and π for an inverting stage
        double hRe = nRe * dRe + nIm * dIm;
        double hIm = nIm * dRe - nRe * dIm;
        out[0] = p[0] + m * lnX
                + 0.5 * (Math.log(nRe * nRe + nIm * nIm) - Math.log(dRe * dRe + dIm * dIm));
        out[1] = Math.atan2(hIm, hRe) + m * (Math.PI / 2) + (inverting ? Math.PI : 0);
    }

    /** d ln(e^θ + jx)/dθ = e^θ/(e^θ + jx), signed for a zero (+1) or a pole (−1). */
    private static void realRootGradient(double e, double x, int sign, int i, double[] gRe, double[] gIm) {
        double mag2 = e * e + x * x;
        gRe[i] = sign * e * e / mag2;
        gIm[i] = -sign * e * x / mag2;
    }

    /** dQ/du = 2ω₀² + j2ζω₀x, dQ/dv = j2ζω₀x; d ln Q = dQ·conj(Q)/|Q|². */
    private static void pairGradient(double w0, double qRe, double qIm, int sign, int i, double[] gRe, double[] gIm) {
        double mag2 = qRe * qRe + qIm * qIm;
        double duRe = 2 * w0 * w0;
        gRe[i] = sign * (duRe * qRe + qIm * qIm) / mag2;
        gIm[i] = sign * (qIm * qRe - duRe * qIm) / mag2;
        gRe[i + 1] = sign * (qIm * qIm) / mag2;
        gIm[i + 1] = sign * (qIm * qRe) / mag2;
    }
}

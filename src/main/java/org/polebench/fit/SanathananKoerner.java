package org.polebench.fit;

/**
 * The linearised starting estimate: Sanathanan–Koerner iteration (Sanathanan and Koerner, IEEE
 * Trans. Automatic Control 8(1), 1963). Each step solves min Σ |(N(vₖ) − Hₖ·D(vₖ))/(Hₖ·D_prev(vₖ))|²
 * (one real row per real part, each over its point's σ), which is linear in the coefficients and,
 * at its fixed point, weighs the relative error as the complex-log residual does. The first
 * D_prev has real poles spread log-evenly over the band, as vector fitting starts (Gustavsen and
 * Semlyen, IEEE Trans. Power Delivery 14(3), 1999). The fixed point is a start, not the
 * least-squares optimum: Levenberg–Marquardt finishes the job (docs/method.md, "Fitting").
 */
final class SanathananKoerner {
    static final int ITERATIONS = 4;

    /**
     * Iterates to a rational estimate.
     *
     * @param dcZeros     m, zeros fixed at v = 0
     * @param finiteZeros degree of the free numerator part
     * @param poles       degree of the denominator, at least 1
     * @param highBandX   normalised frequency of a high-band pole divided out of the data first,
     *                    or NaN for none
     * @return the estimate, or null when the linear problem is singular
     */
    RationalEstimate estimate(PreparedSweep data, int dcZeros, int finiteZeros, int poles, double highBandX) {
        double[] previous = spreadDenominator(data, poles);
        RationalEstimate estimate = null;
        for (int it = 0; it < ITERATIONS; it++) {
            LinearisedSystem system = system(data, dcZeros, finiteZeros, poles, previous, null, highBandX);
            double[] c = solve(system);
            if (c == null) {
                return estimate;
            }
            double[] b = new double[finiteZeros + 1];
            System.arraycopy(c, 0, b, 0, b.length);
            double[] a = new double[poles + 1];
            System.arraycopy(c, b.length, a, 0, poles);
            a[poles] = 1;
            estimate = new RationalEstimate(b, a, !data.hasPhase);
            previous = a;
        }
        return estimate;
    }

    /**
     * The numerator that best matches a denominator known in advance (predicted poles): one
     * linear solve.
     *
     * @param denominator ascending, monic, in the same variable as the data (s or x²)
     */
    RationalEstimate numeratorFor(PreparedSweep data, int dcZeros, int finiteZeros, double[] denominator,
                                  double highBandX) {
        LinearisedSystem system = system(data, dcZeros, finiteZeros, denominator.length - 1, denominator,
                denominator, highBandX);
        double[] c = solve(system);
        return c == null ? null : new RationalEstimate(c, denominator.clone(), !data.hasPhase);
    }

    /**
     * The linear system of one step.
     *
     * @param previous ascending coefficients of D_prev (length poles + 1)
     * @param fixed    when not null, the denominator is this (ascending, monic) and only the
     *                 numerator is unknown
     */
    LinearisedSystem system(PreparedSweep data, int dcZeros, int finiteZeros, int poles, double[] previous,
                            double[] fixed, double highBandX) {
        int n = data.size();
        int unknowns = finiteZeros + 1 + (fixed == null ? poles : 0);
        boolean complex = data.hasPhase;
        int rows = complex ? 2 * n : n;
        double[][] a = new double[unknowns][rows];
        double[] rhs = new double[rows];
        int maxPower = Math.max(dcZeros + finiteZeros, poles);
        double[] powRe = new double[maxPower + 1];
        double[] powIm = new double[maxPower + 1];
        for (int k = 0; k < n; k++) {
            double x = data.x[k];
            // v = jx with phase, v = x² (a real variable) for |H|²
            double vRe = complex ? 0 : x * x;
            double vIm = complex ? x : 0;
            powRe[0] = 1;
            powIm[0] = 0;
            for (int i = 1; i <= maxPower; i++) {
                powRe[i] = powRe[i - 1] * vRe - powIm[i - 1] * vIm;
                powIm[i] = powRe[i - 1] * vIm + powIm[i - 1] * vRe;
            }
            // Hₖ (or |Hₖ|²) with a high-band pole divided out: multiply by (1 + v/x_h) or (1 + x²/x_h²)
            double hRe = data.responseRe[k];
            double hIm = complex ? data.responseIm[k] : 0;
            if (!Double.isNaN(highBandX)) {
                double fRe = 1 + vRe / (complex ? highBandX : highBandX * highBandX);
                double fIm = vIm / highBandX;
                double tRe = hRe * fRe - hIm * fIm;
                hIm = hRe * fIm + hIm * fRe;
                hRe = tRe;
            }
            double dRe = 0;
            double dIm = 0;
            for (int i = 0; i < previous.length; i++) {
                dRe += previous[i] * powRe[i];
                dIm += previous[i] * powIm[i];
            }
            // q = 1/(H·D_prev) and r = 1/D_prev
            double hdRe = hRe * dRe - hIm * dIm;
            double hdIm = hRe * dIm + hIm * dRe;
            double hd2 = hdRe * hdRe + hdIm * hdIm;
            double qRe = hdRe / hd2;
            double qIm = -hdIm / hd2;
            double d2 = dRe * dRe + dIm * dIm;
            double rRe = dRe / d2;
            double rIm = -dIm / d2;
            // e ≈ −δ ln H, so the real part is a gain error (Np) and the imaginary part a phase error (rad);
            // for |H|² the error is 2·δ ln|H|
            double wRe = complex ? 1 / data.sigmaGain[k] : 1 / (2 * data.sigmaGain[k]);
            double wIm = complex ? 1 / data.sigmaPhase[k] : 0;
            for (int i = 0; i <= finiteZeros; i++) {
                double pRe = powRe[dcZeros + i];
                double pIm = powIm[dcZeros + i];
                setRow(a, k, n, complex, i, pRe * qRe - pIm * qIm, pRe * qIm + pIm * qRe, wRe, wIm);
            }
            double bRe;
            double bIm;
            if (fixed == null) {
                for (int i = 0; i < poles; i++) {
                    double pRe = powRe[i];
                    double pIm = powIm[i];
                    setRow(a, k, n, complex, finiteZeros + 1 + i,
                            -(pRe * rRe - pIm * rIm), -(pRe * rIm + pIm * rRe), wRe, wIm);
                }
                bRe = powRe[poles] * rRe - powIm[poles] * rIm;
                bIm = powRe[poles] * rIm + powIm[poles] * rRe;
            } else {
                double fRe = 0;
                double fIm = 0;
                for (int i = 0; i < fixed.length; i++) {
                    fRe += fixed[i] * powRe[i];
                    fIm += fixed[i] * powIm[i];
                }
                bRe = fRe * rRe - fIm * rIm;
                bIm = fRe * rIm + fIm * rRe;
            }
            rhs[k] = bRe * wRe;
            if (complex) {
                rhs[n + k] = bIm * wIm;
            }
        }
        return new LinearisedSystem(a, rhs);
    }

    private static void setRow(double[][] a, int k, int n, boolean complex, int column, double re, double im,
                               double wRe, double wIm) {
        a[column][k] = re * wRe;
        if (complex) {
            a[column][n + k] = im * wIm;
        }
    }

    /**
     * Least-squares solution by Householder QR (Golub and Van Loan, Matrix Computations, 4th ed.,
     * 2013, §5.3.3) after scaling each column to unit norm: the powers of v span many decades,
     * and scaling keeps the triangular solve well conditioned.
     *
     * @return the coefficients, or null when the columns are numerically dependent
     */
    double[] solve(LinearisedSystem system) {
        int rows = system.rows();
        int cols = system.columns();
        if (rows < cols) {
            return null;
        }
        double[][] a = system.copyOfColumns();
        double[] b = system.copyOfRhs();
        double[] scale = new double[cols];
        for (int j = 0; j < cols; j++) {
            double[] col = a[j];
            double s = 0;
            for (int i = 0; i < rows; i++) {
                s += col[i] * col[i];
            }
            scale[j] = s > 0 ? Math.sqrt(s) : 1;
            for (int i = 0; i < rows; i++) {
                col[i] /= scale[j];
            }
        }
        double[] diagonal = new double[cols];
        for (int k = 0; k < cols; k++) {
            double[] col = a[k];
            double norm = 0;
            for (int i = k; i < rows; i++) {
                norm += col[i] * col[i];
            }
            norm = Math.sqrt(norm);
            // a unit-norm column left with less than 1e-12 of itself is dependent on the earlier ones
            if (norm < 1e-12) {
                return null;
            }
            double alpha = col[k] > 0 ? -norm : norm;
            col[k] -= alpha;
            double vNorm2 = 0;
            for (int i = k; i < rows; i++) {
                vNorm2 += col[i] * col[i];
            }
            for (int j = k + 1; j < cols; j++) {
                reflect(col, a[j], k, rows, vNorm2);
            }
            reflect(col, b, k, rows, vNorm2);
            diagonal[k] = alpha;
        }
        double[] c = new double[cols];
        for (int k = cols - 1; k >= 0; k--) {
            double sum = b[k];
            for (int j = k + 1; j < cols; j++) {
                sum -= a[j][k] * c[j];
            }
            c[k] = sum / diagonal[k];
        }
        for (int j = 0; j < cols; j++) {
            c[j] /= scale[j];
            if (!Double.isFinite(c[j])) {
                return null;
            }
        }
        return c;
    }

    /** y ← (I − 2vvᵀ/vᵀv)·y on rows k… */
    private static void reflect(double[] v, double[] y, int k, int rows, double vNorm2) {
        double dot = 0;
        for (int i = k; i < rows; i++) {
            dot += v[i] * y[i];
        }
        double f = 2 * dot / vNorm2;
        for (int i = k; i < rows; i++) {
            y[i] -= f * v[i];
        }
    }

    /** Monic polynomial with real roots spread log-evenly over the band, in the data's variable. */
    private static double[] spreadDenominator(PreparedSweep data, int poles) {
        double lo = Math.log(data.x[0]);
        double hi = Math.log(data.x[data.size() - 1]);
        double[] poly = {1};
        for (int i = 0; i < poles; i++) {
            double r = Math.exp(lo + (hi - lo) * (i + 0.5) / poles);
            double root = data.hasPhase ? r : r * r;
            double[] next = new double[poly.length + 1];
            for (int j = 0; j < poly.length; j++) {
                next[j] += root * poly[j];
                next[j + 1] += poly[j];
            }
            poly = next;
        }
        return poly;
    }
}

package org.polebench.analysis;

/**
 * |H(jω)|² of one {@link StateModel} at many frequencies through the model's Hessenberg form
 * (Laub, "Efficient multivariable frequency response computations", IEEE Trans. Automatic
 * Control 26(2), 1981): once per model, Householder reflections give A = Q·Ĥ·Qᵀ with Ĥ upper
 * Hessenberg (Golub and Van Loan, Matrix Computations, 4th ed., algorithm 7.4.2), b̂ = Qᵀ·B and
 * ĉ = C·Q; then H(jω) = ĉ·(jωI − Ĥ)⁻¹·b̂ + D costs one Gaussian elimination of a Hessenberg
 * matrix with partial pivoting between neighbouring rows, O(k²) per frequency instead of the
 * O(k³) of a dense complex LU. Q is orthogonal, so the result equals the dense solve's up to
 * round-off. Work arrays are preallocated: one instance per thread and task.
 *
 * <p>The reduction holds one loop level per method, and the evaluation, whose loops run k
 * times per level, no outer iteration with an empty inner range (as in
 * {@link org.polebench.linalg.RealLu}, which says why): a tolerance spread builds one of these
 * per board and evaluates it a few dozen times, in a cold JVM.
 */
final class HessenbergResponse {
    private final int k;
    private final double d;
    private final double[][] h;
    private final double[] bHat;
    private final double[] cHat;
    /** the upper triangular factor of jωI − Ĥ, row by row, and its right-hand side */
    private final double[][] ur;
    private final double[][] ui;
    private final double[] yr;
    private final double[] yi;
    /** the row being eliminated: row c of the partly reduced matrix, columns c…k−1 */
    private final double[] carryRe;
    private final double[] carryIm;
    private final double[] xr;
    private final double[] xi;

    HessenbergResponse(StateModel model) {
        this.k = model.order();
        this.d = model.directGain();
        this.h = new double[k][];
        double[][] a = model.aView();
        for (int i = 0; i < k; i++) {
            h[i] = a[i].clone();
        }
        this.bHat = model.bView().clone();
        this.cHat = model.cView().clone();
        double[] v = new double[k];
        for (int col = 0; col < k - 2; col++) {
            reflect(col, v);
        }
        this.ur = new double[k][k];
        this.ui = new double[k][k];
        this.yr = new double[k];
        this.yi = new double[k];
        this.carryRe = new double[k];
        this.carryIm = new double[k];
        this.xr = new double[k];
        this.xi = new double[k];
    }

    // Householder P = I − 2·v·vᵀ/(vᵀv) zeroes column col below the subdiagonal; Ĥ = P·H·P, so
    // B takes P from the left and C from the right.
    private void reflect(int col, double[] v) {
        // the column's 2-norm, scaled by its largest entry against overflow (in place of
        // Math.hypot, whose software form is many times the size of this loop)
        double largest = 0;
        for (int i = col + 1; i < k; i++) {
            largest = Math.max(largest, Math.abs(h[i][col]));
        }
        if (largest == 0) {
            return;
        }
        double squares = 0;
        for (int i = col + 1; i < k; i++) {
            double scaled = h[i][col] / largest;
            squares += scaled * scaled;
        }
        double norm = largest * Math.sqrt(squares);
        double alpha = h[col + 1][col] > 0 ? -norm : norm;
        double vv = 0;
        for (int i = col + 1; i < k; i++) {
            v[i] = h[i][col];
        }
        v[col + 1] -= alpha;
        for (int i = col + 1; i < k; i++) {
            vv += v[i] * v[i];
        }
        double scale = 2 / vv;
        for (int j = col; j < k; j++) {
            reflectColumn(j, col, v, scale);
        }
        for (int i = 0; i < k; i++) {
            reflectRow(h[i], col, v, scale);
        }
        double sb = 0;
        double sc = 0;
        for (int i = col + 1; i < k; i++) {
            sb += v[i] * bHat[i];
            sc += cHat[i] * v[i];
        }
        for (int i = col + 1; i < k; i++) {
            bHat[i] -= scale * sb * v[i];
            cHat[i] -= scale * sc * v[i];
        }
        // the reflection maps the column to alpha·e1 exactly; round-off below it is dropped
        h[col + 1][col] = alpha;
        for (int i = col + 2; i < k; i++) {
            h[i][col] = 0;
        }
    }

    /** Column j of Ĥ from the left: the rows below col take P. */
    private void reflectColumn(int j, int col, double[] v, double scale) {
        double s = 0;
        for (int i = col + 1; i < k; i++) {
            s += v[i] * h[i][j];
        }
        s *= scale;
        for (int i = col + 1; i < k; i++) {
            h[i][j] -= s * v[i];
        }
    }

    /** One row of Ĥ from the right: the columns after col take P. */
    private void reflectRow(double[] row, int col, double[] v, double scale) {
        double s = 0;
        for (int j = col + 1; j < k; j++) {
            s += row[j] * v[j];
        }
        s *= scale;
        for (int j = col + 1; j < k; j++) {
            row[j] -= s * v[j];
        }
    }

    /**
     * Gaussian elimination of jωI − Ĥ with partial pivoting between neighbouring rows, then back
     * substitution. At step c, of the carried row c and row c + 1 of jωI − Ĥ (untouched so far,
     * and starting at column c, since Ĥ is Hessenberg), the one with the larger entry in column
     * c becomes row c of the triangular factor, and the other, less a multiple of it, is carried
     * to the next step. One method: its loops are short (k per level), and split into helpers
     * they were compiled twice, alone and inlined here.
     *
     * @return |H(jω)|² at ω in rad/s (V/V squared), or NaN when jω is an eigenvalue of A
     */
    double magnitudeSquared(double omegaRadPerS) {
        // row 0 of jωI − Ĥ starts the elimination
        double[] first = h[0];
        for (int j = 0; j < k; j++) {
            carryRe[j] = -first[j];
            carryIm[j] = 0;
        }
        carryIm[0] = omegaRadPerS;
        double rhsRe = bHat[0];
        double rhsIm = 0;
        for (int c = 0; c < k - 1; c++) {
            int below = c + 1;
            double[] next = h[below];
            double nextAtC = -next[c];
            boolean swap = Math.abs(nextAtC) > Math.abs(carryRe[c]) + Math.abs(carryIm[c]);
            double pr = swap ? nextAtC : carryRe[c];
            double pi = swap ? 0 : carryIm[c];
            double ar = swap ? carryRe[c] : nextAtC;
            double ai = swap ? carryIm[c] : 0;
            double size = pr * pr + pi * pi;
            if (size == 0) {
                return Double.NaN;
            }
            // l = a / p (0 when the entry under the pivot is 0: the carried row is then taken as it is)
            double lr = (ar * pr + ai * pi) / size;
            double li = (ai * pr - ar * pi) / size;
            double[] rowRe = ur[c];
            double[] rowIm = ui[c];
            rowRe[c] = pr;
            rowIm[c] = pi;
            for (int j = below; j < k; j++) {
                double nr = -next[j];
                double ni = j == below ? omegaRadPerS : 0;
                double upperRe = swap ? nr : carryRe[j];
                double upperIm = swap ? ni : carryIm[j];
                double lowerRe = swap ? carryRe[j] : nr;
                double lowerIm = swap ? carryIm[j] : ni;
                rowRe[j] = upperRe;
                rowIm[j] = upperIm;
                carryRe[j] = lowerRe - (lr * upperRe - li * upperIm);
                carryIm[j] = lowerIm - (lr * upperIm + li * upperRe);
            }
            double upperRhsRe = swap ? bHat[below] : rhsRe;
            double upperRhsIm = swap ? 0 : rhsIm;
            double lowerRhsRe = swap ? rhsRe : bHat[below];
            double lowerRhsIm = swap ? rhsIm : 0;
            yr[c] = upperRhsRe;
            yi[c] = upperRhsIm;
            rhsRe = lowerRhsRe - (lr * upperRhsRe - li * upperRhsIm);
            rhsIm = lowerRhsIm - (lr * upperRhsIm + li * upperRhsRe);
        }
        // the last row is the carried one; it has nothing right of its diagonal, so it stays
        // out of the loop below, whose inner range is then never empty (see the class comment)
        double lastRe = carryRe[k - 1];
        double lastIm = carryIm[k - 1];
        double lastSize = lastRe * lastRe + lastIm * lastIm;
        if (lastSize == 0) {
            return Double.NaN;
        }
        xr[k - 1] = (rhsRe * lastRe + rhsIm * lastIm) / lastSize;
        xi[k - 1] = (rhsIm * lastRe - rhsRe * lastIm) / lastSize;
        double hr = d + cHat[k - 1] * xr[k - 1];
        double him = cHat[k - 1] * xi[k - 1];
        for (int i = k - 2; i >= 0; i--) {
            double sr = yr[i];
            double si = yi[i];
            double[] rr = ur[i];
            double[] ri = ui[i];
            for (int j = i + 1; j < k; j++) {
                sr -= rr[j] * xr[j] - ri[j] * xi[j];
                si -= rr[j] * xi[j] + ri[j] * xr[j];
            }
            double dr = rr[i];
            double di = ri[i];
            double size = dr * dr + di * di;
            if (size == 0) {
                return Double.NaN;
            }
            xr[i] = (sr * dr + si * di) / size;
            xi[i] = (si * dr - sr * di) / size;
            hr += cHat[i] * xr[i];
            him += cHat[i] * xi[i];
        }
        return hr * hr + him * him;
    }
}

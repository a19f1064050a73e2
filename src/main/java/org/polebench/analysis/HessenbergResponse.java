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
 */
final class HessenbergResponse {
    private final int k;
    private final double d;
    private final double[][] h;
    private final double[] bHat;
    private final double[] cHat;
    private final double[][] mr;
    private final double[][] mi;
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
        reduce();
        this.mr = new double[k][k];
        this.mi = new double[k][k];
        this.xr = new double[k];
        this.xi = new double[k];
    }

    // Householder P = I − 2·v·vᵀ/(vᵀv) zeroes column col below the subdiagonal; Ĥ = P·H·P, so
    // B takes P from the left and C from the right.
    private void reduce() {
        double[] v = new double[k];
        for (int col = 0; col < k - 2; col++) {
            // the column's 2-norm, scaled by its largest entry against overflow (in place of
            // Math.hypot, whose software form is many times the size of this loop)
            double largest = 0;
            for (int i = col + 1; i < k; i++) {
                largest = Math.max(largest, Math.abs(h[i][col]));
            }
            if (largest == 0) {
                continue;
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
                double s = 0;
                for (int i = col + 1; i < k; i++) {
                    s += v[i] * h[i][j];
                }
                s *= scale;
                for (int i = col + 1; i < k; i++) {
                    h[i][j] -= s * v[i];
                }
            }
            for (int i = 0; i < k; i++) {
                double s = 0;
                for (int j = col + 1; j < k; j++) {
                    s += h[i][j] * v[j];
                }
                s *= scale;
                for (int j = col + 1; j < k; j++) {
                    h[i][j] -= s * v[j];
                }
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
    }

    /** @return |H(jω)|² at ω in rad/s (V/V squared), or NaN when jω is an eigenvalue of A */
    double magnitudeSquared(double omegaRadPerS) {
        for (int i = 0; i < k; i++) {
            double[] rr = mr[i];
            double[] ri = mi[i];
            double[] hi = h[i];
            for (int j = Math.max(0, i - 1); j < k; j++) {
                rr[j] = -hi[j];
                ri[j] = 0;
            }
            ri[i] = omegaRadPerS;
            xr[i] = bHat[i];
            xi[i] = 0;
        }
        for (int c = 0; c < k - 1; c++) {
            int below = c + 1;
            if (Math.abs(mr[below][c]) + Math.abs(mi[below][c]) > Math.abs(mr[c][c]) + Math.abs(mi[c][c])) {
                // rows c and c + 1 both start at column c here
                double[] t = mr[c];
                mr[c] = mr[below];
                mr[below] = t;
                t = mi[c];
                mi[c] = mi[below];
                mi[below] = t;
                double s = xr[c];
                xr[c] = xr[below];
                xr[below] = s;
                s = xi[c];
                xi[c] = xi[below];
                xi[below] = s;
            }
            double pr = mr[c][c];
            double pi = mi[c][c];
            double size = pr * pr + pi * pi;
            if (size == 0) {
                return Double.NaN;
            }
            double ar = mr[below][c];
            double ai = mi[below][c];
            if (ar == 0 && ai == 0) {
                continue;
            }
            // l = a / p
            double lr = (ar * pr + ai * pi) / size;
            double li = (ai * pr - ar * pi) / size;
            double[] br = mr[below];
            double[] bi = mi[below];
            double[] cr = mr[c];
            double[] ci = mi[c];
            for (int j = below; j < k; j++) {
                br[j] -= lr * cr[j] - li * ci[j];
                bi[j] -= lr * ci[j] + li * cr[j];
            }
            double yr = xr[c];
            double yi = xi[c];
            xr[below] -= lr * yr - li * yi;
            xi[below] -= lr * yi + li * yr;
        }
        double hr = d;
        double him = 0;
        for (int i = k - 1; i >= 0; i--) {
            double sr = xr[i];
            double si = xi[i];
            double[] rr = mr[i];
            double[] ri = mi[i];
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

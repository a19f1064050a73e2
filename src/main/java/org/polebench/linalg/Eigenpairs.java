package org.polebench.linalg;

/**
 * Eigenvalues with right and left eigenvectors, as {@link EigenSolver} found them (kernel
 * arrays; not a value type). Eigenvalue m is {@code re(m) + j·im(m)}; its right vector v
 * satisfies A·v = λv and its left vector w satisfies Aᵀ·w = λw (wᵀA = λwᵀ, no conjugate), both
 * of unit 2-norm. The accessors hand out the arrays themselves, so callers must not change them.
 */
public final class Eigenpairs {
    private final double[] re;
    private final double[] im;
    /** right[m] = {re[], im[]} */
    private final double[][][] right;
    /** left[m] = {re[], im[]} */
    private final double[][][] left;
    private final double traceRelativeError;
    private final double determinantRelativeError;
    private final double maxRelativeResidual;

    Eigenpairs(double[] re, double[] im, double[][][] right, double[][][] left, double traceRelativeError,
               double determinantRelativeError, double maxRelativeResidual) {
        this.re = re;
        this.im = im;
        this.right = right;
        this.left = left;
        this.traceRelativeError = traceRelativeError;
        this.determinantRelativeError = determinantRelativeError;
        this.maxRelativeResidual = maxRelativeResidual;
    }

    /** @return the number of eigenvalues, the order of the matrix */
    public int size() {
        return re.length;
    }

    /** @return the real part of eigenvalue m, in the matrix's units */
    public double re(int m) {
        return re[m];
    }

    /** @return the imaginary part of eigenvalue m, in the matrix's units */
    public double im(int m) {
        return im[m];
    }

    /** @return {re[], im[]} of the right eigenvector of eigenvalue m */
    public double[][] right(int m) {
        return right[m];
    }

    /** @return {re[], im[]} of the left eigenvector of eigenvalue m */
    public double[][] left(int m) {
        return left[m];
    }

    /** @return |Σλ − trace A| / Σ|λ|, on the scaled matrix */
    public double traceRelativeError() {
        return traceRelativeError;
    }

    /** @return |Πλ − det A| / max(|det A|, |Πλ|), on the scaled matrix, det A by LU */
    public double determinantRelativeError() {
        return determinantRelativeError;
    }

    /** @return the largest ‖A·v − λv‖ / ‖A‖_F over the pairs, on the scaled matrix */
    public double maxRelativeResidual() {
        return maxRelativeResidual;
    }
}

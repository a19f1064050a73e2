package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;

/** Eigenvalues with right and left eigenvectors (kernel arrays; not a value type). */
final class Eigenpairs {
    final double[] re;
    final double[] im;
    /** right[m] = {re[], im[]}: A·v = λv, unit 2-norm */
    final double[][][] right;
    /** left[m] = {re[], im[]}: Aᵀ·w = λw (wᵀA = λwᵀ, no conjugate), unit 2-norm */
    final double[][][] left;
    final double traceRelativeError;
    final double determinantRelativeError;
    final double maxRelativeResidual;

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

    int size() {
        return re.length;
    }

    Spectrum spectrum() {
        List<ComplexFrequency> roots = new ArrayList<>(re.length);
        for (int i = 0; i < re.length; i++) {
            roots.add(new ComplexFrequency(re[i], im[i]));
        }
        return new Spectrum(roots, traceRelativeError, determinantRelativeError, maxRelativeResidual);
    }
}

package org.polebench.analysis;

import org.polebench.linalg.ComplexLu;

/**
 * Evaluates H(jω) = C·(jωI − A)⁻¹·B + D of one {@link StateModel} at many frequencies with
 * preallocated work arrays, and keeps x = (jωI − A)⁻¹·B and, on request,
 * w = (jωI − A)⁻ᵀ·Cᵀ for derivatives. One instance per thread and task.
 */
final class ResponseEvaluator {
    private final StateModel model;
    private final int k;
    private final double[][] mr;
    private final double[][] mi;
    private final double[] xr;
    private final double[] xi;
    private final double[] wr;
    private final double[] wi;
    private final ComplexLu lu;
    private double omega;
    private double hr;
    private double hi;

    ResponseEvaluator(StateModel model) {
        this.model = model;
        this.k = model.order();
        this.mr = new double[k][k];
        this.mi = new double[k][k];
        this.xr = new double[k];
        this.xi = new double[k];
        this.wr = new double[k];
        this.wi = new double[k];
        this.lu = new ComplexLu(mr, mi);
    }

    /** Evaluates H at ω in rad/s; returns false when jω is an eigenvalue of A (exactly singular). */
    boolean evaluate(double omegaRadPerS) {
        omega = omegaRadPerS;
        double[][] a = model.aView();
        double[] b = model.bView();
        double[] c = model.cView();
        for (int i = 0; i < k; i++) {
            double[] rr = mr[i];
            double[] ri = mi[i];
            double[] ai = a[i];
            for (int j = 0; j < k; j++) {
                rr[j] = -ai[j];
                ri[j] = 0;
            }
            ri[i] = omegaRadPerS;
            xr[i] = b[i];
            xi[i] = 0;
        }
        hr = model.directGain();
        hi = 0;
        if (k == 0) {
            return true;
        }
        if (!lu.factor()) {
            hr = Double.NaN;
            hi = Double.NaN;
            return false;
        }
        lu.solve(xr, xi);
        for (int i = 0; i < k; i++) {
            hr += c[i] * xr[i];
            hi += c[i] * xi[i];
        }
        return true;
    }

    /** After {@link #evaluate}: solves for w = (jωI − A)⁻ᵀ·Cᵀ with the same factors. */
    void solveAdjoint() {
        double[] c = model.cView();
        for (int i = 0; i < k; i++) {
            wr[i] = c[i];
            wi[i] = 0;
        }
        lu.solveTransposed(wr, wi);
    }

    double responseRe() {
        return hr;
    }

    double responseIm() {
        return hi;
    }

    double magnitudeSquared() {
        return hr * hr + hi * hi;
    }

    double omega() {
        return omega;
    }

    double stateRe(int i) {
        return xr[i];
    }

    double stateIm(int i) {
        return xi[i];
    }

    double adjointRe(int i) {
        return wr[i];
    }

    double adjointIm(int i) {
        return wi[i];
    }
}

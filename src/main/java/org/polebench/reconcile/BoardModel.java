package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Transistor;

/**
 * The stage's own exact response at the sweep's frequencies as a function of the back-solve's
 * parameters θ = (φ_i = ln(C_i/C_i,nom) per low-band capacitor, ln(I_j/I_j,nom) per transistor,
 * g = flat gain in nepers): H(jω; θ) = e^g · H_low(jω) · H_high(jω)/D (DESIGN.md "Back-solve").
 *
 * <p>H_low comes from the low-band port reduction: with A = −Cd⁻¹·Y and B = −Cd⁻¹·b,
 * H_low = D + cᵀ·(sI − A)⁻¹·B = D − cᵀ·(Y + s·Cd)⁻¹·b, and Y, b, c, D do not depend on the
 * capacitors, so one reduction per bias point serves every capacitor value. Its derivative is
 * exact: with x = −(Y + s·Cd)⁻¹·b and u = (Y + s·Cd)⁻ᵀ·c, ∂H_low/∂φ_i = −s·C_i·u_i·x_i.
 * H_high/D is the high-band model's response (low-band capacitors shorted) over the midband
 * gain: the product of the two bands is exact when they lie decades apart, as a low-band
 * sweep assumes. Only the bias parameters need a new small-signal expansion and reduction
 * ({@link OperatingPoints#withCurrentScaled}); their derivative is a forward difference.
 *
 * <p>Keeps the last few reductions, so one instance belongs to one task and thread.
 */
final class BoardModel {
    /** Forward-difference step in ln I: truncation ~1e-6 relative, round-off ~1e-10. */
    static final double BIAS_STEP = 1e-6;
    private static final int CACHED_REDUCTIONS = 8;

    private final Stage stage;
    private final OperatingPoints nominalPoints;
    private final List<String> capacitors;
    private final double[] nominalFarads;
    private final List<String> transistors;
    private final double[] omegas;
    private final PortReduction reduction = new PortReduction();
    private final SmallSignalExpansion expansion = new SmallSignalExpansion();
    private final Map<String, Reduced> cache = new LinkedHashMap<>(16, 0.75f, true) {
        private static final long serialVersionUID = 1L;

        @Override
        protected boolean removeEldestEntry(Map.Entry<String, Reduced> eldest) {
            return size() > CACHED_REDUCTIONS;
        }
    };
    private final SmallComplexLu lowLu;
    private int reductions;
    private int responses;
    private final double[] xr;
    private final double[] xi;
    private final double[] ur;
    private final double[] ui;

    /**
     * @param nominalModel  the nominal low-band model (its port order is the parameter order)
     * @param frequenciesHz where the response is wanted, positive
     */
    BoardModel(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, double[] frequenciesHz) {
        this.stage = stage;
        this.nominalPoints = nominalPoints;
        this.capacitors = nominalModel.capacitorNames();
        int k = capacitors.size();
        this.nominalFarads = new double[k];
        for (int i = 0; i < k; i++) {
            nominalFarads[i] = nominalModel.farads(i);
        }
        List<String> names = new ArrayList<>();
        for (Transistor transistor : stage.transistors()) {
            names.add(transistor.name());
        }
        this.transistors = List.copyOf(names);
        this.omegas = new double[frequenciesHz.length];
        for (int n = 0; n < omegas.length; n++) {
            omegas[n] = 2 * Math.PI * frequenciesHz[n];
        }
        this.lowLu = new SmallComplexLu(k);
        this.xr = new double[k];
        this.xi = new double[k];
        this.ur = new double[k];
        this.ui = new double[k];
    }

    List<String> capacitors() {
        return capacitors;
    }

    List<String> transistors() {
        return transistors;
    }

    double nominalFarads(int i) {
        return nominalFarads[i];
    }

    int frequencies() {
        return omegas.length;
    }

    /** @return k + m + 1: capacitors, transistors, gain */
    int parameterCount() {
        return capacitors.size() + transistors.size() + 1;
    }

    /**
     * Evaluates H and, when {@code dRe} is given, ∂ln H/∂θ for every parameter at every frequency.
     *
     * @param theta parameters in the order of {@link #parameterCount()}
     * @param hRe   out: Re H per frequency
     * @param hIm   out: Im H per frequency
     * @param dRe   out, or null: [frequency][parameter] real part of ∂ln H/∂θ
     * @param dIm   out, or null: imaginary part
     * @param biasColumns whether to compute the bias columns of {@code dRe, dIm} (by forward
     *                    difference); when false they are left as they were
     * @return false when the network is singular at these bias currents or H vanishes
     */
    boolean evaluate(double[] theta, double[] hRe, double[] hIm, double[][] dRe, double[][] dIm,
                     boolean biasColumns) {
        int k = capacitors.size();
        int m = transistors.size();
        double[] lnBias = Arrays.copyOfRange(theta, k, k + m);
        Reduced reduced = reduced(lnBias, true);
        if (reduced == null || !response(reduced, theta, hRe, hIm, dRe, dIm)) {
            return false;
        }
        if (dRe == null || !biasColumns) {
            return true;
        }
        double[] pr = new double[omegas.length];
        double[] pi = new double[omegas.length];
        for (int j = 0; j < m; j++) {
            double[] stepped = lnBias.clone();
            stepped[j] += BIAS_STEP;
            // the derivative leaves out the high band's small bias dependence (its value is kept
            // exact): a Jacobian only steers the search, the residuals fix where it ends
            Reduced other = reduced(stepped, false);
            if (other == null || !response(other, theta, pr, pi, null, null)) {
                return false;
            }
            Reduced lowOnly = reduced(lnBias, false);
            double[] br = new double[omegas.length];
            double[] bi = new double[omegas.length];
            if (lowOnly == null || !response(lowOnly, theta, br, bi, null, null)) {
                return false;
            }
            for (int n = 0; n < omegas.length; n++) {
                // ln(H'/H)/h: a ratio, so no branch cut of the logarithm is crossed
                double size = br[n] * br[n] + bi[n] * bi[n];
                double qr = (pr[n] * br[n] + pi[n] * bi[n]) / size;
                double qi = (pi[n] * br[n] - pr[n] * bi[n]) / size;
                dRe[n][k + j] = 0.5 * Math.log(qr * qr + qi * qi) / BIAS_STEP;
                dIm[n][k + j] = Math.atan2(qi, qr) / BIAS_STEP;
            }
        }
        return true;
    }

    /**
     * @return the low-band model at these bias currents (ln I/I_nom per transistor), with
     *         capacitor {@code i} at C_nom·e^φ_i; for corners and predictions of an estimate
     */
    SmallSignalNetwork network(double[] theta) {
        int k = capacitors.size();
        Stage scaled = stage;
        for (int i = 0; i < k; i++) {
            scaled = scaled.withCapacitance(capacitors.get(i), nominalFarads[i] * Math.exp(theta[i]));
        }
        return expansion.expand(scaled, points(Arrays.copyOfRange(theta, k, k + transistors.size())));
    }

    private OperatingPoints points(double[] lnBias) {
        OperatingPoints points = nominalPoints;
        for (int j = 0; j < lnBias.length; j++) {
            if (lnBias[j] != 0) {
                points = points.withCurrentScaled(transistors.get(j), Math.exp(lnBias[j]));
            }
        }
        return points;
    }

    private boolean response(Reduced reduced, double[] theta, double[] hRe, double[] hIm, double[][] dRe,
                             double[][] dIm) {
        responses++;
        int k = capacitors.size();
        double gain = Math.exp(theta[theta.length - 1]);
        double[] farads = new double[k];
        for (int i = 0; i < k; i++) {
            farads[i] = nominalFarads[i] * Math.exp(theta[i]);
        }
        for (int n = 0; n < omegas.length; n++) {
            double omega = omegas[n];
            double lr = reduced.d;
            double li = 0;
            if (k > 0) {
                double[][] mr = lowLu.real();
                double[][] mi = lowLu.imaginary();
                for (int i = 0; i < k; i++) {
                    System.arraycopy(reduced.y[i], 0, mr[i], 0, k);
                    Arrays.fill(mi[i], 0);
                    mi[i][i] = omega * farads[i];
                    xr[i] = -reduced.b[i];
                    xi[i] = 0;
                }
                if (!lowLu.factor()) {
                    return false;
                }
                lowLu.solve(xr, xi);
                for (int i = 0; i < k; i++) {
                    lr += reduced.c[i] * xr[i];
                    li += reduced.c[i] * xi[i];
                }
            }
            double lowSize = lr * lr + li * li;
            if (!(lowSize > 0) || !Double.isFinite(lowSize)) {
                return false;
            }
            double fr = reduced.highRe[n];
            double fi = reduced.highIm[n];
            hRe[n] = gain * (lr * fr - li * fi);
            hIm[n] = gain * (lr * fi + li * fr);
            if (dRe == null) {
                continue;
            }
            if (k > 0) {
                for (int i = 0; i < k; i++) {
                    ur[i] = reduced.c[i];
                    ui[i] = 0;
                }
                lowLu.solveTransposed(ur, ui);
            }
            for (int i = 0; i < k; i++) {
                // ∂H_low/∂φ_i = −jω·C_i·u_i·x_i; divided by H_low for ∂ln H/∂φ_i
                double pr = ur[i] * xr[i] - ui[i] * xi[i];
                double pi = ur[i] * xi[i] + ui[i] * xr[i];
                double dr = omega * farads[i] * pi;
                double di = -omega * farads[i] * pr;
                dRe[n][i] = (dr * lr + di * li) / lowSize;
                dIm[n][i] = (di * lr - dr * li) / lowSize;
            }
            int g = theta.length - 1;
            dRe[n][g] = 1;
            dIm[n][g] = 0;
        }
        return true;
    }

    private Reduced reduced(double[] lnBias, boolean withHighBand) {
        String key = Arrays.toString(lnBias) + withHighBand;
        Reduced hit = cache.get(key);
        if (hit != null) {
            return hit;
        }
        Reduced made = reduce(lnBias, withHighBand);
        if (made != null) {
            cache.put(key, made);
        }
        return made;
    }

    /** @return how many port reductions this model has made: the cost driver of a back-solve */
    int reductions() {
        return reductions;
    }

    /** @return how many responses over the sweep this model has evaluated */
    int responses() {
        return responses;
    }

    private Reduced reduce(double[] lnBias, boolean withHighBand) {
        reductions++;
        SmallSignalNetwork network = expansion.expand(stage, points(lnBias));
        Reduction low = reduction.reduce(network, Band.LOW);
        if (!(low instanceof Reduction.StateSpace)) {
            return null;
        }
        StateModel model = ((Reduction.StateSpace) low).model();
        int k = model.order();
        if (k != capacitors.size()) {
            return null;
        }
        double[][] y = new double[k][k];
        double[] b = new double[k];
        double[] bState = model.b();
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                y[i][j] = model.admittanceSiemens(i, j);
            }
            // B = −Cd⁻¹·b, so b = −C_i·B_i
            b[i] = -model.farads(i) * bState[i];
        }
        double d = model.directGain();
        double[] highRe = new double[omegas.length];
        double[] highIm = new double[omegas.length];
        Arrays.fill(highRe, 1);
        if (withHighBand && !network.capacitances(Band.HIGH).isEmpty() && d != 0) {
            Reduction high = reduction.reduce(network, Band.HIGH);
            if (!(high instanceof Reduction.StateSpace)) {
                return null;
            }
            if (!highFactor(((Reduction.StateSpace) high).model(), d, highRe, highIm)) {
                return null;
            }
        }
        return new Reduced(y, b, model.c(), d, highRe, highIm);
    }

    // H_high(jω)/D with H_high = C·(jωI − A)⁻¹·B + D_high, from the high-band model's matrices
    private boolean highFactor(StateModel high, double midbandGain, double[] outRe, double[] outIm) {
        int k = high.order();
        if (k == 0) {
            double ratio = high.directGain() / midbandGain;
            Arrays.fill(outRe, ratio);
            return true;
        }
        double[][] a = high.a();
        double[] bState = high.b();
        double[] c = high.c();
        SmallComplexLu lu = new SmallComplexLu(k);
        double[] vr = new double[k];
        double[] vi = new double[k];
        for (int n = 0; n < omegas.length; n++) {
            double[][] mr = lu.real();
            double[][] mi = lu.imaginary();
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < k; j++) {
                    mr[i][j] = -a[i][j];
                    mi[i][j] = 0;
                }
                mi[i][i] = omegas[n];
                vr[i] = bState[i];
                vi[i] = 0;
            }
            if (!lu.factor()) {
                return false;
            }
            lu.solve(vr, vi);
            double hr = high.directGain();
            double hi = 0;
            for (int i = 0; i < k; i++) {
                hr += c[i] * vr[i];
                hi += c[i] * vi[i];
            }
            outRe[n] = hr / midbandGain;
            outIm[n] = hi / midbandGain;
        }
        return true;
    }

    /** One bias point's low-band reduction and high-band factor; arrays owned, never exposed. */
    private static final class Reduced {
        final double[][] y;
        final double[] b;
        final double[] c;
        final double d;
        final double[] highRe;
        final double[] highIm;

        Reduced(double[][] y, double[] b, double[] c, double d, double[] highRe, double[] highIm) {
            this.y = y;
            this.b = b;
            this.c = c;
            this.d = d;
            this.highRe = highRe;
            this.highIm = highIm;
        }
    }
}

package org.polebench.reconcile;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.analysis.PortReduction;
import org.polebench.analysis.Reduction;
import org.polebench.analysis.StateModel;
import org.polebench.circuit.Band;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.circuit.Stage;
import org.polebench.linalg.SweptPortEquations;

/**
 * The stage's own exact response at the sweep's frequencies as a function of the back-solve's
 * parameters θ = (φ_i = ln(C_i/C_i,nom) per low-band capacitor, the network parameters of
 * {@link BoardNetwork}: ln(I_j/I_j,nom) per transistor, ln(β/β_nom) per BJT, ln(R/R_nom) per
 * resistor; g = flat gain in nepers): H(jω; θ) = e^g · H_low(jω) · H_high(jω)/D (docs/method.md, "The back-solve").
 *
 * <p>H_low comes from the low-band port reduction: with A = −Cd⁻¹·Y and B = −Cd⁻¹·b,
 * H_low = D + cᵀ·(sI − A)⁻¹·B = D − cᵀ·(Y + s·Cd)⁻¹·b, and Y, b, c, D do not depend on the
 * capacitors, so one reduction per bias point serves every capacitor value. Its derivative is
 * exact: with x = −(Y + s·Cd)⁻¹·b and u = (Y + s·Cd)⁻ᵀ·c, ∂H_low/∂φ_i = −s·C_i·u_i·x_i.
 * H_high/D is the high-band model's response (low-band capacitors shorted) over the midband
 * gain: the product of the two bands is exact when they lie decades apart, as a low-band
 * sweep assumes. Only the network parameters need a new small-signal expansion and reduction
 * (a resistor or a β with a new bias solve); their derivative is a forward difference of the
 * reduction (Y, b, c, D), carried to H_low to first order with this point's x and u, so a
 * column costs a reduction but no new factoring of the port equations.
 *
 * <p>Every evaluation solves the port equations at all the sweep's frequencies at once
 * ({@link SweptPortEquations}) into preallocated arrays: nothing is allocated per frequency.
 * Keeps the last few reductions and high-band factors, by bias point, and its work arrays, so
 * one instance belongs to one task and thread.
 */
final class BoardModel {
    /** Forward-difference step in ln I: truncation ~1e-6 relative, round-off ~1e-10. */
    static final double BIAS_STEP = 1e-6;
    private static final int CACHED_REDUCTIONS = 32;
    private static final int CACHED_HIGH_FACTORS = 8;
    /** Bias move in ln I within which a high-band factor is reused between exact evaluations. */
    static final double HIGH_BAND_REFRESH = 0.02;

    private final List<String> capacitors;
    private final double[] nominalFarads;
    private final double[] omegas;
    private final PortReduction reduction = new PortReduction();
    /** The network parameters' effect on the resistive network, laid out once. */
    private final BoardNetwork board;
    private final Map<BiasPoint, Reduced> cache = leastRecentlyUsed(CACHED_REDUCTIONS);
    // hypotheses alternate between a few bias points (the no-fault MAP's, the priors' means)
    private final Map<BiasPoint, HighFactor> highCache = leastRecentlyUsed(CACHED_HIGH_FACTORS);
    /**
     * The two bands' reductions laid out once, from the nominal network: every in-region board
     * of the stage has the same elements in the same places and the same zero conductances
     * ({@link PortReduction#prepare}), so each bias point only restamps numbers.
     */
    private final PortReduction.Prepared lowLayout;
    private final PortReduction.Prepared highLayout;
    private final boolean withHighBand;
    /** Which of the nominal network's element values are zero: a layout holds only for this pattern. */
    private final boolean[] nominalZeros;
    private BiasPoint lastExpanded;
    private double[] lastValues;
    private final SweptPortEquations ports;
    private SweptPortEquations highEquations;
    private int reductions;
    private HighFactor lastHigh;
    private int responses;
    private final double[] farads;
    /** x = −(Y + jωCd)⁻¹·b and u = (Y + jωCd)⁻ᵀ·c, [port][frequency]. */
    private final double[][] xr;
    private final double[][] xi;
    private final double[][] ur;
    private final double[][] ui;
    /** Work per frequency for a network column: ΔH_low, and ΔY·x + Δb of one port. */
    private final double[] changeRe;
    private final double[] changeIm;
    private final double[] portRe;
    private final double[] portIm;
    /** Work per frequency: the low band, and jω·conj(H_low)/|H_low|² (as ω·H_low/|H_low|²). */
    private final double[] responseRe;
    private final double[] responseIm;
    private final double[] weightRe;
    private final double[] weightIm;

    /**
     * @param nominalModel  the nominal low-band model (its port order is the parameter order)
     * @param frequenciesHz where the response is wanted, positive
     */
    BoardModel(Stage stage, OperatingPoints nominalPoints, StateModel nominalModel, double[] frequenciesHz) {
        this.capacitors = nominalModel.capacitorNames();
        this.board = new BoardNetwork(stage, nominalPoints, capacitors);
        SmallSignalNetwork nominalNetwork = board.network(null, board.nominal());
        this.lowLayout = reduction.prepare(nominalNetwork, Band.LOW);
        this.highLayout = reduction.prepare(nominalNetwork, Band.HIGH);
        this.withHighBand = !nominalNetwork.capacitances(Band.HIGH).isEmpty();
        double[] nominalElements = nominalNetwork.elementValues();
        this.nominalZeros = new boolean[nominalElements.length];
        for (int e = 0; e < nominalElements.length; e++) {
            nominalZeros[e] = nominalElements[e] == 0;
        }
        int k = capacitors.size();
        this.nominalFarads = new double[k];
        for (int i = 0; i < k; i++) {
            nominalFarads[i] = nominalModel.farads(i);
        }
        this.omegas = new double[frequenciesHz.length];
        for (int n = 0; n < omegas.length; n++) {
            omegas[n] = 2 * Math.PI * frequenciesHz[n];
        }
        this.ports = new SweptPortEquations(k, omegas);
        this.farads = new double[k];
        this.changeRe = new double[omegas.length];
        this.changeIm = new double[omegas.length];
        this.portRe = new double[omegas.length];
        this.portIm = new double[omegas.length];
        this.responseRe = new double[omegas.length];
        this.responseIm = new double[omegas.length];
        this.weightRe = new double[omegas.length];
        this.weightIm = new double[omegas.length];
        this.xr = new double[k][omegas.length];
        this.xi = new double[k][omegas.length];
        this.ur = new double[k][omegas.length];
        this.ui = new double[k][omegas.length];
    }

    List<String> capacitors() {
        return capacitors;
    }

    /** @return the network parameters' layout: bias currents, BJT current gains, resistors */
    BoardNetwork board() {
        return board;
    }

    double nominalFarads(int i) {
        return nominalFarads[i];
    }

    int frequencies() {
        return omegas.length;
    }

    /** @return k + n + 1: capacitors, the network parameters of {@link BoardNetwork}, gain */
    int parameterCount() {
        return capacitors.size() + board.size() + 1;
    }

    /**
     * Evaluates H and, when {@code dRe} is given, ∂ln H/∂θ for every parameter at every frequency.
     *
     * @param theta parameters in the order of {@link #parameterCount()}
     * @param hRe   out: Re H per frequency
     * @param hIm   out: Im H per frequency
     * @param dRe   out, or null: [parameter][frequency] real part of ∂ln H/∂θ
     * @param dIm   out, or null: imaginary part
     * @param biasColumns per network parameter (bias current, β, resistor), whether to compute
     *                    its column of {@code dRe, dIm} (by forward difference, one reduction
     *                    each); null for none. Columns not computed are left as they were.
     * @param exactHighBand false lets the high-band factor of a bias point within
     *                      {@value #HIGH_BAND_REFRESH} in ln I of the last one used be reused
     * @return false when the network is singular at these bias currents or H vanishes
     */
    boolean evaluate(double[] theta, double[] hRe, double[] hIm, double[][] dRe, double[][] dIm,
                     boolean[] biasColumns, boolean exactHighBand) {
        int k = capacitors.size();
        int m = board.size();
        int firstResistor = board.transistors().size() + board.bjts().size();
        double[] lnBias = Arrays.copyOfRange(theta, k, k + m);
        Reduced reduced = reduced(lnBias);
        HighFactor high = reduced == null ? null : highFactor(lnBias, exactHighBand, reduced.d);
        if (reduced == null || high == null || !response(reduced, high, theta, hRe, hIm, dRe, dIm)) {
            return false;
        }
        if (dRe == null || biasColumns == null) {
            return true;
        }
        // the derivative's base is the exact high band here, not one reused from a nearby point
        HighFactor here = exactHighBand ? high : highFactor(lnBias, true, reduced.d);
        if (here == null) {
            return false;
        }
        for (int j = 0; j < m; j++) {
            if (!biasColumns[j]) {
                continue;
            }
            double[] stepped = lnBias.clone();
            stepped[j] += BIAS_STEP;
            // the high band is stepped too, for every network parameter and in every evaluation: a
            // bias current or a β moves gm and so the Miller capacitances' corner, and where the
            // sweep reaches the high band those points hold most of the gradient. Leaving that
            // dependence out (as this code once did between exact evaluations, and for bias and β
            // even in them) made the bias and β columns 25–33 % wrong and their gradient four
            // orders too small on a sweep to 2 MHz, and the search stopped far from the MAP:
            // healthy boards with ordinary β spread were blamed on a resistor or the generator
            // (BoardModelTest checks every column against central differences).
            Reduced other = reduced(stepped);
            HighFactor otherHigh = other == null ? null : highFactor(stepped, true, other.d);
            if (other == null || otherHigh == null
                    || !lowBandDifference(reduced, other, dRe[k + j], dIm[k + j])) {
                return false;
            }
            for (int n = 0; n < omegas.length; n++) {
                // ln(H'_high/H_high)/h: a ratio, so no branch cut of the logarithm is crossed
                double size = here.re[n] * here.re[n] + here.im[n] * here.im[n];
                double qr = (otherHigh.re[n] * here.re[n] + otherHigh.im[n] * here.im[n]) / size;
                double qi = (otherHigh.im[n] * here.re[n] - otherHigh.re[n] * here.im[n]) / size;
                dRe[k + j][n] += 0.5 * Math.log(qr * qr + qi * qi) / BIAS_STEP;
                dIm[k + j][n] += Math.atan2(qi, qr) / BIAS_STEP;
            }
        }
        return true;
    }

    /**
     * @return per frequency, the cancellation ratio (|D| + Σ|c_i·x_i|)/|H_low| of the low-band sum
     *         H_low = D + cᵀ·x at θ: 1 where nothing cancels, 1e16 where the terms of order D
     *         cancel to a result 1e16 times smaller, which then holds no correct digit (the
     *         error bound of a sum, Higham, Accuracy and Stability of Numerical Algorithms, 2nd
     *         ed., 2002, 4.2 and 3.1: |error| ≤ γ_k·Σ|terms|); null where the model is undefined
     */
    double[] cancellation(double[] theta) {
        int k = capacitors.size();
        double[] lnBias = Arrays.copyOfRange(theta, k, k + board.size());
        Reduced reduced = reduced(lnBias);
        HighFactor high = reduced == null ? null : highFactor(lnBias, true, reduced.d);
        int f = omegas.length;
        if (reduced == null || high == null || !response(reduced, high, theta, new double[f], new double[f], null, null)) {
            return null;
        }
        double[] ratio = new double[f];
        for (int n = 0; n < f; n++) {
            double terms = Math.abs(reduced.d);
            for (int i = 0; i < k; i++) {
                terms += Math.abs(reduced.c[i]) * Math.hypot(xr[i][n], xi[i][n]);
            }
            ratio[n] = terms / Math.hypot(responseRe[n], responseIm[n]);
        }
        return ratio;
    }

    // The low band's change from one reduction to a nearby one, to first order, with the
    // capacitors held: with M = Y + s·Cd, x = −M⁻¹·b and u = M⁻ᵀ·c of the last response (this
    // call's), H_low = D + cᵀ·x moves by ΔH = ΔD + Δcᵀ·x − uᵀ·(ΔY·x + Δb) (the derivative of an
    // inverse, Golub and Van Loan, Matrix Computations, 3rd ed., 2.3.4). Over a step of
    // BIAS_STEP this is the forward difference of H_low less its second-order term (relative
    // size ~BIAS_STEP, as the difference's own truncation), and it needs no factoring of M at
    // the stepped point. Writes ΔH/(H_low·h), the column of ∂ln H/∂θ; false when H_low vanishes.
    private boolean lowBandDifference(Reduced base, Reduced other, double[] outRe, double[] outIm) {
        int k = capacitors.size();
        int f = omegas.length;
        double dd = other.d - base.d;
        Arrays.fill(changeRe, dd);
        Arrays.fill(changeIm, 0);
        for (int i = 0; i < k; i++) {
            // Δc_i·x_i − u_i·(Σ_l ΔY_il·x_l + Δb_i), accumulated per port i
            double dc = other.c[i] - base.c[i];
            double db = other.b[i] - base.b[i];
            Arrays.fill(portRe, db);
            Arrays.fill(portIm, 0);
            for (int l = 0; l < k; l++) {
                double dy = other.yFlat[i * k + l] - base.yFlat[i * k + l];
                if (dy == 0) {
                    continue;
                }
                double[] pr = xr[l];
                double[] pi = xi[l];
                for (int n = 0; n < f; n++) {
                    portRe[n] += dy * pr[n];
                    portIm[n] += dy * pi[n];
                }
            }
            double[] pr = xr[i];
            double[] pi = xi[i];
            double[] qr = ur[i];
            double[] qi = ui[i];
            for (int n = 0; n < f; n++) {
                changeRe[n] += dc * pr[n] - (qr[n] * portRe[n] - qi[n] * portIm[n]);
                changeIm[n] += dc * pi[n] - (qr[n] * portIm[n] + qi[n] * portRe[n]);
            }
        }
        for (int n = 0; n < f; n++) {
            double hr = responseRe[n];
            double hi = responseIm[n];
            double size = hr * hr + hi * hi;
            if (!(size > 0)) {
                return false;
            }
            outRe[n] = (changeRe[n] * hr + changeIm[n] * hi) / (size * BIAS_STEP);
            outIm[n] = (changeIm[n] * hr - changeRe[n] * hi) / (size * BIAS_STEP);
        }
        return true;
    }

    /**
     * @return the low-band model at these bias currents (ln I/I_nom per transistor), with
     *         capacitor {@code i} at C_nom·e^φ_i; for corners and predictions of an estimate
     */
    SmallSignalNetwork network(double[] theta) {
        int k = capacitors.size();
        return board.network(Arrays.copyOfRange(theta, 0, k), Arrays.copyOfRange(theta, k, k + board.size()));
    }

    private boolean response(Reduced reduced, HighFactor high, double[] theta, double[] hRe, double[] hIm,
                             double[][] dRe, double[][] dIm) {
        responses++;
        int k = capacitors.size();
        double gain = Math.exp(theta[theta.length - 1]);
        for (int i = 0; i < k; i++) {
            farads[i] = nominalFarads[i] * Math.exp(theta[i]);
        }
        if (k > 0) {
            if (!ports.factor(reduced.yFlat, farads)) {
                return false;
            }
            ports.solve(reduced.negativeB, xr, xi);
            if (dRe != null) {
                ports.solveTransposed(reduced.c, ur, ui);
            }
        }
        int f = omegas.length;
        Arrays.fill(responseRe, reduced.d);
        Arrays.fill(responseIm, 0);
        for (int i = 0; i < k; i++) {
            double ci = reduced.c[i];
            double[] pr = xr[i];
            double[] pi = xi[i];
            for (int n = 0; n < f; n++) {
                responseRe[n] += ci * pr[n];
                responseIm[n] += ci * pi[n];
            }
        }
        for (int n = 0; n < f; n++) {
            double lr = responseRe[n];
            double li = responseIm[n];
            double lowSize = lr * lr + li * li;
            if (!(lowSize > 0) || !Double.isFinite(lowSize)) {
                return false;
            }
            double fr = high.re[n];
            double fi = high.im[n];
            hRe[n] = gain * (lr * fr - li * fi);
            hIm[n] = gain * (lr * fi + li * fr);
            // ∂H_low/∂φ_i = −jω·C_i·u_i·x_i; times conj(H_low)/|H_low|² for ∂ln H/∂φ_i
            weightRe[n] = omegas[n] * lr / lowSize;
            weightIm[n] = omegas[n] * li / lowSize;
        }
        if (dRe == null) {
            return true;
        }
        for (int i = 0; i < k; i++) {
            double[] uiRe = ur[i];
            double[] uiIm = ui[i];
            double[] xiRe = xr[i];
            double[] xiIm = xi[i];
            double ci = farads[i];
            double[] outRe = dRe[i];
            double[] outIm = dIm[i];
            for (int n = 0; n < f; n++) {
                double pr = uiRe[n] * xiRe[n] - uiIm[n] * xiIm[n];
                double pi = uiRe[n] * xiIm[n] + uiIm[n] * xiRe[n];
                outRe[n] = ci * (pi * weightRe[n] - pr * weightIm[n]);
                outIm[n] = -ci * (pr * weightRe[n] + pi * weightIm[n]);
            }
        }
        int g = theta.length - 1;
        Arrays.fill(dRe[g], 0, f, 1);
        Arrays.fill(dIm[g], 0, f, 0);
        return true;
    }

    private Reduced reduced(double[] lnBias) {
        BiasPoint key = new BiasPoint(lnBias);
        Reduced hit = cache.get(key);
        if (hit != null) {
            return hit;
        }
        Reduced made = reduce(lnBias);
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

    private Reduced reduce(double[] lnBias) {
        Reduction low = reduction(lnBias, Band.LOW);
        if (low == null) {
            return null;
        }
        reductions++;
        if (low.stateModel().isEmpty()) {
            return null;
        }
        StateModel model = low.stateModel().get();
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
        return new Reduced(y, b, model.c(), model.directGain());
    }

    // The high band moves with the bias only through gm and rπ (the Miller effect): a fraction
    // of a degree over the top of a low-band sweep, so between exact evaluations the factor of a
    // bias point within HIGH_BAND_REFRESH in ln I is reused (its change there is about 1e-2 of
    // the point noise); the MAP's final evaluation, which fixes χ² and the evidence, is exact.
    private HighFactor highFactor(double[] lnBias, boolean exact, double midbandGain) {
        BiasPoint key = new BiasPoint(lnBias);
        HighFactor hit = highCache.get(key);
        if (hit == null && !exact && lastHigh != null) {
            // between exact evaluations a resistor's move does not refresh the high band: the
            // searches that move a resistor take long steps, each would cost a high-band
            // reduction, and the final exact evaluation of every MAP uses the exact high band
            boolean near = true;
            int resistorsFrom = board.transistors().size() + board.bjts().size();
            for (int j = 0; j < resistorsFrom && near; j++) {
                near = Math.abs(lnBias[j] - lastHigh.lnBias[j]) <= HIGH_BAND_REFRESH;
            }
            hit = near ? lastHigh : null;
        }
        if (hit != null) {
            lastHigh = hit;
            return hit;
        }
        double[] re = new double[omegas.length];
        double[] im = new double[omegas.length];
        Arrays.fill(re, 1);
        if (withHighBand) {
            Reduction high = reduction(lnBias, Band.HIGH);
            if (high == null) {
                return null;
            }
            reductions++;
            if (high.stateModel().isEmpty()) {
                return null;
            }
            if (midbandGain != 0 && !highFactor(high.stateModel().get(), midbandGain, re, im)) {
                return null;
            }
        }
        lastHigh = new HighFactor(lnBias.clone(), re, im);
        highCache.put(key, lastHigh);
        return lastHigh;
    }

    // one band's reduction at one bias point, restamped on the prepared layout; the low and the
    // high band of one bias point come from one expansion. Null where the transistors leave
    // their amplifying region.
    private Reduction reduction(double[] lnBias, Band band) {
        BiasPoint key = new BiasPoint(lnBias);
        if (!key.equals(lastExpanded)) {
            lastValues = board.elementValues(lnBias);
            lastExpanded = key;
        }
        if (lastValues == null) {
            return null;
        }
        for (int e = 0; e < lastValues.length; e++) {
            if ((lastValues[e] == 0) != nominalZeros[e]) {
                // a conductance that vanished or appeared: the layout does not hold, so this
                // network is laid out afresh
                return reduction.reduce(board.network(null, lnBias), band);
            }
        }
        return (band == Band.LOW ? lowLayout : highLayout).reduce(lastValues);
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
        double[] c = high.c();
        // jωI − A is the port form Y + jω·Cd with Y = −A and every "capacitance" 1
        double[] minusA = new double[k * k];
        double[] unit = new double[k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                minusA[i * k + j] = -a[i][j];
            }
            unit[i] = 1;
        }
        if (highEquations == null || highEquations.order() != k) {
            highEquations = new SweptPortEquations(k, omegas);
        }
        double[][] vr = new double[k][omegas.length];
        double[][] vi = new double[k][omegas.length];
        if (!highEquations.factor(minusA, unit)) {
            return false;
        }
        highEquations.solve(high.b(), vr, vi);
        for (int n = 0; n < omegas.length; n++) {
            double hr = high.directGain();
            double hi = 0;
            for (int i = 0; i < k; i++) {
                hr += c[i] * vr[i][n];
                hi += c[i] * vi[i][n];
            }
            outRe[n] = hr / midbandGain;
            outIm[n] = hi / midbandGain;
        }
        return true;
    }

    /** One bias point's low-band reduction; arrays owned, never exposed. */
    private static final class Reduced {
        final double[][] y;
        final double[] yFlat;
        final double[] b;
        final double[] negativeB;
        final double[] c;
        final double d;

        Reduced(double[][] y, double[] b, double[] c, double d) {
            this.y = y;
            int k = y.length;
            this.yFlat = new double[k * k];
            for (int i = 0; i < k; i++) {
                System.arraycopy(y[i], 0, yFlat, i * k, k);
            }
            this.b = b;
            this.negativeB = new double[k];
            for (int i = 0; i < k; i++) {
                negativeB[i] = -b[i];
            }
            this.c = c;
            this.d = d;
        }
    }

    /** @return a map in access order that forgets its least recently used entry beyond {@code capacity} */
    private static <V> Map<BiasPoint, V> leastRecentlyUsed(int capacity) {
        return new LinkedHashMap<>(16, 0.75f, true) {
            private static final long serialVersionUID = 1L;

            @Override
            protected boolean removeEldestEntry(Map.Entry<BiasPoint, V> eldest) {
                return size() > capacity;
            }
        };
    }

    /** ln I/I_nom per transistor as a map key, compared by value (an array compares by identity). */
    private static final class BiasPoint {
        private final double[] lnBias;

        BiasPoint(double[] lnBias) {
            this.lnBias = lnBias.clone();
        }

        @Override
        public boolean equals(Object other) {
            return other instanceof BiasPoint && Arrays.equals(lnBias, ((BiasPoint) other).lnBias);
        }

        @Override
        public int hashCode() {
            return Arrays.hashCode(lnBias);
        }
    }

    /** H_high/D per frequency at one bias point. */
    private static final class HighFactor {
        final double[] lnBias;
        final double[] re;
        final double[] im;

        HighFactor(double[] lnBias, double[] re, double[] im) {
            this.lnBias = lnBias;
            this.re = re;
            this.im = im;
        }
    }
}

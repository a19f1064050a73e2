package org.polebench.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.polebench.circuit.Band;

/**
 * The state-space model of one band's capacitor ports (docs/method.md, "Port reduction"): with the
 * port voltages v as states, Cd·dv/dt = −(Y·v + b·u), y = cᵀ·v + D·u, so
 * A = −Cd⁻¹·Y, B = −Cd⁻¹·b, C = cᵀ and D.
 *
 * <p>Y (siemens) is the short-circuit admittance matrix of the ports: column j holds the
 * currents flowing out of each port into the resistive network when port j is held at 1 V and
 * every other port and the stimulus at 0 V. b (siemens) holds the same currents for the stimulus
 * at 1 V with all ports at 0 V; c (V/V) and D (V/V) are the output voltages of the same solves.
 * Y is non-singular (checked by {@link PortReduction}).
 *
 * <p>High band only: capacitors that close loops (links, see {@link PortReduction}) have
 * v_l = q_lᵀ·v + q_u,l·u. Charge conservation around each loop turns Cd into the capacitance
 * matrix Cf = Cd + Σ_l C_l·q_l·q_lᵀ and adds g·du/dt with g = Σ_l C_l·q_u,l·q_l; the state
 * x = v + Cf⁻¹·g·u removes the derivative, giving A = −Cf⁻¹·Y, B = Cf⁻¹·(Y·Cf⁻¹·g − b),
 * C = cᵀ and D' = D − cᵀ·Cf⁻¹·g (Chua and Lin, Computer-Aided Analysis of Electronic Circuits,
 * 1975, state equations of networks with capacitor loops, from memory). Without links these are
 * the formulas above.
 *
 * <p>{@link #directGain()} is the gain with every port shorted: the midband gain for the low
 * band, the gain at ω → ∞ for the high band. Immutable; arrays are copied in and out.
 */
public final class StateModel {
    private final Band band;
    private final List<String> capacitorNames;
    private final List<LinkCapacitor> links;
    private final double[] farads;
    private final double[][] capacitance;
    private final double[][] y;
    private final AdmittanceInverse yInverse;
    private final double[] c;
    private final double d;
    private final double[][] a;
    private final double[] bState;
    private final double largestPoleBound;

    StateModel(Band band, List<String> capacitorNames, double[] farads, List<LinkCapacitor> links,
               double[][] y, AdmittanceInverse yInverse, double[] b, double[] c, double directGain) {
        int k = farads.length;
        this.band = band;
        this.capacitorNames = List.copyOf(capacitorNames);
        this.links = List.copyOf(links);
        this.farads = farads;
        this.y = y;
        this.yInverse = yInverse;
        this.c = c;
        this.capacitance = new double[k][k];
        for (int i = 0; i < k; i++) {
            capacitance[i][i] = farads[i];
        }
        this.a = new double[k][k];
        this.bState = new double[k];
        if (links.isEmpty()) {
            // Cd is diagonal: the general formulas below with their zero terms left out (the
            // low band, and so every board of a tolerance spread)
            this.d = directGain;
            for (int i = 0; i < k; i++) {
                diagonalRow(i, 1 / farads[i], y[i], b[i]);
            }
        } else {
            this.d = withLinks(k, y, b, c, directGain);
        }
        this.largestPoleBound = SpectralBound.of(a);
    }

    /** @return D' = D − cᵀ·Cf⁻¹·g, after setting A and B by the formulas of the class comment */
    private double withLinks(int k, double[][] y, double[] b, double[] c, double directGain) {
        if (k == 0) {
            // links across the stimulus and shorts alone: no state, and D stands
            return directGain;
        }
        double[] g = new double[k];
        for (LinkCapacitor link : links) {
            double[] q = link.portCoefficients(k);
            double qu = link.stimulusCoefficient();
            for (int i = 0; i < k; i++) {
                g[i] += link.farads * qu * q[i];
                for (int j = 0; j < k; j++) {
                    capacitance[i][j] += link.farads * q[i] * q[j];
                }
            }
        }
        // Cf is symmetric positive definite (a sum of C_i > 0 terms), so it inverts; threshold 0
        // because Commons Math's default pivot threshold (1e-11, absolute) exceeds picofarads
        double[][] cInverse = new LUDecomposition(new Array2DRowRealMatrix(capacitance), 0).getSolver().getInverse()
                .getData();
        double[] cInverseG = multiply(cInverse, g);
        double[] yCInverseG = multiply(y, cInverseG);
        double dPrime = directGain;
        for (int i = 0; i < k; i++) {
            dPrime -= c[i] * cInverseG[i];
        }
        for (int i = 0; i < k; i++) {
            stateRow(i, cInverse[i], y, b, yCInverseG);
        }
        return dPrime;
    }

    // A_ij = −Y_ij/C_i, B_i = −b_i/C_i, as (1/C_i)·… like the general product
    private void diagonalRow(int i, double inverseFarads, double[] yRow, double bSiemens) {
        for (int j = 0; j < yRow.length; j++) {
            a[i][j] = -(inverseFarads * yRow[j]);
        }
        bState[i] = inverseFarads * -bSiemens;
    }

    // row i of A and B; one row per call, as RealLu keeps its loops, for the cold spread's sake
    private void stateRow(int i, double[] cInverseRow, double[][] y, double[] b, double[] yCInverseG) {
        int k = cInverseRow.length;
        for (int j = 0; j < k; j++) {
            double sum = 0;
            for (int m = 0; m < k; m++) {
                sum += cInverseRow[m] * y[m][j];
            }
            a[i][j] = -sum;
        }
        double bi = 0;
        for (int m = 0; m < k; m++) {
            bi += cInverseRow[m] * (yCInverseG[m] - b[m]);
        }
        bState[i] = bi;
    }

    private static double[] multiply(double[][] m, double[] v) {
        double[] result = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            for (int j = 0; j < v.length; j++) {
                result[i] += m[i][j] * v[j];
            }
        }
        return result;
    }

    public Band band() {
        return band;
    }

    /** @return k, the number of ports (states) */
    public int order() {
        return farads.length;
    }

    /** @return the port capacitors in state order */
    public List<String> capacitorNames() {
        return capacitorNames;
    }

    /** @return the link capacitors (high band only): loop-closing capacitors that are no state */
    public List<String> linkCapacitorNames() {
        List<String> names = new ArrayList<>(links.size());
        for (LinkCapacitor link : links) {
            names.add(link.name);
        }
        return names;
    }

    /**
     * @return the links whose loop runs through no port, only the stimulus and shorted low-band
     * capacitors: ideal sources fix their voltage, so they carry current but set no pole and
     * have no time constant; always empty for the low band
     */
    public List<String> capacitorsAcrossSources() {
        List<String> names = new ArrayList<>();
        for (LinkCapacitor link : links) {
            if (Arrays.stream(link.portCoefficients(order())).allMatch(q -> q == 0)) {
                names.add(link.name);
            }
        }
        return names;
    }

    /** @return C_l of link l in farads */
    public double linkFarads(int l) {
        return links.get(l).farads;
    }

    /** @return q_lᵀ·Y⁻¹·q_l in ohms: the resistance link l sees with every other capacitor open */
    public double linkOpenCircuitOhms(int l) {
        double[] q = links.get(l).portCoefficients(order());
        double[][] inverse = yInverse.matrix();
        double sum = 0;
        for (int i = 0; i < q.length; i++) {
            for (int j = 0; j < q.length; j++) {
                sum += q[i] * inverse[i][j] * q[j];
            }
        }
        return sum;
    }

    /** @return true when links make the capacitance matrix non-diagonal */
    public boolean hasLinks() {
        return !links.isEmpty();
    }

    /** @return Cf_ij in farads: diag(C) plus the links' charge terms */
    public double capacitanceFarads(int i, int j) {
        return capacitance[i][j];
    }

    /** @return C_i in farads */
    public double farads(int i) {
        return farads[i];
    }

    /** @return Y_ij in siemens */
    public double admittanceSiemens(int i, int j) {
        return y[i][j];
    }

    /** @return (Y⁻¹)_ij in ohms: the open-circuit resistance seen by port i is (Y⁻¹)_ii */
    public double inverseAdmittanceOhms(int i, int j) {
        return yInverse.ohms(i, j);
    }

    /** @return c_i: output volts per volt on port i, stimulus and other ports at 0 V */
    public double outputPerPortVolt(int i) {
        return c[i];
    }

    /** @return D (D' with links), the output per stimulus volt with every port and link shorted */
    public double directGain() {
        return d;
    }

    /** @return a copy of A in 1/s */
    public double[][] a() {
        double[][] copy = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            copy[i] = a[i].clone();
        }
        return copy;
    }

    /** @return a copy of B in (V/s)/V */
    public double[] b() {
        return bState.clone();
    }

    /** @return a copy of C (V/V) */
    public double[] c() {
        return c.clone();
    }

    double[][] aView() {
        return a;
    }

    double[] bView() {
        return bState;
    }

    double[] cView() {
        return c;
    }

    /** @return an upper bound in rad/s on every pole's magnitude ({@link SpectralBound}) */
    public double largestPoleBound() {
        return largestPoleBound;
    }

    /** @return the same bound for A⁻¹, in s: no pole is smaller in magnitude than its reciprocal */
    double inverseSmallestPoleBound() {
        // computed on request: a lower-corner scan needs it only when it runs far below the poles
        int k = order();
        double[][] yInverseOhms = yInverse.matrix();
        double[][] aInverse = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                double sum = 0;
                for (int m = 0; m < k; m++) {
                    sum += yInverseOhms[i][m] * capacitance[m][j];
                }
                // A⁻¹ = −Y⁻¹·Cf
                aInverse[i][j] = -sum;
            }
        }
        return SpectralBound.of(aInverse);
    }

    /** @return H(jω) = C·(jωI − A)⁻¹·B + D at ω in rad/s, O(k³) */
    public Complex responseAt(double omegaRadPerS) {
        ResponseEvaluator evaluator = new ResponseEvaluator(this);
        evaluator.evaluate(omegaRadPerS);
        return new Complex(evaluator.responseRe(), evaluator.responseIm());
    }

    /** @return H(j·2πf) for f in Hz */
    public Complex responseAtHz(double frequencyHz) {
        return responseAt(2 * Math.PI * frequencyHz);
    }
}

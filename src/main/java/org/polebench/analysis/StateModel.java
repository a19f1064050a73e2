package org.polebench.analysis;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.polebench.circuit.Band;

/**
 * The state-space model of one band's capacitor ports (DESIGN.md, "Port reduction"): with the
 * port voltages as states, C·dv/dt = −(Y·v + b·u), y = cᵀ·v + D·u, so
 * A = −Cd⁻¹·Y, B = −Cd⁻¹·b, C = cᵀ and D.
 *
 * <p>Y (siemens) is the short-circuit admittance matrix of the ports: column j holds the
 * currents flowing out of each port into the resistive network when port j is held at 1 V and
 * every other port and the stimulus at 0 V. b (siemens) holds the same currents for the stimulus
 * at 1 V with all ports at 0 V; c (V/V) and D (V/V) are the output voltages of the same solves.
 * For the low band, D is the midband gain (ports shorted, high-band capacitors open); for the
 * high band it is the gain with every capacitor shorted. Y is non-singular (checked by
 * {@link PortReduction}). Immutable; arrays are copied in and out.
 */
public final class StateModel {
    private final Band band;
    private final List<String> capacitorNames;
    private final List<String> capacitorsAcrossSources;
    private final double[] farads;
    private final double[][] y;
    private final double[][] yInverse;
    private final double[] b;
    private final double[] c;
    private final double d;
    private final double[][] a;
    private final double[] bState;
    private final double normA;
    private final double normAInverse;

    StateModel(Band band, List<String> capacitorNames, List<String> capacitorsAcrossSources, double[] farads,
               double[][] y, double[][] yInverse, double[] b, double[] c, double d) {
        int k = farads.length;
        this.band = band;
        this.capacitorNames = List.copyOf(capacitorNames);
        this.capacitorsAcrossSources = List.copyOf(capacitorsAcrossSources);
        this.farads = farads;
        this.y = y;
        this.yInverse = yInverse;
        this.b = b;
        this.c = c;
        this.d = d;
        this.a = new double[k][k];
        this.bState = new double[k];
        double rowMax = 0;
        double inverseRowMax = 0;
        for (int i = 0; i < k; i++) {
            double rowSum = 0;
            double inverseRowSum = 0;
            for (int j = 0; j < k; j++) {
                a[i][j] = -y[i][j] / farads[i];
                rowSum += Math.abs(a[i][j]);
                // A⁻¹ = −Y⁻¹·Cd
                inverseRowSum += Math.abs(yInverse[i][j] * farads[j]);
            }
            bState[i] = -b[i] / farads[i];
            rowMax = Math.max(rowMax, rowSum);
            inverseRowMax = Math.max(inverseRowMax, inverseRowSum);
        }
        this.normA = rowMax;
        this.normAInverse = inverseRowMax;
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

    /**
     * @return high-band capacitors left out of the high-band model because ideal sources and
     * shorted low-band capacitors fix their voltage (they carry current but set no pole);
     * always empty for the low band
     */
    public List<String> capacitorsAcrossSources() {
        return capacitorsAcrossSources;
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
        return yInverse[i][j];
    }

    /** @return b_i in siemens: port i's current per volt of stimulus, ports shorted */
    public double stimulusAdmittanceSiemens(int i) {
        return b[i];
    }

    /** @return c_i: output volts per volt on port i, stimulus and other ports at 0 V */
    public double outputPerPortVolt(int i) {
        return c[i];
    }

    /** @return D, the output per stimulus volt with every port shorted (the midband gain for the low band) */
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

    /** @return the row-sum norm ‖A‖∞ in 1/s: no pole is larger in magnitude */
    double normA() {
        return normA;
    }

    /** @return ‖A⁻¹‖∞ in s: no pole is smaller in magnitude than its reciprocal */
    double normAInverse() {
        return normAInverse;
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

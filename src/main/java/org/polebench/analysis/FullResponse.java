package org.polebench.analysis;

import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.complex.Complex;
import org.polebench.circuit.NetworkElement;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.linalg.ComplexLu;

/**
 * The response V(out)/V(stimulus) of the whole network at one frequency, every capacitor (both
 * bands) at its admittance jωC: the complex MNA solve (Ho, Ruehli and Brennan, IEEE Trans.
 * Circuits and Systems 22(6), 1975). It needs no port reduction, so it is the independent
 * reference for the state-space response and the curve to plot over both corners.
 * Costs one complex n×n LU per frequency. Immutable; safe to share between threads.
 */
public final class FullResponse {
    private final SmallSignalNetwork network;
    private final MnaSystem resistive;

    public FullResponse(SmallSignalNetwork network) {
        this.network = network;
        this.resistive = MnaSystem.withPorts(network, List.of(), List.of());
    }

    /** @return the complex MNA matrix at ω as {real, imaginary} parts, for tests against another solver */
    double[][][] matrixAt(double omegaRadPerS) {
        double[][] re = resistive.matrix();
        double[][] im = new double[re.length][re.length];
        NetworkElement.Cases<Void> stamp = new NetworkElement.Cases<>() {
            @Override
            public Void conductance(NetworkElement.Conductance g) {
                return null;   // in the resistive system already
            }

            @Override
            public Void capacitance(NetworkElement.Capacitance c) {
                MnaSystem.stampConductance(im, c.a(), c.b(), omegaRadPerS * c.farads());
                return null;
            }

            @Override
            public Void transconductance(NetworkElement.Transconductance t) {
                return null;   // in the resistive system already
            }
        };
        for (NetworkElement element : network.elements()) {
            element.match(stamp);
        }
        return new double[][][] {re, im};
    }

    /** @return the right-hand side of {@link #matrixAt}: the stimulus at 1 V */
    double[] excitation() {
        return resistive.sourceExcitation(0, 1);
    }

    /**
     * @param omegaRadPerS angular frequency in rad/s (0 gives the DC response, capacitors open)
     * @return V(out) for a 1 V stimulus, or empty when the complex MNA matrix is singular there
     */
    public Optional<Complex> atRadPerS(double omegaRadPerS) {
        double[][][] m = matrixAt(omegaRadPerS);
        ComplexLu lu = new ComplexLu(m[0], m[1]);
        if (!lu.factor()) {
            return Optional.empty();
        }
        double[] br = excitation();
        double[] bi = new double[br.length];
        lu.solve(br, bi);
        int out = network.outputNode() - 1;
        return Optional.of(new Complex(br[out], bi[out]));
    }

    /** @return V(out) for a 1 V stimulus at {@code frequencyHz}; see {@link #atRadPerS} */
    public Optional<Complex> atHz(double frequencyHz) {
        return atRadPerS(2 * Math.PI * frequencyHz);
    }
}

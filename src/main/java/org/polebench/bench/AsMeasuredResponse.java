package org.polebench.bench;

import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.polebench.analysis.FullResponse;
import org.polebench.analysis.StateModel;

/**
 * The response a bench shows of a board: H = V(out)·HPout / (V(in)·HPin), V(in) being the EMF
 * (1) with {@code reference: generator} (docs/method.md, "The bench in the model"). The whole
 * response (both bands) is the complex MNA solve ({@link FullResponse}); the midband gain and
 * the lower corner come from the low-band state-space models of the same network, where every
 * high-pass factor is 1 at midband. Immutable; safe to share between threads.
 */
public final class AsMeasuredResponse {
    private static final double STEP = Math.pow(10, 1.0 / 20);
    private static final int MAX_STEPS = 20 * 9;

    private final FullResponse out;
    private final Optional<FullResponse> in;
    private final StateModel outLow;
    private final Optional<StateModel> inLow;
    private final Channel outChannel;
    private final Channel inChannel;

    AsMeasuredResponse(FullResponse out, Optional<FullResponse> in, StateModel outLow, Optional<StateModel> inLow,
                       Channel outChannel, Channel inChannel) {
        this.out = out;
        this.in = in;
        this.outLow = outLow;
        this.inLow = inLow;
        this.outChannel = outChannel;
        this.inChannel = inChannel;
    }

    /**
     * @param frequencyHz positive
     * @return the measured ratio (V/V; arg in radians), every capacitor of both bands in place;
     *         empty when an MNA matrix is singular there
     */
    public Optional<Complex> atHz(double frequencyHz) {
        Optional<Complex> v = out.atHz(frequencyHz);
        if (v.isEmpty()) {
            return Optional.empty();
        }
        Complex reading = v.get().multiply(outChannel.readingFactor(frequencyHz));
        Complex reference = inChannel.readingFactor(frequencyHz);
        if (in.isPresent()) {
            Optional<Complex> vin = in.get().atHz(frequencyHz);
            if (vin.isEmpty()) {
                return Optional.empty();
            }
            reference = reference.multiply(vin.get());
        }
        return Optional.of(reading.divide(reference));
    }

    /** @return the measured ratio of the low band alone (high-band capacitors open), at {@code frequencyHz} */
    public Complex lowBandAtHz(double frequencyHz) {
        Complex reading = outLow.responseAtHz(frequencyHz).multiply(outChannel.readingFactor(frequencyHz));
        Complex reference = inChannel.readingFactor(frequencyHz);
        if (inLow.isPresent()) {
            reference = reference.multiply(inLow.get().responseAtHz(frequencyHz));
        }
        return reading.divide(reference);
    }

    /** @return the measured midband gain in V/V, signed: the low bands' D ratio (every high-pass at 1) */
    public double midbandGain() {
        return outLow.directGain() / inLow.map(StateModel::directGain).orElse(1.0);
    }

    /**
     * The measured lower −3 dB corner: where |H| of the low band crosses |midband gain|/√2,
     * bracketed by a scan down in twentieths of a decade from ten times the highest of the low
     * bands' pole bounds and the channels' corners, then bisected on ln f to 1e-12 (as the
     * stage's own exact corner is found, docs/method.md, "Exact corners"; the first crossing is
     * taken, so with peaking it is the highest one).
     *
     * @return in Hz; empty when the midband gain is 0 or no crossing lies within nine decades below the start
     */
    public OptionalDouble lowerCornerHz() {
        double d = midbandGain();
        if (d == 0 || !Double.isFinite(d)) {
            return OptionalDouble.empty();
        }
        double target = d * d / 2;
        double top = outLow.largestPoleBound() / (2 * Math.PI);
        if (inLow.isPresent()) {
            top = Math.max(top, inLow.get().largestPoleBound() / (2 * Math.PI));
        }
        top = Math.max(top, outChannel.cornerHz().orElse(0));
        top = Math.max(top, inChannel.cornerHz().orElse(0));
        if (!(top > 0)) {
            return OptionalDouble.empty();
        }
        double hi = 10 * top;
        for (int i = 0; i < MAX_STEPS; i++) {
            double lo = hi / STEP;
            if (excess(lo, target) <= 0) {
                return OptionalDouble.of(bisect(lo, hi, target));
            }
            hi = lo;
        }
        return OptionalDouble.empty();
    }

    private double bisect(double lo, double hi, double target) {
        double lnLo = Math.log(lo);
        double lnHi = Math.log(hi);
        while (lnHi - lnLo > 1e-12) {
            double mid = 0.5 * (lnLo + lnHi);
            if (excess(Math.exp(mid), target) <= 0) {
                lnLo = mid;
            } else {
                lnHi = mid;
            }
        }
        return Math.exp(0.5 * (lnLo + lnHi));
    }

    private double excess(double frequencyHz, double target) {
        Complex h = lowBandAtHz(frequencyHz);
        double squared = h.getReal() * h.getReal() + h.getImaginary() * h.getImaginary();
        return squared / target - 1;
    }
}

package org.polebench.fit;

import java.util.List;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;

/**
 * The fitted transfer function as a value: H(s) = K·sᵐ·Π(s − zᵢ)/Π(s − pᵢ) · 1/(1 + s/ω_h),
 * with as many low-band zeros (DC ones included) as low-band poles, so that K is the midband
 * gain the low band levels off at.
 *
 * @param midbandGain          K as a signed voltage ratio (negative for an inverting stage)
 * @param dcZeros              m, the zeros at s = 0
 * @param zerosRadPerS         finite low-band zeros, rad/s (pairs with both members)
 * @param lowBandPolesRadPerS  low-band poles, rad/s (pairs with both members)
 * @param highBandPoleRadPerS  ω_h in rad/s (the pole is at −ω_h), when the model has one
 */
public record FittedModel(double midbandGain, int dcZeros, List<Complex> zerosRadPerS,
                          List<Complex> lowBandPolesRadPerS, OptionalDouble highBandPoleRadPerS) {
    public FittedModel {
        zerosRadPerS = List.copyOf(zerosRadPerS);
        lowBandPolesRadPerS = List.copyOf(lowBandPolesRadPerS);
        if (dcZeros + zerosRadPerS.size() != lowBandPolesRadPerS.size()) {
            throw new IllegalArgumentException("the low band needs as many zeros as poles");
        }
    }

    /** H(j2πf), the whole model. */
    public Complex responseAt(double frequencyHz) {
        Complex h = lowBandResponseAt(frequencyHz);
        if (highBandPoleRadPerS.isPresent()) {
            Complex s = new Complex(0, 2 * Math.PI * frequencyHz);
            h = h.divide(s.divide(highBandPoleRadPerS.getAsDouble()).add(1));
        }
        return h;
    }

    /** H(j2πf) of the low band alone (without the high-band pole). */
    public Complex lowBandResponseAt(double frequencyHz) {
        Complex s = new Complex(0, 2 * Math.PI * frequencyHz);
        Complex h = new Complex(midbandGain);
        for (int i = 0; i < dcZeros; i++) {
            h = h.multiply(s);
        }
        // pair each zero with a pole so that no intermediate product overflows
        int z = 0;
        for (Complex pole : lowBandPolesRadPerS) {
            Complex numerator = z < zerosRadPerS.size() ? s.subtract(zerosRadPerS.get(z)) : Complex.ONE;
            h = h.multiply(numerator).divide(s.subtract(pole));
            z++;
        }
        return h;
    }

    public double gainDbAt(double frequencyHz) {
        return 20 * Math.log10(responseAt(frequencyHz).abs());
    }

    /** arg H in degrees, leads positive, in (−180°, 180°]. */
    public double phaseDegAt(double frequencyHz) {
        return Math.toDegrees(responseAt(frequencyHz).getArgument());
    }
}

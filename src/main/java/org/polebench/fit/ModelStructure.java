package org.polebench.fit;

/**
 * The shape of a fitted model: how many zeros sit at DC, how many real and complex-pair zeros
 * and poles the low band has, and whether one high-band pole is added. The low band always has
 * as many zeros as poles (each coupling or bypass capacitor adds one of each, and the response
 * must level off at the midband gain above the low band); only the high-band pole adds a pole
 * without a zero, so nz ≤ np overall.
 *
 * <p>Fit parameters, in this order: ln|K|; for each real zero and pole θ = ln(−p/ω_ref); for each
 * complex pair (ln(ω₀/ω_ref), ln ζ) of s² + 2ζω₀s + ω₀²; for the high-band pole ln(ω_h/ω_ref).
 *
 * @param dcZeros      zeros fixed at s = 0
 * @param realZeros    finite real zeros, left half-plane
 * @param zeroPairs    complex zero pairs, left half-plane
 * @param realPoles    real low-band poles
 * @param polePairs    complex low-band pole pairs
 * @param highBandPole whether one real pole above the low band is added
 */
public record ModelStructure(int dcZeros, int realZeros, int zeroPairs, int realPoles, int polePairs,
                             boolean highBandPole) {
    public ModelStructure {
        if (dcZeros < 0 || realZeros < 0 || zeroPairs < 0 || realPoles < 0 || polePairs < 0) {
            throw new IllegalArgumentException("root counts must not be negative");
        }
        if (dcZeros + realZeros + 2 * zeroPairs != realPoles + 2 * polePairs) {
            throw new IllegalArgumentException("the low band needs as many zeros as poles");
        }
    }

    /** Low-band poles, counting each member of a pair. */
    public int lowBandPoles() {
        return realPoles + 2 * polePairs;
    }

    /** Finite (non-DC) low-band zeros, counting each member of a pair. */
    public int finiteZeros() {
        return realZeros + 2 * zeroPairs;
    }

    /** All poles of the model, the high-band one included. */
    public int totalPoles() {
        return lowBandPoles() + (highBandPole ? 1 : 0);
    }

    /** Free parameters: ln|K| and one per real root or two per pair. */
    public int parameterCount() {
        return 1 + realZeros + 2 * zeroPairs + realPoles + 2 * polePairs + (highBandPole ? 1 : 0);
    }

    int realZeroOffset() {
        return 1;
    }

    int zeroPairOffset() {
        return 1 + realZeros;
    }

    int realPoleOffset() {
        return 1 + realZeros + 2 * zeroPairs;
    }

    int polePairOffset() {
        return realPoleOffset() + realPoles;
    }

    int highBandOffset() {
        return polePairOffset() + 2 * polePairs;
    }

    /** A short description such as "2 poles, 1 DC zero, 1 real zero". */
    public String describe() {
        StringBuilder text = new StringBuilder();
        text.append(lowBandPoles()).append(lowBandPoles() == 1 ? " pole" : " poles");
        if (polePairs > 0) {
            text.append(" (").append(polePairs).append(polePairs == 1 ? " complex pair)" : " complex pairs)");
        }
        if (dcZeros > 0) {
            text.append(", ").append(dcZeros).append(dcZeros == 1 ? " DC zero" : " DC zeros");
        }
        if (realZeros > 0) {
            text.append(", ").append(realZeros).append(realZeros == 1 ? " real zero" : " real zeros");
        }
        if (zeroPairs > 0) {
            text.append(", ").append(zeroPairs).append(zeroPairs == 1 ? " complex zero pair" : " complex zero pairs");
        }
        if (highBandPole) {
            text.append(", high-band pole");
        }
        return text.toString();
    }
}

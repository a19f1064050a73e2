package org.polebench.fit;

/**
 * A linearised rational estimate N(v)/D(v) with N(v) = vᵐ·Σ bᵢvⁱ and monic D(v) = vⁿᵖ + Σ aᵢvⁱ.
 * With phase data v is the normalised s = j·x; for a magnitude-only sweep v is x² and the
 * estimate is of |H|² (so roots map back by p = −√(−v)).
 */
final class RationalEstimate {
    final double[] numerator;   // b₀…b_nf, ascending
    final double[] denominator; // a₀…a_{np−1}, 1; ascending
    final boolean squaredMagnitude;

    RationalEstimate(double[] numerator, double[] denominator, boolean squaredMagnitude) {
        this.numerator = numerator;
        this.denominator = denominator;
        this.squaredMagnitude = squaredMagnitude;
    }
}

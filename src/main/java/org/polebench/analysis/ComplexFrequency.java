package org.polebench.analysis;

/**
 * A point of the s-plane, such as a pole or a zero.
 *
 * @param realRadPerS      σ in rad/s (negative for a stable pole)
 * @param imaginaryRadPerS ω in rad/s (0 for a real root)
 */
public record ComplexFrequency(double realRadPerS, double imaginaryRadPerS) {

    /** @return σ/2π in Hz */
    public double realHz() {
        return realRadPerS / (2 * Math.PI);
    }

    /** @return ω/2π in Hz */
    public double imaginaryHz() {
        return imaginaryRadPerS / (2 * Math.PI);
    }

    /** @return |s| in rad/s */
    public double magnitudeRadPerS() {
        return Math.hypot(realRadPerS, imaginaryRadPerS);
    }

    /** @return |s|/2π in Hz: the natural frequency of the root */
    public double magnitudeHz() {
        return magnitudeRadPerS() / (2 * Math.PI);
    }

    public boolean isReal() {
        return imaginaryRadPerS == 0;
    }
}

package org.polebench.fit;

import java.util.Optional;
import org.apache.commons.math3.complex.Complex;

/**
 * One pole or zero of the fitted model with its standard uncertainties (first-order propagation
 * of the parameter covariance, GUM 5.1.2). A complex pair appears as two roots, conjugates.
 * When {@link #status()} is {@link RootStatus#UNIDENTIFIABLE} the value is kept only so the model
 * can still be drawn; reports must say "unidentifiable" instead of printing it.
 *
 * @param label             p1, p2, …, z1, …; "z0" for a DC zero, "ph" for the high-band pole
 * @param radPerS           the root, rad/s
 * @param uRealRadPerS      standard uncertainty of its real part, rad/s
 * @param uImaginaryRadPerS standard uncertainty of its imaginary part, rad/s (0 for a real root)
 * @param uMagnitudeRadPerS standard uncertainty of |root| (the corner frequency it sets), rad/s
 * @param status            fitted, structural or unidentifiable
 * @param cluster           when present, the data do not separate this root from the cluster's
 *                          other members: the three uncertainties above then all hold the
 *                          cluster's u of its geometric mean (0 for the imaginary part of a real
 *                          root), the only first-order statement about where the root lies
 */
public record FittedRoot(String label, Complex radPerS, double uRealRadPerS, double uImaginaryRadPerS,
                         double uMagnitudeRadPerS, RootStatus status, Optional<RootCluster> cluster) {
    private static final double TWO_PI = 2 * Math.PI;

    /** A root the data resolve on its own. */
    public FittedRoot(String label, Complex radPerS, double uRealRadPerS, double uImaginaryRadPerS,
                      double uMagnitudeRadPerS, RootStatus status) {
        this(label, radPerS, uRealRadPerS, uImaginaryRadPerS, uMagnitudeRadPerS, status, Optional.empty());
    }

    public boolean isReal() {
        return radPerS.getImaginary() == 0;
    }

    public double realHz() {
        return radPerS.getReal() / TWO_PI;
    }

    public double imaginaryHz() {
        return radPerS.getImaginary() / TWO_PI;
    }

    /** |root|/2π: the corner frequency this root sets, Hz. */
    public double magnitudeHz() {
        return radPerS.abs() / TWO_PI;
    }

    public double uMagnitudeHz() {
        return uMagnitudeRadPerS / TWO_PI;
    }

    public double uRealHz() {
        return uRealRadPerS / TWO_PI;
    }

    public double uImaginaryHz() {
        return uImaginaryRadPerS / TWO_PI;
    }
}

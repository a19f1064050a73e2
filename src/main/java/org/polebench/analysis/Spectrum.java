package org.polebench.analysis;

import java.util.List;

/**
 * The eigenvalues of a state matrix with the checks of docs/method.md, "Poles and zeros".
 *
 * @param roots                    eigenvalues in rad/s, ascending in magnitude; conjugate pairs
 *                                 adjacent; a root with |Im| below 1e-9·|root| is made real
 * @param traceRelativeError       |Σλ − trace A| / Σ|λ|
 * @param determinantRelativeError |Πλ − det A| / max(|det A|, |Πλ|), det A from an LU;
 *                                 meaningful only for a non-singular matrix (poles; not the
 *                                 zeros of a stage with zeros at DC)
 * @param maxRelativeResidual      max over roots of ‖Av − λv‖ / (‖A‖_F·‖v‖)
 */
public record Spectrum(List<ComplexFrequency> roots, double traceRelativeError, double determinantRelativeError,
                       double maxRelativeResidual) {
    public Spectrum {
        roots = List.copyOf(roots);
    }
}

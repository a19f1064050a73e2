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
 * @param conditions               per root, its relative condition number: a relative change
 *                                 ε of every entry of the state matrix moves the root by about
 *                                 that times ε, relative to its size; the larger of the
 *                                 componentwise first-order figure |w|ᵀ·|A|·|v|/(|λ|·|wᵀv|) (v, w
 *                                 its right and left eigenvectors; Wilkinson, The Algebraic
 *                                 Eigenvalue Problem, 1965, 2.8; Geurts, Numer. Math. 39, 1982)
 *                                 and the move measured under changes of {@link #PERTURBATION}
 *                                 ({@link PoleFinder}). 0 for a root at DC found from the
 *                                 response's multiplicity there (exact)
 */
public record Spectrum(List<ComplexFrequency> roots, double traceRelativeError, double determinantRelativeError,
                       double maxRelativeResidual, List<Double> conditions) {
    /**
     * The relative error beyond which a root is not determined to the digits printed: half a
     * unit in the fourth significant digit, the precision of the text and report.
     */
    public static final double PRINTED_RELATIVE = 5e-5;
    /** Unit round-off of IEEE 754 double precision, 2⁻⁵³. */
    public static final double UNIT_ROUNDOFF = Math.ulp(1.0) / 2;
    /**
     * The relative change of the model against which a root's digits are judged: 1e-15, about
     * the rounding error of the state matrix's entries after the port reduction's solves.
     */
    public static final double PERTURBATION = 1e-15;

    public Spectrum {
        roots = List.copyOf(roots);
        conditions = List.copyOf(conditions);
        if (conditions.size() != roots.size()) {
            throw new IllegalArgumentException("one condition number per root");
        }
    }

    /** @return how many roots sit exactly at DC (s = 0): a many-fold zero of a coupled stage */
    public int atDc() {
        int count = 0;
        for (ComplexFrequency root : roots) {
            if (root.realRadPerS() == 0 && root.imaginaryRadPerS() == 0) {
                count++;
            }
        }
        return count;
    }

    /**
     * @return whether root i is determined to the digits printed: its relative move under a
     *         {@link #PERTURBATION} change of the model (its condition number times that) is
     *         below {@link #PRINTED_RELATIVE}
     */
    public boolean determined(int i) {
        return conditions.get(i) * PERTURBATION <= PRINTED_RELATIVE;
    }

    /** @return how many roots are not {@link #determined(int) determined} to the digits printed */
    public int undetermined() {
        int count = 0;
        for (int i = 0; i < roots.size(); i++) {
            count += determined(i) ? 0 : 1;
        }
        return count;
    }

    /** @return the largest relative move of any root under a {@link #PERTURBATION} change of the model */
    public double worstRelativeError() {
        double worst = 0;
        for (double c : conditions) {
            worst = Math.max(worst, c * PERTURBATION);
        }
        return worst;
    }
}

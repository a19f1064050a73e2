package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.linalg.EigenSolver;
import org.polebench.linalg.Eigenpairs;

/**
 * Poles (or zeros) of a state matrix as a {@link Spectrum} in rad/s: the eigenvalues that
 * {@link EigenSolver} finds by the recipe of docs/method.md, "Poles and zeros", with its checks.
 * Immutable.
 */
public final class PoleFinder {
    /** |Im λ| below this share of |λ| is round-off: the root is real (docs/method.md, "Poles and zeros"). */
    public static final double DEFAULT_REAL_SHARE = EigenSolver.DEFAULT_REAL_SHARE;

    private final EigenSolver solver;

    public PoleFinder() {
        this(DEFAULT_REAL_SHARE);
    }

    public PoleFinder(double realShare) {
        this.solver = new EigenSolver(realShare);
    }

    /**
     * @param a a square matrix in 1/s (not changed)
     * @return its eigenvalues in rad/s with the checks, or empty when the eigenvalue iteration
     * does not converge
     */
    public Optional<Spectrum> spectrum(double[][] a) {
        return eigenpairs(a, false).map(PoleFinder::spectrum);
    }

    /** @param snapZeros make eigenvalues below {@link EigenSolver#ZERO_SHARE}·‖A‖ exactly 0 (for zeros at DC) */
    Optional<Eigenpairs> eigenpairs(double[][] a, boolean snapZeros) {
        return solver.eigenpairs(a, snapZeros);
    }

    /** @return the eigenvalues of {@code eigen} as roots in rad/s, in its order, with its checks */
    static Spectrum spectrum(Eigenpairs eigen) {
        List<ComplexFrequency> roots = new ArrayList<>(eigen.size());
        for (int i = 0; i < eigen.size(); i++) {
            roots.add(new ComplexFrequency(eigen.re(i), eigen.im(i)));
        }
        return new Spectrum(roots, eigen.traceRelativeError(), eigen.determinantRelativeError(),
                eigen.maxRelativeResidual());
    }
}

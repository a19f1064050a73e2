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
        return eigenpairs(a, false).map(eigen -> spectrum(eigen, a, false));
    }

    /** @param snapZeros make eigenvalues below {@link EigenSolver#ZERO_SHARE}·‖A‖ exactly 0 (for zeros at DC) */
    Optional<Eigenpairs> eigenpairs(double[][] a, boolean snapZeros) {
        return solver.eigenpairs(a, snapZeros);
    }

    /**
     * @param a         the matrix {@code eigen} came from, whose entries the conditions weigh
     * @param snapZeros as {@code eigen} was found
     * @return the eigenvalues of {@code eigen} as roots in rad/s, in its order, with its checks
     *         and each root's relative condition number (see {@link Spectrum#conditions()}):
     *         the larger of the first-order one from the eigenvectors and the one measured by
     *         {@value #TRIALS} seeded perturbations of every entry of A by a relative
     *         ±{@value Spectrum#PERTURBATION}. The measured one is needed: a many-fold root of
     *         a cascade of identical stages is defective, so the solver returns a ring of roots
     *         whose computed eigenvectors say nothing of their sensitivity, and they move by
     *         1e-2 of their size under a 1e-15 change (seen on a 16-stage cascade), the
     *         ε^(1/m) of Wilkinson (The Algebraic Eigenvalue Problem, 1965, 2.11). A perturbation
     *         experiment as an estimate of a condition number: Higham, Accuracy and Stability of
     *         Numerical Algorithms, 2nd ed., 2002, 26.
     */
    Spectrum spectrum(Eigenpairs eigen, double[][] a, boolean snapZeros) {
        int n = eigen.size();
        double[] measured = new double[n];
        java.util.SplittableRandom random = new java.util.SplittableRandom(PERTURBATION_SEED);
        for (int trial = 0; trial < TRIALS; trial++) {
            double[][] changed = new double[a.length][];
            for (int i = 0; i < a.length; i++) {
                changed[i] = a[i].clone();
                for (int j = 0; j < changed[i].length; j++) {
                    changed[i][j] *= 1 + (random.nextBoolean() ? Spectrum.PERTURBATION : -Spectrum.PERTURBATION);
                }
            }
            Optional<Eigenpairs> moved = solver.eigenpairs(changed, snapZeros);
            for (int m = 0; m < n; m++) {
                double size = Math.hypot(eigen.re(m), eigen.im(m));
                if (moved.isEmpty()) {
                    measured[m] = Double.POSITIVE_INFINITY;
                    continue;
                }
                // the nearest root of the changed matrix: a ring of a defective root turns as a
                // whole, so this understates its move by at most half the ring's spacing
                double nearest = Double.POSITIVE_INFINITY;
                for (int q = 0; q < n; q++) {
                    nearest = Math.min(nearest, Math.hypot(moved.get().re(q) - eigen.re(m), moved.get().im(q) - eigen.im(m)));
                }
                if (size > 0) {
                    measured[m] = Math.max(measured[m], nearest / size / Spectrum.PERTURBATION);
                }
            }
        }
        List<ComplexFrequency> roots = new ArrayList<>(n);
        List<Double> conditions = new ArrayList<>(n);
        for (int m = 0; m < n; m++) {
            ComplexFrequency root = new ComplexFrequency(eigen.re(m), eigen.im(m));
            roots.add(root);
            conditions.add(Math.max(measured[m], relativeCondition(eigen, m, a, root.magnitudeRadPerS())));
        }
        return new Spectrum(roots, eigen.traceRelativeError(), eigen.determinantRelativeError(),
                eigen.maxRelativeResidual(), conditions);
    }

    /** Perturbed matrices per condition measurement, and their seed (fixed: the same stage, the same figures). */
    static final int TRIALS = 2;
    private static final long PERTURBATION_SEED = 1965L;

    // |w|ᵀ·|A|·|v| / (|λ|·|wᵀv|): the componentwise relative condition number of a simple
    // eigenvalue, the first-order bound on |δλ|/|λ| per unit relative change of every entry of
    // A (Geurts, "A contribution to the theory of condition", Numer. Math. 39, 1982; Higham,
    // Accuracy and Stability of Numerical Algorithms, 2nd ed., 2002, 7.2 for the idea). The
    // parts' values enter A entry by entry, so an entrywise change is the model's own. The unit
    // right and left vectors of a near-repeated root (identical stages) are nearly orthogonal
    // and of a defective one orthogonal, where first-order theory fails (Wilkinson, The
    // Algebraic Eigenvalue Problem, 1965, 2.8; Golub and Van Loan, Matrix Computations, 4th
    // ed., 7.2.2): infinite. A root at 0 has no relative error to speak of: 0.
    private static double relativeCondition(Eigenpairs eigen, int m, double[][] a, double magnitude) {
        if (magnitude == 0) {
            return 0;
        }
        double[] vr = eigen.right(m)[0];
        double[] vi = eigen.right(m)[1];
        double[] wr = eigen.left(m)[0];
        double[] wi = eigen.left(m)[1];
        int n = vr.length;
        double sr = 0;
        double si = 0;
        double weighted = 0;
        for (int i = 0; i < n; i++) {
            sr += wr[i] * vr[i] - wi[i] * vi[i];
            si += wr[i] * vi[i] + wi[i] * vr[i];
            double w = Math.hypot(wr[i], wi[i]);
            for (int j = 0; j < n; j++) {
                weighted += w * Math.abs(a[i][j]) * Math.hypot(vr[j], vi[j]);
            }
        }
        double overlap = Math.hypot(sr, si);
        return overlap > 0 ? weighted / (magnitude * overlap) : Double.POSITIVE_INFINITY;
    }
}

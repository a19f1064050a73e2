package org.polebench.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * Finds the roots of one kind (poles, or zeros) that the data do not separate, and quotes each
 * such cluster by its geometric mean (see {@link RootCluster}).
 *
 * <p>Two neighbours, taken as one quadratic factor, have ζ = cosh(Δ/2) with Δ = ln(|r₂|/|r₁|),
 * and to first order u(ζ) = sinh(Δ/2)·u(Δ)/2. They are not separated when critical damping
 * (ζ = 1, the border between two real roots and a complex pair) lies within ζ's expanded
 * uncertainty k·u(ζ): cosh(Δ/2) − 1 ≤ k·sinh(Δ/2)·u(Δ)/2, that is tanh(Δ/4) ≤ k·u(Δ)/2. Roots
 * are taken in order of |root|, each one against the geometric mean of the cluster so far, and
 * joins it only if the data then determine the joint geometric mean better than either part on
 * its own: the mark of a double root, whose members move apart and together in opposite
 * directions, where a well-determined root beside a poorly determined one keeps its own quote. A
 * fitted pair is one member in its own coordinates (ln ω₀, ln ζ) when complex or critically
 * damped, and forms a cluster by itself when ζ = 1 lies within k·u(ζ); with ζ above one its two
 * real roots enter separately. All uncertainties are first-order propagations of the parameter
 * covariance (GUM 5.1.2) through smooth functions: the geometric mean of a cluster is one (the
 * product of a pair's roots is ω₀²), the position of each member near a double root is not.
 */
final class RootClusters {
    /** Below this √(ζ² − 1) the two real roots of a pair are taken as one double root. */
    private static final double DOUBLE_ROOT = 1e-6;

    /** One real root, or one pair not taken apart, in the fit's log coordinates. */
    static final class Member {
        final int[] roots;
        final double lnMagnitude;
        final double[] gradient;
        final int pairOffset;
        final boolean nearCritical;

        /**
         * @param roots        indices of the roots it stands for in the list handed to {@link #apply}
         * @param lnMagnitude  ln(|root|/(rad/s)), ln ω₀ for a pair
         * @param gradient     ∂ lnMagnitude/∂p over all fit parameters
         * @param pairOffset   the offset of its pair's (ln ω₀, ln ζ), or −1 for a real factor
         * @param nearCritical a pair whose ζ lies within k·u(ζ) of one
         */
        Member(int[] roots, double lnMagnitude, double[] gradient, int pairOffset, boolean nearCritical) {
            this.roots = roots;
            this.lnMagnitude = lnMagnitude;
            this.gradient = gradient;
            this.pairOffset = pairOffset;
            this.nearCritical = nearCritical;
        }
    }

    private final double coverageFactor;

    RootClusters(double coverageFactor) {
        this.coverageFactor = coverageFactor;
    }

    /** The members a real root makes (one). */
    static Member realRoot(int index, int parameter, double lnMagnitude, int parameters) {
        double[] g = new double[parameters];
        g[parameter] = 1;
        return new Member(new int[]{index}, lnMagnitude, g, -1, false);
    }

    /**
     * The members a pair s² + 2ζω₀s + ω₀² makes: one when ζ &lt; 1 or its roots coincide, else
     * its two real roots −ω₀(ζ ∓ √(ζ² − 1)), whose ln|r| = ln ω₀ + ln(ζ ∓ q) move with ln ζ as ∓ζ/q.
     *
     * @param first index of the pair's first root (the second follows it)
     */
    List<Member> pair(int first, int offset, double[] p, double[][] cov, double lnOmegaRef) {
        double zeta = Math.exp(p[offset + 1]);
        double lnW0 = p[offset] + lnOmegaRef;
        double[] g = new double[p.length];
        g[offset] = 1;
        double q = zeta >= 1 ? Math.sqrt(zeta * zeta - 1) : 0;
        if (q <= DOUBLE_ROOT) {
            boolean near = Math.abs(zeta - 1) <= coverageFactor * zeta * Math.sqrt(cov[offset + 1][offset + 1]);
            return List.of(new Member(new int[]{first, first + 1}, lnW0, g, offset, near || zeta >= 1));
        }
        double[] lower = g.clone();
        double[] upper = g.clone();
        lower[offset + 1] = -zeta / q;
        upper[offset + 1] = zeta / q;
        return List.of(new Member(new int[]{first}, lnW0 + Math.log(zeta - q), lower, offset, false),
                new Member(new int[]{first + 1}, lnW0 + Math.log(zeta + q), upper, offset, false));
    }

    /**
     * @param roots   the fitted roots of one kind; members of a cluster are replaced by copies carrying it
     * @param members what each fitted (not structural or unidentifiable) root contributes
     * @param found   receives every cluster
     */
    void apply(List<FittedRoot> roots, List<Member> members, double[] p, double[][] cov, List<RootCluster> found) {
        List<Member> sorted = new ArrayList<>(members);
        sorted.sort(Comparator.comparingDouble(m -> m.lnMagnitude));
        List<Member> cluster = new ArrayList<>();
        for (Member next : sorted) {
            if (!cluster.isEmpty() && !unresolved(cluster, next, cov)) {
                close(cluster, roots, p, cov, found);
                cluster.clear();
            }
            cluster.add(next);
        }
        close(cluster, roots, p, cov, found);
    }

    private boolean unresolved(List<Member> cluster, Member next, double[][] cov) {
        double[] mean = meanGradient(cluster);
        double[] d = next.gradient.clone();
        for (int i = 0; i < d.length; i++) {
            d[i] -= mean[i];
        }
        double delta = next.lnMagnitude - meanLn(cluster);
        if (!(Math.tanh(delta / 4) <= coverageFactor * Math.sqrt(Math.max(0, quadratic(cov, d))) / 2)) {
            return false;
        }
        List<Member> merged = new ArrayList<>(cluster);
        merged.add(next);
        double together = quadratic(cov, meanGradient(merged));
        return together < quadratic(cov, mean) && together < quadratic(cov, next.gradient);
    }

    private void close(List<Member> cluster, List<FittedRoot> roots, double[] p, double[][] cov,
                       List<RootCluster> found) {
        int count = 0;
        Set<Integer> pairs = new LinkedHashSet<>();
        for (Member m : cluster) {
            count += m.roots.length;
            pairs.add(m.pairOffset);
        }
        if (count < 2 || (cluster.size() == 1 && !cluster.get(0).nearCritical)) {
            return;
        }
        double mean = Math.exp(meanLn(cluster));
        double u = mean * Math.sqrt(Math.max(0, quadratic(cov, meanGradient(cluster))));
        OptionalDouble zeta = OptionalDouble.empty();
        double uZeta = 0;
        int pair = pairs.iterator().next();
        if (pairs.size() == 1 && pair >= 0 && count == 2) {
            zeta = OptionalDouble.of(Math.exp(p[pair + 1]));
            uZeta = zeta.getAsDouble() * Math.sqrt(cov[pair + 1][pair + 1]);
        }
        Set<String> labels = new LinkedHashSet<>();
        List<Integer> indices = new ArrayList<>();
        for (Member m : cluster) {
            for (int index : m.roots) {
                indices.add(index);
            }
        }
        indices.sort(Integer::compare);
        for (int index : indices) {
            for (String label : roots.get(index).label().split(",")) {
                labels.add(label);
            }
        }
        RootCluster quote = new RootCluster(new ArrayList<>(labels), count, mean, u, zeta, uZeta);
        found.add(quote);
        for (int index : indices) {
            FittedRoot r = roots.get(index);
            roots.set(index, new FittedRoot(r.label(), r.radPerS(), u, r.isReal() ? 0 : u, u, r.status(),
                    Optional.of(quote)));
        }
    }

    /** Mean of ln|root| over the cluster's roots (a pair counts twice). */
    private static double meanLn(List<Member> cluster) {
        double sum = 0;
        int n = 0;
        for (Member m : cluster) {
            sum += m.roots.length * m.lnMagnitude;
            n += m.roots.length;
        }
        return sum / n;
    }

    private static double[] meanGradient(List<Member> cluster) {
        double[] g = new double[cluster.get(0).gradient.length];
        int n = 0;
        for (Member m : cluster) {
            for (int i = 0; i < g.length; i++) {
                g[i] += m.roots.length * m.gradient[i];
            }
            n += m.roots.length;
        }
        for (int i = 0; i < g.length; i++) {
            g[i] /= n;
        }
        return g;
    }

    private static double quadratic(double[][] cov, double[] g) {
        double sum = 0;
        for (int i = 0; i < g.length; i++) {
            if (g[i] == 0) {
                continue;
            }
            for (int j = 0; j < g.length; j++) {
                sum += g[i] * cov[i][j] * g[j];
            }
        }
        return sum;
    }
}

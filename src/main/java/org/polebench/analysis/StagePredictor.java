package org.polebench.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.circuit.Band;
import org.polebench.circuit.SmallSignalNetwork;
import org.polebench.linalg.Eigenpairs;

/**
 * The analysis entry point: port reduction of both bands, poles, zeros, the SCTC and OCTC
 * estimates, the exact corners and the sensitivities of one network (docs/method.md).
 * Immutable and stateless between calls; one instance serves any number of threads.
 */
public final class StagePredictor {
    /** |wᵀv| of unit eigenvectors below this marks a repeated or defective pole. */
    static final double REPEATED_POLE_CONDITION = 1e-6;
    /** A zero below this share of the smallest pole magnitude is a zero at DC (see zerosOf). */
    static final double DC_ZERO_SHARE = 1e-3;

    private final PortReduction reduction;
    private final PoleFinder poleFinder;
    private final CornerFinder cornerFinder;

    public StagePredictor() {
        this(new PortReduction(), new PoleFinder(), new CornerFinder());
    }

    public StagePredictor(PortReduction reduction, PoleFinder poleFinder, CornerFinder cornerFinder) {
        this.reduction = reduction;
        this.poleFinder = poleFinder;
        this.cornerFinder = cornerFinder;
    }

    /** @return the full prediction, or the named singular case of the low band */
    public PredictionOutcome predict(SmallSignalNetwork network) {
        Reduction low = reduction.reduce(network, Band.LOW);
        if (low.singular().isPresent()) {
            return low.singular().get();
        }
        StateModel model = low.stateModel().orElseThrow();
        Optional<Eigenpairs> eigen = poleFinder.eigenpairs(model.aView(), false);
        if (eigen.isEmpty()) {
            return noEigenvalues(model);
        }
        double d = model.directGain();
        Spectrum poles = poleFinder.spectrum(eigen.get(), model.aView(), false);
        Optional<Spectrum> zeros = d == 0 ? Optional.empty() : zerosOf(model, poles);

        SctcEstimate sctc = SctcEstimate.of(model);
        OptionalDouble lowerRadPerS = cornerFinder.lowerCornerRadPerS(model);
        double[] cornerSensitivity = lowerRadPerS.isPresent()
                ? cornerFinder.cornerSensitivities(model, lowerRadPerS.getAsDouble()) : null;
        List<CapacitorSensitivity> capacitorSensitivities = new ArrayList<>(model.order());
        for (int i = 0; i < model.order(); i++) {
            capacitorSensitivities.add(new CapacitorSensitivity(model.capacitorNames().get(i),
                    cornerSensitivity == null ? OptionalDouble.empty() : OptionalDouble.of(cornerSensitivity[i]),
                    -1 / sctc.terms().get(i).seconds()));
        }

        Optional<UpperBand> upper = Optional.empty();
        Optional<Reduction.Singular> upperProblem = Optional.empty();
        if (!network.capacitances(Band.HIGH).isEmpty()) {
            Reduction high = reduction.reduce(network, Band.HIGH);
            if (high.singular().isPresent()) {
                upperProblem = high.singular();
            } else {
                StateModel highModel = high.stateModel().orElseThrow();
                if (highModel.order() > 0) {
                    Optional<Spectrum> highPoles = poleFinder.spectrum(highModel.aView());
                    if (highPoles.isEmpty()) {
                        upperProblem = Optional.of(noEigenvalues(highModel));
                    } else {
                        OptionalDouble upperRadPerS = cornerFinder.upperCornerRadPerS(highModel, d);
                        upper = Optional.of(new UpperBand(highModel, OctcEstimate.of(highModel),
                                hz(upperRadPerS), highPoles.get()));
                    }
                }
            }
        }
        return new Prediction(d, model, sctc, hz(lowerRadPerS), poles, zeros,
                capacitorSensitivities, poleSensitivities(eigen.get()), upper, upperProblem);
    }

    /**
     * The light path for a Monte Carlo spread: only the low-band reduction and the exact lower
     * corner, no eigenvalues, zeros, sensitivities or high band.
     *
     * @return the exact lower −3 dB corner in Hz; empty when the low band is singular or there
     * is no corner (see {@link Prediction#exactLowerCornerHz()}); {@link #predict} says which
     */
    public OptionalDouble exactLowerCornerHz(SmallSignalNetwork network) {
        return exactLowerCornerHz(reduction.reduce(network, Band.LOW));
    }

    /** @return the low-band reduction of {@code network} laid out for many value sets ({@link PortReduction#prepare}) */
    public PortReduction.Prepared lowBandLayout(SmallSignalNetwork network) {
        return reduction.prepare(network, Band.LOW);
    }

    /**
     * @param low a low-band reduction made already (a spread's kernel makes it from a prepared
     *            layout, {@link PortReduction#prepare})
     * @return as {@link #exactLowerCornerHz(SmallSignalNetwork)}
     */
    public OptionalDouble exactLowerCornerHz(Reduction low) {
        if (low.stateModel().isEmpty()) {
            return OptionalDouble.empty();
        }
        return hz(cornerFinder.lowerCornerRadPerS(low.stateModel().get()));
    }

    private static OptionalDouble hz(OptionalDouble radPerS) {
        return radPerS.isPresent() ? OptionalDouble.of(radPerS.getAsDouble() / (2 * Math.PI)) : OptionalDouble.empty();
    }

    private static Reduction.Singular noEigenvalues(StateModel model) {
        return new Reduction.Singular(SingularCase.EIGENVALUES_NOT_FOUND, model.band(), model.capacitorNames(),
                List.of(), "the eigenvalue iteration did not converge on the "
                        + model.band().name().toLowerCase(Locale.ROOT) + "-band state matrix");
    }

    /**
     * Zeros with the ones at DC made exact. A zero of multiplicity m at s = 0 (one per coupling
     * capacitor in the signal path) forms a Jordan block of Z = A − B·C/D, which any eigenvalue
     * solver perturbs to about ε^(1/m)·‖Z‖ (Wilkinson, The Algebraic Eigenvalue Problem, 1965),
     * a ring of m roots around the origin, half of them in the right half-plane; Z's null space
     * does not count them (it has dimension 1). So m is counted from the response instead
     * ({@link #zerosAtDc}) and the m zeros nearest the origin are made exactly 0; and, as
     * before, a zero below 1e-3 of the smallest pole magnitude is taken as DC: no sweep that
     * starts within three decades of the lowest pole could tell it from one.
     */
    private Optional<Spectrum> zerosOf(StateModel model, Spectrum poles) {
        double[][] z = zeroMatrix(model);
        Optional<Spectrum> found = poleFinder.eigenpairs(z, true).map(eigen -> poleFinder.spectrum(eigen, z, true));
        if (found.isEmpty() || poles.roots().isEmpty()) {
            return found;
        }
        double smallestPole = Double.POSITIVE_INFINITY;
        for (ComplexFrequency pole : poles.roots()) {
            smallestPole = Math.min(smallestPole, pole.magnitudeRadPerS());
        }
        Spectrum spectrum = found.get();
        int n = spectrum.roots().size();
        Integer[] nearest = new Integer[n];
        for (int i = 0; i < n; i++) {
            nearest[i] = i;
        }
        java.util.Arrays.sort(nearest, java.util.Comparator.comparingDouble(i -> spectrum.roots().get(i).magnitudeRadPerS()));
        boolean[] atDc = new boolean[n];
        int multiplicity = Math.min(n, zerosAtDc(model));
        for (int r = 0; r < multiplicity; r++) {
            atDc[nearest[r]] = true;
        }
        List<ComplexFrequency> roots = new ArrayList<>(n);
        List<Double> conditions = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            ComplexFrequency zero = spectrum.roots().get(i);
            boolean dc = atDc[i] || zero.magnitudeRadPerS() < DC_ZERO_SHARE * smallestPole;
            roots.add(dc ? new ComplexFrequency(0, 0) : zero);
            conditions.add(dc ? 0.0 : spectrum.conditions().get(i));
        }
        return Optional.of(new Spectrum(roots, spectrum.traceRelativeError(), spectrum.determinantRelativeError(),
                spectrum.maxRelativeResidual(), conditions));
    }

    /**
     * The multiplicity of the zero at DC, from the moments of the response about s = 0: with
     * (sI − A)⁻¹ = −Σ s^j·A^−(j+1), H(s) = h₀ + h₁·s + … with h₀ = D − C·A⁻¹·B and
     * h_j = −C·A^−(j+1)·B (the moments of asymptotic waveform evaluation: Pillage and Rohrer,
     * IEEE Trans. CAD 9(4), 1990). A zero of multiplicity m makes h₀ … h_(m−1) vanish exactly;
     * computed, each is then the rounding residue of a sum whose terms are much larger, so h_j
     * counts as 0 while |h_j| ≤ {@value #MOMENT_CANCELLATION}·k·u·Σ|terms|: a rounded sum of k + 1
     * terms errs by up to about k·u·Σ|terms| (Higham, Accuracy and Stability of Numerical
     * Algorithms, 2nd ed., 2002, 3.1), and the factor leaves room for the errors of the solves.
     * Seen on a 16-stage cascade (33 capacitors): the 17 vanishing moments at 0.2–2.4·u of their
     * terms, the first that does not at 7e-10, so the threshold (4e-13 there) has four decades
     * on either side.
     *
     * @return m, 0 when A is singular (a pole at DC) or H(0) ≠ 0
     */
    static int zerosAtDc(StateModel model) {
        double[][] a = model.aView();
        int k = model.order();
        org.polebench.linalg.RealLu lu = new org.polebench.linalg.RealLu(a, 0);
        if (!lu.isNonSingular()) {
            return 0;
        }
        double[] c = model.cView();
        double[] v = model.bView().clone();
        double d = model.directGain();
        int m = 0;
        for (int j = 0; j <= k; j++) {
            v = lu.solve(v);
            double sum = j == 0 ? d : 0;
            double terms = j == 0 ? Math.abs(d) : 0;
            for (int i = 0; i < k; i++) {
                sum -= c[i] * v[i];
                terms += Math.abs(c[i] * v[i]);
            }
            if (!(terms > 0) || Math.abs(sum) > MOMENT_CANCELLATION * k * Spectrum.UNIT_ROUNDOFF * terms) {
                return m;
            }
            m++;
        }
        return m;
    }

    /** A moment below this many k·u of its terms is a rounding residue: exactly 0 (see zerosAtDc). */
    static final double MOMENT_CANCELLATION = 100;

    // Zeros of a SISO model: det(sI − A)·H(s)/D = det(sI − (A − B·C/D)).
    private static double[][] zeroMatrix(StateModel model) {
        int k = model.order();
        double[][] a = model.aView();
        double[] b = model.bView();
        double[] c = model.cView();
        double d = model.directGain();
        double[][] z = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                z[i][j] = a[i][j] - b[i] * c[j] / d;
            }
        }
        return z;
    }

    private static List<PoleSensitivity> poleSensitivities(Eigenpairs eigen) {
        int n = eigen.size();
        List<PoleSensitivity> result = new ArrayList<>(n);
        for (int m = 0; m < n; m++) {
            double[] vr = eigen.right(m)[0];
            double[] vi = eigen.right(m)[1];
            double[] wr = eigen.left(m)[0];
            double[] wi = eigen.left(m)[1];
            double sr = 0;
            double si = 0;
            double[] pr = new double[n];
            double[] pi = new double[n];
            for (int i = 0; i < n; i++) {
                pr[i] = wr[i] * vr[i] - wi[i] * vi[i];
                pi[i] = wr[i] * vi[i] + wi[i] * vr[i];
                sr += pr[i];
                si += pi[i];
            }
            ComplexFrequency pole = new ComplexFrequency(eigen.re(m), eigen.im(m));
            double size = sr * sr + si * si;
            if (Math.sqrt(size) < REPEATED_POLE_CONDITION) {
                result.add(new PoleSensitivity(pole, true, List.of()));
                continue;
            }
            List<Double> values = new ArrayList<>(n);
            for (int i = 0; i < n; i++) {
                // −Re(p_i / Σp)
                values.add(-(pr[i] * sr + pi[i] * si) / size);
            }
            result.add(new PoleSensitivity(pole, false, values));
        }
        return result;
    }
}

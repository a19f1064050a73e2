package org.polebench.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.polebench.InputWarning;
import org.polebench.units.Decibels;

/**
 * Turns the chosen fit into a {@link FitResult}: scales the covariance (see
 * {@link UncertaintyBasis}), propagates it to every reported quantity to first order (GUM 5.1.2),
 * finds both lower corners and flags what the data cannot support.
 */
final class FitStatement {
    /** Two-sided coverage probability of k = 2 for a normal distribution (GUM G.1.3). */
    private static final double COVERAGE = 0.9545;
    private static final double CHI_SQUARE_PERCENTILE = 0.99;
    private static final double DECADE = 10;

    private final LowerCorner corner = new LowerCorner();

    FitResult state(PreparedSweep data, RefinedFit fit, List<CandidateScore> scores, List<DroppedPoint> dropped,
                    List<InputWarning> earlier) {
        List<InputWarning> warnings = new ArrayList<>(earlier);
        ModelStructure s = fit.structure();
        double[] p = fit.parameters;
        int nu = fit.degreesOfFreedom();
        UncertaintyBasis basis;
        double scale;
        double k;
        double chiSquare = chiSquareWithCalibration(data, fit);
        double reduced = chiSquare / nu;
        if (data.uncertaintiesStated) {
            double limit = new ChiSquaredDistribution(null, nu).inverseCumulativeProbability(CHI_SQUARE_PERCENTILE);
            if (chiSquare <= limit) {
                basis = UncertaintyBasis.STATED;
                scale = 1;
                k = 2;
            } else {
                basis = UncertaintyBasis.STATED_SCALED_BY_RESIDUALS;
                scale = reduced;
                k = studentK(nu);
                warnings.add(InputWarning.general(String.format(Locale.ROOT,
                        "the residuals scatter more than the stated point uncertainties allow (chi-square/nu = %.3g);"
                                + " uncertainties are scaled by sqrt(chi-square/nu)", reduced)));
            }
        } else {
            basis = UncertaintyBasis.FROM_RESIDUALS;
            scale = reduced;
            k = studentK(nu);
        }
        double[][] cov = new double[p.length][p.length];
        for (int i = 0; i < p.length; i++) {
            for (int j = 0; j < p.length; j++) {
                cov[i][j] = scale * fit.inverseInformation[i][j];
            }
        }
        // the point noise alone moves the midband against the points; the flat calibration term
        // moves both together, so the data corner takes this part only
        double uMidbandNoise = Math.sqrt(cov[0][0]);
        addCalibration(data, fit, cov);
        double omegaRef = 2 * Math.PI * data.referenceHz;
        double lowestRad = 2 * Math.PI * data.lowestHz();
        double highestRad = 2 * Math.PI * data.highestHz();

        List<String> names = new ArrayList<>();
        names.add("midband gain ln|K|");
        List<FittedRoot> zeros = new ArrayList<>();
        for (int i = 0; i < s.dcZeros(); i++) {
            zeros.add(new FittedRoot("z0", Complex.ZERO, 0, 0, 0, RootStatus.STRUCTURAL));
        }
        Labels zeroLabels = new Labels("z");
        Labels poleLabels = new Labels("p");
        List<FittedRoot> poles = new ArrayList<>();
        RootClusters clusters = new RootClusters(k);
        List<RootClusters.Member> zeroMembers = new ArrayList<>();
        List<RootClusters.Member> poleMembers = new ArrayList<>();
        realRoots(p, cov, s.realZeroOffset(), s.realZeros(), omegaRef, lowestRad, zeroLabels, names, zeros,
                zeroMembers);
        pairs(p, cov, s.zeroPairOffset(), s.zeroPairs(), omegaRef, lowestRad, zeroLabels, names, zeros, clusters,
                zeroMembers);
        realRoots(p, cov, s.realPoleOffset(), s.realPoles(), omegaRef, lowestRad, poleLabels, names, poles,
                poleMembers);
        pairs(p, cov, s.polePairOffset(), s.polePairs(), omegaRef, lowestRad, poleLabels, names, poles, clusters,
                poleMembers);
        List<RootCluster> zeroClusters = new ArrayList<>();
        List<RootCluster> poleClusters = new ArrayList<>();
        clusters.apply(zeros, zeroMembers, p, cov, zeroClusters);
        clusters.apply(poles, poleMembers, p, cov, poleClusters);
        OptionalDouble high = OptionalDouble.empty();
        if (s.highBandPole()) {
            int i = s.highBandOffset();
            double w = omegaRef * Math.exp(p[i]);
            double u = w * Math.sqrt(cov[i][i]);
            RootStatus status = w > DECADE * highestRad ? RootStatus.UNIDENTIFIABLE : RootStatus.FITTED;
            poles.add(new FittedRoot("ph", new Complex(-w, 0), u, 0, u, status));
            names.add("high-band pole ln(wh)");
            warnings.add(InputWarning.general("the sweep reaches the upper rolloff: one high-band pole is part of "
                    + "the model"));
            high = OptionalDouble.of(w);
        }
        for (FittedRoot root : poles) {
            if (root.status() == RootStatus.UNIDENTIFIABLE) {
                warnings.add(InputWarning.general("pole " + root.label() + " lies more than a decade outside the swept "
                        + "band; it is unidentifiable from these data and is not quoted"));
            }
        }
        for (FittedRoot root : zeros) {
            if (root.status() == RootStatus.UNIDENTIFIABLE) {
                warnings.add(InputWarning.general("zero " + root.label() + " lies more than a decade below the swept "
                        + "band; it is unidentifiable from these data and is not quoted"));
            }
        }
        clusterWarnings("poles", poleClusters, warnings);
        clusterWarnings("zeros", zeroClusters, warnings);
        for (FittedRoot root : poles) {
            if (!root.isReal() && root.status() == RootStatus.FITTED && root.cluster().isEmpty()
                    && Math.abs(root.radPerS().getImaginary()) < 0.05 * root.radPerS().abs()) {
                warnings.add(InputWarning.general("poles " + root.label() + " are a complex pair with damping near 1;"
                        + " their real and imaginary parts are poorly separated"));
                break;
            }
        }

        double signedK = (fit.model.inverting() ? -1 : 1) * Math.exp(p[0]);
        List<FittedRoot> lowBandPoles = s.highBandPole() ? poles.subList(0, poles.size() - 1) : poles;
        FittedModel model = new FittedModel(signedK, s.dcZeros(), values(zeros, true), values(lowBandPoles, false),
                high);
        Estimate gain = new Estimate(Decibels.fromNepers(p[0]), Math.sqrt(cov[0][0]) / Decibels.NEPERS_PER_DB, k);
        if (!data.hasPhase) {
            warnings.add(InputWarning.general("magnitude-only sweep: the zeros are taken in the left half-plane "
                    + "(minimum phase) and the sign of the gain cannot be told"));
        }

        Optional<Estimate> modelCorner = modelCorner(data, fit, cov, k, warnings);
        double[] dc = corner.dataCorner(data, p[0], uMidbandNoise);
        Optional<Estimate> dataCorner = dc == null ? Optional.empty() : Optional.of(new Estimate(dc[0], dc[1], k));
        if (dc == null) {
            warnings.add(InputWarning.general("the measured gain never falls 3 dB below midband inside the fitted band; "
                    + "no corner can be read from the data"));
        }
        return new FitResult(model, s, gain, fit.model.inverting(), poles, zeros, names, correlation(cov),
                quality(data, fit, basis), modelCorner, dataCorner, dropped, scores,
                new FitBand(data.lowestHz(), data.highestHz()), warnings);
    }

    /**
     * Adds the flat calibration term to the covariance by the law of propagation of uncertainty
     * (GUM 5.1.2), the terms independent of the point noise and of each other. The sensitivity of
     * the parameters to a flat offset c of the data is that of the weighted least-squares
     * solution, linearised at the optimum: ∂θ/∂c = (JᵀWJ)⁻¹JᵀW·e, with e the offset's pattern
     * in the residuals (1 on every gain row for a gain error in nepers, 1 on every phase row for
     * a phase offset in radians) and J the fit's own Jacobian. A flat gain error therefore moves
     * ln|K| one for one and nothing else (e is ln|K|'s own column of J), so it never moves a
     * corner relative to midband; a flat phase offset moves whatever the fit trades against it.
     */
    private static void addCalibration(PreparedSweep data, RefinedFit fit, double[][] cov) {
        int np = fit.parameters.length;
        int rows = data.residualCount();
        int n = data.size();
        double[] value = new double[rows];
        double[] jacobian = new double[rows * np];
        LogResidualFit.evaluate(data, fit.model, fit.parameters, value, jacobian);
        CalibrationTerm term = data.calibration;
        double uGain = Decibels.toNepers(term.gainStandardUncertaintyDb());
        addOffset(fit, jacobian, np, 0, n, data.sigmaGain, uGain, cov);
        if (data.hasPhase && term.phaseStandardUncertaintyDeg().isPresent()) {
            double uPhase = Math.toRadians(term.phaseStandardUncertaintyDeg().getAsDouble());
            addOffset(fit, jacobian, np, n, n, data.sigmaPhase, uPhase, cov);
        }
    }

    /**
     * χ² of the fit's residuals r under the covariance the sweep is taken to have, the point
     * noise D plus the flat calibration terms, V = D + u_g²·e_g·e_gᵀ + u_φ²·e_φ·e_φᵀ:
     * rᵀV⁻¹r = rᵀD⁻¹r − Σ (eᵀD⁻¹r)²/(1/u² + eᵀD⁻¹e), the terms on disjoint rows taken one at a time
     * (Sherman–Morrison). A flat phase offset within the instrument's accuracy is a shape the model
     * cannot take, so without this it would read as residuals beyond the stated noise and scale
     * every uncertainty up. The gain term drops out at the optimum (its e is ln|K|'s column of J,
     * so eᵀD⁻¹r = 0). Used for the basis and the noise scale; the χ² reported is the plain one.
     */
    private static double chiSquareWithCalibration(PreparedSweep data, RefinedFit fit) {
        int n = data.size();
        double[] value = new double[data.residualCount()];
        LogResidualFit.evaluate(data, fit.model, fit.parameters, value, (double[]) null);
        double chi = fit.chiSquare;
        CalibrationTerm term = data.calibration;
        chi -= flatPart(value, 0, n, data.sigmaGain, Decibels.toNepers(term.gainStandardUncertaintyDb()));
        if (data.hasPhase && term.phaseStandardUncertaintyDeg().isPresent()) {
            chi -= flatPart(value, n, n, data.sigmaPhase, Math.toRadians(term.phaseStandardUncertaintyDeg().getAsDouble()));
        }
        return Math.max(chi, 0);
    }

    private static double flatPart(double[] residual, int first, int count, double[] sigma, double u) {
        if (u == 0) {
            return 0;
        }
        double eWr = 0;
        double eWe = 0;
        for (int k = 0; k < count; k++) {
            double w = 1 / (sigma[k] * sigma[k]);
            eWr += w * residual[first + k];
            eWe += w;
        }
        return eWr * eWr / (1 / (u * u) + eWe);
    }

    /** cov += u²·s·sᵀ with s = (JᵀWJ)⁻¹·Σ_rows J_rᵀ/σ_r², the rows from {@code first} on. */
    private static void addOffset(RefinedFit fit, double[] jacobian, int np, int first, int count, double[] sigma,
                                  double u, double[][] cov) {
        if (u == 0) {
            return;
        }
        double[] g = new double[np];
        for (int k = 0; k < count; k++) {
            double w = 1 / (sigma[k] * sigma[k]);
            int row = (first + k) * np;
            for (int i = 0; i < np; i++) {
                g[i] += w * jacobian[row + i];
            }
        }
        double[] sens = new double[np];
        for (int i = 0; i < np; i++) {
            for (int j = 0; j < np; j++) {
                sens[i] += fit.inverseInformation[i][j] * g[j];
            }
        }
        for (int i = 0; i < np; i++) {
            for (int j = 0; j < np; j++) {
                cov[i][j] += u * u * sens[i] * sens[j];
            }
        }
    }

    private Optional<Estimate> modelCorner(PreparedSweep data, RefinedFit fit, double[][] cov, double k,
                                           List<InputWarning> warnings) {
        ModelStructure s = fit.structure();
        ModelStructure low = new ModelStructure(s.dcZeros(), s.realZeros(), s.zeroPairs(), s.realPoles(),
                s.polePairs(), false);
        RationalModel lowBand = new RationalModel(low, false);
        double[] p = Arrays.copyOf(fit.parameters, low.parameterCount());
        OptionalDouble x = corner.modelCorner(lowBand, p, data.x[0], data.x[data.size() - 1]);
        if (x.isEmpty()) {
            if (low.lowBandPoles() > 0) {
                warnings.add(InputWarning.general("the fitted low band never falls 3 dB below midband; no corner"));
            } else {
                warnings.add(InputWarning.general("no low-band pole is supported by the data: the lower corner lies "
                        + "below the swept band"));
            }
            return Optional.empty();
        }
        double cornerHz = x.getAsDouble() * data.referenceHz;
        if (cornerHz < data.lowestHz() / DECADE) {
            warnings.add(InputWarning.general("the fitted lower corner lies more than a decade below the lowest swept "
                    + "frequency; it is not quoted"));
            return Optional.empty();
        }
        if (cornerHz < data.lowestHz()) {
            warnings.add(InputWarning.general("the fitted lower corner lies below the lowest swept frequency "
                    + "(extrapolated by the model)"));
        }
        double[] g = corner.cornerGradient(lowBand, p, x.getAsDouble());
        double var = 0;
        for (int i = 0; i < g.length; i++) {
            for (int j = 0; j < g.length; j++) {
                var += g[i] * cov[i][j] * g[j];
            }
        }
        return Optional.of(new Estimate(cornerHz, data.referenceHz * Math.sqrt(Math.max(var, 0)), k));
    }

    private static void clusterWarnings(String kind, List<RootCluster> clusters, List<InputWarning> warnings) {
        for (RootCluster c : clusters) {
            String which = kind + " " + String.join(", ", c.labels());
            if (c.dampingRatio().isPresent()) {
                warnings.add(InputWarning.general(which + " are a pair whose damping ratio lies within its "
                        + "uncertainty of 1: whether they are complex or two real " + kind + " cannot be told; "
                        + "they are quoted by their natural frequency and damping ratio"));
            } else {
                warnings.add(InputWarning.general(which + " are not separated by the data (they coincide within "
                        + "their uncertainty); they are quoted together by their geometric mean"));
            }
        }
    }

    private static void realRoots(double[] p, double[][] cov, int offset, int count, double omegaRef,
                                  double lowestRad, Labels labels, List<String> names, List<FittedRoot> out,
                                  List<RootClusters.Member> members) {
        for (int i = offset; i < offset + count; i++) {
            double w = omegaRef * Math.exp(p[i]);
            double u = w * Math.sqrt(cov[i][i]);
            String label = labels.next();
            names.add(label + " ln|" + label + "|");
            RootStatus status = status(w, lowestRad);
            if (status == RootStatus.FITTED) {
                members.add(RootClusters.realRoot(out.size(), i, Math.log(w), p.length));
            }
            out.add(new FittedRoot(label, new Complex(-w, 0), u, 0, u, status));
        }
    }

    /** A pair s² + 2ζω₀s + ω₀²: complex roots when ζ < 1, two real ones otherwise. */
    private static void pairs(double[] p, double[][] cov, int offset, int count, double omegaRef, double lowestRad,
                              Labels labels, List<String> names, List<FittedRoot> out, RootClusters clusters,
                              List<RootClusters.Member> members) {
        for (int j = 0; j < count; j++) {
            int i = offset + 2 * j;
            if (status(omegaRef * Math.exp(p[i]), lowestRad) == RootStatus.FITTED) {
                members.addAll(clusters.pair(out.size(), i, p, cov, Math.log(omegaRef)));
            }
            double w0 = omegaRef * Math.exp(p[i]);
            double zeta = Math.exp(p[i + 1]);
            double cuu = cov[i][i];
            double cuv = cov[i][i + 1];
            double cvv = cov[i + 1][i + 1];
            String a = labels.next();
            String b = labels.next();
            names.add(a + "," + b + " ln w0");
            names.add(a + "," + b + " ln zeta");
            if (zeta < 1) {
                double re = -zeta * w0;
                double im = w0 * Math.sqrt(1 - zeta * zeta);
                // ∂Re/∂u = ∂Re/∂v = Re; ∂Im/∂u = Im; ∂Im/∂v = −ω₀ζ²/√(1−ζ²)
                double uRe = Math.sqrt(Math.max(0, re * re * (cuu + 2 * cuv + cvv)));
                double dImDv = -w0 * zeta * zeta / Math.sqrt(1 - zeta * zeta);
                double uIm = Math.sqrt(Math.max(0, im * im * cuu + 2 * im * dImDv * cuv + dImDv * dImDv * cvv));
                double uMag = w0 * Math.sqrt(cuu);
                RootStatus status = status(w0, lowestRad);
                out.add(new FittedRoot(a + "," + b, new Complex(re, im), uRe, uIm, uMag, status));
                out.add(new FittedRoot(a + "," + b, new Complex(re, -im), uRe, uIm, uMag, status));
            } else {
                double q = Math.sqrt(zeta * zeta - 1);
                double[] roots = {-w0 / (zeta + q), -w0 * (zeta + q)};
                double[] dZeta = {-w0 * (1 - zeta / q), -w0 * (1 + zeta / q)};
                String[] label = {a, b};
                for (int r = 0; r < 2; r++) {
                    double du = roots[r];
                    double dv = zeta * dZeta[r];
                    double u = Math.sqrt(Math.max(0, du * du * cuu + 2 * du * dv * cuv + dv * dv * cvv));
                    out.add(new FittedRoot(label[r], new Complex(roots[r], 0), u, 0, u,
                            status(Math.abs(roots[r]), lowestRad)));
                }
            }
        }
    }

    private static RootStatus status(double magnitudeRad, double lowestRad) {
        return magnitudeRad < lowestRad / DECADE ? RootStatus.UNIDENTIFIABLE : RootStatus.FITTED;
    }

    private static List<Complex> values(List<FittedRoot> roots, boolean skipStructural) {
        List<Complex> out = new ArrayList<>();
        for (FittedRoot root : roots) {
            if (!(skipStructural && root.status() == RootStatus.STRUCTURAL)) {
                out.add(root.radPerS());
            }
        }
        return out;
    }

    private static List<List<Double>> correlation(double[][] cov) {
        List<List<Double>> rows = new ArrayList<>();
        for (int i = 0; i < cov.length; i++) {
            List<Double> row = new ArrayList<>();
            for (int j = 0; j < cov.length; j++) {
                row.add(i == j ? 1.0 : cov[i][j] / Math.sqrt(cov[i][i] * cov[j][j]));
            }
            rows.add(row);
        }
        return rows;
    }

    private static FitQuality quality(PreparedSweep data, RefinedFit fit, UncertaintyBasis basis) {
        int n = data.size();
        double[] value = new double[data.residualCount()];
        LogResidualFit.evaluate(data, fit.model, fit.parameters, value, (double[]) null);
        double gain = 0;
        double phase = 0;
        for (int k = 0; k < n; k++) {
            gain += value[k] * value[k];
            if (data.hasPhase) {
                phase += value[n + k] * value[n + k];
            }
        }
        double rmsDb = Decibels.fromNepers(Math.sqrt(gain / n));
        OptionalDouble rmsDeg = data.hasPhase ? OptionalDouble.of(Math.toDegrees(Math.sqrt(phase / n)))
                : OptionalDouble.empty();
        return new FitQuality(fit.chiSquare, fit.degreesOfFreedom(), n, rmsDb, rmsDeg, basis, data.calibration);
    }

    /** k = t₉₅.₄₅(ν), Student's t for ν degrees of freedom (GUM G.3.4, table G.2). */
    static double studentK(int nu) {
        return new TDistribution(null, nu).inverseCumulativeProbability(0.5 + COVERAGE / 2);
    }

    /** Hands out p1, p2, … in order. */
    private static final class Labels {
        private final String prefix;
        private int next = 1;

        Labels(String prefix) {
            this.prefix = prefix;
        }

        String next() {
            return prefix + next++;
        }
    }
}

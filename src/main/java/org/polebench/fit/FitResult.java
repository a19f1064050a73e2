package org.polebench.fit;

import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;
import org.polebench.InputWarning;

/**
 * A fitted low-frequency model of one sweep with everything a report needs to trust it.
 *
 * @param model               the transfer function, to evaluate anywhere
 * @param structure           its shape (chosen by BIC unless the settings fixed it)
 * @param midbandGainDb       20·log10|K|, dB, with uncertainty
 * @param inverting           whether K is negative (a magnitude-only sweep cannot tell: false)
 * @param poles               low-band poles, then the high-band pole if any
 * @param zeros               DC zeros first (structural), then finite zeros
 * @param parameterNames      names of the fit parameters, in the order of {@code correlation}
 * @param correlation         correlation matrix of the fit parameters (ln|K|, ln|p| or ln|z| for each
 *                            real root, ln ω₀ and ln ζ for each pair, ln ω_h); symmetric, unit diagonal
 * @param quality             χ², residual RMS and the uncertainty basis
 * @param lowerCornerModelHz  the fitted model's exact lower −3 dB corner (the highest frequency below
 *                            midband where its low band is 3.01 dB under |K|), Hz; empty when it
 *                            lies more than a decade below the band or the model has none
 * @param lowerCornerDataHz   the corner interpolated (linear in dB against log f) between the two
 *                            measured points that straddle midband − 3.01 dB, the midband taken
 *                            from the fit, Hz; empty when the data never fall that far
 * @param droppedPoints       points left out as outliers
 * @param candidates          every order tried, with its score
 * @param band                the frequency range actually fitted
 * @param warnings            what the reader must know: unidentifiable roots, extrapolated corners,
 *                            dropped points, scaled uncertainties
 */
public record FitResult(FittedModel model, ModelStructure structure, Estimate midbandGainDb, boolean inverting,
                        List<FittedRoot> poles, List<FittedRoot> zeros, List<String> parameterNames,
                        List<List<Double>> correlation, FitQuality quality, Optional<Estimate> lowerCornerModelHz,
                        Optional<Estimate> lowerCornerDataHz, List<DroppedPoint> droppedPoints,
                        List<CandidateScore> candidates, FitBand band, List<InputWarning> warnings) {
    public FitResult {
        poles = List.copyOf(poles);
        zeros = List.copyOf(zeros);
        parameterNames = List.copyOf(parameterNames);
        correlation = correlation.stream().map(List::copyOf).collect(Collectors.toUnmodifiableList());
        droppedPoints = List.copyOf(droppedPoints);
        candidates = List.copyOf(candidates);
        warnings = List.copyOf(warnings);
    }

    /** Total poles of the model, the high-band one included. */
    public int order() {
        return poles.size();
    }

    /** k of every expanded uncertainty in this result. */
    public double coverageFactor() {
        return midbandGainDb.coverageFactor();
    }
}

package org.polebench.analysis;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.units.Decibels;

/**
 * Everything the analysis predicts for one network (docs/method.md). Poles and zeros are
 * complex in rad/s ({@link ComplexFrequency} has Hz accessors); corners are in Hz.
 *
 * @param midbandGain            D of the low-band model in V/V, signed (negative: inverting)
 * @param lowBand                the low-band state-space model, for H(jω) and further analysis
 * @param sctc                   the short-circuit time-constant estimate, one term per
 *                               low-band capacitor
 * @param exactLowerCornerHz     the highest frequency below midband where |H| = |D|/√2, in Hz;
 *                               empty when D = 0, when there are no low-band capacitors, or
 *                               when the gain never falls 3 dB (a partly bypassed shelf)
 * @param poles                  the low-band poles with their checks
 * @param zeros                  the low-band zeros, eig(A − B·C/D); empty when D = 0, where they
 *                               are not the eigenvalues of a finite matrix. Zeros at DC are
 *                               exactly 0.
 * @param capacitorSensitivities one per low-band capacitor, in port order
 * @param poleSensitivities      one per low-band pole, in the order of {@code poles}
 * @param upperBand              present when the network has high-band capacitors and their
 *                               reduction succeeded
 * @param upperBandProblem       present when the network has high-band capacitors and their
 *                               reduction is singular (the low band is unaffected)
 */
public record Prediction(double midbandGain, StateModel lowBand, SctcEstimate sctc, OptionalDouble exactLowerCornerHz,
                         Spectrum poles, Optional<Spectrum> zeros, List<CapacitorSensitivity> capacitorSensitivities,
                         List<PoleSensitivity> poleSensitivities, Optional<UpperBand> upperBand,
                         Optional<Reduction.Singular> upperBandProblem) implements PredictionOutcome {
    public Prediction {
        capacitorSensitivities = List.copyOf(capacitorSensitivities);
        poleSensitivities = List.copyOf(poleSensitivities);
    }

    @Override
    public Optional<Prediction> prediction() {
        return Optional.of(this);
    }

    @Override
    public Optional<Reduction.Singular> singular() {
        return Optional.empty();
    }

    /** @return 20·log10|D| in dB */
    public double midbandGainDb() {
        return Decibels.fromRatio(midbandGain);
    }

    /** @return true when the midband output is in antiphase with the input ({@code D < 0}) */
    public boolean inverting() {
        return midbandGain < 0;
    }

    /** @return the SCTC estimate of the lower corner, Σ(1/τ_i)/2π, in Hz */
    public double sctcLowerCornerHz() {
        return sctc.cornerHz();
    }
}

package org.polebench.reconcile;

import java.util.Optional;
import org.polebench.circuit.Tolerance;

/**
 * One unknown of the back-solve, on a log scale, with its two priors.
 *
 * @param kind           capacitor, bias current or gain calibration
 * @param part           the capacitor's or transistor's designator; empty for the gain
 * @param nominal        the nominal value in {@link ParameterKind#unit()} terms: farads, amperes,
 *                       or 0 dB for the gain
 * @param tolerance      the part's tolerance band (capacitor or bias), empty for the gain
 * @param tolerancePrior the prior when the parameter is within its tolerance (docs/method.md,
 *                       "The back-solve"), on ln(value/nominal), or on g in nepers
 * @param faultPrior     the wide prior it gets when a single-fault hypothesis frees it
 */
public record ModelParameter(ParameterKind kind, Optional<String> part, double nominal, Optional<Tolerance> tolerance,
                             Prior tolerancePrior, Prior faultPrior) {

    /** @return the designator, or "gain" for the gain calibration */
    public String label() {
        return part.orElse("gain");
    }

    /**
     * @param logValue the parameter on its own scale (ln ratio, or nepers)
     * @return the value in the kind's unit: farads, amperes, or dB
     */
    public double valueOf(double logValue) {
        if (kind == ParameterKind.GAIN) {
            return logValue / org.polebench.units.Decibels.NEPERS_PER_DB;
        }
        return nominal * Math.exp(logValue);
    }

    /**
     * @return the standard uncertainty in the kind's unit for a standard uncertainty on the log
     *         scale, to first order (GUM 5.1.2): value·u for a ln ratio, u/(Np per dB) for the gain
     */
    public double uncertaintyOf(double logValue, double logUncertainty) {
        if (kind == ParameterKind.GAIN) {
            return logUncertainty / org.polebench.units.Decibels.NEPERS_PER_DB;
        }
        return nominal * Math.exp(logValue) * logUncertainty;
    }
}

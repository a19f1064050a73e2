package org.polebench.reconcile;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What a hypothesis says of one part it frees: the estimate and, for a capacitor or a
 * resistor, how it compares with the preferred values it is sold in.
 *
 * @param estimate          the freed parameter's posterior under the hypothesis
 * @param nearestPreferred  the nearest IEC 60063 value of the series its tolerance belongs to,
 *                          in farads or ohms; empty for a bias current or the gain
 * @param series            that series
 * @param decadeSlip        the nearest preferred value is the nominal times a power of ten other
 *                          than 1 (47 µF fitted as 4.7 µF)
 * @param fitsPreferredPart the estimate lies in the nearest preferred value's own tolerance band,
 *                          widened by twice its standard uncertainty: likely a part of that value
 */
public record PartReading(ParameterEstimate estimate, OptionalDouble nearestPreferred,
                          Optional<PreferredSeries> series, boolean decadeSlip, boolean fitsPreferredPart) {

    /** @return the reading of a freed parameter, with its preferred value where it has one */
    static PartReading of(ParameterEstimate estimate) {
        ModelParameter parameter = estimate.parameter();
        boolean valued = parameter.kind() == ParameterKind.CAPACITOR || parameter.kind() == ParameterKind.RESISTOR;
        if (!valued || parameter.tolerance().isEmpty()) {
            return new PartReading(estimate, OptionalDouble.empty(), Optional.empty(), false, false);
        }
        org.polebench.circuit.Tolerance tolerance = parameter.tolerance().get();
        PreferredSeries series = PreferredSeries.forTolerance(
                Math.max(Math.abs(tolerance.lowerFraction()), Math.abs(tolerance.upperFraction())));
        double value = estimate.value();
        double near = series.nearest(value);
        double decades = Math.log10(near / parameter.nominal());
        boolean slip = Math.abs(decades - Math.rint(decades)) < 1e-6 && Math.rint(decades) != 0;
        double u = estimate.uncertainty();
        double low = near * (1 + tolerance.lowerFraction()) - 2 * u;
        double high = near * (1 + tolerance.upperFraction()) + 2 * u;
        return new PartReading(estimate, OptionalDouble.of(near), Optional.of(series), slip,
                value >= low && value <= high);
    }
}

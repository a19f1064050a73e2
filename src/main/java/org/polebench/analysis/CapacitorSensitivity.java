package org.polebench.analysis;

import java.util.OptionalDouble;

/**
 * How the lower corner moves with one low-band capacitor.
 *
 * @param capacitor              the part's name
 * @param exactCornerPerLnC      ∂ln f_L/∂ln C_i of the exact corner (dimensionless; −1 means the
 *                               corner is inversely proportional to C_i); empty when there is no
 *                               exact corner. The values of all capacitors sum to −1.
 * @param sctcCornerRadPerSPerLnC ∂ωL,SCTC/∂ln C_i = −1/τ_i in rad/s (docs/method.md, "Sensitivities")
 */
public record CapacitorSensitivity(String capacitor, OptionalDouble exactCornerPerLnC,
                                   double sctcCornerRadPerSPerLnC) {
}

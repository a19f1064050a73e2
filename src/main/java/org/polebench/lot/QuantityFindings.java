package org.polebench.lot;

import java.util.Optional;

/**
 * What a lot says of one measured quantity.
 *
 * @param quantity     which figure
 * @param predicted    the stage's predicted band
 * @param distribution the boards' values against the band; empty when no board gave one
 * @param chart        the individuals chart in test order; empty with fewer than two boards
 * @param capability   Cpk against the stage's limits; empty without limits for this quantity or
 *                     without a chart
 */
public record QuantityFindings(LotQuantity quantity, PredictedBand predicted, Optional<LotDistribution> distribution,
                               Optional<IndividualsChart> chart, Optional<Capability> capability) {
}
